/**
 * One detector per layout: each maps the columns its kind of file needs, given the header's roles and the samples
 * (`DetectionContext`). `chooseLayout` decides which one applies.
 */
import type { DetectionContext } from './detection-context';
import { unitFromText } from './header-vocabulary';
import type { UploadKind } from './upload-kind';

/** The longest run of interval-slot headers ("Hr 01" … "Hr 24", "00:15" … "24:00"). */
export function longestSlotRun(ctx: DetectionContext): { first: number; count: number } {
  let best = { first: -1, count: 0 };
  for (let i = 0; i < ctx.roles.length;) {
    if (ctx.roles[i] !== 'interval-slot') {
      i++;
      continue;
    }
    let j = i;
    while (ctx.roles[j] === 'interval-slot') j++;
    if (j - i > best.count) best = { first: i, count: j - i };
    i = j;
  }
  return best;
}

/** Start and end columns holding whole dates at least two days apart: billing periods, not intervals. */
function looksLikeBillingPeriods(ctx: DetectionContext): boolean {
  const starts = ctx.cells(ctx.first('start'));
  const ends = ctx.cells(ctx.first('end'));
  if (starts.length === 0 || ends.length === 0) return false;
  let periods = 0;
  for (let i = 0; i < Math.min(starts.length, ends.length); i++) {
    const a = ctx.parse(starts[i]!);
    const b = ctx.parse(ends[i]!);
    if (!a.ok || !b.ok || a.kind !== 'wall' || b.kind !== 'wall' || !a.dateOnly || !b.dateOnly) continue;
    const days =
      (Date.UTC(b.wall.year, b.wall.month - 1, b.wall.day) - Date.UTC(a.wall.year, a.wall.month - 1, a.wall.day)) /
      86_400_000;
    if (days >= 2) periods++;
  }
  return periods * 2 > Math.min(starts.length, ends.length);
}

export function chooseLayout(ctx: DetectionContext): { kind: UploadKind | null; why: string } {
  const slotRun = longestSlotRun(ctx);
  if (slotRun.count >= 23) return { kind: 'interval-wide', why: `${slotRun.count} interval columns in a row` };
  if ((ctx.has('station') || ctx.has('controller')) && (ctx.has('duration') || ctx.has('end'))) {
    return { kind: 'runtime', why: 'a station/controller column with a run time or end column' };
  }
  if (ctx.has('start') && ctx.has('end') && ctx.has('usageValue') && looksLikeBillingPeriods(ctx)) {
    return { kind: 'billing', why: 'start and end dates days apart with a usage column (billing periods)' };
  }
  if (ctx.has('registerValue') && !ctx.has('usageValue'))
    return { kind: 'register', why: 'a register/reading value column' };
  if (ctx.has('usageValue')) return { kind: 'interval-long', why: 'a usage/volume column beside a timestamp' };
  return { kind: null, why: 'no column looks like a usage volume, a register read, or a controller run' };
}

/** The time of each row: a timestamp column, a date and a time column, or an "Interval End" stamp. */
function detectTimestamp(ctx: DetectionContext): void {
  const date = ctx.first('date');
  const time = ctx.first('time');
  if (ctx.has('timestamp')) ctx.take('timestamp', ctx.first('timestamp'));
  else if (date !== undefined && time !== undefined) {
    ctx.take('date', date);
    ctx.take('time', time);
  } else if (!ctx.has('start') && ctx.has('end') && ctx.mapping.kind === 'interval-long') {
    // Some exports stamp each interval at its end ("Interval End").
    ctx.take('timestamp', ctx.first('end'));
    ctx.mapping.timestampMarksEnd = true;
    ctx.reasons.push('Timestamps mark the end of each interval.');
  } else ctx.take('timestamp', ctx.first('start') ?? date ?? time);
}

export function detectIntervalLong(ctx: DetectionContext): void {
  ctx.detectMeter();
  detectTimestamp(ctx);
  ctx.take('value', ctx.first('usageValue'));
  ctx.take('intervalMinutes', ctx.first('intervalMinutes') ?? ctx.first('duration'));
  ctx.take('readType', ctx.first('readType'));
  if (ctx.mapping.columns.intervalMinutes === undefined) {
    ctx.mapping.intervalMinutes = ctx.sampleSpacingMinutes();
    if (ctx.mapping.intervalMinutes)
      ctx.reasons.push(`Interval length ${ctx.mapping.intervalMinutes} min, from the sample rows' spacing.`);
    else {
      ctx.reasons.push('Interval length not found; choose it.');
      ctx.doubts++;
    }
  }
  ctx.detectUnit();
}

export function detectIntervalWide(ctx: DetectionContext): void {
  const run = longestSlotRun(ctx);
  ctx.detectMeter();
  ctx.take('date', ctx.first('date') ?? ctx.first('timestamp'));
  ctx.mapping.intervalColumns = run;
  ctx.reasons.push(`"${ctx.header[run.first]}" … "${ctx.header[run.first + run.count - 1]}" → ${run.count} intervals.`);
  ctx.detectUnit();
}

export function detectRegister(ctx: DetectionContext): void {
  ctx.detectMeter(true);
  detectTimestamp(ctx);
  ctx.take('value', ctx.first('registerValue') ?? ctx.first('usageValue'));
  ctx.take('multiplier', ctx.first('multiplier'));
  ctx.take('registerDigits', ctx.first('registerDigits'));
  ctx.take('readType', ctx.first('readType'));
  ctx.detectUnit();
}

export function detectBilling(ctx: DetectionContext): void {
  ctx.detectMeter();
  ctx.take('start', ctx.first('start'));
  ctx.take('end', ctx.first('end'));
  ctx.take('value', ctx.first('usageValue'));
  ctx.take('readType', ctx.first('readType'));
  ctx.detectUnit();
}

export function detectRuntime(ctx: DetectionContext): void {
  ctx.take('controller', ctx.first('controller'));
  ctx.take('station', ctx.first('station'));
  const date = ctx.first('date');
  const start = ctx.first('start') ?? ctx.first('timestamp') ?? ctx.first('time');
  // A "Date" column next to time-only "Start"/"End" columns: the reader combines them.
  if (date !== undefined && ctx.looksTimeOnly(start)) ctx.take('date', date);
  ctx.take('start', start ?? (ctx.mapping.columns.date === undefined ? date : undefined));
  ctx.take('end', ctx.first('end'));
  ctx.take('duration', ctx.first('duration'));
  ctx.take('cause', ctx.first('cause'));
  const gallons = ctx.first('measuredGallons') ?? ctx.first('usageValue');
  if (gallons !== undefined && unitFromText(ctx.header[gallons] ?? '') === 'gal') ctx.take('measuredGallons', gallons);
}

export const LAYOUT_DETECTORS: Record<UploadKind, (ctx: DetectionContext) => void> = {
  'interval-long': detectIntervalLong,
  'interval-wide': detectIntervalWide,
  register: detectRegister,
  runtime: detectRuntime,
  billing: detectBilling,
};
