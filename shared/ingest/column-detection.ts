/**
 * Guess the kind of upload and a column mapping from the header row and a few sample rows. The guess is for a
 * person to confirm in the upload preview, so it explains itself (`reasons`) and says how sure it is.
 */
import type { Delimiter } from './delimiter-sniffing';
import { classifyHeader, unitFromText, type HeaderRole } from './header-vocabulary';
import { combineDateAndTime, parseTimeOfDay, parseTimestamp } from './timestamp-parsing';
import { INTERVAL_MINUTES, type ColumnMapping, type MappedField, type UploadKind } from './upload-kind';
import { wallTimeAsUtcMs } from './zoned-time';

export interface ColumnDetection {
  kind: UploadKind | null;
  mapping: ColumnMapping | null;
  /** 0–1: 1 when every required column was found by name and the samples parse. */
  confidence: number;
  reasons: string[];
}

export interface DetectionOptions {
  /** The file's delimiter; decimal commas are only considered when it is not `,`. */
  delimiter?: Delimiter;
}

interface Found {
  roles: HeaderRole[];
  first(role: HeaderRole): number | undefined;
}

function longestSlotRun(roles: HeaderRole[]): { first: number; count: number } {
  let best = { first: -1, count: 0 };
  for (let i = 0; i < roles.length;) {
    if (roles[i] !== 'interval-slot') {
      i++;
      continue;
    }
    let j = i;
    while (roles[j] === 'interval-slot') j++;
    if (j - i > best.count) best = { first: i, count: j - i };
    i = j;
  }
  return best;
}

function column(rows: string[][], index: number | undefined): string[] {
  if (index === undefined) return [];
  return rows.map((r) => (r[index] ?? '').trim()).filter((v) => v !== '');
}

/** True when most sample cells are a time of day only (e.g. a "Start" column beside a "Date" column). */
function looksTimeOnly(values: string[]): boolean {
  return values.length > 0 && values.filter((v) => parseTimeOfDay(v).ok).length * 2 > values.length;
}

function looksDecimalComma(values: string[]): boolean {
  return values.some((v) => /^[+-]?\d{1,3}(?:\.\d{3})*,\d+$/.test(v)) && !values.some((v) => /^\d+\.\d+$/.test(v));
}

/** Most common positive spacing (minutes) between consecutive sample timestamps of the same meter. */
function inferIntervalMinutes(rows: string[][], columns: Partial<Record<MappedField, number>>): number | undefined {
  const last = new Map<string, number>();
  const counts = new Map<number, number>();
  const meterCol = columns.meter;
  for (const row of rows) {
    const cell = (i: number | undefined) => (i === undefined ? '' : (row[i] ?? ''));
    const parsed =
      columns.timestamp !== undefined
        ? parseTimestamp(cell(columns.timestamp))
        : combineDateAndTime(cell(columns.date), cell(columns.time));
    if (!parsed.ok) continue;
    const ms = parsed.kind === 'instant' ? parsed.utcMs : wallTimeAsUtcMs(parsed.wall);
    const key = meterCol === undefined ? '' : (row[meterCol] ?? '').trim();
    const prev = last.get(key);
    last.set(key, ms);
    if (prev === undefined || ms <= prev) continue;
    const minutes = Math.round((ms - prev) / 60_000);
    counts.set(minutes, (counts.get(minutes) ?? 0) + 1);
  }
  const best = [...counts.entries()].sort((a, b) => b[1] - a[1])[0]?.[0];
  return best !== undefined && (INTERVAL_MINUTES as readonly number[]).includes(best) ? best : undefined;
}

function chooseKind(found: Found, slotRun: { count: number }): { kind: UploadKind | null; why: string } {
  const has = (role: HeaderRole) => found.first(role) !== undefined;
  if (slotRun.count >= 23) return { kind: 'interval-wide', why: `${slotRun.count} interval columns in a row` };
  if ((has('station') || has('controller')) && (has('duration') || has('end'))) {
    return { kind: 'runtime', why: 'a station/controller column with a run time or end column' };
  }
  if (has('registerValue') && !has('usageValue')) return { kind: 'register', why: 'a register/reading value column' };
  if (has('usageValue')) return { kind: 'interval-long', why: 'a usage/volume column beside a timestamp' };
  return { kind: null, why: 'no column looks like a usage volume, a register read, or a controller run' };
}

/** Guesses the kind and mapping; `kind: null` when the header matches nothing this reader knows. */
export function detectColumns(
  header: string[],
  sampleRows: string[][] = [],
  options: DetectionOptions = {},
): ColumnDetection {
  const roles = header.map(classifyHeader);
  const found: Found = {
    roles,
    first: (role) => {
      const i = roles.indexOf(role);
      return i < 0 ? undefined : i;
    },
  };
  const slotRun = longestSlotRun(roles);
  const { kind, why } = chooseKind(found, slotRun);
  const reasons = [kind ? `Looks like ${kind}: ${why}.` : `Unknown layout: ${why}.`];
  if (!kind) return { kind: null, mapping: null, confidence: 0, reasons };

  const columns: Partial<Record<MappedField, number>> = {};
  const mapping: ColumnMapping = { kind, header: [...header], columns };
  const take = (field: MappedField, index: number | undefined) => {
    if (index === undefined || Object.values(columns).includes(index)) return;
    columns[field] = index;
    reasons.push(`"${header[index]}" → ${field}.`);
  };
  let doubts = 0;

  if (kind === 'runtime') {
    take('controller', found.first('controller'));
    take('station', found.first('station'));
    const date = found.first('date');
    const start = found.first('start') ?? found.first('timestamp') ?? found.first('time');
    // A "Date" column next to time-only "Start"/"End" columns: the reader combines them.
    if (date !== undefined && looksTimeOnly(column(sampleRows, start))) take('date', date);
    take('start', start ?? (columns.date === undefined ? date : undefined));
    take('end', found.first('end'));
    take('duration', found.first('duration'));
    take('cause', found.first('cause'));
    const gallons = found.first('measuredGallons') ?? found.first('usageValue');
    if (gallons !== undefined && unitFromText(header[gallons] ?? '') === 'gal') take('measuredGallons', gallons);
  } else {
    take('meter', found.first('meter'));
    if (kind === 'interval-wide') {
      take('date', found.first('date') ?? found.first('timestamp'));
      mapping.intervalColumns = slotRun;
      reasons.push(
        `"${header[slotRun.first]}" … "${header[slotRun.first + slotRun.count - 1]}" → ${slotRun.count} intervals.`,
      );
    } else {
      const date = found.first('date');
      const time = found.first('time');
      if (found.first('timestamp') !== undefined) take('timestamp', found.first('timestamp'));
      else if (date !== undefined && time !== undefined) {
        take('date', date);
        take('time', time);
      } else if (found.first('start') === undefined && found.first('end') !== undefined && kind === 'interval-long') {
        // Some exports stamp each interval at its end ("Interval End").
        take('timestamp', found.first('end'));
        mapping.timestampMarksEnd = true;
        reasons.push('Timestamps mark the end of each interval.');
      } else take('timestamp', found.first('start') ?? date ?? time);
      const value =
        kind === 'register' ? (found.first('registerValue') ?? found.first('usageValue')) : found.first('usageValue');
      take('value', value);
      if (kind === 'interval-long') {
        take('intervalMinutes', found.first('intervalMinutes') ?? found.first('duration'));
        if (columns.intervalMinutes === undefined) {
          mapping.intervalMinutes = inferIntervalMinutes(sampleRows, columns);
          if (mapping.intervalMinutes)
            reasons.push(`Interval length ${mapping.intervalMinutes} min, from the sample rows' spacing.`);
          else {
            reasons.push('Interval length not found; choose it.');
            doubts++;
          }
        }
      }
    }
    take('unit', found.first('unit'));
    if (columns.unit === undefined) {
      const unitSource =
        columns.value !== undefined
          ? [columns.value]
          : header.map((_, i) => i).filter((i) => roles[i] !== 'interval-slot');
      for (const i of unitSource) {
        const unit = unitFromText(header[i] ?? '');
        if (unit) {
          mapping.unit = unit;
          reasons.push(`Unit ${unit}, named in "${header[i]}".`);
          break;
        }
      }
      if (!mapping.unit) {
        reasons.push('No unit in the header; choose one.');
        doubts++;
      }
    }
    if (columns.meter === undefined) {
      reasons.push('No meter column: a single-meter file; choose the meter.');
      doubts++;
    }
  }

  if (options.delimiter && options.delimiter !== ',') {
    const numberCells =
      kind === 'interval-wide'
        ? sampleRows.flatMap((r) => r.slice(slotRun.first, slotRun.first + slotRun.count))
        : column(sampleRows, columns.value ?? columns.duration);
    if (looksDecimalComma(numberCells.map((v) => v.trim()).filter(Boolean))) {
      mapping.decimalComma = true;
      reasons.push('Numbers use a decimal comma (1.234,5).');
    }
  }

  const timeCol = columns.timestamp ?? columns.start ?? columns.date;
  const timeCells = column(sampleRows, timeCol);
  if (timeCells.length > 0 && columns.date === undefined) {
    const parsed = timeCells.filter((v) => parseTimestamp(v).ok).length;
    if (parsed * 2 < timeCells.length) {
      reasons.push(`Most sample values in "${header[timeCol!]}" are not dates this reader understands.`);
      doubts += 2;
    }
  }
  const confidence = Math.max(0.1, Math.round(100 * 0.8 ** doubts) / 100);
  return { kind, mapping, confidence, reasons };
}
