import type { Page } from '../api/page';

/** What the portfolio and site-overview endpoints return. Volumes are US gallons, money in `currency`. */
export const PORTFOLIO_PERIODS = ['month', 'water-year', 'custom'] as const;
export type PortfolioPeriod = (typeof PORTFOLIO_PERIODS)[number];
export const PORTFOLIO_CONDITIONS = ['over-budget', 'no-recent-data', 'open-alerts'] as const;
export type PortfolioCondition = (typeof PORTFOLIO_CONDITIONS)[number];
export const PORTFOLIO_SORTS = [
  'name',
  'useGallons',
  'budgetGallons',
  'percentOfBudget',
  'openAlerts',
  'lastDataAt',
] as const;
export type PortfolioSort = (typeof PORTFOLIO_SORTS)[number];
/** A site whose latest reading is older than this has "no recent data". */
export const RECENT_DATA_DAYS = 3;

export interface UseAgainstBudget {
  useGallons: number;
  /** Null when no site in scope has a computable budget. */
  budgetGallons: number | null;
  percentOfBudget: number | null;
}

export interface PortfolioRow {
  siteId: number;
  siteName: string;
  organisationName: string;
  timeZone: string;
  tags: string[];
  useGallons: number;
  budgetGallons: number | null;
  percentOfBudget: number | null;
  /** Last 12 calendar months' use, oldest first, ending with the period's last month. */
  trend: { month: string; gallons: number }[];
  openAlerts: number;
  /** End of the latest reading (UTC ISO); null when the site has none. */
  lastDataAt: string | null;
  budgetProblem: string | null;
}

export interface PortfolioDto {
  period: { kind: PortfolioPeriod; from: string; to: string; label: string };
  yearToDate: { from: string; to: string };
  headline: {
    period: UseAgainstBudget;
    yearToDate: UseAgainstBudget;
    /** Σ per site and month of max(0, use − budget). */
    overBudgetGallons: number;
    overBudgetCost: number | null;
    currency: string | null;
    openAlerts: number;
    sitesOverBudget: number;
    sitesWithoutRecentData: number;
    siteCount: number;
  };
  sites: Page<PortfolioRow>;
  /** Whether an alert table exists yet (alerts come from the nightly watch). */
  alertsAvailable: boolean;
}

export interface OverviewDay {
  date: string;
  useGallons: number | null;
  /** The month's budget spread over its days in proportion to daily ETo; null without a budget. */
  budgetGallons: number | null;
  etoMm: number | null;
  rainMm: number | null;
  coveredMinutes: number;
}

export interface SiteOverviewDto {
  site: { id: number; name: string; timeZone: string; organisationName: string };
  from: string;
  to: string;
  figures: UseAgainstBudget & {
    overBudgetGallons: number;
    lastDataAt: string | null;
    openAlerts: number;
    daysWithData: number;
    days: number;
  };
  days: OverviewDay[];
  uploads: { id: number; date: string; fileName: string; status: string; accepted: number }[];
  alerts: { id: number; date: string; title: string; status: string }[];
  budgetProblem: string | null;
}

export interface HourlyGridDto {
  siteId: number;
  month: string;
  timeZone: string;
  /** One entry per local day of the month; `hours[h]` is gallons in local hour h (null: no reading). */
  days: { date: string; hours: (number | null)[] }[];
  maxGallons: number;
}

export const MONTHLY_FLAGS = ['over-budget', 'partial-data', 'no-data', 'no-budget', 'weather-filled'] as const;
export type MonthlyFlag = (typeof MONTHLY_FLAGS)[number];

export interface MonthlyRow {
  month: string;
  useGallons: number;
  budgetGallons: number | null;
  varianceGallons: number | null;
  percentOfBudget: number | null;
  etoMm: number | null;
  rainMm: number | null;
  cost: number | null;
  currency: string | null;
  flags: MonthlyFlag[];
}

export interface SiteMonthlyDto {
  site: { id: number; name: string; timeZone: string };
  from: string;
  to: string;
  months: MonthlyRow[];
}

export function percentOf(use: number, budget: number | null): number | null {
  return budget && budget > 0 ? (use / budget) * 100 : null;
}
