/**
 * What a detector reports. A finding is a fact about a period, not an alert: the job turns findings into alerts,
 * using `key` to avoid duplicates and `conditionKey` to reopen an alert when the same condition comes back.
 */
import { costOfGap } from '../rates/water-cost';
import type { AlertThresholds } from './alert-thresholds';
import type { SiteFacts } from './watch-inputs';

export const FINDING_KINDS = [
  'leak',
  'runaway-zone',
  'overspend',
  'silent-meter',
  'weather',
  'watering-rules',
] as const;
export type FindingKind = (typeof FINDING_KINDS)[number];

export const FINDING_SUB_KINDS = {
  leak: ['continuous-flow', 'night-flow', 'month-far-over-budget'],
  'runaway-zone': ['over-volume', 'long-run', 'open-valve'],
  // One alert per site and calendar month, with the month-end projection inside it.
  overspend: ['calendar-month'],
  'silent-meter': ['no-reads', 'zero-while-running'],
  // A weather station's missing or late days (filed by the job, not by `watchSite`).
  weather: ['station-gap'],
  // Runs against the local agency's watering rule in force: one alert per site and calendar month.
  'watering-rules': ['outside-rules'],
} as const satisfies Record<FindingKind, readonly string[]>;
export type FindingSubKind = (typeof FINDING_SUB_KINDS)[FindingKind][number];

/** Rillmark's own urgency labels. */
export const SEVERITIES = ['watch', 'act-soon', 'act-now'] as const;
export type Severity = (typeof SEVERITIES)[number];

export interface ChartPoint {
  atUtc: number;
  value: number;
}

export interface ChartSeries {
  label: string;
  unit: 'gal' | 'gal/h' | 'min';
  points: ChartPoint[];
}

export interface Finding {
  /** Stable identity of this episode: site, kind, sub-kind, zone and the period's start. */
  key: string;
  /** The same condition whatever the episode: site, kind, sub-kind and zone. */
  conditionKey: string;
  siteId: string;
  kind: FindingKind;
  subKind: FindingSubKind;
  zoneId?: string;
  /** When the data cannot tell which of several zones is at fault, all of them (and no `zoneId`). */
  suspectZoneIds?: string[];
  /**
   * Bounds the condition to one period when its episodes must never run into each other, e.g. the calendar month
   * (`YYYY-MM`) of an overspend: May's alert is never extended into June.
   */
  scope?: string;
  /** [start, end) in epoch ms. The start is fixed once seen; the end grows while the condition lasts. */
  periodStartUtc: number;
  periodEndUtc: number;
  /** When the data first met the condition: the earliest moment an alert could have been raised. */
  detectedAtUtc: number;
  /** True when the condition still held at the end of the data. */
  ongoing: boolean;
  severity: Severity;
  /** Named numbers behind the decision (gallons, gal/h, minutes, ratios). */
  evidence: Record<string, number>;
  series: ChartSeries[];
  /** Estimated water wasted so far; null when it cannot be told (a meter that measures nothing). */
  waterLostGal: number | null;
  /** What that water cost, priced above the month's budget; null without a rate schedule. */
  moneyLost: { amount: number; currency: string } | null;
  explanation: string;
}

export type FindingDraft = Omit<Finding, 'key' | 'conditionKey' | 'siteId' | 'moneyLost' | 'severity'> & {
  /** Month (`YYYY-MM`) whose budget prices the lost water. */
  pricingMonth: string;
  /** Set to override the loss-based severity (e.g. a silent meter loses nothing measurable but blinds the site). */
  severity?: Severity;
};

export function conditionKeyOf(
  siteId: string,
  kind: FindingKind,
  subKind: FindingSubKind,
  zoneId?: string,
  scope?: string,
): string {
  return [siteId, kind, subKind, zoneId ?? '-', ...(scope ? [scope] : [])].join('|');
}

export function findingKeyOf(conditionKey: string, periodStartUtc: number): string {
  return `${conditionKey}|${new Date(periodStartUtc).toISOString()}`;
}

function monthBudget(site: SiteFacts, month: string): number {
  return site.monthlyBudgets.find((b) => b.month === month)?.gallons ?? 0;
}

/** Average daily budget over the months given (30.44 = mean days per month), for judging how big a loss is. */
export function averageDailyBudget(site: SiteFacts): number {
  if (site.monthlyBudgets.length === 0) return 0;
  const total = site.monthlyBudgets.reduce((sum, b) => sum + b.gallons, 0);
  return total / (site.monthlyBudgets.length * 30.44);
}

/**
 * Waste priced as if the rest of the month were exactly on budget: the extra water falls in the tiers just above
 * the budget, which is what it adds to the bill.
 */
export function priceLostWater(
  site: SiteFacts,
  month: string,
  lostGal: number,
): { amount: number; currency: string } | null {
  if (!site.rateSchedule || !(lostGal > 0))
    return site.rateSchedule ? { amount: 0, currency: site.rateSchedule.currency } : null;
  const budget = monthBudget(site, month);
  return {
    amount: costOfGap(site.rateSchedule, budget + lostGal, budget).gapCost,
    currency: site.rateSchedule.currency,
  };
}

/** Severity from the waste rate against the site's average daily budget. */
export function severityOfLoss(lostGalPerDay: number, site: SiteFacts, thresholds: AlertThresholds): Severity {
  const daily = averageDailyBudget(site);
  if (!(daily > 0)) return lostGalPerDay > 0 ? 'act-soon' : 'watch';
  const share = lostGalPerDay / daily;
  if (share >= thresholds.severityActNowShare) return 'act-now';
  if (share >= thresholds.severityActSoonShare) return 'act-soon';
  return 'watch';
}

/** Completes a detector's draft with keys, money and severity. */
export function completeFinding(draft: FindingDraft, site: SiteFacts, thresholds: AlertThresholds): Finding {
  const { pricingMonth, severity, ...rest } = draft;
  const conditionKey = conditionKeyOf(site.siteId, draft.kind, draft.subKind, draft.zoneId, draft.scope);
  const days = Math.max(1 / 24, (draft.periodEndUtc - draft.periodStartUtc) / 86_400_000);
  return {
    ...rest,
    key: findingKeyOf(conditionKey, draft.periodStartUtc),
    conditionKey,
    siteId: site.siteId,
    severity: severity ?? severityOfLoss((draft.waterLostGal ?? 0) / days, site, thresholds),
    moneyLost: draft.waterLostGal === null ? null : priceLostWater(site, pricingMonth, draft.waterLostGal),
  };
}
