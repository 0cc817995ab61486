/**
 * Reference check: Rillmark's local-time → UTC conversion (shared/ingest/zoned-time.ts, built only on
 * Intl.DateTimeFormat offsets) agrees with date-fns-tz 3 (`fromZonedTime`, `formatInTimeZone`,
 * `getTimezoneOffset`), an independent implementation, across DST transitions. The ingest code does not use
 * date-fns-tz, so this is a real second opinion.
 * date-fns-tz picks one instant for a repeated (fall-back) wall time (the earlier one in US zones, the later one in
 * Australia/Sydney, as observed with 3.2) and shifts a spring-forward gap time; ours reports both instants, or the
 * gap. So: unique times must match exactly; for repeated times, date-fns-tz's instant must be one of our two and
 * both of ours must format back to the same wall time; for gap times, date-fns-tz's instant must NOT format back
 * to the wall time (it confirms the time does not exist).
 * Offsets are compared with `formatInTimeZone(..., 'xxx')`, not `getTimezoneOffset`: the latter returned the
 * post-transition offset for the hours just before a change (e.g. −420 at 2026-03-08T02:00Z in Los Angeles,
 * when the clock there still reads 18:00 PST), while its own formatter agrees with Intl.
 */
import { formatInTimeZone, fromZonedTime } from 'date-fns-tz';
import { describe, expect, it } from 'vitest';
import { resolveLocalTime, wallTimeFromUtcFields, zoneOffsetMinutes, type WallTime } from '@shared/ingest/zoned-time';

const p2 = (n: number) => String(n).padStart(2, '0');
const wallText = (w: WallTime) => `${w.year}-${p2(w.month)}-${p2(w.day)}T${p2(w.hour)}:${p2(w.minute)}:00`;
const formatted = (utcMs: number, zone: string) => formatInTimeZone(new Date(utcMs), zone, "yyyy-MM-dd'T'HH:mm:ss");

/** Every wall time from `fromIso` (inclusive) to `toIso` (exclusive), `stepMinutes` apart on the clock face. */
function walls(fromIso: string, toIso: string, stepMinutes: number): WallTime[] {
  const out: WallTime[] = [];
  for (let ms = Date.parse(`${fromIso}Z`); ms < Date.parse(`${toIso}Z`); ms += stepMinutes * 60_000)
    out.push(wallTimeFromUtcFields(ms));
  return out;
}

function compare(zone: string, list: WallTime[]) {
  const counts = { unique: 0, ambiguous: 0, gap: 0 };
  for (const wall of list) {
    const text = wallText(wall);
    const theirs = fromZonedTime(text, zone).getTime();
    const ours = resolveLocalTime(wall, zone);
    counts[ours.kind]++;
    if (ours.kind === 'unique') {
      expect(ours.utcMs, `${zone} ${text}`).toBe(theirs);
    } else if (ours.kind === 'ambiguous') {
      expect([ours.earlierUtcMs, ours.laterUtcMs], `${zone} ${text}`).toContain(theirs);
      expect(formatted(ours.earlierUtcMs, zone)).toBe(text);
      expect(formatted(ours.laterUtcMs, zone)).toBe(text);
      expect(ours.laterUtcMs).toBeGreaterThan(ours.earlierUtcMs);
    } else {
      expect(formatted(theirs, zone), `${zone} ${text} should not exist`).not.toBe(text);
    }
  }
  return counts;
}

describe('local → UTC agrees with date-fns-tz across DST transitions (15-minute steps)', () => {
  it('America/Los_Angeles, 2026 spring-forward (03-08) and fall-back (11-01)', () => {
    expect(compare('America/Los_Angeles', walls('2026-03-07T00:00:00', '2026-03-10T00:00:00', 15))).toMatchObject({
      gap: 4,
      ambiguous: 0,
    });
    expect(compare('America/Los_Angeles', walls('2026-10-31T00:00:00', '2026-11-03T00:00:00', 15))).toMatchObject({
      gap: 0,
      ambiguous: 4,
    });
  });

  it('America/Denver, 2026 spring-forward and fall-back', () => {
    expect(compare('America/Denver', walls('2026-03-07T00:00:00', '2026-03-10T00:00:00', 15))).toMatchObject({
      gap: 4,
    });
    expect(compare('America/Denver', walls('2026-10-31T00:00:00', '2026-11-03T00:00:00', 15))).toMatchObject({
      ambiguous: 4,
    });
  });

  it('America/Phoenix has no DST: every time is unique', () => {
    expect(compare('America/Phoenix', walls('2026-03-07T00:00:00', '2026-03-10T00:00:00', 15))).toEqual({
      unique: 288,
      ambiguous: 0,
      gap: 0,
    });
  });

  it('southern hemisphere and a 30-minute DST shift (Australia/Sydney, Australia/Lord_Howe)', () => {
    expect(compare('Australia/Sydney', walls('2026-04-04T00:00:00', '2026-04-06T00:00:00', 15))).toMatchObject({
      ambiguous: 4,
    });
    expect(compare('Australia/Sydney', walls('2026-10-03T00:00:00', '2026-10-05T00:00:00', 15))).toMatchObject({
      gap: 4,
    });
    expect(compare('Australia/Lord_Howe', walls('2026-04-04T00:00:00', '2026-04-06T00:00:00', 15))).toMatchObject({
      ambiguous: 2,
    });
    expect(compare('Australia/Lord_Howe', walls('2026-10-03T00:00:00', '2026-10-05T00:00:00', 15))).toMatchObject({
      gap: 2,
    });
  });
});

describe('whole-year check, hourly', () => {
  it.each(['America/Los_Angeles', 'America/Denver'])(
    '%s, 2026: one gap hour, one repeated hour, the rest agree',
    (zone) => {
      expect(compare(zone, walls('2026-01-01T00:00:00', '2027-01-01T00:00:00', 60))).toEqual({
        unique: 8758,
        ambiguous: 1,
        gap: 1,
      });
    },
  );
});

/** date-fns-tz's offset for an instant, from its `xxx` (e.g. `-08:00`, `+10:30`) format token. */
function theirOffsetMinutes(ms: number, zone: string): number {
  const [sign, hh, mm] = /^([+-])(\d{2}):(\d{2})$/.exec(formatInTimeZone(new Date(ms), zone, 'xxx'))!.slice(1);
  return (sign === '-' ? -1 : 1) * (Number(hh) * 60 + Number(mm));
}

describe('zone offsets agree with date-fns-tz formatInTimeZone', () => {
  it.each(['America/Los_Angeles', 'America/Denver', 'Australia/Lord_Howe'])('%s, every hour of 2026', (zone) => {
    const seen = new Set<number>();
    for (let ms = Date.UTC(2026, 0, 1); ms < Date.UTC(2027, 0, 1); ms += 3_600_000) {
      const ours = zoneOffsetMinutes(ms, zone);
      expect(ours, new Date(ms).toISOString()).toBe(theirOffsetMinutes(ms, zone));
      seen.add(ours);
    }
    expect(seen.size).toBe(2); // both standard and daylight time were exercised
  });
});
