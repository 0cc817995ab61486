/** What the alerts and watch APIs send and accept; shared by the server and the browser. */
import type { ChartSeries, FindingKind, Severity } from './finding';
import type { ThresholdName } from './alert-thresholds';

export const ALERT_STATUSES = ['open', 'acknowledged', 'resolved'] as const;
export type AlertStatus = (typeof ALERT_STATUSES)[number];
export const ALERT_ACTIONS = ['opened', 'acknowledged', 'resolved', 'reopened', 'note', 'updated'] as const;
export type AlertAction = (typeof ALERT_ACTIONS)[number];
export const ALERT_SORTS = ['detected', 'lastSeen', 'severity', 'waterLost', 'site', 'period'] as const;
export type AlertSort = (typeof ALERT_SORTS)[number];

/** Rillmark's own names for the kinds and sub-kinds, as the UI and e-mail show them. */
export const KIND_LABELS: Record<FindingKind, string> = {
  leak: 'Leak',
  'runaway-zone': 'Runaway zone',
  overspend: 'Over budget',
  'silent-meter': 'Silent meter',
};
export const SUB_KIND_LABELS: Record<string, string> = {
  'continuous-flow': 'Flow that never stops',
  'night-flow': 'High night flow',
  'month-far-over-budget': 'Month far over budget',
  'over-volume': 'Zone uses too much',
  'long-run': 'Zone runs too long',
  'open-valve': 'Valve open with nothing scheduled',
  'month-to-date': 'Over budget so far this month',
  'projected-month-end': 'Heading over budget by month end',
  'no-reads': 'No readings',
  'zero-while-running': 'No flow while zones ran',
};
export const SEVERITY_LABELS: Record<Severity, string> = {
  watch: 'Keep an eye on',
  'act-soon': 'Act soon',
  'act-now': 'Act now',
};

export interface AlertListFilter {
  status?: AlertStatus;
  kind?: FindingKind;
  siteId?: number;
  page: number;
  pageSize: number;
  sort: AlertSort;
  dir: 'asc' | 'desc';
}

export interface AlertSummaryDto {
  id: number;
  siteId: number;
  siteName: string;
  /** The site's IANA zone: the UI shows every time in it. */
  timeZone: string;
  kind: FindingKind;
  subKind: string;
  zoneId: number | null;
  zoneName: string | null;
  periodStartUtc: string;
  periodEndUtc: string;
  severity: Severity;
  status: AlertStatus;
  ongoing: boolean;
  waterLostGal: number | null;
  moneyLost: { amount: number; currency: string } | null;
  firstDetectedAt: string;
  lastSeenAt: string;
  reopenCount: number;
}

export interface AlertEventDto {
  id: number;
  action: AlertAction;
  note: string | null;
  at: string;
  userId: number | null;
  userName: string;
}

export interface AlertDetailDto extends AlertSummaryDto {
  evidence: { numbers: Record<string, number>; series: ChartSeries[]; suspectZoneIds: string[]; detectedAtUtc: string };
  explanation: string;
  events: AlertEventDto[];
  /** Whether the signed-in user may acknowledge, resolve and add notes. */
  canAct: boolean;
}

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

export const NOTIFICATION_FREQUENCIES = ['each', 'daily', 'none'] as const;
export type NotificationFrequency = (typeof NOTIFICATION_FREQUENCIES)[number];

export interface NotificationPreferenceDto {
  frequency: NotificationFrequency;
  /** Null follows every site the user can see. */
  siteIds: number[] | null;
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
