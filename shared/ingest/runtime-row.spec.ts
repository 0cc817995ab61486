import { describe, expect, it } from 'vitest';
import { createRuntimeReader, parseRuntimeCause } from './runtime-row';
import type { ColumnMapping } from './upload-kind';

const now = new Date('2026-12-01T00:00:00Z');
const withDuration: ColumnMapping = {
  kind: 'runtime',
  header: ['Controller', 'Station', 'Start Time', 'Run Time (min)', 'Cause', 'Flow (gal)'],
  columns: { controller: 0, station: 1, start: 2, duration: 3, cause: 4, measuredGallons: 5 },
};
const withEnd: ColumnMapping = {
  kind: 'runtime',
  header: ['Controller ID', 'Zone', 'Date', 'Start', 'End'],
  columns: { controller: 0, station: 1, date: 2, start: 3, end: 4 },
};

describe('parseRuntimeCause', () => {
  it.each([
    ['Scheduled', 'scheduled'],
    ['Program A', 'scheduled'],
    ['Manual', 'manual'],
    ['Rain Skip', 'skipped-rain'],
    ['Rain sensor', 'skipped-rain'],
    ['Wind skip', 'skipped-wind'],
    ['', null],
    ['Gremlins', undefined],
  ])('%j → %s', (text, cause) => {
    expect(parseRuntimeCause(text)).toBe(cause);
  });
});

describe('createRuntimeReader', () => {
  it('start + duration + cause + measured gallons', () => {
    const reader = createRuntimeReader(withDuration, { timeZone: 'America/Los_Angeles', now });
    expect(reader.read(['CTL-HOA-NORTH-A', '2', '2026-10-30 22:12', '15', 'Scheduled', '142.0'], 2)).toEqual({
      ok: true,
      record: {
        controllerRef: 'CTL-HOA-NORTH-A',
        station: '2',
        startUtc: '2026-10-31T05:12:00.000Z',
        minutes: 15,
        cause: 'scheduled',
        measuredGallons: 142,
      },
    });
  });

  it('date + time-only start/end; a run past midnight ends the next day', () => {
    const reader = createRuntimeReader(withEnd, { timeZone: 'America/Los_Angeles', now });
    expect(reader.read(['CTL-SCHOOL-A', 'B1', '11/3/2026', '11:50 PM', '12:10 AM'], 2)).toEqual({
      ok: true,
      record: {
        controllerRef: 'CTL-SCHOOL-A',
        station: 'B1',
        startUtc: '2026-11-04T07:50:00.000Z',
        minutes: 20,
        cause: null,
      },
    });
  });

  it('a run across the fall-back hour lasts its real elapsed time', () => {
    const reader = createRuntimeReader(withEnd, { timeZone: 'America/Denver', now });
    // 00:50 MDT → 01:20 in the second (MST) pass would be 90 min; the reader picks the first end after the start: 30
    // min.
    expect(reader.read(['C', '1', '2026-11-01', '00:50', '01:20'], 2)).toMatchObject({
      ok: true,
      record: { minutes: 30 },
    });
    // Start in the second 01:xx (after a row that reached it) and end at 02:10 MST.
    const r2 = createRuntimeReader(withEnd, { timeZone: 'America/Denver', now });
    r2.read(['C', '1', '2026-11-01', '01:30', '01:40'], 2);
    expect(r2.read(['C', '1', '2026-11-01', '01:30', '02:10'], 3)).toMatchObject({
      ok: true,
      record: { startUtc: '2026-11-01T08:30:00.000Z', minutes: 40 },
    });
  });

  it('a start in the spring-forward gap is an error in the start column', () => {
    const reader = createRuntimeReader(withEnd, { timeZone: 'America/Denver', now });
    expect(reader.read(['C', '1', '2026-03-08', '02:15', '02:45'], 6)).toMatchObject({
      ok: false,
      row: 6,
      column: 4,
      message: expect.stringMatching(/does not exist/),
    });
  });

  it('errors: empty station, unknown cause, negative duration, future start, unknown controller', () => {
    const reader = createRuntimeReader(withDuration, { timeZone: 'UTC', now, knownRefs: new Set(['CTL-HOA-NORTH-A']) });
    const base = ['CTL-HOA-NORTH-A', '2', '2026-10-30 22:12', '15', 'Scheduled', ''];
    const withCell = (i: number, v: string) => base.map((c, k) => (k === i ? v : c));
    expect(reader.read(withCell(1, ''), 2)).toMatchObject({ ok: false, column: 2 });
    expect(reader.read(withCell(4, 'Gremlins'), 3)).toMatchObject({ ok: false, column: 5 });
    expect(reader.read(withCell(3, '-4'), 4)).toMatchObject({ ok: false, column: 4 });
    expect(reader.read(withCell(2, '2027-01-01 00:00'), 5)).toMatchObject({ ok: false, column: 3 });
    expect(reader.read(withCell(0, 'CTL-OTHER'), 6)).toMatchObject({
      ok: false,
      column: 1,
      message: expect.stringMatching(/unknown controller/),
    });
    expect(reader.read(base, 7)).toMatchObject({ ok: true });
  });
});
