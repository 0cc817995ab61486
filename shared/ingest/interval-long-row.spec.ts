import { describe, expect, it } from 'vitest';
import { createIntervalLongReader } from './interval-long-row';
import type { ColumnMapping } from './upload-kind';

const now = new Date('2026-12-01T00:00:00Z');
const mapping: ColumnMapping = {
  kind: 'interval-long',
  header: ['Meter #', 'Interval Start', 'Usage (Gal)'],
  columns: { meter: 0, timestamp: 1, value: 2 },
  unit: 'gal',
  intervalMinutes: 60,
};

describe('createIntervalLongReader', () => {
  it('a row becomes a record with the UTC start', () => {
    const reader = createIntervalLongReader(mapping, { timeZone: 'America/Los_Angeles', now });
    expect(reader.read(['HOA-NORTH-01', '2026-11-10 00:00', '1,234.5'], 2)).toEqual({
      ok: true,
      record: {
        meterRef: 'HOA-NORTH-01',
        startUtc: '2026-11-10T08:00:00.000Z',
        minutes: 60,
        volume: 1234.5,
        unit: 'gal',
      },
    });
  });

  it('fall-back: the repeated 01:00 row maps to PDT then PST', () => {
    const reader = createIntervalLongReader(mapping, { timeZone: 'America/Los_Angeles', now });
    const starts = ['00:00', '01:00', '01:00', '02:00'].map((t) => {
      const out = reader.read(['M', `2026-11-01 ${t}`, '1'], 2);
      return out?.ok ? out.record.startUtc : out;
    });
    expect(starts).toEqual([
      '2026-11-01T07:00:00.000Z',
      '2026-11-01T08:00:00.000Z',
      '2026-11-01T09:00:00.000Z',
      '2026-11-01T10:00:00.000Z',
    ]);
  });

  it('errors carry the row, the 1-based column and the header name', () => {
    const reader = createIntervalLongReader(mapping, { timeZone: 'America/Los_Angeles', now });
    expect(reader.read(['HOA-NORTH-01', '2026-11-10 00:00', '-3'], 7)).toEqual({
      ok: false,
      row: 7,
      column: 3,
      message: 'Usage (Gal): -3 is negative; a volume cannot be below zero',
    });
    expect(reader.read(['HOA-NORTH-01', 'soon', '3'], 8)).toMatchObject({ ok: false, row: 8, column: 2 });
  });

  it('a timestamp after now is an error; so is an interval that has not ended', () => {
    const reader = createIntervalLongReader(mapping, { timeZone: 'UTC', now });
    expect(reader.read(['M', '2027-01-01 00:00', '1'], 2)).toMatchObject({
      ok: false,
      column: 2,
      message: expect.stringMatching(/in the future/),
    });
    expect(reader.read(['M', '2026-11-30 23:30', '1'], 3)).toMatchObject({
      ok: false,
      message: expect.stringMatching(/not yet over/),
    });
    expect(reader.read(['M', '2026-11-30 23:00', '1'], 4)).toMatchObject({ ok: true });
  });

  it('an unknown meter is an error when known refs are given', () => {
    const reader = createIntervalLongReader(mapping, { timeZone: 'UTC', now, knownRefs: new Set(['HOA-NORTH-01']) });
    expect(reader.read(['HOA-SOUTH-99', '2026-11-10 00:00', '1'], 5)).toEqual({
      ok: false,
      row: 5,
      column: 1,
      message: 'Meter #: unknown meter "HOA-SOUTH-99"; add it to the site or fix the file',
      unknownRef: { field: 'meter', ref: 'HOA-SOUTH-99' },
    });
  });

  it('a fixed meter and an interval column', () => {
    const m: ColumnMapping = {
      kind: 'interval-long',
      header: ['Start', 'Gal', 'Int'],
      columns: { timestamp: 0, value: 1, intervalMinutes: 2 },
      unit: 'gal',
      fixedMeterRef: 'SCHOOL-02',
    };
    const reader = createIntervalLongReader(m, { timeZone: 'UTC', now });
    expect(reader.read(['2026-11-10T00:15:00Z', '3', '15'], 2)).toMatchObject({
      ok: true,
      record: { meterRef: 'SCHOOL-02', minutes: 15 },
    });
    expect(reader.read(['2026-11-10T00:15:00Z', '3', '0'], 3)).toMatchObject({ ok: false, column: 3 });
  });

  it('decimal comma mapping reads 1.234,5', () => {
    const reader = createIntervalLongReader({ ...mapping, decimalComma: true }, { timeZone: 'UTC', now });
    expect(reader.read(['M', '2026-11-10 00:00', '1.234,5'], 2)).toMatchObject({
      ok: true,
      record: { volume: 1234.5 },
    });
  });

  it('a unit column value is read per row; an unknown unit is an error', () => {
    const m: ColumnMapping = {
      ...mapping,
      header: [...mapping.header, 'Unit'],
      columns: { ...mapping.columns, unit: 3 },
      unit: undefined,
    };
    const reader = createIntervalLongReader(m, { timeZone: 'UTC', now });
    expect(reader.read(['M', '2026-11-10 00:00', '1', 'HCF'], 2)).toMatchObject({ ok: true, record: { unit: 'ccf' } });
    expect(reader.read(['M', '2026-11-10 01:00', '1', 'buckets'], 3)).toMatchObject({ ok: false, column: 4 });
  });

  it('a blank row gives nothing', () => {
    expect(createIntervalLongReader(mapping, { timeZone: 'UTC', now }).read(['', ' ', ''], 9)).toBeNull();
  });

  it('end-stamped intervals ("Interval End"): start = stamp − minutes, including across fall-back', () => {
    const m: ColumnMapping = {
      ...mapping,
      header: ['Meter #', 'Interval End', 'Usage (Gal)'],
      timestampMarksEnd: true,
    };
    const reader = createIntervalLongReader(m, { timeZone: 'America/Los_Angeles', now });
    const starts = ['01:00', '01:00', '02:00'].map((t) => {
      const out = reader.read(['M', `2026-11-01 ${t}`, '1'], 2);
      return out?.ok ? out.record.startUtc : out;
    });
    expect(starts).toEqual(['2026-11-01T07:00:00.000Z', '2026-11-01T08:00:00.000Z', '2026-11-01T09:00:00.000Z']);
  });
});
