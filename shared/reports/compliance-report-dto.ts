/** The auditor's and manager's compliance ranking, as the API sends it. */
import type { SiteKind } from '../sites/site';

export const COMPLIANCE_SORTS = ['rank', 'name', 'completeness', 'trend', 'use'] as const;
export type ComplianceSort = (typeof COMPLIANCE_SORTS)[number];

export interface ComplianceRowDto {
  rank: number;
  siteId: number;
  siteName: string;
  siteKind: SiteKind;
  organisationName: string;
  tags: string[];
  /** Metered use in the period (the month if one was asked for, else the year), gal. */
  useGal: number;
  /** Budget for the same period, gal: the monthly budget, or the annual MAWA; null when it cannot be computed. */
  budgetGal: number | null;
  percentOfBudget: number | null;
  /** The annual view's figures, always given. */
  annualUseGal: number;
  annualMawaGal: number | null;
  annualPercentOfMawa: number | null;
  /** Share 0..1 of the period's days with metered use. */
  completeness: number;
  presentDays: number;
  expectedDays: number;
  /** % change against the same period last year; null without last year's use. */
  trendPercent: number | null;
  lastYearUseGal: number | null;
  /** Why there is no budget, when there is none. */
  problem: string | null;
  noticeSentAt: string | null;
}

export interface ComplianceReportDto {
  year: number;
  month: string | null;
  period: { from: string; to: string };
  basis: string;
  items: ComplianceRowDto[];
  total: number;
  page: number;
  pageSize: number;
}

export interface ComplianceNoticeDto {
  siteId: number;
  month: string;
  recipients: number;
  sentAt: string;
}
