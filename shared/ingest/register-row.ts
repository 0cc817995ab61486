/** Register-read files → register records (cumulative values; differencing is `register-differencing.ts`). */
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
import type { RegisterRecord, RowError, RowOutcome } from './ingest-records';
import type { ColumnMapping } from './upload-kind';

export interface RegisterReader {
  read(cells: string[], row: number): RowOutcome<RegisterRecord> | null;
}

type RegisterFacts = Pick<RegisterRecord, 'serial' | 'multiplier' | 'digits'>;

/** Serial, multiplier and dial digits when the file has those columns (blank cells: the meter's settings). */
function readRegisterFacts(mapping: ColumnMapping, cells: string[], row: number): RegisterFacts | RowError {
  const c = mapping.columns;
  const facts: RegisterFacts = {};
  const serial = cellText(cells, c.serial);
  if (serial !== '') facts.serial = serial.slice(0, 64);
  const multiplierText = cellText(cells, c.multiplier);
  if (multiplierText !== '') {
    const m = parseNumber(multiplierText.replace(/^[x×]\s*/i, ''), mapping);
    if (!m.ok || m.value <= 0) return rowError(mapping, row, c.multiplier!, `"${multiplierText}" is not a multiplier`);
    facts.multiplier = m.value;
  }
  const digitsText = cellText(cells, c.registerDigits);
  if (digitsText !== '') {
    const d = parseNumber(digitsText);
    if (!d.ok || !Number.isInteger(d.value) || d.value < 1 || d.value > 12)
      return rowError(mapping, row, c.registerDigits!, `"${digitsText}" is not a number of register digits (1–12)`);
    facts.digits = d.value;
  }
  return facts;
}

export function createRegisterReader(mapping: ColumnMapping, options: ReadOptions): RegisterReader {
  const resolver = createInstantResolver(options.timeZone);
  const now = nowMs(options);
  return {
    read(cells, row) {
      if (isBlankRow(cells)) return null;
      const meter = readRef(mapping, cells, row, 'meter', options);
      if (!meter.ok) return meter;
      const stamp = readTimestamp(mapping, cells, row, 'timestamp', options.dateEvidence);
      if (!stamp.ok) return stamp;
      const instant = resolver.resolve(meter.ref, stamp.parsed, zoneFor(options, meter.ref));
      if (!instant.ok) return rowError(mapping, row, stamp.column, instant.message);
      if (instant.utcMs > now) return rowError(mapping, row, stamp.column, `${toIso(instant.utcMs)} is in the future`);
      const valueCol = mapping.columns.value!;
      const value = parseVolume(cellText(cells, valueCol), mapping);
      if (!value.ok) return rowError(mapping, row, valueCol, value.message);
      const unit = readUnit(mapping, cells, row, { ref: meter.ref, options });
      if (!unit.ok) return unit;
      const facts = readRegisterFacts(mapping, cells, row);
      if ('ok' in facts) return facts;
      const estimated = readEstimated(mapping, cells, row);
      if (typeof estimated !== 'boolean') return estimated;
      const record: RegisterRecord = {
        meterRef: meter.ref,
        atUtc: toIso(instant.utcMs),
        value: value.value,
        unit: unit.unit,
        ...facts,
      };
      if (estimated) record.estimated = true;
      return { ok: true, record };
    },
  };
}
