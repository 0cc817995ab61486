import { describe, expect, it } from 'vitest';
import { HOUR_MS, inLocalWindow, localHourOf, localMidnightUtc, nightOf } from './site-clock';

const LA = 'America/Los_Angeles';
const SYD = 'Australia/Sydney';

describe('localHourOf', () => {
  it('reads local date and hour in summer and winter time', () => {
    expect(localHourOf(Date.UTC(2026, 6, 1, 4), LA)).toEqual({ date: '2026-06-30', month: '2026-06', hour: 21 });
    expect(localHourOf(Date.UTC(2026, 0, 1, 5), LA)).toEqual({ date: '2025-12-31', month: '2025-12', hour: 21 });
  });

  it('gives 23 distinct local hours on the spring-forward day and repeats 01 on the fall-back day', () => {
    const spring = localMidnightUtc('2026-03-08', LA);
    const springHours = Array.from({ length: 23 }, (_, i) => localHourOf(spring + i * HOUR_MS, LA));
    expect(springHours.every((h) => h.date === '2026-03-08')).toBe(true);
    expect(springHours.map((h) => h.hour)).not.toContain(2);
    expect(localHourOf(spring + 23 * HOUR_MS, LA).date).toBe('2026-03-09');

    const fall = localMidnightUtc('2026-11-01', LA);
    const fallHours = Array.from({ length: 25 }, (_, i) => localHourOf(fall + i * HOUR_MS, LA).hour);
    expect(fallHours.slice(0, 4)).toEqual([0, 1, 1, 2]);
    expect(localHourOf(fall + 25 * HOUR_MS, LA).date).toBe('2026-11-02');
  });

  it('handles a southern-hemisphere zone whose DST runs October to April', () => {
    // 2026-10-04 Sydney springs forward at 02:00 → 03:00 (AEST +10 → AEDT +11).
    expect(localHourOf(Date.UTC(2026, 9, 3, 15), SYD)).toMatchObject({ date: '2026-10-04', hour: 1 });
    expect(localHourOf(Date.UTC(2026, 9, 3, 16), SYD)).toMatchObject({ date: '2026-10-04', hour: 3 });
  });
});

describe('localMidnightUtc', () => {
  it('is 07:00 or 08:00 UTC in Los Angeles depending on the season', () => {
    expect(localMidnightUtc('2026-07-01', LA)).toBe(Date.UTC(2026, 6, 1, 7));
    expect(localMidnightUtc('2026-01-15', LA)).toBe(Date.UTC(2026, 0, 15, 8));
  });
});

describe('windows', () => {
  it('wraps past midnight when the start is later than the end', () => {
    const w = { startHour: 21, endHour: 6 };
    expect([20, 21, 23, 0, 5, 6].map((h) => inLocalWindow(h, w))).toEqual([false, true, true, true, true, false]);
  });

  it('names a wrapping night by the morning it ends on', () => {
    const w = { startHour: 22, endHour: 5 };
    expect(nightOf({ date: '2026-07-01', month: '2026-07', hour: 23 }, w)).toBe('2026-07-02');
    expect(nightOf({ date: '2026-07-02', month: '2026-07', hour: 3 }, w)).toBe('2026-07-02');
    expect(nightOf({ date: '2026-07-02', month: '2026-07', hour: 12 }, w)).toBeNull();
  });
});
