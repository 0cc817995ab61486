import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { formatCell, neutraliseFormula, quoteField, toCsv, type CsvColumn } from './csv-writer';

describe('formula-injection neutralising', () => {
  it('when text starts with =, +, -, @, tab or CR, then it gets a leading apostrophe', () => {
    expect(neutraliseFormula('=HYPERLINK("http://example.invalid","Click")')).toBe(
      '\'=HYPERLINK("http://example.invalid","Click")',
    );
    expect(neutraliseFormula('+1')).toBe("'+1");
    expect(neutraliseFormula('-2')).toBe("'-2");
    expect(neutraliseFormula('@SUM(A1:A9)')).toBe("'@SUM(A1:A9)");
    expect(neutraliseFormula('\t=1+1')).toBe("'\t=1+1");
    expect(neutraliseFormula('\r=1+1')).toBe("'\r=1+1");
  });

  it('when the trigger is not the first character, or the text is empty, then it is left alone', () => {
    expect(neutraliseFormula('Site A = north')).toBe('Site A = north');
    expect(neutraliseFormula('a-b')).toBe('a-b');
    expect(neutraliseFormula('')).toBe('');
  });
});

describe('cells', () => {
  it('when −2 is a number, then it stays numeric; when "-2" is text, then it is neutralised', () => {
    expect(formatCell(-2)).toBe('-2');
    expect(formatCell('-2')).toBe("'-2");
    expect(formatCell(-0)).toBe('0');
    expect(formatCell(1234.5)).toBe('1234.5');
  });

  it('when a value is missing, then the cell is empty; when it is NaN or infinite, then it refuses', () => {
    expect(formatCell(null)).toBe('');
    expect(formatCell(undefined)).toBe('');
    expect(() => formatCell(Number.NaN)).toThrow(RangeError);
    expect(() => formatCell(Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });

  it('when text holds a comma, a quote or a line break, then it is quoted with inner quotes doubled', () => {
    expect(quoteField('Oak, east')).toBe('"Oak, east"');
    expect(quoteField('the "big" lawn')).toBe('"the ""big"" lawn"');
    expect(quoteField('line one\nline two')).toBe('"line one\nline two"');
    expect(quoteField('cr\rhere')).toBe('"cr\rhere"');
    expect(quoteField('plain')).toBe('plain');
  });

  it('when a formula also holds quotes and commas, then it is neutralised first and then quoted', () => {
    expect(formatCell('=HYPERLINK("http://example.invalid","x")')).toBe(
      '"\'=HYPERLINK(""http://example.invalid"",""x"")"',
    );
  });
});

interface InventedRow {
  site: string;
  savedGal: number;
  change: number | null;
}

const columns: CsvColumn<InventedRow>[] = [
  { header: 'Site', value: (r) => r.site },
  { header: 'Saved (gal)', value: (r) => r.savedGal },
  { header: '-Change %', value: (r) => r.change },
];

describe('toCsv', () => {
  const rows: InventedRow[] = [
    { site: 'Heron Glen, phase "2"', savedGal: 12_500, change: -2 },
    { site: '@SUM(1+1)', savedGal: -300, change: null },
    { site: 'two\nlines', savedGal: 0, change: 4.25 },
  ];

  it('when writing rows, then header, CRLF line ends, quoting and neutralising are all applied', () => {
    expect(toCsv(columns, rows)).toBe(
      "Site,Saved (gal),'-Change %\r\n" +
        '"Heron Glen, phase ""2""",12500,-2\r\n' +
        "'@SUM(1+1),-300,\r\n" +
        '"two\nlines",0,4.25\r\n',
    );
  });

  it('when a standard CSV parser reads it back, then every cell round-trips (text with its guard apostrophe)', () => {
    // papaparse is an independent RFC 4180 reader already used by ingest.
    const parsed = Papa.parse<string[]>(toCsv(columns, rows), { newline: '\r\n', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toEqual([
      ['Site', 'Saved (gal)', "'-Change %"],
      ['Heron Glen, phase "2"', '12500', '-2'],
      ["'@SUM(1+1)", '-300', ''],
      ['two\nlines', '0', '4.25'],
    ]);
  });

  it('when asked for a byte-order mark, then the file starts with U+FEFF', () => {
    expect(toCsv(columns, [], { byteOrderMark: true })).toBe("\uFEFFSite,Saved (gal),'-Change %\r\n");
  });

  it('when there are no columns, then it refuses', () => {
    expect(() => toCsv([], rows)).toThrow(RangeError);
  });
});
