/** Register-read files → register records (cumulative values; differencing is `register-differencing.ts`). */
import { createInstantResolver } from './local-instant-resolver';
import { parseVolume } from './number-parsing';
import {
  cellText,
  isBlankRow,
  nowMs,
  readRef,
  readTimestamp,
  readUnit,
  rowError,
  toIso,
  type ReadOptions,
} from './row-cells';
import type { RegisterRecord, RowOutcome } from './ingest-records';
import type { ColumnMapping } from './upload-kind';

export interface RegisterReader {
  read(cells: string[], row: number): RowOutcome<RegisterRecord> | null;
}

export function createRegisterReader(mapping: ColumnMapping, options: ReadOptions): RegisterReader {
  const resolver = createInstantResolver(options.timeZone);
  const now = nowMs(options);
  return {
    read(cells, row) {
      if (isBlankRow(cells)) return null;
      const meter = readRef(mapping, cells, row, 'meter', options);
      if (!meter.ok) return meter;
      const stamp = readTimestamp(mapping, cells, row, 'timestamp');
      if (!stamp.ok) return stamp;
      const instant = resolver.resolve(meter.ref, stamp.parsed);
      if (!instant.ok) return rowError(mapping, row, stamp.column, instant.message);
      if (instant.utcMs > now) return rowError(mapping, row, stamp.column, `${toIso(instant.utcMs)} is in the future`);
      const valueCol = mapping.columns.value!;
      const value = parseVolume(cellText(cells, valueCol), mapping);
      if (!value.ok) return rowError(mapping, row, valueCol, value.message);
      const unit = readUnit(mapping, cells, row);
      if (!unit.ok) return unit;
      return {
        ok: true,
        record: { meterRef: meter.ref, atUtc: toIso(instant.utcMs), value: value.value, unit: unit.unit },
      };
    },
  };
}
