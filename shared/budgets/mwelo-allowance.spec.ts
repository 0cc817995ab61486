import { describe, expect, it } from 'vitest';
import { estimatedTotalWaterUse, maximumAppliedWaterAllowance, mweloCompliance } from './mwelo-allowance';

// Invented site; the published Fresno example is in test/reference/mwelo.test.ts.
describe('MWELO allowance', () => {
  it('rejects an SLA larger than the landscape area, or an ETAF outside (0, 1]', () => {
    expect(() =>
      maximumAppliedWaterAllowance({
        etoInPerYear: 50,
        landscapeAreaFt2: 100,
        specialLandscapeAreaFt2: 200,
        etaf: 0.55,
      }),
    ).toThrow(/exceeds the landscape area/);
    expect(() =>
      maximumAppliedWaterAllowance({ etoInPerYear: 50, landscapeAreaFt2: 100, specialLandscapeAreaFt2: 0, etaf: 0 }),
    ).toThrow(/ETAF/);
  });

  it('never gives a negative allowance when effective rain exceeds ETo', () => {
    expect(
      maximumAppliedWaterAllowance({
        etoInPerYear: 10,
        landscapeAreaFt2: 100,
        specialLandscapeAreaFt2: 0,
        etaf: 0.55,
        effectivePrecipitationInPerYear: 12,
      }).gallons,
    ).toBe(0);
  });

  it('flags a design whose use exceeds the allowance and whose regular ETAF is too high', () => {
    // All turf on spray: ETAF = 0.7/0.75 = 0.933 > 0.55.
    const etwu = estimatedTotalWaterUse(50, [
      { areaFt2: 10_000, plantFactor: 0.7, irrigationEfficiency: 0.75, specialLandscapeArea: false },
    ]);
    const mawa = maximumAppliedWaterAllowance({
      etoInPerYear: 50,
      landscapeAreaFt2: 10_000,
      specialLandscapeAreaFt2: 0,
      etaf: 0.55,
    });
    const result = mweloCompliance(etwu, mawa, 0.55);
    expect(result.complies).toBe(false);
    expect(result.reasons).toHaveLength(2);
    expect(etwu.regularAreaEtaf).toBeCloseTo(0.7 / 0.75, 12);
  });

  it('computes the sitewide ETAF as (B + D)/(A + C)', () => {
    // Regular 1,000 ft² at PF 0.3/IE 0.81; SLA 500 ft² at ETAF 1 → (370.37 + 500)/1500.
    const etwu = estimatedTotalWaterUse(50, [
      { areaFt2: 1000, plantFactor: 0.3, irrigationEfficiency: 0.81, specialLandscapeArea: false },
      { areaFt2: 500, plantFactor: 0.8, irrigationEfficiency: 0.75, specialLandscapeArea: true },
    ]);
    expect(etwu.sitewideEtaf).toBeCloseTo((1000 * (0.3 / 0.81) + 500) / 1500, 12);
    expect(etwu.regularAreaEtaf).toBeCloseTo(0.3 / 0.81, 12);
  });
});
