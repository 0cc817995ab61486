import { describe, expect, it } from 'vitest';
import { describeEffectiveRainMethod, effectiveRainMm } from './effective-rain';

describe('effective rain', () => {
  it('none credits nothing', () => {
    expect(effectiveRainMm({ kind: 'none' }, 12, 5)).toBe(0);
  });

  it('fixed fraction credits that share of the rain', () => {
    expect(effectiveRainMm({ kind: 'fixed-fraction', fraction: 0.25 }, 12, 5)).toBe(3);
  });

  it("threshold ignores small rain and caps the rest at the day's demand", () => {
    const method = { kind: 'threshold', minimumMm: 5 } as const;
    expect(effectiveRainMm(method, 4.9, 6)).toBe(0);
    expect(effectiveRainMm(method, 5.5, 6)).toBe(5.5);
    expect(effectiveRainMm(method, 25, 6)).toBe(6);
  });

  it('rejects negative rain and bad parameters', () => {
    expect(() => effectiveRainMm({ kind: 'none' }, -1, 5)).toThrow(/Rain -1 mm/);
    expect(() => effectiveRainMm({ kind: 'fixed-fraction', fraction: 1.5 }, 1, 5)).toThrow(/between 0 and 1/);
    expect(() => effectiveRainMm({ kind: 'threshold', minimumMm: -2 }, 1, 5)).toThrow(/zero or more/);
  });

  it('describes each method', () => {
    expect(describeEffectiveRainMethod({ kind: 'fixed-fraction', fraction: 0.25 })).toMatch(/^25 % of each day's rain/);
    expect(describeEffectiveRainMethod({ kind: 'threshold', minimumMm: 5 })).toMatch(/no published source/);
  });
});
