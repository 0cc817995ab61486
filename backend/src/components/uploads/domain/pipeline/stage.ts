import type { QueryRunner } from 'typeorm';
import { DateOrderEvidence, type DateOrder } from '@shared/ingest/date-order';
import type { RowError } from '@shared/ingest/ingest-records';
import { cellText } from '@shared/ingest/row-cells';
import { createRowReader, interpretRows } from '@shared/ingest/row-reader';
import type { ColumnMapping, UploadKind } from '@shared/ingest/upload-kind';
import type { RejectionDto } from '@shared/uploads/upload';
import type { VolumeUnit } from '@shared/units/volume-units';
import {
  BILLING_TARGET,
  INTERVAL_TARGET,
  REGISTER_TARGET,
  RUNTIME_TARGET,
  type IngestTarget,
} from '../../data/ingest-targets';
import { StageTable } from '../../data/stage-table';
import { clipText } from '../../../../platform/clip-text';
import { FileProblem, type CsvRows } from '../csv-rows';
import type { IngestRefs } from '../ingest-refs';
import { IntervalSpans } from '../interval-spans';
import { MappingProblem } from '../upload-errors';
import { createStageLines } from '../stage-lines';
import { UnitFindings } from '../unit-findings';

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

export interface StageOptions {
  timeZone: string;
  /** A file for many sites: each meter's or controller's site zone. */
  zoneOf?: (ref: string) => string | undefined;
  now: number;
  /** A whole mapping a person confirmed (its header is replaced by the file's). */
  mapping?: ColumnMapping;
  /** Changes on top of the detected mapping (e.g. the meter of a single-meter file). */
  overrides?: Partial<ColumnMapping>;
  /** Refuse the file when it is not of this kind. */
  kind?: UploadKind;
  refs: IngestRefs;
  /**
   * Day/month order: chosen for the file, the organisation's usual one, and (a second reading, once the whole file
   * decided) the order to read with from the first row.
   */
  dateOrder: { chosen?: DateOrder; organisationDefault?: DateOrder | null; read?: DateOrder };
  onProgress(rowsRead: number): void;
  /** Interval files load straight into stored readings under this upload, in a transaction this function opens. */
  directUploadId?: number;
}

/** Rows naming one meter or controller no site in scope has. */
export interface UnknownRefTally {
  field: 'meter' | 'controller';
  ref: string;
  rows: number;
  firstRows: number[];
}

export interface Staged {
  /** Loaded straight into stored readings (a transaction is open); `staged` is then the rows stored. */
  direct: boolean;
  kind: UploadKind;
  /** The mapping the rows were read with (its `dateOrder` is the order used, when the file has numeric dates). */
  mapping: ColumnMapping;
  target: IngestTarget;
  table: StageTable;
  rowsRead: number;
  /** Records staged (a direct load: stored). */
  staged: number;
  /** With `direct`: the spans of what was loaded, so the checks after the load need not read it back. */
  spans?: IntervalSpans;
  rejected: number;
  rejections: RejectionDto[];
  /** Rejected rows per site (null: a row whose meter or controller no site in scope has). */
  rejectedBySite: Map<number | null, number>;
  unknownRefs: Map<string, UnknownRefTally>;
  /** Every numeric date of the file, for the date-order decision. */
  dateEvidence: DateOrderEvidence;
  units: UnitFindings;
}

const TARGETS: Record<UploadKind, IngestTarget> = {
  'interval-long': INTERVAL_TARGET,
  'interval-wide': INTERVAL_TARGET,
  register: REGISTER_TARGET,
  runtime: RUNTIME_TARGET,
  billing: BILLING_TARGET,
};

/** Reads up to HEAD_ROWS data rows (and the header) from the batches, keeping what came after them. */
async function readHead(batches: AsyncIterator<string[][]>): Promise<{ head: string[][]; afterHead: string[][] }> {
  const head: string[][] = [];
  let afterHead: string[][] = [];
  while (head.length <= HEAD_ROWS) {
    const next = await batches.next();
    if (next.done) break;
    const wanted = HEAD_ROWS + 1 - head.length;
    head.push(...next.value.slice(0, wanted));
    afterHead = next.value.slice(wanted);
  }
  return { head, afterHead };
}

/** The site of the meter or controller a row names (for counts per site), when it is known. */
function rowSiteOf(mapping: ColumnMapping, refs: IngestRefs): (cells: string[]) => number | null {
  const c = mapping.columns;
  if (mapping.kind === 'runtime') return (cells) => refs.controllers.get(cellText(cells, c.controller)) ?? null;
  return (cells) => {
    const ref = c.meter === undefined ? (mapping.fixedMeterRef ?? '').trim() : cellText(cells, c.meter);
    return refs.meters.get(ref)?.siteId ?? null;
  };
}

/**
 * Stage: reads the CSV rows as they stream in and loads every good record into the connection's stage table (or,
 * direct, into stored readings); row errors are collected with their row, column and reason, rows of unknown meters
 * once per meter. Nothing is decided here beyond the mapping: the file's date order, repeats and conflicts are for
 * the next steps.
 */
export async function stageFile(qr: QueryRunner, csv: CsvRows, options: StageOptions): Promise<Staged> {
  const batches = csv.batches[Symbol.asyncIterator]();
  const { head, afterHead } = await readHead(batches);
  const mapping = decideMapping(head, csv, options);
  const target = TARGETS[mapping.kind];
  const direct = options.directUploadId !== undefined && target === INTERVAL_TARGET;
  const staged: Staged = {
    direct,
    kind: mapping.kind,
    mapping,
    target,
    table: new StageTable(qr, target),
    rowsRead: 0,
    staged: 0,
    rejected: 0,
    rejections: [],
    rejectedBySite: new Map(),
    unknownRefs: new Map(),
    dateEvidence: new DateOrderEvidence(),
    units: new UnitFindings(),
    spans: direct ? new IntervalSpans() : undefined,
  };
  const handleAll = rowHandler(staged, options);
  if (direct) await qr.startTransaction(IMPORT_ISOLATION);
  await staged.table.open(direct ? options.directUploadId : undefined);
  try {
    await handleAll(head.slice(1));
    await handleAll(afterHead);
    for (let next = await batches.next(); !next.done; next = await batches.next()) await handleAll(next.value);
    staged.staged = await staged.table.finish();
  } catch (err) {
    staged.table.abort(err as Error);
    throw err;
  }
  options.onProgress(staged.rowsRead);
  return staged;
}

/** The per-row work: read, turn into a stage line, send; errors and unknown refs are tallied. */
function rowHandler(staged: Staged, options: StageOptions): (rows: string[][]) => Promise<void> {
  const { mapping, table } = staged;
  const refs = options.refs;
  const runtime = mapping.kind === 'runtime';
  const knownRefs = runtime ? new Set(refs.controllers.keys()) : new Set(refs.meters.keys());
  const meterUnits = new Map<string, VolumeUnit>([...refs.meters.values()].map((m) => [m.ref, m.unit]));
  const reader = createRowReader(mapping, {
    timeZone: options.timeZone,
    zoneOf: options.zoneOf,
    now: options.now,
    knownRefs,
    meterUnits,
    dateEvidence: staged.dateEvidence,
  });
  const toLine = createStageLines(mapping, refs, { units: staged.units, spans: staged.spans });
  const siteOf = rowSiteOf(mapping, refs);
  const reject = (e: RowError, cells: string[]) => {
    staged.rejected++;
    const site = siteOf(cells);
    staged.rejectedBySite.set(site, (staged.rejectedBySite.get(site) ?? 0) + 1);
    if (e.unknownRef) return tallyUnknown(staged, e);
    if (staged.rejections.length < MAX_STORED_REJECTIONS)
      staged.rejections.push({ row: e.row, column: e.column, kind: 'rejected', message: clipText(e.message, 500) });
  };
  let row = 1;
  // Synchronous per row (a promise per row costs more than the row); the table is flushed between rows.
  const handle = (cells: string[]) => {
    row++;
    if (cells.length === 1 && cells[0]!.trim() === '') return;
    staged.rowsRead++;
    for (const outcome of reader.read(cells, row)) {
      if (!outcome.ok) {
        reject(outcome, cells);
        continue;
      }
      const line = toLine(outcome.record, row);
      if (typeof line === 'string') table.add(line);
      else reject(line, cells);
    }
    if (staged.rowsRead % 2000 === 0) options.onProgress(staged.rowsRead);
  };
  return async (rows) => {
    for (const cells of rows) {
      handle(cells);
      if (table.full) await table.flush();
    }
  };
}

function tallyUnknown(staged: Staged, e: RowError): void {
  const { field, ref } = e.unknownRef!;
  const key = `${field}\u0000${ref}`;
  let tally = staged.unknownRefs.get(key);
  if (!tally) staged.unknownRefs.set(key, (tally = { field, ref, rows: 0, firstRows: [] }));
  tally.rows++;
  if (tally.firstRows.length < 8) tally.firstRows.push(e.row);
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
    dateOrder: options.dateOrder.read ?? options.dateOrder.chosen,
    organisationDateOrder: options.dateOrder.organisationDefault,
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
