// Ingest only recognises and carries the unit; conversions belong to shared/units (docs/references.md §5).
import type { VolumeUnit } from '../units/volume-units';
import type { DateOrder } from './date-order';

/**
 * The shapes shared by every step of CSV interpretation: the kinds of upload, the column mapping a person
 * confirms, and the plain records the row readers produce. Pure types and tiny constants only.
 */

export const UPLOAD_KINDS = ['interval-long', 'interval-wide', 'register', 'runtime', 'billing'] as const;
/**
 * - `interval-long`: one row per reading (meter, timestamp, volume; optional interval length, read type).
 * - `interval-wide`: one row per local day (meter optional, date, then 24, 48 or 96 interval columns).
 * - `register`: cumulative register reads (meter optional, timestamp, register value; optional serial,
 *   multiplier, register digits, read type).
 * - `runtime`: irrigation-controller runs (controller, station, start, duration or end; optional cause, gallons).
 * - `billing`: billing periods (meter optional, start date, end date, usage), spread over the period's days.
 */
export type UploadKind = (typeof UPLOAD_KINDS)[number];

/** Interval lengths the product accepts; anything else inferred from samples is left for a person to choose. */
export const INTERVAL_MINUTES = [5, 15, 30, 60, 1440] as const;

/** The columns a mapping can point at. Each holds a 0-based column index. */
export const MAPPED_FIELDS = [
  'meter',
  'controller',
  'station',
  'timestamp',
  'date',
  'time',
  'value',
  'unit',
  'intervalMinutes',
  'start',
  'end',
  'duration',
  'cause',
  'measuredGallons',
  'serial',
  'multiplier',
  'registerDigits',
  'readType',
] as const;
export type MappedField = (typeof MAPPED_FIELDS)[number];

/** Words used in messages so a person recognises the field. */
export const FIELD_LABELS: Record<MappedField, string> = {
  meter: 'meter',
  controller: 'controller',
  station: 'station / zone',
  timestamp: 'timestamp',
  date: 'date',
  time: 'time of day',
  value: 'volume / register value',
  unit: 'unit',
  intervalMinutes: 'interval length (minutes)',
  start: 'run start',
  end: 'run end',
  duration: 'run time (minutes)',
  cause: 'cause',
  measuredGallons: 'measured gallons',
  serial: 'meter serial (register swaps)',
  multiplier: 'register multiplier',
  registerDigits: 'register digits',
  readType: 'read type (actual / estimated)',
};

export interface ColumnMapping {
  kind: UploadKind;
  /** The header row as read, kept so messages can name the column. */
  header: string[];
  /** Field → 0-based column index. */
  columns: Partial<Record<MappedField, number>>;
  /** Wide layout: the run of interval columns (0-based first column and how many). */
  intervalColumns?: { first: number; count: number };
  /** Unit to use when the file has no unit column; set from the header (e.g. "Usage (CCF)") or chosen. */
  unit?: VolumeUnit;
  /** Interval length when the file has no interval column (long layout), e.g. inferred from sample spacing. */
  intervalMinutes?: number;
  /** Meter for every row when the file has no meter column (single-meter exports). */
  fixedMeterRef?: string;
  /** `1.234,5` style numbers; only meaningful for `;`-delimited files. */
  decimalComma?: boolean;
  /** Long layout: the timestamp marks the END of each interval ("Interval End"), so start = stamp − minutes. */
  timestampMarksEnd?: boolean;
  /** How numeric dates are read (`13/06/2026`); absent: decided from the file (see `date-order.ts`). */
  dateOrder?: DateOrder;
}
