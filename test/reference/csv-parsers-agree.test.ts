/**
 * Reference check: two independent CSV parsers feed the same rows into shared/ingest and get identical results.
 * - csv-parse 7 (https://csv.js.org/parse/, the server's streaming parser behind its quote-free fast path, which
 *   backend/src/components/uploads/domain/csv-rows.spec.ts checks against it), after iconv-lite decoding as the
 *   server does;
 * - Papa Parse 5 (https://www.papaparse.com/, the browser preview's parser), after WHATWG TextDecoder decoding
 *   as the browser does.
 * Both are given the delimiter from `sniffDelimiter`. Papa Parse yields a trailing [""] row for a final newline
 * that csv-parse does not; the row readers skip blank rows, and the raw rows are compared without it.
 */
import { readFileSync } from 'node:fs';
import { parse as csvParse } from 'csv-parse/sync';
import iconv from 'iconv-lite';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { sniffDelimiter, stripBom } from '@shared/ingest/delimiter-sniffing';
import { decodeText, sniffEncoding } from '@shared/ingest/encoding-sniffing';
import { interpretRows } from '@shared/ingest/row-reader';
import type { ColumnMapping } from '@shared/ingest/upload-kind';
import type { VolumeUnit } from '@shared/units/volume-units';

interface SampleFile {
  timeZone: string;
  refused?: string;
  records?: number;
  mappingOverrides?: Partial<ColumnMapping>;
  checkKnownRefs?: boolean;
  dateOrder?: 'month-first' | 'day-first';
}
const samples = new URL('../../samples/', import.meta.url);
const catalogue = JSON.parse(readFileSync(new URL('catalogue.json', samples), 'utf8')) as {
  now: string;
  sites: Array<{ meters: Array<{ ref: string; unit: VolumeUnit }>; controllers: string[] }>;
  files: Record<string, SampleFile>;
};
const meterUnits = new Map(catalogue.sites.flatMap((s) => s.meters.map((m) => [m.ref, m.unit] as const)));
const knownRefs = new Set(catalogue.sites.flatMap((s) => [...s.meters.map((m) => m.ref), ...s.controllers]));

function withCsvParse(bytes: Buffer): { text: string; rows: string[][] } {
  const sniffed = sniffEncoding(new Uint8Array(bytes));
  if (sniffed.kind === 'refused') throw new Error(sniffed.message);
  const text = stripBom(iconv.decode(bytes, sniffed.kind === 'utf-8' ? 'utf8' : 'win1252'));
  return { text, rows: csvParse(text, { delimiter: sniffDelimiter(text), relax_column_count: true }) };
}

function withPapa(bytes: Buffer): { text: string; rows: string[][] } {
  const decoded = decodeText(new Uint8Array(bytes));
  if (!decoded.ok) throw new Error(decoded.message);
  const parsed = Papa.parse<string[]>(decoded.text, { delimiter: sniffDelimiter(decoded.text), skipEmptyLines: false });
  const rows = parsed.data;
  while (rows.length > 0 && rows[rows.length - 1]!.every((c) => c === '')) rows.pop();
  return { text: decoded.text, rows };
}

const readable = Object.entries(catalogue.files).filter(([, f]) => !f.refused);

describe('csv-parse and Papa Parse agree on every sample file', () => {
  it.each(readable)('%s', (path, spec) => {
    const bytes = readFileSync(new URL(path, samples));
    const a = withCsvParse(bytes);
    const b = withPapa(bytes);
    expect(b.text).toBe(a.text);
    expect(b.rows).toEqual(a.rows);

    const options = {
      timeZone: spec.timeZone,
      now: new Date(catalogue.now),
      delimiter: sniffDelimiter(a.text),
      mappingOverrides: spec.mappingOverrides,
      knownRefs: spec.checkKnownRefs ? knownRefs : undefined,
      dateOrder: spec.dateOrder,
      meterUnits,
    };
    const fromCsvParse = interpretRows(a.rows, options);
    const fromPapa = interpretRows(b.rows, options);
    expect(fromPapa).toEqual(fromCsvParse);
    // Guard against agreeing on nothing: the records are the ones the catalogue promises.
    expect(fromCsvParse.records).toHaveLength(spec.records!);
  });

  it('the refused files are refused before either parser runs', () => {
    const refused = Object.entries(catalogue.files).filter(([, f]) => f.refused);
    expect(refused.length).toBeGreaterThan(0);
    for (const [path] of refused) {
      const bytes = readFileSync(new URL(path, samples));
      expect(() => withCsvParse(bytes)).toThrow();
      expect(() => withPapa(bytes)).toThrow();
    }
  });
});
