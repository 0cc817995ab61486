import type {
  IngestRecord,
  IntervalRecord,
  RegisterRecord,
  RowError,
  RuntimeRecord,
} from '@shared/ingest/ingest-records';
import { rowError } from '@shared/ingest/row-cells';
import type { ColumnMapping } from '@shared/ingest/upload-kind';
import { toGallons } from '@shared/units/volume-units';
import { sqlUtc } from '../data/ingest-targets';
import { zoneKey, type IngestRefs } from './ingest-refs';
import type { IntervalSpans } from './interval-spans';

/** Largest volume one interval may hold: the column is DECIMAL(12,4) gallons. */
const MAX_GALLONS = 99_999_999;

export type StageLine = string | RowError;

/**
 * Turns one record into a stage line (tab-separated, `\N` for NULL, file row last), or a row error for what only
 * the server can judge: a reading outside the meter's installed life, a zone the controller does not have.
 */
export function createStageLines(
  mapping: ColumnMapping,
  refs: IngestRefs,
  spans?: IntervalSpans,
): (record: IngestRecord, row: number) => StageLine {
  const c = mapping.columns;
  const timeColumn = c.timestamp ?? c.date ?? c.start ?? null;
  const lastRead = { key: '', position: 0 };

  const installed = (ref: string, atIso: string, row: number): RowError | number => {
    const meter = refs.meters.get(ref)!;
    if (meter.firstInstalledMs === null && meter.removedMs === null) return meter.id;
    const ms = Date.parse(atIso);
    if (meter.firstInstalledMs !== null && ms < meter.firstInstalledMs) {
      return rowError(
        mapping,
        row,
        timeColumn,
        `${atIso.slice(0, 16).replace('T', ' ')} UTC is before meter ` +
          `${ref} was installed (${new Date(meter.firstInstalledMs).toISOString().slice(0, 10)})`,
      );
    }
    if (meter.removedMs !== null && ms >= meter.removedMs) {
      return rowError(
        mapping,
        row,
        timeColumn,
        `${atIso.slice(0, 16).replace('T', ' ')} UTC is after meter ${ref} ` +
          `was removed (${new Date(meter.removedMs).toISOString().slice(0, 10)})`,
      );
    }
    return meter.id;
  };

  switch (mapping.kind) {
    case 'interval-long':
    case 'interval-wide':
      return (record, row) => {
        const r = record as IntervalRecord;
        const meterId = installed(r.meterRef, r.startUtc, row);
        if (typeof meterId !== 'number') return meterId;
        const gallons = toGallons(r.volume, r.unit);
        if (gallons > MAX_GALLONS)
          return rowError(
            mapping,
            row,
            c.value ?? null,
            `${r.volume} ${r.unit} is more than one interval can hold (${MAX_GALLONS.toLocaleString('en-US')} gal)`,
          );
        const start = sqlUtc(r.startUtc);
        spans?.add(meterId, start, r.minutes);
        return `${meterId}\t${start}\t${r.minutes}\t${gallons.toFixed(4)}\t${r.volume.toFixed(6)}\t${r.unit}\t${row}\n`;
      };
    case 'register':
      return (record, row) => {
        const r = record as RegisterRecord;
        const meterId = installed(r.meterRef, r.atUtc, row);
        if (typeof meterId !== 'number') return meterId;
        if (r.value >= 1e12)
          return rowError(mapping, row, c.value ?? null, `${r.value} is too large for a register read`);
        const key = `${meterId}|${r.atUtc}`;
        lastRead.position = key === lastRead.key ? lastRead.position + 1 : 0;
        lastRead.key = key;
        return `${meterId}\t${sqlUtc(r.atUtc)}\t${lastRead.position}\t${r.value.toFixed(4)}\t${r.unit}\t${row}\n`;
      };
    case 'runtime':
      return (record, row) => {
        const r = record as RuntimeRecord;
        const zoneId = refs.zones.get(zoneKey(r.controllerRef, r.station));
        if (zoneId === undefined) {
          return rowError(
            mapping,
            row,
            c.station ?? null,
            `unknown zone "${r.station}" on controller ${r.controllerRef}; ` +
              'add the zone to the controller or fix the file',
          );
        }
        if (r.minutes > 65_535)
          return rowError(
            mapping,
            row,
            c.duration ?? c.end ?? null,
            `${r.minutes} minutes is longer than one run can be`,
          );
        const gallons = r.measuredGallons === undefined ? '\\N' : r.measuredGallons.toFixed(2);
        return `${zoneId}\t${sqlUtc(r.startUtc)}\t${r.minutes}\t${r.cause ?? '\\N'}\t${gallons}\t${row}\n`;
      };
  }
}
