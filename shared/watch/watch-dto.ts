/** What the watch API sends and accepts (a site's watch settings, watch runs); shared by the server and the browser. */
import type { ThresholdName } from './alert-thresholds';

export interface ThresholdSettingDto {
  name: ThresholdName;
  value: number;
  defaultValue: number;
  unit: string;
  explanation: string;
  overridden: boolean;
}

export interface WatchSettingsDto {
  siteId: number;
  irrigationWindow: { startHour: number; endHour: number };
  thresholds: ThresholdSettingDto[];
  canEdit: boolean;
}

export interface WatchSettingsInput {
  irrigationWindow?: { startHour: number; endHour: number };
  /** Only the thresholds that differ from the defaults; a name left out falls back to its default. */
  thresholds: Partial<Record<ThresholdName, number>>;
}

export interface WatchRunDto {
  id: number;
  trigger: 'scheduled' | 'manual' | 'recheck';
  status: 'running' | 'done' | 'failed';
  rangeFromUtc: string | null;
  rangeToUtc: string;
  startedAt: string;
  finishedAt: string | null;
  sitesChecked: number;
  sitesSkipped: number;
  findings: number;
  alertsRaised: number;
  alertsUpdated: number;
  alertsReopened: number;
  mailsQueued: number;
  /** The chosen sites, when the run covers only some. */
  siteIds: number[] | null;
  /** Progress: sites the run will look at, and how many it has been through. */
  sitesTotal: number;
  sitesDone: number;
  errors: WatchRunNote[];
  /** Checks a site did not get, or got on weaker data: "overspend not checked: …", an estimated month's budget. */
  warnings: WatchRunNote[];
}

export interface WatchRunNote {
  siteId: number;
  siteName: string;
  message: string;
  /** A site not set up for the check yet (no hydrozones or weather station): listed, not mailed. */
  setupOnly?: boolean;
}

/** The default watering window when a site has not set one: 21:00 to 06:59 local. */
export const DEFAULT_IRRIGATION_WINDOW = { startHour: 21, endHour: 7 } as const;
