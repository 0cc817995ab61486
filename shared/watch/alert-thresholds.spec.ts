import { describe, expect, it } from 'vitest';
import { DEFAULT_THRESHOLDS, resolveThresholds, type ThresholdName } from './alert-thresholds';

describe('DEFAULT_THRESHOLDS', () => {
  it('gives every threshold a usable value, a unit and a plain-words explanation', () => {
    for (const [name, spec] of Object.entries(DEFAULT_THRESHOLDS)) {
      expect(Number.isFinite(spec.value) && spec.value >= 0, name).toBe(true);
      expect(spec.unit.length, name).toBeGreaterThan(0);
      expect(spec.explanation.length, name).toBeGreaterThan(20);
    }
  });

  it('says "common practice, no source" on the trade rules of thumb', () => {
    const ruleOfThumb: ThresholdName[] = ['continuousFlowHours', 'monthlyLeakRatio', 'overVolumeRatio'];
    for (const name of ruleOfThumb)
      expect(DEFAULT_THRESHOLDS[name].explanation, name).toMatch(/common practice, no source/);
  });
});

describe('resolveThresholds', () => {
  it("applies a site's overrides over the defaults", () => {
    const t = resolveThresholds({ continuousFlowHours: 36 });
    expect(t.continuousFlowHours).toBe(36);
    expect(t.monthlyLeakRatio).toBe(DEFAULT_THRESHOLDS.monthlyLeakRatio.value);
  });

  it('rejects negative or non-numeric values and impossible hours', () => {
    expect(() => resolveThresholds({ overVolumeRatio: -1 })).toThrow(/overVolumeRatio/);
    expect(() => resolveThresholds({ silentHours: Number.NaN })).toThrow(/silentHours/);
    expect(() => resolveThresholds({ nightStartHour: 24 })).toThrow(/nightStartHour/);
    expect(() => resolveThresholds({ nightEndHour: 2.5 })).toThrow(/nightEndHour/);
  });
});
