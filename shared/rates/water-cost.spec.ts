import { describe, expect, it } from 'vitest';
import type { RateSchedule } from './rate-schedule';
import { validateRateSchedule } from './rate-schedule';
import { costOfBudget, costOfGap, costOfVolume } from './water-cost';

// Invented rates; every expected figure is a hand calculation in the comment beside it.
const CCF = 172_800 / 231; // gallons per CCF

const uniform: RateSchedule = {
  name: 'Uniform',
  unit: 'ccf',
  currency: 'USD',
  fixedChargePerPeriod: 20,
  volumeCharge: { kind: 'uniform', pricePerUnit: 4 },
};
const tiered: RateSchedule = {
  name: 'Tiered',
  unit: 'ccf',
  currency: 'USD',
  fixedChargePerPeriod: 15,
  volumeCharge: {
    kind: 'tiered',
    tiers: [
      { upToUnits: 10, pricePerUnit: 3 },
      { upToUnits: 30, pricePerUnit: 5 },
      { upToUnits: null, pricePerUnit: 8 },
    ],
  },
};
const budgetBased: RateSchedule = {
  name: 'Budget-based',
  unit: 'kgal',
  currency: 'USD',
  fixedChargePerPeriod: 10,
  volumeCharge: {
    kind: 'budget-based',
    tiers: [
      { upToPercentOfBudget: 100, pricePerUnit: 2 },
      { upToPercentOfBudget: 150, pricePerUnit: 6 },
      { upToPercentOfBudget: null, pricePerUnit: 12 },
    ],
  },
};

describe('cost of a volume', () => {
  it('uniform: 20 CCF × $4 + $20 = $100', () => {
    expect(costOfVolume(uniform, 20 * CCF).total).toBe(100);
  });

  it('tiered: 35 CCF = 10 × $3 + 20 × $5 + 5 × $8 + $15 = $185', () => {
    const cost = costOfVolume(tiered, 35 * CCF);
    expect(cost.total).toBe(185);
    expect(cost.lines.map((l) => Math.round(l.units * 1e6) / 1e6)).toEqual([10, 20, 5]);
  });

  it('tiered: within the first tier, 4 CCF = 4 × $3 + $15 = $27', () => {
    expect(costOfVolume(tiered, 4 * CCF).total).toBe(27);
  });

  it('zero use costs the fixed charge', () => {
    expect(costOfVolume(tiered, 0).total).toBe(15);
  });

  it('budget-based: budget 20 kgal, use 35 kgal = 20 × $2 + 10 × $6 + 5 × $12 + $10 = $170', () => {
    expect(costOfVolume(budgetBased, 35_000, 20_000).total).toBe(170);
  });

  it('budget-based without a budget is an error', () => {
    expect(() => costOfVolume(budgetBased, 1000)).toThrow(/needs the period's water budget/);
  });
});

describe('cost of the budget and of the gap', () => {
  it('budget cost: 20 kgal at $2 + $10 = $50', () => {
    expect(costOfBudget(budgetBased, 20_000).total).toBe(50);
  });

  it('gap: 35 kgal against a 20 kgal budget costs $170 − $50 = $120 more', () => {
    const gap = costOfGap(budgetBased, 35_000, 20_000);
    expect(gap.gapGal).toBe(15_000);
    expect(gap.gapCost).toBe(120);
  });

  it('under budget the gap is a saving: 5 CCF against 12 CCF on the tiered rate = −(5 × $3 + 2 × $5) = −$25', () => {
    expect(costOfGap(tiered, 5 * CCF, 12 * CCF).gapCost).toBe(-25);
  });
});

describe('rate schedule validation', () => {
  it('requires ascending bounds and an open-ended last tier', () => {
    const bad: RateSchedule = {
      ...tiered,
      volumeCharge: {
        kind: 'tiered',
        tiers: [
          { upToUnits: 30, pricePerUnit: 3 },
          { upToUnits: 10, pricePerUnit: 5 },
        ],
      },
    };
    expect(validateRateSchedule(bad)).toEqual([
      'The last tier must be open-ended (no upper bound (units))',
      "Tier 2 upper bound (units) must be above tier 1's",
    ]);
    expect(() => costOfVolume(bad, 100)).toThrow(/Rate schedule "Tiered"/);
  });

  it('rejects negative prices and fixed charges', () => {
    expect(
      validateRateSchedule({
        ...uniform,
        fixedChargePerPeriod: -1,
        volumeCharge: { kind: 'uniform', pricePerUnit: -2 },
      }),
    ).toEqual(['Fixed charge must be zero or more', 'Price 1 must be zero or more']);
  });
});
