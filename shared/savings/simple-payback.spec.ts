import { describe, expect, it } from 'vitest';
import { annualSavings, simplePaybackYears } from './simple-payback';

describe('simple payback', () => {
  it('when half a year saved $600 on a $2,400 retrofit, then it pays back in about two years', () => {
    // 182.625 days = half of 365.25: $1,200 a year.
    expect(annualSavings(600, 182.625)).toBeCloseTo(1200, 9);
    expect(simplePaybackYears({ installedCost: 2400, savedMoney: 600, reportingDays: 182.625 })).toBeCloseTo(2, 9);
  });

  it('when nothing was saved, the price or cost is unknown, or no month was reported, then there is no payback', () => {
    expect(simplePaybackYears({ installedCost: 2400, savedMoney: 0, reportingDays: 200 })).toBeNull();
    expect(simplePaybackYears({ installedCost: 2400, savedMoney: -50, reportingDays: 200 })).toBeNull();
    expect(simplePaybackYears({ installedCost: null, savedMoney: 500, reportingDays: 200 })).toBeNull();
    expect(simplePaybackYears({ installedCost: 2400, savedMoney: null, reportingDays: 200 })).toBeNull();
    expect(simplePaybackYears({ installedCost: 2400, savedMoney: 500, reportingDays: 0 })).toBeNull();
  });

  it('when the cost is negative, then it is refused', () => {
    expect(() => simplePaybackYears({ installedCost: -1, savedMoney: 500, reportingDays: 200 })).toThrow(RangeError);
  });
});
