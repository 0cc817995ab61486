/** The plain records the row readers produce, and the outcome of reading one row. */
import type { VolumeUnit } from '../units/volume-units';

export interface IntervalRecord {
  meterRef: string;
  /** ISO 8601 UTC instant, e.g. `2026-11-01T08:00:00.000Z`. */
  startUtc: string;
  minutes: number;
  volume: number;
  unit: VolumeUnit;
}

export interface RegisterRecord {
  meterRef: string;
  atUtc: string;
  value: number;
  unit: VolumeUnit;
}

export const RUNTIME_CAUSES = ['scheduled', 'manual', 'skipped-rain', 'skipped-wind'] as const;
export type RuntimeCause = (typeof RUNTIME_CAUSES)[number];

export interface RuntimeRecord {
  controllerRef: string;
  station: string;
  startUtc: string;
  minutes: number;
  /** `null` when the file has no cause column (the log does not say). */
  cause: RuntimeCause | null;
  measuredGallons?: number;
}

export type IngestRecord = IntervalRecord | RegisterRecord | RuntimeRecord;

/** One row's (or one wide-row cell's) outcome. `row` and `column` are 1-based, as a spreadsheet shows them. */
export type RowOutcome<R> =
  { ok: true; record: R; warnings?: string[] } | { ok: false; row: number; column: number | null; message: string };

export type RowError = Extract<RowOutcome<unknown>, { ok: false }>;
