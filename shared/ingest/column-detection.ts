/**
 * Guess the kind of upload and a column mapping from the header row and a few sample rows. The guess is for a
 * person to confirm in the upload preview, so it explains itself (`reasons`) and says how sure it is. Each layout
 * has its own detector (`detect-layouts.ts`); what they share is here and in `detection-context.ts`.
 */
import { DetectionContext, type DetectionOptions } from './detection-context';
import { chooseLayout, LAYOUT_DETECTORS, longestSlotRun } from './detect-layouts';
import type { ColumnMapping, UploadKind } from './upload-kind';

export type { DetectionOptions } from './detection-context';

export interface ColumnDetection {
  kind: UploadKind | null;
  mapping: ColumnMapping | null;
  /** 0–1: 1 when every required column was found by name and the samples parse. */
  confidence: number;
  reasons: string[];
}

function looksDecimalComma(values: string[]): boolean {
  return values.some((v) => /^[+-]?\d{1,3}(?:\.\d{3})*,\d+$/.test(v)) && !values.some((v) => /^\d+\.\d+$/.test(v));
}

/** `1.234,5` numbers, only considered in `;` or tab files. */
function detectDecimalComma(ctx: DetectionContext): void {
  if (!ctx.options.delimiter || ctx.options.delimiter === ',') return;
  const { columns, kind } = ctx.mapping;
  const run = longestSlotRun(ctx);
  const numberCells =
    kind === 'interval-wide'
      ? ctx.sample.flatMap((r) => r.slice(run.first, run.first + run.count))
      : ctx.cells(columns.value ?? columns.duration);
  if (looksDecimalComma(numberCells.map((v) => v.trim()).filter(Boolean))) {
    ctx.mapping.decimalComma = true;
    ctx.reasons.push('Numbers use a decimal comma (1.234,5).');
  }
}

/** Most sample times that do not parse make the guess doubtful. */
function checkSampleTimes(ctx: DetectionContext): void {
  const { columns } = ctx.mapping;
  const timeCol = columns.timestamp ?? columns.start ?? columns.date;
  const timeCells = ctx.cells(timeCol);
  if (timeCells.length === 0 || (columns.date !== undefined && ctx.mapping.kind !== 'billing')) return;
  const parsed = timeCells.filter((v) => ctx.parse(v).ok).length;
  if (parsed * 2 < timeCells.length) {
    ctx.reasons.push(`Most sample values in "${ctx.header[timeCol!]}" are not dates this reader understands.`);
    ctx.doubts += 2;
  }
}

/** Guesses the kind and mapping; `kind: null` when the header matches nothing this reader knows. */
export function detectColumns(
  header: string[],
  sampleRows: string[][] = [],
  options: DetectionOptions = {},
): ColumnDetection {
  const ctx = new DetectionContext(header, sampleRows, options);
  const { kind, why } = chooseLayout(ctx);
  if (!kind) return { kind: null, mapping: null, confidence: 0, reasons: [`Unknown layout: ${why}.`] };
  ctx.reasons.push(`Looks like ${kind}: ${why}.`);
  ctx.begin(kind);
  LAYOUT_DETECTORS[kind](ctx);
  detectDecimalComma(ctx);
  checkSampleTimes(ctx);
  if (options.dateOrder) ctx.mapping.dateOrder = options.dateOrder;
  const confidence = Math.max(0.1, Math.round(100 * 0.8 ** ctx.doubts) / 100);
  return { kind, mapping: ctx.mapping, confidence, reasons: ctx.reasons };
}
