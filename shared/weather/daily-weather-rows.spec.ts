import { describe, expect, it } from 'vitest';
import { findGaps, interpretWeatherRows } from './daily-weather-rows';

const station = { latitudeDeg: 36.4, elevationM: 95 };

describe('interpretWeatherRows', () => {
  it('when ETo and rain are in inches, then they are stored in millimetres (1 in = 25.4 mm exactly)', () => {
    const { days, issues } = interpretWeatherRows(
      ['Date', 'ETo_in', 'Rain_in'],
      [['2025-06-01', '0.2', '0.1']],
      'eto-rain',
      station,
    );
    expect(issues).toEqual([]);
    expect(days[0]).toMatchObject({ date: '2025-06-01', etoMm: 5.08, method: 'measured' });
    expect(days[0]!.rainMm).toBeCloseTo(2.54, 12);
  });

  it('when a cell is blank, then that value is null (to be filled from normals), not zero', () => {
    const { days } = interpretWeatherRows(
      ['date', 'eto_mm', 'rain_mm'],
      [['2025-06-01', '', '0']],
      'eto-rain',
      station,
    );
    expect(days[0]).toMatchObject({ etoMm: null, rainMm: 0 });
  });

  it('when any row is bad, then no day is returned and every problem names its row', () => {
    const { days, issues } = interpretWeatherRows(
      ['date', 'eto_mm', 'rain_mm'],
      [
        ['2025-06-01', '5', '0'],
        ['2025-06-31', '5', '0'],
        ['2025-06-02', 'five', '0'],
        ['2025-06-01', '5', '0'],
      ],
      'eto-rain',
      station,
    );
    expect(days).toEqual([]);
    expect(issues.map((i) => `${i.row}:${i.field}`)).toEqual(['3:date', '4:eto_mm', '5:date']);
  });

  it('when both eto_mm and eto_in are given, then the header is refused', () => {
    const { issues } = interpretWeatherRows(
      ['date', 'eto_mm', 'eto_in', 'rain_mm'],
      [['2025-06-01', '5', '0.2', '0']],
      'eto-rain',
      station,
    );
    expect(issues[0]).toMatchObject({ row: 1, field: 'eto_mm, eto_in' });
  });
});

describe('findGaps', () => {
  it('when dates skip days, then each run of missing days is listed once', () => {
    expect(findGaps(['2025-02-27', '2025-03-02', '2025-03-03', '2025-02-26'])).toEqual([
      { from: '2025-02-28', to: '2025-03-01', days: 2 },
    ]);
  });
});
