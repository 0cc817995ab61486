/** Reading mapped cells out of one row, with errors that name the row and the column. */
import { combineDateAndTime, parseTimestamp, type ParsedTimestamp } from './timestamp-parsing';
import { unitFromText } from './header-vocabulary';
import type { RowError } from './ingest-records';
import type { ColumnMapping } from './upload-kind';
import type { VolumeUnit } from '../units/volume-units';

export interface ReadOptions {
  /** The site's IANA zone; local wall times in the file are read in it. */
  timeZone: string;
  /** Readings after this instant are errors (a clock or year typo). */
  now: Date | number;
  /** Meter refs (meter kinds) or controller refs (runtime) that exist; when given, others are errors. */
  knownRefs?: ReadonlySet<string>;
}

export function nowMs(options: ReadOptions): number {
  return typeof options.now === 'number' ? options.now : options.now.getTime();
}

/** `column` is 0-based here and 1-based in the result, as a spreadsheet numbers columns. */
export function rowError(mapping: ColumnMapping, row: number, column: number | null, message: string): RowError {
  const name = column === null ? null : mapping.header[column];
  return {
    ok: false,
    row,
    column: column === null ? null : column + 1,
    message: name ? `${name}: ${message}` : message,
  };
}

export function cellText(cells: string[], column: number | undefined): string {
  return column === undefined ? '' : (cells[column] ?? '').trim();
}

export function isBlankRow(cells: string[]): boolean {
  return cells.every((c) => c.trim() === '');
}

/** The meter or controller ref: from its column, else the mapping's fixed meter; checked against known refs. */
export function readRef(
  mapping: ColumnMapping,
  cells: string[],
  row: number,
  field: 'meter' | 'controller',
  options: ReadOptions,
): { ok: true; ref: string } | RowError {
  const column = mapping.columns[field];
  const ref =
    column === undefined && field === 'meter' ? (mapping.fixedMeterRef ?? '').trim() : cellText(cells, column);
  if (ref === '') return rowError(mapping, row, column ?? null, `the ${field} is empty`);
  if (options.knownRefs && !options.knownRefs.has(ref)) {
    return rowError(mapping, row, column ?? null, `unknown ${field} "${ref}"; add it to the site or fix the file`);
  }
  return { ok: true, ref };
}

type TimeField = 'timestamp' | 'start' | 'end';

/**
 * Parses the timestamp for `field`. A `timestamp` column wins; otherwise `date` + `time` columns are combined.
 * For a run's `start`/`end`, a time-of-day cell is combined with the `date` column when there is one.
 */
export function readTimestamp(
  mapping: ColumnMapping,
  cells: string[],
  row: number,
  field: TimeField,
): { ok: true; parsed: Extract<ParsedTimestamp, { ok: true }>; column: number } | RowError {
  const c = mapping.columns;
  const own = field === 'timestamp' ? (c.timestamp ?? (c.time === undefined ? c.date : c.time)) : c[field];
  if (own === undefined) return rowError(mapping, row, null, `no ${field} column`);
  const text = cellText(cells, own);
  if (text === '') return rowError(mapping, row, own, 'is empty');
  const alone = parseTimestamp(text);
  const combine = c.date !== undefined && own !== c.date && !(alone.ok && !(alone.kind === 'wall' && alone.dateOnly));
  if (!combine) {
    return alone.ok ? { ok: true, parsed: alone, column: own } : rowError(mapping, row, own, alone.message);
  }
  const date = cellText(cells, c.date);
  if (date === '') return rowError(mapping, row, c.date!, 'is empty');
  const parsed = combineDateAndTime(date, text);
  if (!parsed.ok) return rowError(mapping, row, parseTimestamp(date).ok ? own : c.date!, parsed.message);
  return { ok: true, parsed, column: own };
}

/** Whole-minute instant → ISO text; a big upload formats a million instants over a few thousand distinct ones. */
const isoMinutes = new Map<number, string>();

export function toIso(utcMs: number): string {
  if (utcMs % 60_000 !== 0) return new Date(utcMs).toISOString();
  let iso = isoMinutes.get(utcMs);
  if (iso === undefined) {
    if (isoMinutes.size > 100_000) isoMinutes.clear();
    iso = new Date(utcMs).toISOString();
    isoMinutes.set(utcMs, iso);
  }
  return iso;
}

/** Unit from the row's unit column, else the mapping's unit. */
export function readUnit(
  mapping: ColumnMapping,
  cells: string[],
  row: number,
): { ok: true; unit: VolumeUnit } | RowError {
  const column = mapping.columns.unit;
  if (column === undefined) {
    return mapping.unit ? { ok: true, unit: mapping.unit } : rowError(mapping, row, null, 'no unit chosen');
  }
  const text = cellText(cells, column);
  if (text === '' && mapping.unit) return { ok: true, unit: mapping.unit };
  const unit = unitFromText(text);
  return unit ? { ok: true, unit } : rowError(mapping, row, column, `"${text}" is not a volume unit this reader knows`);
}
