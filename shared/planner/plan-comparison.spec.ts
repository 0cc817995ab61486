import { describe, expect, it } from 'vitest';
import type { RateSchedule } from '../rates/rate-schedule';
import { comparePlan, type PlanWeatherMonth } from './plan-comparison';
import { applyZoneChanges, checkZoneChanges, type PlanZone } from './plan-zones';
import { changeKindOf, savingsProjectFor } from './carry-out';

// Invented site: a turf zone on spray and a shrub zone on drip; 50 in of ETo and 12 in of rain in the year.
const zones: PlanZone[] = [
  {
    id: 1,
    name: 'Entry turf',
    areaFt2: 10_000,
    plantFactor: 0.8,
    irrigationMethod: 'spray',
    efficiency: 0.75,
    specialLandscapeArea: false,
  },
  {
    id: 2,
    name: 'Shrub beds',
    areaFt2: 5_000,
    plantFactor: 0.3,
    irrigationMethod: 'drip',
    efficiency: 0.81,
    specialLandscapeArea: false,
  },
];
const months: PlanWeatherMonth[] = Array.from({ length: 12 }, (_, i) => ({
  month: `2025-${String(i + 1).padStart(2, '0')}`,
  etoMm: (50 * 25.4) / 12,
  rainMm: (12 * 25.4) / 12,
}));
const uniform: RateSchedule = {
  name: 'Landscape',
  unit: 'kgal',
  currency: 'USD',
  fixedChargePerPeriod: 12,
  volumeCharge: { kind: 'uniform', pricePerUnit: 5 },
};
const base = {
  zones,
  months,
  allowedEtaf: 0.45,
  smartControllerReductionPercent: null,
  rainSensor: false,
  schedule: uniform,
  costOfWork: 20_000,
};

describe('what-if plan comparison', () => {
  it('when nothing changes, then both sides agree and nothing is saved', () => {
    const c = comparePlan({ ...base, changes: [] });
    expect(c.after).toEqual(c.before);
    expect(c.savedGal).toBe(0);
    expect(c.paybackYears).toBeNull();
    // ETWU = 50 × 0.62 × (0.8/0.75 × 10,000 + 0.3/0.81 × 5,000)
    expect(c.before.etwuGal).toBeCloseTo(50 * 0.62 * ((0.8 / 0.75) * 10_000 + (0.3 / 0.81) * 5_000), 6);
    expect(c.before.mawaGal).toBeCloseTo(50 * 0.62 * 0.45 * 15_000, 6);
  });

  it('when the turf becomes low-water plants on drip, then ETWU uses the new ETAF and money follows the rate', () => {
    const c = comparePlan({ ...base, changes: [{ hydrozoneId: 1, irrigationMethod: 'drip', plantFactor: 0.2 }] });
    const after = 50 * 0.62 * ((0.2 / 0.81) * 10_000 + (0.3 / 0.81) * 5_000);
    expect(c.after.etwuGal).toBeCloseTo(after, 6);
    expect(c.zones[0]!.after.etaf).toBeCloseTo(0.2 / 0.81, 12);
    expect(c.zones[0]!.changes).toEqual(['spray → drip', 'plant factor 0.80 → 0.20', 'efficiency 0.75 → 0.81']);
    expect(c.savedGal).toBeCloseTo(c.before.etwuGal - after, 6);
    // Uniform rate: fixed charges cancel, so money saved = gallons saved ÷ 1,000 × $5.
    // Each month is rounded to cents, so allow a few cents over the year.
    expect(Math.abs(c.savedMoney! - (c.savedGal / 1000) * 5)).toBeLessThan(0.13);
    expect(c.paybackYears!).toBeCloseTo(20_000 / c.savedMoney!, 9);
  });

  it('when area is removed, then the allowance shrinks with the landscape', () => {
    const c = comparePlan({ ...base, changes: [{ hydrozoneId: 1, areaRemovedFt2: 10_000 }] });
    expect(c.after.landscapeAreaFt2).toBe(5_000);
    expect(c.after.mawaGal).toBeCloseTo(50 * 0.62 * 0.45 * 5_000, 6);
    expect(c.zones[0]!.after.etwuGal).toBe(0);
    expect(c.zones[0]!.changes).toEqual(['taken out of irrigation']);
  });

  it('when a rain sensor and a smart controller are added, then a quarter of the rain counts and use is cut', () => {
    const c = comparePlan({ ...base, changes: [], rainSensor: true, smartControllerReductionPercent: 10 });
    const etwu = (50 - 0.25 * 12) * 0.62 * ((0.8 / 0.75) * 10_000 + (0.3 / 0.81) * 5_000);
    expect(c.after.etwuGal).toBeCloseTo(etwu, 6);
    expect(c.after.estimatedUseGal).toBeCloseTo(0.9 * etwu, 6);
    // The allowance does not move: it is the ordinance's, not the controller's.
    expect(c.after.mawaGal).toBeCloseTo(c.before.mawaGal, 9);
  });

  it('when there is no rate schedule, then money and payback are not guessed', () => {
    const c = comparePlan({ ...base, schedule: null, changes: [{ hydrozoneId: 1, plantFactor: 0.5 }] });
    expect(c.savedGal).toBeGreaterThan(0);
    expect(c.savedMoney).toBeNull();
    expect(c.paybackYears).toBeNull();
  });

  it('checks changes against the zones', () => {
    expect(checkZoneChanges(zones, [{ hydrozoneId: 9 }])).toEqual(['Hydrozone 9 is not on this site']);
    expect(checkZoneChanges(zones, [{ hydrozoneId: 1, areaRemovedFt2: 20_000 }])[0]).toMatch(/0–10000 ft²/);
    expect(checkZoneChanges(zones, [{ hydrozoneId: 1 }, { hydrozoneId: 1 }])).toEqual([
      '"Entry turf" is changed twice',
    ]);
    expect(applyZoneChanges(zones, [{ hydrozoneId: 2, efficiency: 0.9 }])[1]!.after.efficiency).toBe(0.9);
  });
});

describe('carrying a plan out', () => {
  it('when installed mid-June, then the baseline is the 12 months before June and reporting the 12 after', () => {
    const p = savingsProjectFor(
      {
        title: 'Entry turf to drip',
        notes: '',
        zoneChanges: [{ hydrozoneId: 1, irrigationMethod: 'drip' }],
        changeSummary: ['Entry turf: spray → drip'],
      },
      { installedOn: '2026-06-15' },
    );
    expect(p).toMatchObject({
      changeKind: 'spray-to-drip',
      baselineFrom: '2025-06',
      baselineTo: '2026-05',
      reportingFrom: '2026-07',
      reportingTo: '2027-06',
      modelForm: 'eto',
    });
    expect(p.changeDescription).toContain('spray → drip');
  });

  it('names the main change', () => {
    expect(changeKindOf({ zoneChanges: [{ hydrozoneId: 1, plantFactor: 0.2 }] })).toBe('replanting');
    expect(changeKindOf({ zoneChanges: [], rainSensor: true })).toBe('controller-replacement');
    expect(changeKindOf({ zoneChanges: [] })).toBe('other');
  });
});
