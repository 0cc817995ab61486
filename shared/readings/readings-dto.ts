/** What a site's readings endpoints return (overview, hour-by-day grid, monthly table). Volumes are US gallons. */
import type { MonthlyTotals } from './monthly-totals';

export interface UseAgainstBudget {
  useGallons: number;
  /** Null when no site in scope has a computable budget. */
  budgetGallons: number | null;
  percentOfBudget: number | null;
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

/** `estimated`: some use comes from estimated reads; `from-bills`: some is a bill spread over its days. */
export const MONTHLY_FLAGS = [
  'over-budget',
  'partial-data',
  'no-data',
  'no-budget',
  'weather-filled',
  'partial-budget',
  'estimated',
  'from-bills',
] as const;
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
  /** The totals row (see monthly-totals.ts): budget and variance over the months with readings and a budget. */
  totals: MonthlyTotals;
}

export function percentOf(use: number, budget: number | null): number | null {
  return budget && budget > 0 ? (use / budget) * 100 : null;
}
