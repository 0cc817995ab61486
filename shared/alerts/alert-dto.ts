/** What the alerts API sends and accepts (stored alerts, their events, e-mail preferences); shared by both sides. */
import type { ChartSeries, FindingKind, Severity } from '../watch/finding';

export const ALERT_STATUSES = ['open', 'acknowledged', 'resolved'] as const;
export type AlertStatus = (typeof ALERT_STATUSES)[number];
export const ALERT_ACTIONS = ['opened', 'acknowledged', 'resolved', 'reopened', 'note', 'updated'] as const;
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

export const NOTIFICATION_FREQUENCIES = ['each', 'daily', 'none'] as const;
export type NotificationFrequency = (typeof NOTIFICATION_FREQUENCIES)[number];

export interface NotificationPreferenceDto {
  frequency: NotificationFrequency;
  /** Null follows every site the user can see. */
  siteIds: number[] | null;
}
