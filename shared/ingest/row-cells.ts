/** Reading mapped cells out of one row, with errors that name the row and the column. */
import type { DateOrderEvidence } from './date-order';
import { combineDateAndTime, parseTimestamp, type ParsedTimestamp } from './timestamp-parsing';
import { unitFromText } from './header-vocabulary';
import type { RowError, UnknownRef } from './ingest-records';
import type { ColumnMapping } from './upload-kind';
import type { VolumeUnit } from '../units/volume-units';

export interface ReadOptions {
  /** The site's IANA zone; local wall times in the file are read in it. */
  timeZone: string;
  /** For a file of many sites: the zone of the site a meter or controller ref belongs to (else `timeZone`). */
  zoneOf?: (ref: string) => string | undefined;
  /** Readings after this instant are errors (a clock or year typo). */
  now: Date | number;
  /** Meter refs (meter kinds) or controller refs (runtime) that exist; when given, others are errors. */
  knownRefs?: ReadonlySet<string>;
  /** Each meter's own unit, used when the file names none. */
  meterUnits?: ReadonlyMap<string, VolumeUnit>;
  /** Collects the file's numeric dates (`13/06/2026`) to decide its date order. */
  dateEvidence?: DateOrderEvidence;
}

/** The zone a row's wall times are read in. */
export function zoneFor(options: ReadOptions, ref: string): string {
  return options.zoneOf?.(ref) ?? options.timeZone;
}

export function nowMs(options: ReadOptions): number {
  return typeof options.now === 'number' ? options.now : options.now.getTime();
}

/** `column` is 0-based here and 1-based in the result, as a spreadsheet numbers columns. */
export function rowError(
  mapping: ColumnMapping,
  row: number,
  column: number | null,
  message: string,
  unknownRef?: UnknownRef,
): RowError {
  const name = column === null ? null : mapping.header[column];
  const error: RowError = {
    ok: false,
    row,
    column: column === null ? null : column + 1,
    message: name ? `${name}: ${message}` : message,
  };
  if (unknownRef) error.unknownRef = unknownRef;
  return error;
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
    const message = `unknown ${field} "${ref}"; add it to the site or fix the file`;
    return rowError(mapping, row, column ?? null, message, { field, ref });
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
  evidence?: DateOrderEvidence,
): { ok: true; parsed: Extract<ParsedTimestamp, { ok: true }>; column: number } | RowError {
  const c = mapping.columns;
  const own = field === 'timestamp' ? (c.timestamp ?? (c.time === undefined ? c.date : c.time)) : c[field];
  if (own === undefined) return rowError(mapping, row, null, `no ${field} column`);
  const text = cellText(cells, own);
  if (text === '') return rowError(mapping, row, own, 'is empty');
  const order = mapping.dateOrder;
  const alone = parseTimestamp(text, order);
  const combine = c.date !== undefined && own !== c.date && !(alone.ok && !(alone.kind === 'wall' && alone.dateOnly));
  if (!combine) {
    observeDate(evidence, alone, row, text);
    return alone.ok ? { ok: true, parsed: alone, column: own } : rowError(mapping, row, own, alone.message);
  }
  const date = cellText(cells, c.date);
  if (date === '') return rowError(mapping, row, c.date!, 'is empty');
  const dateAlone = parseTimestamp(date, order);
  observeDate(evidence, dateAlone, row, date);
  const parsed = combineDateAndTime(date, text, order);
  if (!parsed.ok) return rowError(mapping, row, dateAlone.ok ? own : c.date!, parsed.message);
  return { ok: true, parsed, column: own };
}

/** Reports a numeric date's two fields to the file's date-order evidence. */
export function observeDate(
  evidence: DateOrderEvidence | undefined,
  parsed: ParsedTimestamp,
  row: number,
  text: string,
): void {
  if (evidence && 'numericDate' in parsed && parsed.numericDate) {
    evidence.observe(parsed.numericDate.first, parsed.numericDate.second, row, text);
  }
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

/** Unit from the row's unit column, else the mapping's unit, else the meter's own unit. */
export function readUnit(
  mapping: ColumnMapping,
  cells: string[],
  row: number,
  meter: { ref: string; options: ReadOptions },
): { ok: true; unit: VolumeUnit } | RowError {
  const column = mapping.columns.unit;
  const fallback = mapping.unit ?? meter.options.meterUnits?.get(meter.ref);
  if (column === undefined) {
    if (fallback) return { ok: true, unit: fallback };
    return rowError(mapping, row, null, `no unit in the file, and none known for meter ${meter.ref}; choose one`);
  }
  const text = cellText(cells, column);
  if (text === '' && fallback) return { ok: true, unit: fallback };
  const unit = unitFromText(text);
  return unit ? { ok: true, unit } : rowError(mapping, row, column, `"${text}" is not a volume unit this reader knows`);
}

/** A read-type cell: estimated (`E`, `Est.`, `Estimated`, `Calculated`) or actual (`A`, `Actual`, `Read`, …). */
export function parseReadType(text: string): boolean | null {
  const t = text.trim().toLowerCase().replace(/\.$/, '');
  if (t === '') return false;
  if (/^(?:e|est|estimated?|estimation|calc|calculated|computed|projected)$/.test(t)) return true;
  if (/^(?:a|act|actual|r|read|measured|regular|normal|amr|ami|manual|customer|field|meter|validated|ok)$/.test(t))
    return false;
  return null;
}

/** The row's estimated flag from the read-type column (false when there is none). */
export function readEstimated(mapping: ColumnMapping, cells: string[], row: number): boolean | RowError {
  const column = mapping.columns.readType;
  if (column === undefined) return false;
  const text = cellText(cells, column);
  const estimated = parseReadType(text);
  if (estimated !== null) return estimated;
  return rowError(mapping, row, column, `"${text}" is not a read type this reader knows (actual or estimated)`);
}
