import { describe, expect, it } from 'vitest';
import { createRegisterReader } from './register-row';
import type { ColumnMapping } from './upload-kind';

const now = new Date('2026-12-01T00:00:00Z');
const mapping: ColumnMapping = {
  kind: 'register',
  header: ['Meter Serial', 'Read Date', 'Register Reading', 'Unit'],
  columns: { meter: 0, timestamp: 1, value: 2, unit: 3 },
};

describe('createRegisterReader', () => {
  it('a date-only read is local midnight in the site zone', () => {
    const reader = createRegisterReader(mapping, { timeZone: 'America/Denver', now });
    expect(reader.read(['OFFICE-PARK-01', '2026-07-01', '031,702', 'CCF'], 2)).toEqual({
      ok: true,
      record: { meterRef: 'OFFICE-PARK-01', atUtc: '2026-07-01T06:00:00.000Z', value: 31702, unit: 'ccf' },
    });
  });

  it('a negative register value and a future read are errors', () => {
    const reader = createRegisterReader(mapping, { timeZone: 'UTC', now });
    expect(reader.read(['M', '2026-07-01', '-5', 'CCF'], 3)).toMatchObject({ ok: false, row: 3, column: 3 });
    expect(reader.read(['M', '2026-12-02', '5', 'CCF'], 4)).toMatchObject({
      ok: false,
      row: 4,
      column: 2,
      message: expect.stringMatching(/future/),
    });
  });
});
