/** The auditor's and manager's compliance ranking, as the API sends it. */
import type { SiteKind } from '../sites/site';
import type { WorklistGroup } from './worklist';

export const COMPLIANCE_SORTS = ['rank', 'name', 'completeness', 'trend', 'use'] as const;
export type ComplianceSort = (typeof COMPLIANCE_SORTS)[number];

export interface ComplianceRowDto {
  rank: number;
  siteId: number;
  siteName: string;
  siteKind: SiteKind;
  /** The owning organisation. */
  ownerId: number;
  organisationName: string;
  tags: string[];
  /** The worklist group the site is in (see shared/reports/worklist.ts). */
  group: WorklistGroup;
  /** Alerts on the site not resolved yet. */
  openAlerts: number;
  /** Metered use in the period so far (the month if one was asked for, else the year), gal. */
  useGal: number;
  /**
   * Allowance for the same period to date, gal: the month's budget or the year's MAWA, prorated by the share of the
   * period's ETo that has fallen when the period is not over yet; null when it cannot be computed.
   */
  budgetGal: number | null;
  /** The whole period's budget or MAWA, gal. */
  fullBudgetGal: number | null;
  /** Share of the period's ETo to date when prorated (0..1), null when the whole period is past. */
  allowanceShare: number | null;
  /** Null when the site has no readings in the period (unknown, never 0 %). */
  percentOfBudget: number | null;
  /** The year's figures, always given: use to date against the MAWA to date. */
  annualUseGal: number;
  annualMawaGal: number | null;
  annualAllowanceGal: number | null;
  annualPercentOfMawa: number | null;
  /** Share 0..1 of the period's days with metered use. */
  completeness: number;
  presentDays: number;
  expectedDays: number;
  /** % change against the same period last year; null without last year's use. */
  trendPercent: number | null;
  lastYearUseGal: number | null;
  /** Why there is no budget, when there is none, in plain words. */
  problem: string | null;
  noticeSentAt: string | null;
}

export interface ComplianceReportDto {
  year: number;
  month: string | null;
  period: { from: string; to: string };
  basis: string;
  /** How the allowance column is worked out, as its heading's note ("MAWA to date, prorated by ETo"). */
  allowanceLabel: string;
  /** Organisations owning the visible sites (before the owner filter), for the filter's choices. */
  owners: { id: number; name: string }[];
  /** Sites per worklist group over the whole filtered list. */
  groups: { group: WorklistGroup; label: string; count: number }[];
  items: ComplianceRowDto[];
  total: number;
  page: number;
  pageSize: number;
}

/** One notice in a site's history. */
export interface NoticeHistoryDto {
  month: string;
  sentAt: string;
  sentBy: string;
  senderOrganisation: string;
  recipients: number;
  percentOfBudget: number | null;
  message: string;
}

export interface ComplianceNoticeDto {
  siteId: number;
  month: string;
  recipients: number;
  sentAt: string;
}
