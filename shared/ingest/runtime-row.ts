/** Irrigation-controller runtime logs → runtime records. */
import { createInstantResolver } from './local-instant-resolver';
import { parseNumber, parseVolume } from './number-parsing';
import {
  cellText,
  isBlankRow,
  nowMs,
  readRef,
  readTimestamp,
  rowError,
  toIso,
  zoneFor,
  type ReadOptions,
} from './row-cells';
import { parseTimestamp } from './timestamp-parsing';
import type { RowOutcome, RuntimeCause, RuntimeRecord } from './ingest-records';
import type { ColumnMapping } from './upload-kind';
import { addWallMinutes, wallTimeAsUtcMs } from './zoned-time';

/** Controllers word causes many ways; these cover the common ones. Order matters: "rain skip" is not a schedule. */
const causeRules: Array<[RuntimeCause, RegExp]> = [
  ['skipped-wind', /wind/],
  ['skipped-rain', /rain|freeze|frost|moisture|sensor|skip|delay|suspend|shower/],
  ['manual', /manual|hand|test|override|remote|app|by user/],
  ['scheduled', /sched|program|auto|timer|normal|regular|cycle/],
];

/** A cause cell → a cause, `null` for an empty cell, or `undefined` when the words are not recognised. */
export function parseRuntimeCause(text: string): RuntimeCause | null | undefined {
  const t = text.trim().toLowerCase();
  if (t === '') return null;
  return causeRules.find(([, pattern]) => pattern.test(t))?.[0];
}

export interface RuntimeReader {
  read(cells: string[], row: number): RowOutcome<RuntimeRecord> | null;
}

/** Longest single run accepted; a longer one is a unit mix-up (seconds read as minutes) or a stuck valve log. */
export const MAX_RUN_MINUTES = 24 * 60;

export function createRuntimeReader(mapping: ColumnMapping, options: ReadOptions): RuntimeReader {
  const resolver = createInstantResolver(options.timeZone);
  const now = nowMs(options);
  const c = mapping.columns;
  return {
    read(cells, row) {
      if (isBlankRow(cells)) return null;
      const controller = readRef(mapping, cells, row, 'controller', options);
      if (!controller.ok) return controller;
      const station = cellText(cells, c.station);
      if (station === '') return rowError(mapping, row, c.station ?? null, 'the station is empty');

      const start = readTimestamp(mapping, cells, row, 'start', options.dateEvidence);
      if (!start.ok) return start;
      const zone = zoneFor(options, controller.ref);
      const startAt = resolver.resolve(`${controller.ref}\u0000${station}`, start.parsed, zone);
      if (!startAt.ok) return rowError(mapping, row, start.column, startAt.message);
      if (startAt.utcMs > now) return rowError(mapping, row, start.column, `${toIso(startAt.utcMs)} is in the future`);

      let minutes: number;
      const durationText = cellText(cells, c.duration);
      if (c.duration !== undefined && (durationText !== '' || c.end === undefined)) {
        const parsed = parseNumber(durationText, mapping);
        if (!parsed.ok) return rowError(mapping, row, c.duration, parsed.message);
        if (parsed.value < 0 || parsed.value > MAX_RUN_MINUTES) {
          return rowError(mapping, row, c.duration, `${parsed.value} minutes is not a run time (0–${MAX_RUN_MINUTES})`);
        }
        minutes = parsed.value;
      } else {
        // The date column (if any) was already counted with the start.
        const end = readTimestamp(mapping, cells, row, 'end', c.date === undefined ? options.dateEvidence : undefined);
        if (!end.ok) return end;
        let parsedEnd = end.parsed;
        // Time-only end before time-only start on one date: the run crossed midnight.
        const endAlone = parseTimestamp(cellText(cells, c.end), mapping.dateOrder);
        if (
          !endAlone.ok &&
          parsedEnd.kind === 'wall' &&
          start.parsed.kind === 'wall' &&
          wallTimeAsUtcMs(parsedEnd.wall) < wallTimeAsUtcMs(start.parsed.wall)
        ) {
          parsedEnd = { ...parsedEnd, wall: addWallMinutes(parsedEnd.wall, 24 * 60) };
        }
        const endAt = resolver.resolveNotBefore(parsedEnd, startAt.utcMs, zone);
        if (!endAt.ok) return rowError(mapping, row, end.column, endAt.message);
        minutes = (endAt.utcMs - startAt.utcMs) / 60_000;
        if (minutes < 0) return rowError(mapping, row, end.column, 'the run ends before it starts');
        if (minutes > MAX_RUN_MINUTES)
          return rowError(mapping, row, end.column, `a ${minutes}-minute run is longer than a day`);
      }

      let cause: RuntimeCause | null = null;
      if (c.cause !== undefined) {
        const parsed = parseRuntimeCause(cellText(cells, c.cause));
        if (parsed === undefined) {
          return rowError(
            mapping,
            row,
            c.cause,
            `"${cellText(cells, c.cause)}" is not a cause this reader knows (scheduled, manual, rain skip, wind skip)`,
          );
        }
        cause = parsed;
      }
      const record: RuntimeRecord = {
        controllerRef: controller.ref,
        station,
        startUtc: toIso(startAt.utcMs),
        minutes,
        cause,
      };
      const gallonsText = cellText(cells, c.measuredGallons);
      if (gallonsText !== '') {
        const gallons = parseVolume(gallonsText, mapping);
        if (!gallons.ok) return rowError(mapping, row, c.measuredGallons!, gallons.message);
        record.measuredGallons = gallons.value;
      }
      return { ok: true, record };
    },
  };
}
