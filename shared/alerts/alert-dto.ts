/** What the alerts API sends and accepts (stored alerts, their events, e-mail preferences); shared by both sides. */
import type { ChartSeries, FindingKind, Severity } from '../watch/finding';

export const ALERT_STATUSES = ['open', 'acknowledged', 'resolved'] as const;
export type AlertStatus = (typeof ALERT_STATUSES)[number];
export const ALERT_ACTIONS = [
  'opened',
  'acknowledged',
  'resolved',
  'reopened',
  'note',
  'updated',
  'verified',
  'not-verified',
] as const;
export type AlertAction = (typeof ALERT_ACTIONS)[number];
export const ALERT_SORTS = ['detected', 'lastSeen', 'severity', 'waterLost', 'site', 'period'] as const;
export type AlertSort = (typeof ALERT_SORTS)[number];

/**
 * Rillmark's own short names for the kinds and sub-kinds, as the UI, e-mail and documents show them. Plain words
 * chosen for this product (not the flow-sensor alarm names controller makers use); codes never reach the screen.
 */
export const KIND_LABELS: Record<FindingKind, string> = {
  leak: 'Leak suspected',
  'runaway-zone': 'Zone overrun',
  overspend: 'Over budget',
  'silent-meter': 'Meter gone quiet',
  weather: 'Weather data',
  'watering-rules': 'Watering rules',
};
export const SUB_KIND_LABELS: Record<string, string> = {
  'continuous-flow': 'Water never stops',
  'night-flow': 'Water running at night',
  'month-far-over-budget': 'Month far over budget',
  'over-volume': 'Zone drew far more than planned',
  'long-run': 'Zone ran far longer than usual',
  'open-valve': 'Water after watering ended',
  'calendar-month': 'Month over budget',
  // Stored before months became one alert each (the projection now sits inside the month's alert).
  'month-to-date': 'Over budget so far this month',
  'projected-month-end': 'Heading over budget by month end',
  'no-reads': 'No readings coming in',
  'zero-while-running': 'Meter still while zones ran',
  'station-gap': 'Weather station missing days',
  'outside-rules': 'Watering outside the rules',
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

/** How a person resolved an alert; "fixed" asks the watch to confirm the repair from the data that follows. */
export const ALERT_RESOLUTIONS = ['fixed', 'not-a-problem', 'other'] as const;
export type AlertResolution = (typeof ALERT_RESOLUTIONS)[number];
export const RESOLUTION_LABELS: Record<AlertResolution, string> = {
  fixed: 'Fixed (a repair was made)',
  'not-a-problem': 'Not a problem',
  other: 'Other',
};

/** watching: fixed, waiting for the nights after the repair; then verified by data, or not (and reopened). */
export const VERIFICATION_STATUSES = ['watching', 'verified', 'not-verified'] as const;
export type VerificationStatus = (typeof VERIFICATION_STATUSES)[number];
export const VERIFICATION_LABELS: Record<VerificationStatus, string> = {
  watching: 'Repair being checked against the meter',
  verified: 'Verified by data',
  'not-verified': 'Repair not confirmed by data',
};

export interface RepairVerificationDto {
  status: VerificationStatus;
  /** When the data settled it (data time: the end of the last night or run that decided). */
  decidedAt: string | null;
  numbers: Record<string, number>;
  series: ChartSeries[];
  explanation: string | null;
}

export interface AlertDetailDto extends AlertSummaryDto {
  resolution: AlertResolution | null;
  /** The repair's moment as the resolver gave it (end of the day they named), or the resolution time. */
  repairedAt: string | null;
  verification: RepairVerificationDto | null;
  evidence: { numbers: Record<string, number>; series: ChartSeries[]; suspectZoneIds: string[]; detectedAtUtc: string };
  explanation: string;
  events: AlertEventDto[];
  /** Whether the signed-in user may acknowledge, resolve and add notes. */
  canAct: boolean;
}

/** Time from alert to verified repair, per site or per who resolved it (their organisation). */
export interface RepairTimeRow {
  key: string;
  label: string;
  verified: number;
  notVerified: number;
  watching: number;
  /** Median days from first detection to the repair, and to the data confirming it. */
  medianDaysToRepair: number | null;
  medianDaysToVerified: number | null;
}

export interface RepairTimesDto {
  from: string;
  to: string;
  bySite: RepairTimeRow[];
  byResolver: RepairTimeRow[];
}

export const NOTIFICATION_FREQUENCIES = ['each', 'daily', 'none'] as const;
export type NotificationFrequency = (typeof NOTIFICATION_FREQUENCIES)[number];

export interface NotificationPreferenceDto {
  frequency: NotificationFrequency;
  /** Null follows every site the user can see. */
  siteIds: number[] | null;
}
