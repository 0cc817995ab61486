import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { detectColumns } from './column-detection';
import { sniffDelimiter } from './delimiter-sniffing';
import { decodeText } from './encoding-sniffing';

// Tests may use Node; the code under test may not.
const samples = new URL('../../samples/', import.meta.url);
const catalogue = JSON.parse(readFileSync(new URL('catalogue.json', samples), 'utf8')) as {
  files: Record<string, { kind?: string | null; refused?: string }>;
};

function rowsOf(path: string) {
  const decoded = decodeText(new Uint8Array(readFileSync(new URL(path, samples))));
  if (!decoded.ok) throw new Error(decoded.message);
  const delimiter = sniffDelimiter(decoded.text);
  return { delimiter, rows: parse(decoded.text, { delimiter, relax_column_count: true }) as string[][] };
}

function detect(path: string) {
  const { delimiter, rows } = rowsOf(path);
  return detectColumns(rows[0]!, rows.slice(1, 21), { delimiter });
}

describe('detectColumns on every sample file', () => {
  const readable = Object.entries(catalogue.files).filter(([, f]) => !f.refused);
  it.each(readable)('%s → kind %j', (path, expected) => {
    expect(detect(path).kind).toBe(expected.kind);
  });

  it('interval-long-hourly: meter, timestamp, value, gal from "Usage (Gal)", 60 min from spacing', () => {
    const d = detect('meters/interval-long-hourly.csv');
    expect(d.mapping).toMatchObject({
      columns: { meter: 0, timestamp: 1, value: 2 },
      unit: 'gal',
      intervalMinutes: 60,
    });
    expect(d.confidence).toBe(1);
  });

  it('interval-wide-24: Hr 01…Hr 24 is the interval run, a unit column', () => {
    expect(detect('meters/interval-wide-24.csv').mapping).toMatchObject({
      columns: { meter: 0, date: 1, unit: 2 },
      intervalColumns: { first: 3, count: 24 },
    });
  });

  it('interval-wide-96-semicolon: 00:15…24:00 and decimal commas', () => {
    expect(detect('meters/interval-wide-96-semicolon.csv').mapping).toMatchObject({
      intervalColumns: { first: 3, count: 96 },
      decimalComma: true,
    });
  });

  it('single meter: no meter column lowers confidence and asks for one; CCF from "Consumption CCF"', () => {
    const d = detect('meters/single-meter-no-meter-column.csv');
    expect(d.mapping).toMatchObject({ columns: { timestamp: 0, value: 1 }, unit: 'ccf' });
    expect(d.mapping?.columns.meter).toBeUndefined();
    expect(d.confidence).toBeLessThan(1);
    expect(d.reasons.join(' ')).toMatch(/single-meter/);
  });

  it('separate date and time columns', () => {
    expect(detect('meters/interval-long-date-time-columns.csv').mapping).toMatchObject({
      columns: { meter: 0, date: 1, time: 2, value: 3, unit: 4 },
      intervalMinutes: 60,
    });
  });

  it('tab-delimited with an interval column', () => {
    expect(detect('meters/interval-long-tab-delimited.csv').mapping?.columns).toEqual({
      meter: 0,
      timestamp: 1,
      value: 2,
      intervalMinutes: 3,
    });
  });

  it('register: "Register Reading" is the value', () => {
    expect(detect('meters/register-monthly.csv').mapping?.columns).toEqual({
      meter: 0,
      timestamp: 1,
      value: 2,
      unit: 3,
    });
  });

  it('runtime with duration, cause and measured gallons', () => {
    expect(detect('runtime/runtime-start-duration.csv').mapping?.columns).toEqual({
      controller: 0,
      station: 1,
      start: 2,
      duration: 3,
      cause: 4,
      measuredGallons: 5,
    });
  });

  it('runtime with a date column and time-only start/end', () => {
    expect(detect('runtime/runtime-start-end.csv').mapping?.columns).toEqual({
      controller: 0,
      station: 1,
      date: 2,
      start: 3,
      end: 4,
      cause: 5,
    });
  });

  it('unknown columns: no kind, confidence 0, a reason', () => {
    const d = detect('broken/unknown-columns.csv');
    expect(d).toMatchObject({ kind: null, mapping: null, confidence: 0 });
    expect(d.reasons[0]).toMatch(/Unknown layout/);
  });
});

describe('detectColumns on messy headers', () => {
  it('"Serial, Read Date, Usage (CCF)" with US dates', () => {
    const d = detectColumns(
      ['Serial', 'Read Date', 'Usage (CCF)'],
      [
        ['RM-IRR-0142', '11/1/2026 1:00 AM', '0.12'],
        ['RM-IRR-0142', '11/1/2026 2:00 AM', '0.10'],
      ],
    );
    expect(d.mapping).toMatchObject({
      kind: 'interval-long',
      columns: { meter: 0, timestamp: 1, value: 2 },
      unit: 'ccf',
      intervalMinutes: 60,
    });
  });

  it('a comma-delimited file never gets decimal comma, even when values look like it', () => {
    const d = detectColumns(['Meter', 'Interval Start', 'Usage (Gal)'], [['M', '2026-11-01 00:00', '1,234']], {
      delimiter: ',',
    });
    expect(d.mapping?.decimalComma).toBeUndefined();
  });

  it('samples whose timestamps do not parse lower the confidence', () => {
    const d = detectColumns(
      ['Meter', 'Timestamp', 'Usage (Gal)', 'Interval (min)'],
      [
        ['M', 'tomorrow', '1', '60'],
        ['M', 'later', '1', '60'],
      ],
    );
    expect(d.confidence).toBeLessThan(0.7);
  });

  it('"Interval End" stamps: the mapping says timestamps mark interval ends', () => {
    const d = detectColumns(
      ['Meter', 'Interval End', 'Usage (Gal)'],
      [
        ['M', '2026-11-01 00:15', '1'],
        ['M', '2026-11-01 00:30', '1'],
      ],
    );
    expect(d.mapping).toMatchObject({
      columns: { meter: 0, timestamp: 1, value: 2 },
      timestampMarksEnd: true,
      intervalMinutes: 15,
    });
  });

  it('"HE 1"…"HE 24" wide headers and a header unit', () => {
    const header = ['Date', ...Array.from({ length: 24 }, (_, i) => `HE ${i + 1}`), 'Total (kgal)'];
    const d = detectColumns(header, []);
    expect(d.mapping).toMatchObject({
      kind: 'interval-wide',
      columns: { date: 0 },
      intervalColumns: { first: 1, count: 24 },
      unit: 'kgal',
    });
  });
});
