import { describe, expect, it } from 'vitest';
import { layoutWideDay, type WideSlot } from './wide-day-layout';

const day = (year: number, month: number, d: number) => ({ year, month, day: d, hour: 0, minute: 0, second: 0 });
const iso = (ms: number) => new Date(ms).toISOString().slice(0, 16);
function slots(result: ReturnType<typeof layoutWideDay>): WideSlot[] {
  if (!result.ok) throw new Error(result.message);
  return result.slots;
}
const intervals = (s: WideSlot[]) =>
  s.filter((x): x is Extract<WideSlot, { kind: 'interval' }> => x.kind === 'interval');

describe('layoutWideDay', () => {
  it('an ordinary day: 24 hourly columns from local midnight', () => {
    const s = intervals(slots(layoutWideDay(day(2026, 7, 1), 24, 'America/Los_Angeles')));
    expect(s).toHaveLength(24);
    expect(iso(s[0]!.startUtcMs)).toBe('2026-07-01T07:00');
    expect(iso(s[23]!.startUtcMs)).toBe('2026-07-02T06:00');
  });

  it('spring-forward, 24 columns: column 3 (02:00–03:00) is skipped, 23 intervals remain', () => {
    const s = slots(layoutWideDay(day(2026, 3, 8), 24, 'America/Denver'));
    expect(s.filter((x) => x.kind === 'skipped')).toEqual([{ kind: 'skipped', column: 2 }]);
    const iv = intervals(s);
    expect(iv).toHaveLength(23);
    expect(iv.map((x) => x.minutes).every((m) => m === 60)).toBe(true);
    expect(iso(iv[1]!.startUtcMs)).toBe('2026-03-08T08:00'); // 01:00 MST
    expect(iso(iv[2]!.startUtcMs)).toBe('2026-03-08T09:00'); // 03:00 MDT
  });

  it('spring-forward, 23 columns: elapsed hours in order', () => {
    const iv = intervals(slots(layoutWideDay(day(2026, 3, 8), 23, 'America/Los_Angeles')));
    expect(iv).toHaveLength(23);
    expect(iso(iv[2]!.startUtcMs)).toBe('2026-03-08T10:00'); // 03:00 PDT
  });

  it('fall-back, 24 columns: the repeated hour folds into one 120-minute interval', () => {
    const iv = intervals(slots(layoutWideDay(day(2026, 11, 1), 24, 'America/Los_Angeles')));
    expect(iv).toHaveLength(24);
    expect(iv[1]).toEqual({ kind: 'interval', columns: [1], startUtcMs: Date.UTC(2026, 10, 1, 8), minutes: 120 });
    expect(iso(iv[2]!.startUtcMs)).toBe('2026-11-01T10:00');
    expect(iv.reduce((sum, x) => sum + x.minutes, 0)).toBe(25 * 60);
  });

  it('fall-back, 96 columns: the four quarter-hours of the repeated hour fold into one 120-minute interval', () => {
    const iv = intervals(slots(layoutWideDay(day(2026, 11, 1), 96, 'America/Denver')));
    expect(iv).toHaveLength(93);
    expect(iv[4]).toEqual({
      kind: 'interval',
      columns: [4, 5, 6, 7],
      startUtcMs: Date.UTC(2026, 10, 1, 7),
      minutes: 120,
    });
    expect(iv.reduce((sum, x) => sum + x.minutes, 0)).toBe(25 * 60);
  });

  it('fall-back, 25 columns: elapsed hours, 01:00 twice', () => {
    const iv = intervals(slots(layoutWideDay(day(2026, 11, 1), 25, 'America/Los_Angeles')));
    expect(iv.map((x) => iso(x.startUtcMs)).slice(1, 4)).toEqual([
      '2026-11-01T08:00',
      '2026-11-01T09:00',
      '2026-11-01T10:00',
    ]);
  });

  it('25 columns on an ordinary day do not fit', () => {
    expect(layoutWideDay(day(2026, 7, 1), 25, 'America/Los_Angeles')).toEqual({
      ok: false,
      message: '25 interval columns do not fit 2026-07-01, a 24-hour day in America/Los_Angeles',
    });
  });

  it('an odd column count is refused', () => {
    expect(layoutWideDay(day(2026, 7, 1), 30, 'UTC').ok).toBe(false);
  });
});
