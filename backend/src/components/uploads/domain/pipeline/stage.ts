import type { QueryRunner } from 'typeorm';
import type { ApiErrorDetail } from '@shared/api/errors';
import type { RowError } from '@shared/ingest/ingest-records';
import { createRowReader, interpretRows } from '@shared/ingest/row-reader';
import type { ColumnMapping, UploadKind } from '@shared/ingest/upload-kind';
import type { RejectionDto } from '@shared/uploads/upload';
import { INTERVAL_TARGET, REGISTER_TARGET, RUNTIME_TARGET, type IngestTarget } from '../data/ingest-targets';
import { IngestWriter } from '../data/ingest-writer';
import { clipText } from '../../../platform/clip-text';
import { FileProblem, type CsvRows } from './csv-rows';
import type { IngestRefs } from './ingest-refs';
import { IntervalSpans } from './interval-spans';
import { createStageLines } from './stage-lines';

/**
 * Imports and roll-backs run READ COMMITTED: under REPEATABLE READ the range DELETE that refreshes
 * `site_daily_use` takes gap locks reaching into the next site's rows, and two sites' uploads at the same
 * moment (nightly scripts on one schedule) deadlocked. Duplicate-key checks still lock, so no reading is doubled.
 */
export const IMPORT_ISOLATION = 'READ COMMITTED' as const;

/** Rejections stored per upload; the counts stay exact beyond it. Keeps a garbage file from filling a table. */
export const MAX_STORED_REJECTIONS = 10_000;
/** Data rows given to column detection (enough to see the interval spacing). */
const HEAD_ROWS = 20;

export class MappingProblem extends FileProblem {
  constructor(
    message: string,
    readonly details: ApiErrorDetail[],
  ) {
    super(message);
  }
}

export interface StageOptions {
  timeZone: string;
  now: number;
  /** A whole mapping a person confirmed (its header is replaced by the file's). */
  mapping?: ColumnMapping;
  /** Changes on top of the detected mapping (e.g. the meter of a single-meter file). */
  overrides?: Partial<ColumnMapping>;
  /** Refuse the file when it is not of this kind. */
  kind?: UploadKind;
  refs: IngestRefs;
  onProgress(rowsRead: number): void;
  /** Interval files load straight into stored readings under this upload, in a transaction this function opens. */
  directUploadId?: number;
}

export interface Staged {
  /** Loaded straight into stored readings (a transaction is open); `staged` is then the rows stored. */
  direct: boolean;
  kind: UploadKind;
  mapping: ColumnMapping;
  target: IngestTarget;
  writer: IngestWriter;
  rowsRead: number;
  /** Records staged (after repeats within the file were dropped). */
  staged: number;
  /** Records whose key repeats an earlier row of the same file. */
  repeats: number;
  /** With `direct`: the spans of what was loaded, so the checks after the load need not read it back. */
  spans?: IntervalSpans;
  rejected: number;
  rejections: RejectionDto[];
}

const TARGETS: Record<UploadKind, IngestTarget> = {
  'interval-long': INTERVAL_TARGET,
  'interval-wide': INTERVAL_TARGET,
  register: REGISTER_TARGET,
  runtime: RUNTIME_TARGET,
};

/**
 * Reads the CSV rows as they stream in and loads every good record into the connection's stage table; row
 * errors are collected with their row, column and reason. Nothing is written to stored data here.
 */
export async function stageUpload(qr: QueryRunner, csv: CsvRows, options: StageOptions): Promise<Staged> {
  const batches = csv.batches[Symbol.asyncIterator]();
  const head: string[][] = [];
  let afterHead: string[][] = [];
  while (head.length <= HEAD_ROWS) {
    const next = await batches.next();
    if (next.done) break;
    const wanted = HEAD_ROWS + 1 - head.length;
    head.push(...next.value.slice(0, wanted));
    afterHead = next.value.slice(wanted);
  }
  const mapping = decideMapping(head, csv, options);
  const knownRefs = mapping.kind === 'runtime' ? options.refs.controllers : new Set(options.refs.meters.keys());
  const reader = createRowReader(mapping, { timeZone: options.timeZone, now: options.now, knownRefs });
  const target = TARGETS[mapping.kind];
  const writer = new IngestWriter(qr, target);
  const direct = options.directUploadId !== undefined && target === INTERVAL_TARGET;
  const spans = direct ? new IntervalSpans() : undefined;
  const toLine = createStageLines(mapping, options.refs, spans);
  if (direct) await qr.startTransaction(IMPORT_ISOLATION);
  await writer.open(direct ? options.directUploadId : undefined);

  const staged: Staged = {
    direct,
    kind: mapping.kind,
    mapping,
    target,
    writer,
    rowsRead: 0,
    staged: 0,
    repeats: 0,
    rejected: 0,
    rejections: [],
    spans,
  };
  const reject = (e: RowError) => {
    staged.rejected++;
    if (staged.rejections.length < MAX_STORED_REJECTIONS)
      staged.rejections.push({ row: e.row, column: e.column, kind: 'rejected', message: clipText(e.message, 500) });
  };
  let row = 1;
  // Synchronous per row (a promise per row costs more than the row); the writer is flushed between rows.
  const handle = (cells: string[]) => {
    row++;
    if (cells.length === 1 && cells[0]!.trim() === '') return;
    staged.rowsRead++;
    for (const outcome of reader.read(cells, row)) {
      if (!outcome.ok) {
        reject(outcome);
        continue;
      }
      const line = toLine(outcome.record, row);
      if (typeof line === 'string') writer.add(line);
      else reject(line);
    }
    if (staged.rowsRead % 2000 === 0) options.onProgress(staged.rowsRead);
  };
  const handleAll = async (rows: string[][]) => {
    for (const cells of rows) {
      handle(cells);
      if (writer.full) await writer.flush();
    }
  };
  try {
    await handleAll(head.slice(1));
    await handleAll(afterHead);
    for (let next = await batches.next(); !next.done; next = await batches.next()) await handleAll(next.value);
    staged.staged = await writer.finish();
  } catch (err) {
    writer.abort(err as Error);
    throw err;
  }
  staged.repeats = direct ? 0 : writer.linesSent - staged.staged;
  if (staged.repeats > 0) {
    staged.rejections.push({
      row: 0,
      column: null,
      kind: 'notice',
      message:
        `${staged.repeats} record(s) repeat a meter/zone and interval ` +
        'given earlier in this file; the first of each was kept.',
    });
  }
  options.onProgress(staged.rowsRead);
  return staged;
}

/** Detects (or takes) the mapping from the header and the first rows; whole-file problems stop the upload here. */
function decideMapping(head: string[][], csv: CsvRows, options: StageOptions): ColumnMapping {
  const header = head[0] ?? [];
  const given = options.mapping ? { ...options.mapping, header } : undefined;
  const result = interpretRows(head, {
    timeZone: options.timeZone,
    now: options.now,
    delimiter: csv.delimiter,
    mapping: given,
    mappingOverrides: options.overrides,
    sampleSize: HEAD_ROWS,
  });
  if (result.fileProblems.length) throw new FileProblem(clipText(result.fileProblems.join(' '), 2_000));
  const mapping = result.mapping!;
  if (options.kind && !options.mapping && mapping.kind !== options.kind) {
    throw new FileProblem(
      `This looks like a ${mapping.kind} file, not ${options.kind}. ` +
        `${result.detection?.reasons[0] ?? ''} Choose the columns yourself ` +
        'if the guess is wrong.',
    );
  }
  if (result.mappingProblems.length) {
    const details = result.mappingProblems.map((p) => ({ field: `mapping.${p.field}`, message: p.message }));
    throw new MappingProblem(
      `The column mapping is incomplete: ${result.mappingProblems.map((p) => p.message).join(' ')}`,
      details,
    );
  }
  return mapping;
}
