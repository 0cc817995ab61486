import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { sniffDelimiter } from './delimiter-sniffing';
import { decodeText, sniffEncoding } from './encoding-sniffing';
import { differenceRegisterReads, type RegisterPeriod } from './register-differencing';
import { interpretRows } from './row-reader';
import type { IntervalRecord, RegisterRecord, RuntimeRecord } from './ingest-records';
import type { ColumnMapping } from './upload-kind';
import type { VolumeUnit } from '../units/volume-units';

// Expected outcomes live in samples/catalogue.json so the demo seed and these tests share one description.
interface SampleFile {
  timeZone: string;
  kind?: string | null;
  encoding?: string;
  delimiter?: string;
  refused?: string;
  records?: number;
  errors?: number;
  errorAt?: Array<[number, number]>;
  fileProblem?: string;
  mappingProblems?: string[];
  mappingOverrides?: Partial<ColumnMapping>;
  dateOrder?: 'month-first' | 'day-first';
  decidedDateOrder?: 'month-first' | 'day-first';
  dateEvidenceRow?: number;
  checkKnownRefs?: boolean;
  differenced?: { volumes: number; rollovers: number; problems: string[] };
}
interface CatalogueMeter {
  ref: string;
  unit: VolumeUnit;
  registerDigits?: number;
  multiplier?: number;
  registers?: RegisterPeriod[];
}
const samples = new URL('../../samples/', import.meta.url);
const catalogue = JSON.parse(readFileSync(new URL('catalogue.json', samples), 'utf8')) as {
  now: string;
  sites: Array<{ meters: CatalogueMeter[]; controllers: string[] }>;
  files: Record<string, SampleFile>;
};
const meters = catalogue.sites.flatMap((s) => s.meters);
const knownRefs = new Set([...meters.map((m) => m.ref), ...catalogue.sites.flatMap((s) => s.controllers)]);
const now = new Date(catalogue.now);
const meterUnits = new Map(meters.map((m) => [m.ref, m.unit]));

function interpret(path: string, extra: Partial<Parameters<typeof interpretRows>[1]> = {}) {
  const spec = catalogue.files[path]!;
  const decoded = decodeText(new Uint8Array(readFileSync(new URL(path, samples))));
  if (!decoded.ok) return { decoded, result: null };
  const delimiter = sniffDelimiter(decoded.text);
  const rows = parse(decoded.text, { delimiter, relax_column_count: true }) as string[][];
  const result = interpretRows(rows, {
    timeZone: spec.timeZone,
    now,
    delimiter,
    mappingOverrides: spec.mappingOverrides,
    dateOrder: spec.dateOrder,
    meterUnits,
    knownRefs: spec.checkKnownRefs ? knownRefs : undefined,
    ...extra,
  });
  return { decoded, delimiter, result };
}

describe('every sample file gives the outcome samples/catalogue.json lists', () => {
  it.each(Object.entries(catalogue.files))('%s', (path, spec) => {
    const { decoded, delimiter, result } = interpret(path);
    if (spec.refused) {
      expect(decoded.ok).toBe(false);
      expect(sniffEncoding(new Uint8Array(readFileSync(new URL(path, samples))))).toMatchObject({
        kind: 'refused',
        reason: spec.refused,
      });
      return;
    }
    expect(decoded.ok && decoded.encoding).toBe(spec.encoding);
    expect(delimiter).toBe(spec.delimiter);
    expect(result!.detection?.kind ?? null).toBe(spec.kind);
    expect(result!.records).toHaveLength(spec.records!);
    expect(result!.errors).toHaveLength(spec.errors!);
    if (spec.errorAt) expect(result!.errors.map((e) => [e.row, e.column])).toEqual(spec.errorAt);
    if (spec.fileProblem) expect(result!.fileProblems.join(' ')).toContain(spec.fileProblem);
    else expect(result!.fileProblems).toEqual([]);
    expect(result!.mappingProblems.map((p) => p.field)).toEqual(spec.mappingProblems ?? []);
    if (spec.decidedDateOrder) {
      expect(result!.dateOrder).toMatchObject({ kind: 'decided', order: spec.decidedDateOrder, source: 'file' });
      if (spec.dateEvidenceRow) expect(result!.dateOrder).toMatchObject({ clue: { row: spec.dateEvidenceRow } });
    }

    if (spec.differenced) {
      const reads = result!.records as RegisterRecord[];
      const out = { volumes: 0, rollovers: 0, problems: [] as string[] };
      for (const ref of new Set(reads.map((r) => r.meterRef))) {
        const m = meters.find((x) => x.ref === ref)!;
        const registers = m.registers ?? [
          {
            installedUtc: '2000-01-01T00:00:00.000Z',
            removedUtc: null,
            multiplier: m.multiplier ?? 1,
            digits: m.registerDigits ?? null,
          },
        ];
        const d = differenceRegisterReads(
          { meterRef: ref, registers },
          reads.filter((r) => r.meterRef === ref),
        );
        out.volumes += d.volumes.length;
        out.rollovers += d.rollovers.length;
        out.problems.push(...d.problems.map((p) => p.kind));
      }
      expect(out).toEqual(spec.differenced);
    }
  });
});

describe('sample contents, in detail', () => {
  it('interval-long-hourly: 2026-11-01 has 25 hourly rows per meter, the second 01:00 in PST', () => {
    const records = interpret('meters/interval-long-hourly.csv').result!.records as IntervalRecord[];
    const nov1 = records.filter(
      (r) => r.meterRef === 'HOA-NORTH-01' && r.startUtc >= '2026-11-01T07:00' && r.startUtc < '2026-11-02T08:00',
    );
    expect(nov1).toHaveLength(25);
    expect(nov1.slice(0, 4).map((r) => r.startUtc.slice(11, 16))).toEqual(['07:00', '08:00', '09:00', '10:00']);
    expect(new Set(records.map((r) => r.startUtc + r.meterRef)).size).toBe(98); // no instant used twice
  });

  it('interval-long-us-ampm: 12 AM, 1 AM, 1 AM, 2 AM → 07, 08, 09, 10 UTC', () => {
    const records = interpret('meters/interval-long-us-ampm.csv').result!.records as IntervalRecord[];
    expect(records.map((r) => r.startUtc.slice(11, 16))).toEqual([
      '07:00',
      '08:00',
      '09:00',
      '10:00',
      '11:00',
      '12:00',
    ]);
  });

  it('interval-long-serial-dates: 46335 is 2026-11-09 local midnight at Tannery Point (Los Angeles)', () => {
    const records = interpret('meters/interval-long-serial-dates.csv').result!.records as IntervalRecord[];
    expect(records.map((r) => r.startUtc)).toEqual(
      [0, 1, 2, 3, 4, 5].map((h) => new Date(Date.UTC(2026, 10, 9, 8 + h)).toISOString()),
    );
  });

  it('interval-long-spring-forward: 01:00 PST then 03:00 PDT are one hour apart', () => {
    const records = interpret('meters/interval-long-spring-forward.csv').result!.records as IntervalRecord[];
    expect(records.slice(1, 3).map((r) => r.startUtc)).toEqual([
      '2026-03-08T09:00:00.000Z',
      '2026-03-08T10:00:00.000Z',
    ]);
  });

  it('interval-wide-24 (Los Angeles, fall-back day): one 120-minute record holds the doubled Hr 02 value', () => {
    const records = interpret('meters/interval-wide-24.csv').result!.records as IntervalRecord[];
    expect(records.filter((r) => r.minutes !== 60)).toEqual([
      { meterRef: 'OFFICE-PARK-01', startUtc: '2026-11-01T08:00:00.000Z', minutes: 120, volume: 181, unit: 'gal' },
    ]);
  });

  it('interval-wide-96-semicolon: decimal commas read as fractions of a gallon', () => {
    const records = interpret('meters/interval-wide-96-semicolon.csv').result!.records as IntervalRecord[];
    expect(records[0]).toEqual({
      meterRef: 'SCHOOL-01',
      startUtc: '2026-11-02T08:00:00.000Z',
      minutes: 15,
      volume: 21.625,
      unit: 'gal',
    });
  });

  it('interval-long-utf8-bom: the BOM does not hide the first header; UTC instants are kept as given', () => {
    const { result } = interpret('meters/interval-long-utf8-bom.csv');
    expect(result!.mapping!.header[0]).toBe('Meter');
    expect((result!.records[0] as IntervalRecord).startUtc).toBe('2026-11-06T08:00:00.000Z');
  });

  it('interval-long-windows-1252: the note with ° and é decodes, and rows still read', () => {
    const { decoded } = interpret('meters/interval-long-windows-1252.csv');
    expect(decoded.ok && decoded.text).toContain('Frost 28°F');
    expect(decoded.ok && decoded.text).toContain('Café patio');
  });

  it('runtime-start-end: the run from 11:50 PM to 12:10 AM lasts 20 minutes', () => {
    const records = interpret('runtime/runtime-start-end.csv').result!.records as RuntimeRecord[];
    expect(records.find((r) => r.station === 'B1')).toEqual({
      controllerRef: 'CTL-SCHOOL-A',
      station: 'B1',
      startUtc: '2026-11-04T07:50:00.000Z',
      minutes: 20,
      cause: 'scheduled',
    });
  });

  it('runtime-start-duration: skipped runs have 0 minutes and their cause', () => {
    const records = interpret('runtime/runtime-start-duration.csv').result!.records as RuntimeRecord[];
    expect(records.filter((r) => r.minutes === 0).map((r) => r.cause)).toEqual([
      'skipped-rain',
      'skipped-rain',
      'skipped-wind',
    ]);
  });

  it('register-monthly: HOA-NORTH-01 rolls over from 9,912 to 0,043 = 131 CCF', () => {
    const reads = (interpret('meters/register-monthly.csv').result!.records as RegisterRecord[]).filter(
      (r) => r.meterRef === 'HOA-NORTH-01',
    );
    const d = differenceRegisterReads(
      {
        meterRef: 'HOA-NORTH-01',
        registers: [{ installedUtc: '2000-01-01T00:00:00Z', removedUtc: null, multiplier: 1, digits: 4 }],
      },
      reads,
    );
    expect(d.volumes.map((v) => v.volume)).toEqual([168, 173, 151, 131, 96]);
  });

  it('register-meter-swap: the swap-instant pair splits old and new registers', () => {
    const reads = interpret('meters/register-meter-swap.csv').result!.records as RegisterRecord[];
    const facts = meters.find((m) => m.ref === 'OFFICE-PARK-02')!;
    const d = differenceRegisterReads({ meterRef: 'OFFICE-PARK-02', registers: facts.registers! }, reads);
    expect(d.volumes.map((v) => v.volume)).toEqual([128, 126, 35, 61, 109]);
    expect(d.volumes.every((v) => v.unit === 'kgal')).toBe(true);
  });

  it('a mapping passed in replaces the detected one (e.g. confirmed in the preview)', () => {
    const mapping: ColumnMapping = {
      kind: 'interval-long',
      header: ['a', 'b', 'c'],
      columns: { meter: 0, timestamp: 1, value: 2 },
      unit: 'ccf',
      intervalMinutes: 15,
    };
    const records = interpret('meters/interval-long-hourly.csv', { mapping }).result!.records as IntervalRecord[];
    expect(records[0]).toMatchObject({ unit: 'ccf', minutes: 15 });
  });
});

describe('interpretRows on trivial tables', () => {
  it('no rows → the file is empty', () => {
    expect(interpretRows([], { timeZone: 'UTC', now }).fileProblems).toEqual(['The file is empty.']);
  });
});
