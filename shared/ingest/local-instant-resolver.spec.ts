import { describe, expect, it } from 'vitest';
import { createInstantResolver } from './local-instant-resolver';
import { parseTimestamp } from './timestamp-parsing';

function stamp(text: string) {
  const parsed = parseTimestamp(text);
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed;
}
const iso = (r: { ok: boolean; utcMs?: number }) => (r.ok ? new Date(r.utcMs!).toISOString().slice(0, 16) : 'ERR');

describe('createInstantResolver: fall-back', () => {
  it('Los Angeles hourly: the second 01:00 of a meter maps to the later (PST) instant', () => {
    const r = createInstantResolver('America/Los_Angeles');
    const got = ['2026-11-01 00:00', '2026-11-01 01:00', '2026-11-01 01:00', '2026-11-01 02:00'].map((t) =>
      iso(r.resolve('M1', stamp(t))),
    );
    expect(got).toEqual(['2026-11-01T07:00', '2026-11-01T08:00', '2026-11-01T09:00', '2026-11-01T10:00']);
  });

  it('Denver 15-minute: 01:00…01:45 then 01:00…01:45 again map to MDT then MST', () => {
    const r = createInstantResolver('America/Denver');
    const labels = ['01:00', '01:15', '01:30', '01:45', '01:00', '01:15', '01:30', '01:45', '02:00'];
    const got = labels.map((t) => iso(r.resolve('M1', stamp(`2026-11-01 ${t}`))));
    expect(got).toEqual([
      '2026-11-01T07:00',
      '2026-11-01T07:15',
      '2026-11-01T07:30',
      '2026-11-01T07:45',
      '2026-11-01T08:00',
      '2026-11-01T08:15',
      '2026-11-01T08:30',
      '2026-11-01T08:45',
      '2026-11-01T09:00',
    ]);
  });

  it('tracks order per meter: interleaved meters each get their own first occurrence', () => {
    const r = createInstantResolver('America/Los_Angeles');
    const seq: Array<[string, string]> = [
      ['A', '01:00'],
      ['B', '01:00'],
      ['A', '01:00'],
      ['B', '01:00'],
    ];
    expect(seq.map(([m, t]) => iso(r.resolve(m, stamp(`2026-11-01 ${t}`))))).toEqual([
      '2026-11-01T08:00',
      '2026-11-01T08:00',
      '2026-11-01T09:00',
      '2026-11-01T09:00',
    ]);
  });

  it('a value with an offset is exact and moves the meter past the fold', () => {
    const r = createInstantResolver('America/Los_Angeles');
    expect(iso(r.resolve('M', stamp('2026-11-01T01:30:00-08:00')))).toBe('2026-11-01T09:30');
    expect(iso(r.resolve('M', stamp('2026-11-01 01:45')))).toBe('2026-11-01T09:45');
  });
});

describe('createInstantResolver: spring-forward', () => {
  it('a row in the gap is an error naming the time and zone, not a shifted instant', () => {
    const r = createInstantResolver('America/Denver');
    const result = r.resolve('M', stamp('2026-03-08 02:30'));
    expect(result).toEqual({
      ok: false,
      message:
        '2026-03-08 02:30 does not exist in America/Denver (clocks spring ' +
        "forward past it); check the export's clock or the site's time zone",
    });
  });
});

describe('resolveNotBefore', () => {
  it('a run end in the repeated hour picks the instant after the start', () => {
    const r = createInstantResolver('America/Los_Angeles');
    const start = Date.UTC(2026, 10, 1, 9, 10); // 01:10 PST, the second 01:10
    expect(iso(r.resolveNotBefore(stamp('2026-11-01 01:40'), start))).toBe('2026-11-01T09:40');
    expect(iso(r.resolveNotBefore(stamp('2026-11-01 01:40'), Date.UTC(2026, 10, 1, 8, 0)))).toBe('2026-11-01T08:40');
  });
});
