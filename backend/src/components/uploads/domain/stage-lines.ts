import type {
  BillingRecord,
  IngestRecord,
  IntervalRecord,
  RegisterRecord,
  RowError,
  RuntimeRecord,
} from '@shared/ingest/ingest-records';
import { rowError } from '@shared/ingest/row-cells';
import type { ColumnMapping } from '@shared/ingest/upload-kind';
import { READING_FLAGS } from '@shared/readings/reading-flags';
import { toGallons, type VolumeUnit } from '@shared/units/volume-units';
import { sqlUtc } from '../data/ingest-targets';
import { zoneKey, type IngestMeter, type IngestRefs } from './ingest-refs';
import type { IntervalSpans } from './interval-spans';
import type { UnitFindings } from './unit-findings';

/** Largest volume one interval may hold: the column is DECIMAL(12,4) gallons. */
const MAX_GALLONS = 99_999_999;

export type StageLine = string | RowError;
type LineOf = (record: IngestRecord, row: number) => StageLine;

interface LineContext {
  mapping: ColumnMapping;
  refs: IngestRefs;
  units: UnitFindings;
  spans?: IntervalSpans;
  /** The file names no unit: every record is in its meter's own unit. */
  unitFromMeter: boolean;
}

const nullable = (v: string | number | undefined) => (v === undefined ? '\\N' : String(v).replace(/[\t\n\\]/g, ' '));

/** The meter a record names, refused outside its installed life. */
function installedMeter(ctx: LineContext, ref: string, atIso: string, row: number): IngestMeter | RowError {
  const meter = ctx.refs.meters.get(ref)!;
  if (meter.firstInstalledMs === null && meter.removedMs === null) return meter;
  const ms = Date.parse(atIso);
  const c = ctx.mapping.columns;
  const timeColumn = c.timestamp ?? c.date ?? c.start ?? null;
  const when = `${atIso.slice(0, 16).replace('T', ' ')} UTC`;
  if (meter.firstInstalledMs !== null && ms < meter.firstInstalledMs) {
    const installed = new Date(meter.firstInstalledMs).toISOString().slice(0, 10);
    return rowError(ctx.mapping, row, timeColumn, `${when} is before meter ${ref} was installed (${installed})`);
  }
  if (meter.removedMs !== null && ms >= meter.removedMs) {
    const removed = new Date(meter.removedMs).toISOString().slice(0, 10);
    return rowError(ctx.mapping, row, timeColumn, `${when} is after meter ${ref} was removed (${removed})`);
  }
  return meter;
}

/** Notes where the unit came from: the meter's own (the file names none), or a file unit the meter does not use. */
function noteUnit(ctx: LineContext, meter: IngestMeter, unit: VolumeUnit): void {
  if (ctx.unitFromMeter) ctx.units.usedMeterUnit(meter.id);
  else if (unit !== meter.unit) ctx.units.fileUnitDiffers(meter.id, unit);
}

function intervalLine(ctx: LineContext): LineOf {
  return (record, row) => {
    const r = record as IntervalRecord;
    const meter = installedMeter(ctx, r.meterRef, r.startUtc, row);
    if ('ok' in meter) return meter;
    noteUnit(ctx, meter, r.unit);
    const gallons = toGallons(r.volume, r.unit);
    if (gallons > MAX_GALLONS)
      return rowError(
        ctx.mapping,
        row,
        ctx.mapping.columns.value ?? null,
        `${r.volume} ${r.unit} is more than one interval can hold (${MAX_GALLONS.toLocaleString('en-US')} gal)`,
      );
    const start = sqlUtc(r.startUtc);
    ctx.spans?.add(meter.id, start, r.minutes);
    const flags = r.estimated ? READING_FLAGS.estimated : 0;
    const values = `${gallons.toFixed(4)}\t${r.volume.toFixed(6)}\t${r.unit}\t${flags}`;
    return `${meter.id}\t${start}\t${r.minutes}\t${values}\t${row}\n`;
  };
}

function registerLine(ctx: LineContext): LineOf {
  // Two reads of one meter at one instant with different values (or serials) are a swap's final and initial read:
  // positions 0 and 1. The same read twice keeps its position, so it is a repeat within the file.
  const last = { key: '', position: 0, value: 0, serial: '' };
  return (record, row) => {
    const r = record as RegisterRecord;
    const meter = installedMeter(ctx, r.meterRef, r.atUtc, row);
    if ('ok' in meter) return meter;
    noteUnit(ctx, meter, r.unit);
    if (r.value >= 1e12)
      return rowError(
        ctx.mapping,
        row,
        ctx.mapping.columns.value ?? null,
        `${r.value} is too large for a register read`,
      );
    const key = `${meter.id}|${r.atUtc}`;
    const serial = r.serial ?? '';
    const sameRead = last.value === r.value && last.serial === serial;
    last.position = key !== last.key ? 0 : sameRead ? last.position : last.position + 1;
    Object.assign(last, { key, value: r.value, serial });
    const facts = [nullable(r.serial), nullable(r.multiplier), nullable(r.digits), r.estimated ? 1 : 0].join('\t');
    return `${meter.id}\t${sqlUtc(r.atUtc)}\t${last.position}\t${r.value.toFixed(4)}\t${r.unit}\t${facts}\t${row}\n`;
  };
}

function billingLine(ctx: LineContext): LineOf {
  return (record, row) => {
    const r = record as BillingRecord;
    const meter = installedMeter(ctx, r.meterRef, `${r.startDate}T12:00:00.000Z`, row);
    if ('ok' in meter) return meter;
    noteUnit(ctx, meter, r.unit);
    const gallons = toGallons(r.volume, r.unit);
    if (gallons >= 1e10)
      return rowError(
        ctx.mapping,
        row,
        ctx.mapping.columns.value ?? null,
        `${r.volume} ${r.unit} is too large for a bill`,
      );
    const estimated = r.estimated ? 1 : 0;
    const values = `${gallons.toFixed(4)}\t${r.volume.toFixed(6)}\t${r.unit}\t${estimated}`;
    return `${meter.id}\t${r.startDate}\t${r.endDate}\t${values}\t${row}\n`;
  };
}

function runtimeLine(ctx: LineContext): LineOf {
  const c = ctx.mapping.columns;
  return (record, row) => {
    const r = record as RuntimeRecord;
    const zoneId = ctx.refs.zones.get(zoneKey(r.controllerRef, r.station));
    if (zoneId === undefined) {
      return rowError(
        ctx.mapping,
        row,
        c.station ?? null,
        `unknown zone "${r.station}" on controller ${r.controllerRef}; add the zone to the controller or fix the file`,
      );
    }
    if (r.minutes > 65_535)
      return rowError(
        ctx.mapping,
        row,
        c.duration ?? c.end ?? null,
        `${r.minutes} minutes is longer than one run can be`,
      );
    const gallons = r.measuredGallons === undefined ? '\\N' : r.measuredGallons.toFixed(2);
    return `${zoneId}\t${sqlUtc(r.startUtc)}\t${r.minutes}\t${r.cause ?? '\\N'}\t${gallons}\t${row}\n`;
  };
}

/**
 * Turns one record into a stage line (tab-separated, `\N` for NULL, file row last), or a row error for what only
 * the server can judge: a reading outside the meter's installed life, a zone the controller does not have.
 */
export function createStageLines(
  mapping: ColumnMapping,
  refs: IngestRefs,
  extra: { units: UnitFindings; spans?: IntervalSpans },
): LineOf {
  const unitFromMeter = mapping.columns.unit === undefined && !mapping.unit;
  const ctx: LineContext = { mapping, refs, unitFromMeter, ...extra };
  switch (mapping.kind) {
    case 'interval-long':
    case 'interval-wide':
      return intervalLine(ctx);
    case 'register':
      return registerLine(ctx);
    case 'billing':
      return billingLine(ctx);
    case 'runtime':
      return runtimeLine(ctx);
  }
}
