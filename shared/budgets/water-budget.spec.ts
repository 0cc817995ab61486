import { describe, expect, it } from 'vitest';
import { LITRES_PER_GALLON } from '../units/volume-units';
import type { Hydrozone } from './hydrozone';
import { siteBudgetForPeriod, zoneBudgetForDay, zoneBudgetForPeriod } from './water-budget';

// Invented zones and weather; hand calculations in the comments.
const lawn: Hydrozone = {
  id: 'lawn',
  name: 'Lawn',
  areaFt2: 1000,
  plantFactor: 0.5,
  irrigationMethod: 'spray',
  specialLandscapeArea: false,
};
const shrubs: Hydrozone = {
  id: 'shrubs',
  name: 'Shrubs',
  areaFt2: 500,
  plantFactor: 0.2,
  irrigationMethod: 'drip',
  specialLandscapeArea: false,
};
const quarter = { kind: 'fixed-fraction', fraction: 0.25 } as const;

describe('zoneBudgetForDay', () => {
  it('computes gross, rain credit and budget by hand', () => {
    // ETo 5.08 mm = 0.2 in. Gross = 0.2 × 0.5 × 1000 × 144/231 ÷ 0.75 = 83.117 gal.
    // Rain 2.54 mm × 25 % = 0.635 mm = 0.025 in. Credit = 0.025 × 1000 × 144/231 ÷ 0.75 = 20.779 gal. Budget 62.338
    // gal.
    const b = zoneBudgetForDay(lawn, { date: '2026-07-01', etoMm: 5.08, rainMm: 2.54 }, quarter);
    expect(b.grossGallons).toBeCloseTo(83.117, 3);
    expect(b.rainCreditGallons).toBeCloseTo(20.779, 3);
    expect(b.gallons).toBeCloseTo(62.338, 3);
  });

  it('gives the same water in litres worked in metric (mm × m² = L)', () => {
    const b = zoneBudgetForDay(lawn, { date: '2026-07-01', etoMm: 5.08, rainMm: 2.54 }, quarter);
    expect(b.litres).toBeCloseTo(b.gallons * LITRES_PER_GALLON, 6);
  });

  it('never goes below zero when rain exceeds demand', () => {
    const b = zoneBudgetForDay(lawn, { date: '2026-07-01', etoMm: 2, rainMm: 40 }, quarter);
    expect(b.gallons).toBe(0);
    expect(b.litres).toBe(0);
  });

  it('lists the steps with formulas for the "how computed" view', () => {
    const b = zoneBudgetForDay(lawn, { date: '2026-07-01', etoMm: 5.08, rainMm: 0 }, { kind: 'none' });
    expect(b.steps.map((s) => s.label)).toEqual([
      'Reference ET',
      'Plant factor',
      'Irrigation efficiency',
      'Area',
      'Gross irrigation',
      'Effective rain',
      'Rain credit',
      'Budget',
      'Budget (metric)',
    ]);
    expect(b.steps.find((s) => s.label === 'Gross irrigation')!.formula).toBe(
      'ETo (in) × PF × area (ft²) × 0.623377 ÷ IE',
    );
    expect(b.steps.find((s) => s.label === 'Irrigation efficiency')!.formula).toMatch(/MWELO App. B note c/);
  });

  it('rejects an invalid hydrozone or negative weather', () => {
    expect(() =>
      zoneBudgetForDay({ ...lawn, areaFt2: -5 }, { date: '2026-07-01', etoMm: 5, rainMm: 0 }, quarter),
    ).toThrow(/Area must be greater than 0/);
    expect(() => zoneBudgetForDay(lawn, { date: '2026-07-01', etoMm: -1, rainMm: 0 }, quarter)).toThrow(
      /ETo on 2026-07-01/,
    );
  });
});

describe('period and site budgets', () => {
  const days = [
    { date: '2026-06-30', etoMm: 5.08, rainMm: 0 },
    { date: '2026-07-01', etoMm: 5.08, rainMm: 0, filled: true },
  ];

  it('sums the daily budgets and counts filled days', () => {
    const period = zoneBudgetForPeriod(lawn, days, { kind: 'none' });
    expect(period.gallons).toBeCloseTo(2 * 83.117, 3);
    expect(period.filledDays).toBe(1);
    expect(period.startDate).toBe('2026-06-30');
    expect(period.endDate).toBe('2026-07-01');
    expect(period.byMonth.map((m) => m.month)).toEqual(['2026-06', '2026-07']);
    expect(period.byMonth[1]!.gallons).toBeCloseTo(83.117, 3);
  });

  it('when a day appears twice, then it throws', () => {
    expect(() => zoneBudgetForPeriod(lawn, [days[0]!, days[0]!], { kind: 'none' })).toThrow(/appears more than once/);
  });

  it('adds the zones and splits the site total by month', () => {
    // Shrubs: 0.2 × 0.2 × 500 × 144/231 ÷ 0.81 = 15.392 gal/day.
    const site = siteBudgetForPeriod([lawn, shrubs], days, { kind: 'none' });
    expect(site.gallons).toBeCloseTo(2 * (83.117 + 15.392), 2);
    expect(site.byMonth.map((m) => m.month)).toEqual(['2026-06', '2026-07']);
    expect(site.byMonth[0]!.gallons).toBeCloseTo(83.117 + 15.392, 2);
    expect(() => siteBudgetForPeriod([lawn, lawn], days, { kind: 'none' })).toThrow(/"lawn" appears more than once/);
  });
});
