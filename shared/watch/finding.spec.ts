import { describe, expect, it } from 'vitest';
import type { RateSchedule } from '../rates/rate-schedule';
import { resolveThresholds } from './alert-thresholds';
import {
  completeFinding,
  conditionKeyOf,
  findingKeyOf,
  priceLostWater,
  severityOfLoss,
  type FindingDraft,
} from './finding';
import { testSite } from './watch-test-input';

// Invented tiered rate: 100 CCF at $2, then $5.
const tiers: RateSchedule = {
  name: 'Invented tiers',
  unit: 'ccf',
  currency: 'USD',
  fixedChargePerPeriod: 30,
  volumeCharge: {
    kind: 'tiered',
    tiers: [
      { upToUnits: 100, pricePerUnit: 2 },
      { upToUnits: null, pricePerUnit: 5 },
    ],
  },
};
const CCF = 748.051948; // gallons in 100 ft³

describe('keys', () => {
  it('name the condition without the period, and the episode with its start', () => {
    const condition = conditionKeyOf('s1', 'runaway-zone', 'long-run', 'Z3');
    expect(condition).toBe('s1|runaway-zone|long-run|Z3');
    expect(findingKeyOf(condition, Date.UTC(2026, 6, 1, 4))).toBe(
      's1|runaway-zone|long-run|Z3|2026-07-01T04:00:00.000Z',
    );
    expect(conditionKeyOf('s1', 'leak', 'continuous-flow')).toBe('s1|leak|continuous-flow|-');
  });
});

describe('priceLostWater', () => {
  it("prices the waste in the tier just above the month's budget", () => {
    // Budget 90 CCF; 20 CCF lost → 10 CCF at $2 and 10 CCF at $5 = $70.
    const site = testSite({ rateSchedule: tiers, monthlyBudgets: [{ month: '2026-06', gallons: 90 * CCF }] });
    expect(priceLostWater(site, '2026-06', 20 * CCF)).toEqual({ amount: 70, currency: 'USD' });
  });

  it('is null without a rate schedule', () => {
    expect(priceLostWater(testSite(), '2026-06', 1000)).toBeNull();
  });
});

describe('severityOfLoss', () => {
  // 30,000 gal in June → about 985.5 gal a day on average (30,000 / 30.44).
  const site = testSite();
  const t = resolveThresholds();
  it('grades waste against the average daily budget', () => {
    expect(severityOfLoss(50, site, t)).toBe('watch');
    expect(severityOfLoss(200, site, t)).toBe('act-soon');
    expect(severityOfLoss(600, site, t)).toBe('act-now');
  });
});

describe('completeFinding', () => {
  it("adds keys, site, money and a loss-based severity to a detector's draft", () => {
    const draft: FindingDraft = {
      kind: 'leak',
      subKind: 'continuous-flow',
      periodStartUtc: Date.UTC(2026, 5, 1),
      periodEndUtc: Date.UTC(2026, 5, 3),
      detectedAtUtc: Date.UTC(2026, 5, 2),
      ongoing: true,
      evidence: {},
      series: [],
      waterLostGal: 1200,
      explanation: 'x',
      pricingMonth: '2026-06',
    };
    const f = completeFinding(draft, testSite({ rateSchedule: tiers }), resolveThresholds());
    expect(f.key).toBe('site-1|leak|continuous-flow|-|2026-06-01T00:00:00.000Z');
    expect(f.siteId).toBe('site-1');
    expect(f.severity).toBe('act-now'); // 600 gal/day against ~985 gal/day budget
    expect(f.moneyLost?.currency).toBe('USD');
    expect('pricingMonth' in f).toBe(false);
  });
});
