import type { PortfolioPeriod } from './portfolio-dto';

/** Calendar helpers for the portfolio's periods. Dates are `YYYY-MM-DD` local calendar dates. */
export interface ResolvedPeriod {
  kind: PortfolioPeriod;
  from: string;
  to: string;
  label: string;
}

const MONTH_NAMES = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

export function lastDayOfMonth(month: string): string {
  const [y, m] = month.split('-').map(Number) as [number, number];
  return new Date(Date.UTC(y, m, 0)).toISOString().slice(0, 10);
}

export function daysInMonth(month: string): number {
  return Number(lastDayOfMonth(month).slice(8));
}

export function addMonths(month: string, n: number): string {
  const [y, m] = month.split('-').map(Number) as [number, number];
  return new Date(Date.UTC(y, m - 1 + n, 1)).toISOString().slice(0, 7);
}

/** Months YYYY-MM from the month of `from` to the month of `to`, inclusive. */
export function monthsBetween(from: string, to: string): string[] {
  const out: string[] = [];
  for (let m = from.slice(0, 7); m <= to.slice(0, 7); m = addMonths(m, 1)) out.push(m);
  return out;
}

/** The water year runs October to September and is named for the year it ends in. */
export function waterYearStart(date: string): string {
  const y = Number(date.slice(0, 4));
  return Number(date.slice(5, 7)) >= 10 ? `${y}-10-01` : `${y - 1}-10-01`;
}

export function dayCount(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000) + 1;
}

export function resolvePeriod(kind: PortfolioPeriod, today: string, from?: string, to?: string): ResolvedPeriod {
  if (kind === 'custom') {
    const f = from ?? `${today.slice(0, 7)}-01`;
    const t = to ?? today;
    return { kind, from: f, to: t, label: `${f} to ${t}` };
  }
  const anchor = from ?? today;
  if (kind === 'water-year') {
    const start = waterYearStart(anchor);
    const endYear = Number(start.slice(0, 4)) + 1;
    return {
      kind,
      from: start,
      to: `${endYear}-09-30`,
      label: `Water year ${endYear} (Oct ${endYear - 1} – Sep ${endYear})`,
    };
  }
  const month = anchor.slice(0, 7);
  return {
    kind,
    from: `${month}-01`,
    to: lastDayOfMonth(month),
    label: `${MONTH_NAMES[Number(month.slice(5)) - 1]} ${month.slice(0, 4)}`,
  };
}
