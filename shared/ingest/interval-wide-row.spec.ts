import { describe, expect, it } from 'vitest';
import { createIntervalWideReader } from './interval-wide-row';
import type { IntervalRecord, RowOutcome } from './ingest-records';
import type { ColumnMapping } from './upload-kind';

const now = new Date('2026-12-01T00:00:00Z');
const hours = Array.from({ length: 24 }, (_, i) => `Hr ${String(i + 1).padStart(2, '0')}`);
const mapping: ColumnMapping = {
  kind: 'interval-wide',
  header: ['Meter', 'Read Date', ...hours],
  columns: { meter: 0, date: 1 },
  intervalColumns: { first: 2, count: 24 },
  unit: 'gal',
};
const records = (outs: RowOutcome<IntervalRecord>[]) => outs.flatMap((o) => (o.ok ? [o.record] : []));

describe('createIntervalWideReader', () => {
  it('an ordinary day gives 24 hourly records', () => {
    const reader = createIntervalWideReader(mapping, { timeZone: 'America/Denver', now });
    const out = reader.read(['OFFICE-PARK-01', '2026-11-10', ...Array(24).fill('2')], 2);
    expect(records(out)).toHaveLength(24);
    expect(records(out)[0]).toEqual({
      meterRef: 'OFFICE-PARK-01',
      startUtc: '2026-11-10T07:00:00.000Z',
      minutes: 60,
      volume: 2,
      unit: 'gal',
    });
  });

  it('fall-back with 24 columns: Hr 02 becomes one 120-minute record; totals are kept', () => {
    const reader = createIntervalWideReader(mapping, { timeZone: 'America/Denver', now });
    const values = Array.from({ length: 24 }, (_, i) => String(i + 1));
    const recs = records(reader.read(['M', '2026-11-01', ...values], 2));
    expect(recs).toHaveLength(24);
    expect(recs[1]).toMatchObject({ startUtc: '2026-11-01T07:00:00.000Z', minutes: 120, volume: 2 });
    expect(recs.reduce((s, r) => s + r.volume, 0)).toBe(300);
  });

  it('spring-forward with 24 columns: Hr 03 empty → 23 records; Hr 03 non-zero → an error in that column', () => {
    const reader = createIntervalWideReader(mapping, { timeZone: 'America/Los_Angeles', now });
    const cells = Array(24).fill('1');
    cells[2] = '';
    expect(records(reader.read(['M', '2026-03-08', ...cells], 2))).toHaveLength(23);
    cells[2] = '0';
    expect(reader.read(['M', '2026-03-08', ...cells], 3).every((o) => o.ok)).toBe(true);
    cells[2] = '4';
    const errors = reader.read(['M', '2026-03-08', ...cells], 4).filter((o) => !o.ok);
    expect(errors).toEqual([
      {
        ok: false,
        row: 4,
        column: 5,
        message:
          'Hr 03: this clock time does not exist on 2026-03-08 in America/Los_Angeles ' +
          '(clocks spring forward); it should be empty',
      },
    ]);
  });

  it('empty cells are missing readings; a bad cell is an error in its own column', () => {
    const reader = createIntervalWideReader(mapping, { timeZone: 'UTC', now });
    const cells = Array(24).fill('');
    cells[0] = '1';
    cells[5] = 'x';
    const out = reader.read(['M', '2026-11-10', ...cells], 2);
    expect(records(out)).toHaveLength(1);
    expect(out.filter((o) => !o.ok)).toEqual([{ ok: false, row: 2, column: 8, message: 'Hr 06: "x" is not a number' }]);
  });

  it('a date with a time, and hours after now, are errors', () => {
    const reader = createIntervalWideReader(mapping, { timeZone: 'UTC', now });
    expect(reader.read(['M', '2026-11-10 06:00', ...Array(24).fill('1')], 2)).toEqual([
      { ok: false, row: 2, column: 2, message: 'Read Date: should be a local date (one row per day)' },
    ]);
    const out = reader.read(['M', '2026-11-30', ...Array(24).fill('1')], 3);
    expect(records(out)).toHaveLength(24);
    expect(reader.read(['M', '2026-12-01', ...Array(24).fill('1')], 4).filter((o) => !o.ok)).toHaveLength(24);
  });
});
