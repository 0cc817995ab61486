/** One-reading-per-row interval files → interval records. */
import { createInstantResolver } from './local-instant-resolver';
import { parseNumber, parseVolume } from './number-parsing';
import {
  cellText,
  isBlankRow,
  nowMs,
  readEstimated,
  readRef,
  readTimestamp,
  readUnit,
  rowError,
  toIso,
  zoneFor,
  type ReadOptions,
} from './row-cells';
import type { IntervalRecord, RowError, RowOutcome } from './ingest-records';
import type { ColumnMapping } from './upload-kind';

export interface IntervalLongReader {
  /** `null` for a blank row. Rows must arrive in file order (DST fall-back is resolved per meter in order). */
  read(cells: string[], row: number): RowOutcome<IntervalRecord> | null;
}

/** The row's interval length: its own column, else the mapping's. */
function readMinutes(mapping: ColumnMapping, cells: string[], row: number): number | RowError {
  const minutesCol = mapping.columns.intervalMinutes;
  if (minutesCol === undefined) {
    return mapping.intervalMinutes ?? rowError(mapping, row, null, 'no interval length chosen');
  }
  const parsed = parseNumber(cellText(cells, minutesCol));
  if (!parsed.ok) return rowError(mapping, row, minutesCol, parsed.message);
  if (!Number.isInteger(parsed.value) || parsed.value <= 0 || parsed.value > 1440) {
    return rowError(mapping, row, minutesCol, `${parsed.value} is not an interval length in whole minutes (1–1440)`);
  }
  return parsed.value;
}

export function createIntervalLongReader(mapping: ColumnMapping, options: ReadOptions): IntervalLongReader {
  const resolver = createInstantResolver(options.timeZone);
  const now = nowMs(options);
  const evidence = options.dateEvidence;
  return {
    read(cells, row) {
      if (isBlankRow(cells)) return null;
      const meter = readRef(mapping, cells, row, 'meter', options);
      if (!meter.ok) return meter;
      const stamp = readTimestamp(mapping, cells, row, 'timestamp', evidence);
      if (!stamp.ok) return stamp;
      const instant = resolver.resolve(meter.ref, stamp.parsed, zoneFor(options, meter.ref));
      if (!instant.ok) return rowError(mapping, row, stamp.column, instant.message);

      const minutes = readMinutes(mapping, cells, row);
      if (typeof minutes !== 'number') return minutes;
      const startMs = mapping.timestampMarksEnd ? instant.utcMs - minutes * 60_000 : instant.utcMs;
      if (startMs + minutes * 60_000 > now) {
        return rowError(mapping, row, stamp.column, `${toIso(startMs)} is in the future (interval not yet over)`);
      }

      const valueCol = mapping.columns.value!;
      const volume = parseVolume(cellText(cells, valueCol), mapping);
      if (!volume.ok) return rowError(mapping, row, valueCol, volume.message);
      const unit = readUnit(mapping, cells, row, { ref: meter.ref, options });
      if (!unit.ok) return unit;
      const estimated = readEstimated(mapping, cells, row);
      if (typeof estimated !== 'boolean') return estimated;
      const record: IntervalRecord = {
        meterRef: meter.ref,
        startUtc: toIso(startMs),
        minutes,
        volume: volume.value,
        unit: unit.unit,
      };
      if (estimated) record.estimated = true;
      return { ok: true, record };
    },
  };
}
