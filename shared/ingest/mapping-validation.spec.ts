import { describe, expect, it } from 'vitest';
import { validateMapping } from './mapping-validation';
import type { ColumnMapping } from './upload-kind';

const longMapping = (over: Partial<ColumnMapping> = {}): ColumnMapping => ({
  kind: 'interval-long',
  header: ['Meter #', 'Interval Start', 'Usage (Gal)'],
  columns: { meter: 0, timestamp: 1, value: 2 },
  unit: 'gal',
  intervalMinutes: 60,
  ...over,
});

describe('validateMapping', () => {
  it('a complete interval-long mapping has no problems', () => {
    expect(validateMapping(longMapping())).toEqual([]);
  });

  it('a missing value column is named', () => {
    expect(validateMapping(longMapping({ columns: { meter: 0, timestamp: 1 } }))).toEqual([
      { field: 'value', message: 'Choose the volume / register value column.' },
    ]);
  });

  it('no meter column and no fixed meter → meter problem; a fixed meter fixes it', () => {
    expect(validateMapping(longMapping({ columns: { timestamp: 1, value: 2 } })).map((p) => p.field)).toEqual([
      'meter',
    ]);
    expect(validateMapping(longMapping({ columns: { timestamp: 1, value: 2 }, fixedMeterRef: 'SCHOOL-02' }))).toEqual(
      [],
    );
  });

  it("no unit anywhere is no problem: each meter's own unit is used; an unknown unit is", () => {
    expect(validateMapping(longMapping({ unit: undefined }))).toEqual([]);
    expect(validateMapping(longMapping({ unit: 'pints' as never })).map((p) => p.field)).toEqual(['unit']);
  });

  it('an interval length outside the accepted set → problem', () => {
    expect(validateMapping(longMapping({ intervalMinutes: 7 }))[0]?.message).toMatch(/5, 15, 30, 60, 1440/);
    expect(validateMapping(longMapping({ intervalMinutes: undefined })).map((p) => p.field)).toEqual([
      'intervalMinutes',
    ]);
  });

  it('a column beyond the header and a column used twice are problems', () => {
    const problems = validateMapping(longMapping({ columns: { meter: 0, timestamp: 5, value: 0 } }));
    expect(problems.map((p) => p.message)).toEqual([
      'The timestamp column (6) is not in the header.',
      '"Meter #" is already the meter column.',
    ]);
  });

  it('a time column without a date column', () => {
    expect(validateMapping(longMapping({ columns: { meter: 0, time: 1, value: 2 } }))).toEqual([
      { field: 'date', message: 'Choose the date column to go with the time column.' },
    ]);
  });

  it('runtime needs controller, station, start and a duration or end', () => {
    const problems = validateMapping({
      kind: 'runtime',
      header: ['Controller', 'Station', 'Cause'],
      columns: { controller: 0, station: 1, cause: 2 },
    });
    expect(problems).toEqual([
      { field: 'start', message: 'Choose the run start column.' },
      { field: 'duration', message: 'Choose the run time column or the run end column.' },
    ]);
  });

  it('wide needs 24/48/96 interval columns', () => {
    const header = ['Meter', 'Date', ...Array.from({ length: 20 }, (_, i) => `Hr ${i + 1}`)];
    const problems = validateMapping({
      kind: 'interval-wide',
      header,
      columns: { meter: 0, date: 1 },
      unit: 'gal',
      intervalColumns: { first: 2, count: 20 },
    });
    expect(problems).toEqual([
      { field: 'intervalColumns', message: 'A one-row-per-day file needs 24, 48 or 96 interval columns; found 20.' },
    ]);
  });

  it('register needs a timestamp', () => {
    const problems = validateMapping({
      kind: 'register',
      header: ['Meter', 'Reading'],
      columns: { meter: 0, value: 1 },
      unit: 'ccf',
    });
    expect(problems).toEqual([{ field: 'timestamp', message: 'Choose the timestamp column.' }]);
  });
});
