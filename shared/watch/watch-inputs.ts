/** What the nightly watch reads for one site: meter data, controller runtime logs and site facts. Pure types. */
import type { RuntimeCause } from '../ingest/ingest-records';
import type { RateSchedule } from '../rates/rate-schedule';
import type { SiteRule } from '../watering-rules/watering-rule';
import type { AlertThresholds } from './alert-thresholds';

/** One hour of meter volume; `startUtc` is the hour's start (epoch ms). Missing hours are simply absent. */
export interface MeterHour {
  startUtc: number;
  gallons: number;
}

/** A register-derived total for one local calendar month (`YYYY-MM`), for sites read once a month. */
export interface MonthlyUse {
  month: string;
  gallons: number;
}

/** One entry of a controller's runtime log. Skipped entries carry the minutes that would have run. */
export interface ZoneRun {
  zoneId: string;
  startUtc: number;
  minutes: number;
  /** `null` when the log does not say; such a run is taken to have watered. */
  cause: RuntimeCause | null;
  /** From the controller's own flow sensor, when it has one. */
  measuredGallons?: number;
}

export interface ZoneFacts {
  zoneId: string;
  designGpm: number;
  /** How people know the zone, e.g. `Station 4 “Front beds”`; alert texts fall back to `Zone <id>`. */
  label?: string;
  /** The programmed minutes, when known; lets the watch compare a run with its schedule as well as its history. */
  scheduledMinutes?: number;
}

/** Local hours [startHour, endHour), wrapping past midnight when start > end (21–6 is 21:00 to 05:59). */
export interface LocalHourWindow {
  startHour: number;
  endHour: number;
}

export interface MonthBudget {
  month: string;
  /** For the days covered: a partial month's budget counts only the days that had weather. */
  gallons: number;
  /** Days the budget covers, when fewer than the month's (no weather for the others). */
  coveredDays?: number;
  /** Days whose weather was estimated (the station's recent days or a neighbouring station). */
  estimatedDays?: number;
}

export interface SiteFacts {
  siteId: string;
  /** IANA zone; night and the irrigation window are local hours in it. */
  timeZone: string;
  irrigationWindow: LocalHourWindow;
  /** Budget per local month (`YYYY-MM`). */
  monthlyBudgets: readonly MonthBudget[];
  /**
   * Budget per local day (`YYYY-MM-DD`), when known; prorating follows its shape instead of the calendar. A partial
   * month lists only the days its budget covers, and overspend compares use on those days only.
   */
  dailyBudgets?: ReadonlyArray<{ date: string; gallons: number }>;
  rateSchedule?: RateSchedule;
  thresholds?: Partial<AlertThresholds>;
}

export interface SiteWatchInput {
  site: SiteFacts;
  zones: readonly ZoneFacts[];
  /** Hourly interval data; absent for sites read once a month. */
  meterHours?: readonly MeterHour[];
  monthlyUse?: readonly MonthlyUse[];
  runs: readonly ZoneRun[];
  /** The local water agency's watering rules this site is under (every stage; the one in force is picked by date). */
  wateringRules?: readonly SiteRule[];
  /** "Now" for the run: an ongoing silence is measured up to here. */
  asOfUtc: number;
}

/** True when the log says the zone actually watered (skips record what would have run). */
export function runWatered(run: ZoneRun): boolean {
  return run.minutes > 0 && run.cause !== 'skipped-rain' && run.cause !== 'skipped-wind';
}

/** What every detector gets besides its data: the site, its zones, resolved thresholds and "now". */
export interface WatchContext {
  site: SiteFacts;
  zones: readonly ZoneFacts[];
  thresholds: AlertThresholds;
  asOfUtc: number;
}

/** The zone as alert texts name it: its label when known, else `Zone <id>`. */
export function zoneName(zones: readonly ZoneFacts[], zoneId: string): string {
  return zones.find((z) => z.zoneId === zoneId)?.label ?? `Zone ${zoneId}`;
}
