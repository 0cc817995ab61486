/** One entry point for streaming rows of any kind, and a whole-table interpretation for previews and tests. */
import { createBillingReader } from './billing-row';
import { detectColumns, type ColumnDetection } from './column-detection';
import { collectDateEvidence } from './date-evidence';
import { decideDateOrder, type DateOrder, type DateOrderDecision } from './date-order';
import type { Delimiter } from './delimiter-sniffing';
import { createIntervalLongReader } from './interval-long-row';
import { createIntervalWideReader } from './interval-wide-row';
import { validateMapping, type MappingProblem } from './mapping-validation';
import { createRegisterReader } from './register-row';
import type { ReadOptions } from './row-cells';
import { createRuntimeReader } from './runtime-row';
import type { IngestRecord, RowError, RowOutcome } from './ingest-records';
import type { ColumnMapping } from './upload-kind';

export type { ReadOptions } from './row-cells';

export interface RowReader {
  /**
   * Outcomes of one data row (none for a blank row; many for a one-row-per-day row). Feed rows in file order:
   * the reader keeps per-meter state to resolve the repeated DST hour.
   */
  read(cells: string[], row: number): RowOutcome<IngestRecord>[];
}

/** A reader for a mapping that `validateMapping` accepted. */
export function createRowReader(mapping: ColumnMapping, options: ReadOptions): RowReader {
  const single = (reader: { read(cells: string[], row: number): RowOutcome<IngestRecord> | null }): RowReader => ({
    read: (cells, row) => {
      const outcome = reader.read(cells, row);
      return outcome ? [outcome] : [];
    },
  });
  switch (mapping.kind) {
    case 'interval-long':
      return single(createIntervalLongReader(mapping, options));
    case 'register':
      return single(createRegisterReader(mapping, options));
    case 'runtime':
      return single(createRuntimeReader(mapping, options));
    case 'interval-wide':
      return createIntervalWideReader(mapping, options);
    case 'billing':
      return single(createBillingReader(mapping, options));
  }
}

export interface InterpretOptions extends ReadOptions {
  /** A mapping a person confirmed; when absent the detected one is used. */
  mapping?: ColumnMapping;
  /** Applied on top of the detected mapping (e.g. `{ fixedMeterRef, unit }` chosen in the preview). */
  mappingOverrides?: Partial<ColumnMapping>;
  delimiter?: Delimiter;
  /** Rows given to column detection; 20 is enough to see the interval spacing. */
  sampleSize?: number;
  /** Day/month order chosen for this file (wins over the file's own dates; a mapping's `dateOrder` counts too). */
  dateOrder?: DateOrder;
  /** The organisation's usual order, used only when the dates fit both. */
  organisationDateOrder?: DateOrder | null;
}

export interface Interpretation {
  /** Whole-file problems (empty, header only, unknown layout); no rows were read when there are any. */
  fileProblems: string[];
  detection: ColumnDetection | null;
  mapping: ColumnMapping | null;
  mappingProblems: MappingProblem[];
  /** What the rows given say about day/month order, and what was decided from it (null before detection). */
  dateOrder: DateOrderDecision | null;
  records: IngestRecord[];
  errors: RowError[];
}

/**
 * Detects, validates and reads a table already split into cells. `rows[0]` is the header; row numbers in errors
 * count the header as row 1, so the first data row is row 2 (what a spreadsheet shows).
 */
export function interpretRows(rows: string[][], options: InterpretOptions): Interpretation {
  const result: Interpretation = {
    fileProblems: [],
    detection: null,
    mapping: null,
    mappingProblems: [],
    dateOrder: null,
    records: [],
    errors: [],
  };
  const nonBlank = rows.filter((r) => r.some((c) => c.trim() !== ''));
  if (nonBlank.length === 0) {
    result.fileProblems.push('The file is empty.');
    return result;
  }
  const [header, ...data] = rows;
  if (data.every((r) => r.every((c) => c.trim() === '')))
    result.fileProblems.push('The file has a header but no data rows.');

  const sample = data.slice(0, options.sampleSize ?? 20);
  const detect = (dateOrder?: DateOrder) => detectColumns(header!, sample, { delimiter: options.delimiter, dateOrder });
  result.detection = detect();
  const first = options.mapping ?? result.detection.mapping;
  if (!first) {
    result.fileProblems.push(`No known layout: ${result.detection.reasons.join(' ')}`);
    return result;
  }
  // Day/month order from every row given; detection is repeated in that order (it reads the interval spacing).
  const chosen = options.dateOrder ?? options.mapping?.dateOrder ?? options.mappingOverrides?.dateOrder;
  result.dateOrder = decideDateOrder(collectDateEvidence(first, data), {
    chosen,
    organisationDefault: options.organisationDateOrder,
  });
  const order = result.dateOrder.kind === 'decided' ? result.dateOrder.order : chosen;
  if (order && !options.mapping) result.detection = detect(order);
  const base = options.mapping ?? result.detection.mapping ?? first;
  const mapping: ColumnMapping = { ...base, ...options.mappingOverrides };
  if (order) mapping.dateOrder = order;
  else delete mapping.dateOrder;
  result.mapping = mapping;
  // A header-only file is reported as such; asking for an interval length it cannot have would only confuse.
  if (result.fileProblems.length > 0) return result;
  result.mappingProblems = validateMapping(mapping);
  if (result.mappingProblems.length > 0) return result;

  const reader = createRowReader(mapping, options);
  data.forEach((cells, i) => {
    for (const outcome of reader.read(cells, i + 2)) {
      if (outcome.ok) result.records.push(outcome.record);
      else result.errors.push(outcome);
    }
  });
  return result;
}
