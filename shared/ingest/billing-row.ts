/**
 * Billing-period files (start date, end date, usage; what utility bills give) → billing records. Both dates are
 * local days and both belong to the period (a June bill is 06/01 – 06/30); the usage is spread over the days later.
 */
import { parseVolume } from './number-parsing';
import {
  cellText,
  isBlankRow,
  nowMs,
  observeDate,
  readEstimated,
  readRef,
  readUnit,
  rowError,
  zoneFor,
  type ReadOptions,
} from './row-cells';
import { parseTimestamp } from './timestamp-parsing';
import type { BillingRecord, RowError, RowOutcome } from './ingest-records';
import type { ColumnMapping } from './upload-kind';
import { addWallMinutes, resolveLocalTime, wallTimeAsUtcMs, type WallTime } from './zoned-time';

/** Longest period accepted; a longer one is a typo in a year or a lifetime total. */
export const MAX_BILLING_DAYS = 400;

export interface BillingReader {
  read(cells: string[], row: number): RowOutcome<BillingRecord> | null;
}

const ymd = (w: WallTime) =>
  `${String(w.year).padStart(4, '0')}-${String(w.month).padStart(2, '0')}-${String(w.day).padStart(2, '0')}`;

/** One date cell → its local day (a time, if any, is ignored: bills are whole days). */
function readDay(
  mapping: ColumnMapping,
  cells: string[],
  row: number,
  field: 'start' | 'end',
  options: ReadOptions,
): WallTime | RowError {
  const column = mapping.columns[field];
  if (column === undefined) return rowError(mapping, row, null, `no ${field} date column`);
  const text = cellText(cells, column);
  if (text === '') return rowError(mapping, row, column, 'is empty');
  const parsed = parseTimestamp(text, mapping.dateOrder);
  observeDate(options.dateEvidence, parsed, row, text);
  if (!parsed.ok) return rowError(mapping, row, column, parsed.message);
  if (parsed.kind !== 'wall')
    return rowError(mapping, row, column, 'should be a date (a billing period is whole days)');
  return { ...parsed.wall, hour: 0, minute: 0, second: 0 };
}

/** The instant a local day ends (the next day's first instant) in `zone`. */
function dayEndMs(day: WallTime, zone: string): number {
  const next = addWallMinutes(day, 24 * 60);
  const r = resolveLocalTime(next, zone);
  if (r.kind === 'unique') return r.utcMs;
  if (r.kind === 'ambiguous') return r.earlierUtcMs;
  return wallTimeAsUtcMs(next);
}

export function createBillingReader(mapping: ColumnMapping, options: ReadOptions): BillingReader {
  const now = nowMs(options);
  return {
    read(cells, row) {
      if (isBlankRow(cells)) return null;
      const meter = readRef(mapping, cells, row, 'meter', options);
      if (!meter.ok) return meter;
      const start = readDay(mapping, cells, row, 'start', options);
      if ('ok' in start) return start;
      const end = readDay(mapping, cells, row, 'end', options);
      if ('ok' in end) return end;
      const days = Math.round((wallTimeAsUtcMs(end) - wallTimeAsUtcMs(start)) / 86_400_000) + 1;
      const endCol = mapping.columns.end!;
      if (days < 1)
        return rowError(mapping, row, endCol, `the period ends (${ymd(end)}) before it starts (${ymd(start)})`);
      if (days > MAX_BILLING_DAYS)
        return rowError(
          mapping,
          row,
          endCol,
          `a ${days}-day period is longer than a bill can be (${MAX_BILLING_DAYS})`,
        );
      if (dayEndMs(end, zoneFor(options, meter.ref)) > now)
        return rowError(mapping, row, endCol, `the period ends ${ymd(end)}, which is not over yet`);
      const valueCol = mapping.columns.value!;
      const volume = parseVolume(cellText(cells, valueCol), mapping);
      if (!volume.ok) return rowError(mapping, row, valueCol, volume.message);
      const unit = readUnit(mapping, cells, row, { ref: meter.ref, options });
      if (!unit.ok) return unit;
      const estimated = readEstimated(mapping, cells, row);
      if (typeof estimated !== 'boolean') return estimated;
      const record: BillingRecord = {
        meterRef: meter.ref,
        startDate: ymd(start),
        endDate: ymd(end),
        volume: volume.value,
        unit: unit.unit,
      };
      if (estimated) record.estimated = true;
      return { ok: true, record };
    },
  };
}
