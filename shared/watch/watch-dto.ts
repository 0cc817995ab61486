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
  errors: { siteId: number; siteName: string; message: string }[];
}

/** The default watering window when a site has not set one: 21:00 to 06:59 local. */
export const DEFAULT_IRRIGATION_WINDOW = { startHour: 21, endHour: 7 } as const;
