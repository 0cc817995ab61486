import { describe, expect, it } from 'vitest';
import { buildTimeline } from './hour-timeline';
import { detectOverspend } from './overspend-detection';
import { HOUR_MS } from './site-clock';
import { hours, repeat, T0, testContext, testZones } from './watch-test-input';

// June 2026 budget 30,000 gal = 1,000 gal/day. The site uses `perDay` gallons, all in the 22:00 hour.
function june(days: number, perDay: (d: number) => number) {
  const values: number[] = [];
  for (let d = 0; d < days; d++) values.push(...repeat(0, 22), perDay(d), 0);
  return buildTimeline(hours(T0, values), [], testZones, 'UTC');
}

describe('detectOverspend', () => {
  it('stays quiet while use keeps within 10 % of the prorated budget', () => {
    expect(
      detectOverspend(
        june(20, () => 1080),
        testContext(),
      ),
    ).toEqual([]);
  });

  it('flags month-to-date and projected overspend, with the month as the period', () => {
    // 1,300 gal/day for 14 days: 18,200 against 14,000 prorated (130 %); projected 18,200 + 1,300 × 16 = 39,000.
    const findings = detectOverspend(
      june(14, () => 1300),
      testContext(
        {},
        {
          rateSchedule: {
            name: 'Flat',
            unit: 'kgal',
            currency: 'USD',
            fixedChargePerPeriod: 0,
            volumeCharge: { kind: 'uniform', pricePerUnit: 4 },
          },
        },
      ),
    );
    expect(findings.map((f) => f.subKind)).toEqual(['month-to-date', 'projected-month-end']);
    const [toDate, projected] = findings;
    expect(toDate).toMatchObject({
      periodStartUtc: T0,
      periodEndUtc: T0 + 14 * 24 * HOUR_MS,
      ongoing: true,
      waterLostGal: 4200,
    });
    // Month to date is first judged on day 7 (9,100 > 1.1 × 7,000); the projection once it has 14 days.
    expect(toDate!.detectedAtUtc).toBe(T0 + 7 * 24 * HOUR_MS);
    expect(projected!.detectedAtUtc).toBe(T0 + 14 * 24 * HOUR_MS);
    expect(projected!.evidence['projectedGal']).toBe(39_000);
    // 9,000 gal over at $4 per kgal.
    expect(projected!.evidence['projectedExtraCost']).toBe(36);
  });

  it('says a month came back under the alert line instead of calling it over by 0 gal', () => {
    // 1,300 gal/day for 10 days (13,000 vs 10,000 prorated: flagged), then 600 a day for 10: 19,000 vs 20,000 (95 %).
    const findings = detectOverspend(
      june(20, (d) => (d < 10 ? 1300 : 600)),
      testContext(),
    );
    const toDate = findings.find((f) => f.subKind === 'month-to-date')!;
    expect(toDate).toMatchObject({ ongoing: false, waterLostGal: 0 });
    expect(toDate.explanation).toMatch(
      /^Over its budget so far on \d+ days? \(first on 2026-06-\d\d\); by 2026-06-20 19,000 gal against 20,000 gal .*\(95 %\), under the alert line again\.$/,
    );
    expect(toDate.explanation).not.toMatch(/by 0 gal/);
  });

  it('projects from the recent pace, so a late surge shows before the month-to-date total catches up', () => {
    // 800 gal/day for 20 days, then 2,500 gal/day for 4: to date 26,000 vs 24,000 (108 %, under 110 %), but
    // projected 26,000 + mean(last 14 days: 10 × 800 + 4 × 2,500 = 18,000 / 14) × 6 = 33,714 > 1.1 × 30,000.
    const findings = detectOverspend(
      june(24, (d) => (d < 20 ? 800 : 2500)),
      testContext(),
    );
    expect(findings.map((f) => f.subKind)).toEqual(['projected-month-end']);
    expect(findings[0]!.evidence['projectedGal']).toBeCloseTo(26_000 + (18_000 / 14) * 6, 6);
  });

  it("follows the daily budgets' shape when the site has them", () => {
    // Same 1,000 gal/day use; the daily budgets put 600 gal on each of the first 10 days and 1,200 after.
    const dailyBudgets = Array.from({ length: 30 }, (_, i) => ({
      date: `2026-06-${String(i + 1).padStart(2, '0')}`,
      gallons: i < 10 ? 600 : 1200,
    }));
    const findings = detectOverspend(
      june(10, () => 1000),
      testContext({}, { dailyBudgets }),
    );
    expect(findings[0]).toMatchObject({ subKind: 'month-to-date' });
    expect(findings[0]!.evidence['proratedBudgetGal']).toBe(6000);
  });
});
