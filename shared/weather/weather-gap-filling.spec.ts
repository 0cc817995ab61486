import { describe, expect, it } from 'vitest';
import { fillWeatherGaps, type MonthlyWeatherNormal } from './weather-gap-filling';

// Invented normals: 124 mm ETo and 31 mm rain in January (4 and 1 mm/d), 56 mm and 28 mm in February 2025 (2 and 1
// mm/d).
const normals: MonthlyWeatherNormal[] = [
  { month: 1, etoMm: 124, rainMm: 31 },
  { month: 2, etoMm: 56, rainMm: 28 },
];

describe('fillWeatherGaps', () => {
  it('fills missing days and missing values from the monthly normal and flags them', () => {
    const result = fillWeatherGaps(
      [
        { date: '2025-01-30', etoMm: 3, rainMm: 0 },
        { date: '2025-02-01', etoMm: null, rainMm: 7 },
      ],
      '2025-01-30',
      '2025-02-02',
      normals,
    );
    expect(result.days).toEqual([
      { date: '2025-01-30', etoMm: 3, rainMm: 0, filled: false, filledFields: [] },
      { date: '2025-01-31', etoMm: 4, rainMm: 1, filled: true, filledFields: ['eto', 'rain'] },
      { date: '2025-02-01', etoMm: 2, rainMm: 7, filled: true, filledFields: ['eto'] },
      { date: '2025-02-02', etoMm: 2, rainMm: 1, filled: true, filledFields: ['eto', 'rain'] },
    ]);
    expect(result.filledDates).toEqual(['2025-01-31', '2025-02-01', '2025-02-02']);
  });

  it('when a day appears twice, then it throws', () => {
    const day = { date: '2025-01-05', etoMm: 3, rainMm: 0 };
    expect(() => fillWeatherGaps([day, { ...day, etoMm: 4 }], '2025-01-01', '2025-01-31', normals)).toThrow(
      'Weather for 2025-01-05 appears more than once',
    );
  });

  it('keeps zero values as measured, not as gaps', () => {
    const result = fillWeatherGaps([{ date: '2025-01-01', etoMm: 0, rainMm: 0 }], '2025-01-01', '2025-01-01', normals);
    expect(result.days[0]).toMatchObject({ etoMm: 0, rainMm: 0, filled: false });
  });

  it('reports records outside the period and rejects a period that ends before it starts', () => {
    const result = fillWeatherGaps([{ date: '2024-12-31', etoMm: 1, rainMm: 0 }], '2025-01-01', '2025-01-01', normals);
    expect(result.ignoredDates).toEqual(['2024-12-31']);
    expect(() => fillWeatherGaps([], '2025-02-01', '2025-01-01', normals)).toThrow(/before its start/);
  });

  it('when a gap falls in a month without a normal, then it throws', () => {
    expect(() => fillWeatherGaps([], '2025-03-01', '2025-03-01', normals)).toThrow(/no normal for month 3/);
  });
});
