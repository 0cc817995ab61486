/** A manager's month close: each owned site's month, the review marks and the board packets, as the API sends them. */
import type { Page } from '../api/page';

export const MONTH_CLOSE_SORTS = ['name', 'percentOfBudget', 'variance', 'cost', 'openAlerts', 'reviewed'] as const;
export type MonthCloseSort = (typeof MONTH_CLOSE_SORTS)[number];

export interface MonthReviewDto {
  siteId: number;
  month: string;
  note: string;
  reviewedBy: string;
  reviewedAt: string;
}

export interface MonthCloseRowDto {
  siteId: number;
  siteName: string;
  tags: string[];
  timeZone: string;
  /** Metered use in the month, gal; null when the month has no readings at all (unknown, not zero). */
  useGallons: number | null;
  budgetGallons: number | null;
  varianceGallons: number | null;
  percentOfBudget: number | null;
  /** The bill for the metered use at the rate in force. */
  cost: number | null;
  currency: string | null;
  /** Alerts whose period touches the month, and how many of them are not resolved yet. */
  alertsInMonth: number;
  openAlerts: number;
  /** Days of the month (so far) with metered use, out of the days expected. */
  meteredDays: number;
  expectedDays: number;
  completeness: number;
  /** Why there is no budget, in plain words. */
  budgetProblem: string | null;
  review: MonthReviewDto | null;
}

export interface MonthCloseDto extends Page<MonthCloseRowDto> {
  month: string;
  /** Every owned site of the organisation, not just this page. */
  summary: {
    sites: number;
    reviewed: number;
    useGallons: number;
    budgetGallons: number | null;
    cost: number | null;
    currency: string | null;
    openAlerts: number;
    /** Use against budget over the sites with readings and a budget (`comparedSites` of them). */
    percentOfBudget: number | null;
    comparedSites: number;
  };
  /** Whether the signed-in user may mark sites reviewed. */
  canReview: boolean;
}

export interface MonthReviewInput {
  note: string;
}

export const BOARD_PACKET_STATUSES = ['queued', 'running', 'done', 'failed'] as const;
export type BoardPacketStatus = (typeof BOARD_PACKET_STATUSES)[number];

export interface BoardPacketDto {
  id: number;
  month: string;
  title: string;
  siteIds: number[];
  status: BoardPacketStatus;
  doneSites: number;
  totalSites: number;
  /** 0..1, for the progress bar. */
  progress: number;
  sizeBytes: number | null;
  error: string | null;
  createdBy: string;
  createdAt: string;
  finishedAt: string | null;
}

export interface BoardPacketInput {
  month: string;
  title: string;
  siteIds: number[];
}

/** At most this many sites in one packet (one page each). */
export const BOARD_PACKET_MAX_SITES = 60;
