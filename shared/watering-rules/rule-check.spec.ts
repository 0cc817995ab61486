import { describe, expect, it } from 'vitest';
import { HOUR_MS } from '../watch/site-clock';
import { hours, repeat, run, T0 } from '../watch/watch-test-input';
import { checkWatering } from './rule-check';
import { addressNumberOf, dayAllowed, ruleInForce, type SiteRule, type WateringRule } from './watering-rule';

// T0 is Monday 2026-06-01 00:00 UTC; the site clock is UTC here.
const rule = (over: Partial<WateringRule> = {}): WateringRule => ({
  id: 1,
  name: 'Summer rule',
  stage: 'Stage 2',
  dayMode: 'odd-even',
  weekdays: [],
  allowedHours: { startHour: 20, endHour: 8 },
  maxStationMinutes: 30,
  inForceFrom: '2026-05-01',
  inForceTo: '2026-09-30',
  ...over,
});
const under = (r: WateringRule, addressNumber: number | null = 7, assignedWeekdays: number[] = []): SiteRule => ({
  rule: r,
  assignment: { siteId: 1, addressNumber, assignedWeekdays },
});
const at = (day: number, hour: number, minute = 0) => T0 + (day - 1) * 24 * HOUR_MS + hour * HOUR_MS + minute * 60_000;

describe('watering rules', () => {
  it('allows odd dates to odd address numbers, fixed weekdays, assigned weekdays; unknown when it cannot tell', () => {
    expect(dayAllowed(under(rule()), '2026-06-03')).toBe(true);
    expect(dayAllowed(under(rule()), '2026-06-02')).toBe(false);
    expect(dayAllowed(under(rule(), 12), '2026-06-02')).toBe(true);
    expect(dayAllowed(under(rule(), null), '2026-06-02')).toBeNull();
    expect(dayAllowed(under(rule({ dayMode: 'weekdays', weekdays: [1, 4] })), '2026-06-01')).toBe(true); // Monday
    expect(dayAllowed(under(rule({ dayMode: 'weekdays', weekdays: [1, 4] })), '2026-06-02')).toBe(false);
    expect(dayAllowed(under(rule({ dayMode: 'assigned' }), null, [2]), '2026-06-02')).toBe(true);
    expect(dayAllowed(under(rule({ dayMode: 'assigned' }), null, []), '2026-06-02')).toBeNull();
    expect(addressNumberOf('1420 Vale Rd')).toBe(1420);
    expect(addressNumberOf('Vale Rd')).toBeNull();
  });

  it('picks the stage in force on the date, the latest to start when stages overlap', () => {
    const stage1 = under(rule({ id: 1, inForceFrom: '2026-01-01', inForceTo: null }));
    const stage2 = under(rule({ id: 2, inForceFrom: '2026-06-10', inForceTo: '2026-06-30' }));
    expect(ruleInForce([stage1, stage2], '2026-06-09')?.rule.id).toBe(1);
    expect(ruleInForce([stage1, stage2], '2026-06-15')?.rule.id).toBe(2);
    expect(ruleInForce([stage2], '2026-07-01')).toBeNull();
  });

  it('lists runs on a wrong day, at wrong hours or too long; manual runs are marked; skips never count', () => {
    const breaches = checkWatering({
      rules: [under(rule())],
      timeZone: 'UTC',
      runs: [
        run('A', at(2, 22), 10), // even date
        run('A', at(3, 14), 10), // afternoon
        run('B', at(5, 21), 45), // over 30 min
        run('B', at(5, 13), 15, { cause: 'manual' }),
        run('A', at(7, 21), 10), // fine
        run('C', at(9, 7, 30), 40), // runs past 08:00 and over 30 min
        run('C', at(4, 14), 20, { cause: 'skipped-rain' }),
      ],
    });
    expect(breaches.map((b) => [b.localStart, b.reasons, b.manual])).toEqual([
      ['2026-06-02 22:00', ['day'], false],
      ['2026-06-03 14:00', ['hours'], false],
      ['2026-06-05 13:00', ['hours'], true],
      ['2026-06-05 21:00', ['minutes'], false],
      ['2026-06-09 07:30', ['hours', 'minutes'], false],
    ]);
  });

  it('judges metered hours when the site sends no controller log, and not a small steady flow', () => {
    // Base flow 2 gal/h all day; watering of 120 gal/h at 21:00 on the 3rd (fine) and at 15:00 on the 3rd (not).
    const values = repeat(2, 5 * 24);
    values[2 * 24 + 21] = 120;
    values[2 * 24 + 15] = 120;
    values[2 * 24 + 16] = 110;
    const breaches = checkWatering({
      rules: [under(rule())],
      timeZone: 'UTC',
      runs: [],
      meterHours: hours(T0, values),
    });
    expect(breaches).toHaveLength(1);
    expect(breaches[0]).toMatchObject({ source: 'meter', zoneId: null, minutes: 120, reasons: ['hours'] });
  });
});
