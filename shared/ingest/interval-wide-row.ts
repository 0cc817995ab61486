/** One-row-per-day interval files → interval records, one per interval column (see `wide-day-layout.ts`). */
import { parseVolume } from './number-parsing';
import {
  cellText,
  isBlankRow,
  nowMs,
  observeDate,
  readRef,
  readUnit,
  rowError,
  toIso,
  zoneFor,
  type ReadOptions,
} from './row-cells';
import { parseTimestamp } from './timestamp-parsing';
import type { IntervalRecord, RowOutcome } from './ingest-records';
import type { ColumnMapping } from './upload-kind';
import { layoutWideDay, type WideDayLayout } from './wide-day-layout';
import { formatWallTime } from './zoned-time';

export interface IntervalWideReader {
  /**
   * Every outcome of one day's row: a record per filled interval and an error per bad cell. Empty cells are
   * missing readings and produce nothing (exports leave the rest of today blank).
   */
  read(cells: string[], row: number): RowOutcome<IntervalRecord>[];
}

export function createIntervalWideReader(mapping: ColumnMapping, options: ReadOptions): IntervalWideReader {
  const now = nowMs(options);
  const run = mapping.intervalColumns!;
  const layouts = new Map<string, WideDayLayout>();

  return {
    read(cells, row) {
      if (isBlankRow(cells)) return [];
      const meter = readRef(mapping, cells, row, 'meter', options);
      if (!meter.ok) return [meter];
      const dateCol = mapping.columns.date!;
      const dateText = cellText(cells, dateCol);
      const date = parseTimestamp(dateText, mapping.dateOrder);
      observeDate(options.dateEvidence, date, row, dateText);
      if (!date.ok) return [rowError(mapping, row, dateCol, date.message)];
      if (date.kind !== 'wall' || date.wall.hour !== 0 || date.wall.minute !== 0) {
        return [rowError(mapping, row, dateCol, 'should be a local date (one row per day)')];
      }
      const unit = readUnit(mapping, cells, row, { ref: meter.ref, options });
      if (!unit.ok) return [unit];

      const zone = zoneFor(options, meter.ref);
      const day = formatWallTime(date.wall);
      const key = `${day}|${zone}`;
      let layout = layouts.get(key);
      if (!layout) {
        layout = layoutWideDay(date.wall, run.count, zone);
        layouts.set(key, layout);
      }
      if (!layout.ok) return [rowError(mapping, row, dateCol, layout.message)];

      const outcomes: RowOutcome<IntervalRecord>[] = [];
      for (const slot of layout.slots) {
        if (slot.kind === 'skipped') {
          const col = run.first + slot.column;
          const text = cellText(cells, col);
          const value = parseVolume(text, mapping);
          if (text !== '' && (!value.ok || value.value !== 0)) {
            outcomes.push(
              rowError(
                mapping,
                row,
                col,
                `this clock time does not exist on ${day.slice(0, 10)} in ${zone} ` +
                  '(clocks spring forward); it should be empty',
              ),
            );
          }
          continue;
        }
        const cols = slot.columns.map((k) => run.first + k);
        const texts = cols.map((c) => cellText(cells, c));
        if (texts.every((t) => t === '')) continue;
        const missing = texts.findIndex((t) => t === '');
        if (missing >= 0) {
          outcomes.push(
            rowError(
              mapping,
              row,
              cols[missing]!,
              'is empty, but the repeated DST hour needs all its columns to make one interval',
            ),
          );
          continue;
        }
        let volume = 0;
        let bad = false;
        for (const [i, text] of texts.entries()) {
          const parsed = parseVolume(text, mapping);
          if (!parsed.ok) {
            outcomes.push(rowError(mapping, row, cols[i]!, parsed.message));
            bad = true;
          } else volume += parsed.value;
        }
        if (bad) continue;
        if (slot.startUtcMs + slot.minutes * 60_000 > now) {
          outcomes.push(
            rowError(mapping, row, cols[0]!, `${toIso(slot.startUtcMs)} is in the future (interval not yet over)`),
          );
          continue;
        }
        outcomes.push({
          ok: true,
          // Summing decimals of a folded hour can leave float noise; volumes never need more than 6 places.
          record: {
            meterRef: meter.ref,
            startUtc: toIso(slot.startUtcMs),
            minutes: slot.minutes,
            volume: Math.round(volume * 1e6) / 1e6,
            unit: unit.unit,
          },
        });
      }
      return outcomes;
    },
  };
}
