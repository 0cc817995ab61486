/** The plain records the row readers produce, and the outcome of reading one row. */
import type { VolumeUnit } from '../units/volume-units';

export interface IntervalRecord {
  meterRef: string;
  /** ISO 8601 UTC instant, e.g. `2026-11-01T08:00:00.000Z`. */
  startUtc: string;
  minutes: number;
  volume: number;
  unit: VolumeUnit;
  /** The file marks the value estimated (a read-type column), or it comes from an estimated register read. */
  estimated?: boolean;
}

export interface RegisterRecord {
  meterRef: string;
  atUtc: string;
  value: number;
  unit: VolumeUnit;
  /** The physical meter's serial when the file names it apart from the meter id; a change is a meter swap. */
  serial?: string;
  /** Register multiplier and dial digits as the file gives them (else the meter's settings apply). */
  multiplier?: number;
  digits?: number;
  estimated?: boolean;
}

/** A billing period: usage between two dates (local, inclusive), as utility bills give it. */
export interface BillingRecord {
  meterRef: string;
  /** `YYYY-MM-DD`, the first and last local day of the period. */
  startDate: string;
  endDate: string;
  volume: number;
  unit: VolumeUnit;
  estimated?: boolean;
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

export type IngestRecord = IntervalRecord | RegisterRecord | RuntimeRecord | BillingRecord;

/** A meter or controller the row names that the site (or organisation) does not have. */
export interface UnknownRef {
  field: 'meter' | 'controller';
  ref: string;
}

/** One row's (or one wide-row cell's) outcome. `row` and `column` are 1-based, as a spreadsheet shows them. */
export type RowOutcome<R> =
  | { ok: true; record: R; warnings?: string[] }
  | { ok: false; row: number; column: number | null; message: string; unknownRef?: UnknownRef };

export type RowError = Extract<RowOutcome<unknown>, { ok: false }>;
