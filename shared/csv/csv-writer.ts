/**
 * CSV export of report tables: RFC 4180 quoting, plus neutralisation of spreadsheet formula injection.
 *
 * Injection: a spreadsheet treats a cell starting with `=`, `+`, `-` or `@` as a formula (and tab or CR at the
 * start can smuggle one past simple filters), so a site name like `=HYPERLINK("http://…")` would run when the
 * auditor opens the export. Following OWASP's CSV-injection advice, such *text* cells get a leading `'`, which
 * spreadsheets show as text and do not evaluate. Numbers are a separate cell kind and are written plainly, so a
 * real −2 stays a number a spreadsheet can sum; the string "-2" is text and gets the prefix. The cost: someone
 * re-importing the file sees the `'` in those text cells — the safer way round for an export people open by
 * double-clicking.
 */

/** A number is written as a number; a string as (neutralised) text; null/undefined as an empty cell. */
export type CsvCell = string | number | null | undefined;

export interface CsvColumn<Row> {
  header: string;
  value: (row: Row) => CsvCell;
}

export interface CsvOptions {
  /** A UTF-8 byte-order mark so Excel reads accents and "m³" correctly; off by default. */
  byteOrderMark?: boolean;
}

const FORMULA_TRIGGERS = new Set(['=', '+', '-', '@', '\t', '\r']);
// RFC 4180 §2.6: fields with a comma, a double quote or a line break are enclosed in double quotes.
const NEEDS_QUOTES = /[",\r\n]/;

/** Prefixes text that a spreadsheet would evaluate as a formula. */
export function neutraliseFormula(text: string): string {
  return text.length > 0 && FORMULA_TRIGGERS.has(text[0]!) ? `'${text}` : text;
}

/** RFC 4180 quoting: wrap in quotes when needed, doubling any quote inside. */
export function quoteField(text: string): string {
  return NEEDS_QUOTES.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

export function formatCell(cell: CsvCell): string {
  if (cell === null || cell === undefined) return '';
  if (typeof cell === 'number') {
    // An unfinished calculation should fail loudly, not export "NaN" into an auditor's file.
    if (!Number.isFinite(cell)) throw new RangeError(`Cannot write ${cell} to CSV; use null for a missing value`);
    // `+ 0` turns −0 into 0; String() never yields a leading "+", "=" or "@", so numbers need no neutralising.
    return String(cell + 0);
  }
  return quoteField(neutraliseFormula(cell));
}

/** Header row then one line per row, CRLF-terminated as RFC 4180 §2.1 asks. */
export function toCsv<Row>(columns: readonly CsvColumn<Row>[], rows: Iterable<Row>, options: CsvOptions = {}): string {
  if (columns.length === 0) throw new RangeError('A CSV needs at least one column');
  const lines = [columns.map((column) => formatCell(column.header)).join(',')];
  for (const row of rows) lines.push(columns.map((column) => formatCell(column.value(row))).join(','));
  return (options.byteOrderMark ? '\uFEFF' : '') + lines.map((line) => `${line}\r\n`).join('');
}
