import type { Page } from '../api/page';
import type { UseAgainstBudget } from '../readings/readings-dto';

/** What the portfolio endpoint returns. Volumes are US gallons, money in `currency`. */
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
