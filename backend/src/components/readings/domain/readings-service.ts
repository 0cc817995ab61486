import { toCsv, type CsvColumn } from '@shared/csv/csv-writer';
import { dayCount, daysInMonth, lastDayOfMonth, monthsBetween } from '@shared/portfolio/period';
import { monthlyTotals } from '@shared/readings/monthly-totals';
import {
  percentOf,
  type HourlyGridDto,
  type MonthlyFlag,
  type MonthlyRow,
  type OverviewDay,
  type SiteMonthlyDto,
  type SiteOverviewDto,
} from '@shared/readings/readings-dto';
import { costOfVolume } from '@shared/rates/water-cost';
import { addDays } from '@shared/weather/day-of-year';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { DailyUseRepository, MonthlyUse } from '../data/daily-use-repository';
import { scheduleInForce, type RateSchedulesService } from '../../rates/domain/rate-schedules-service';
import type { SitesService } from '../../sites/domain/sites-service';
import type { AlertsService } from '../../alerts/domain/alerts-service';
import type { ReadingsRepository } from '../data/readings-repository';
import type { BudgetCache } from '../../budgets/domain/budget-cache';
import type { RateScheduleDto } from '@shared/rates/rate-schedule-dto';

/** One site's month for the month close: the monthly table's row, its metered days and why a budget is missing. */
export type SiteMonth = MonthlyRow & { meteredDays: number; budgetProblem: string | null };
type BudgetMonthRow = Awaited<ReturnType<BudgetCache['months']>>[number];

const MAX_OVERVIEW_DAYS = 400;
const MAX_MONTHS = 25;
/** A month counts as fully metered when readings cover at least this share of its minutes. */
const COMPLETE_SHARE = 0.95;

/**
 * One site's readings as the site pages show them: key figures, daily use against budget, the hour-by-day grid and the
 * monthly table.
 */
export class ReadingsService {
  constructor(
    private readonly sites: SitesService,
    private readonly repo: ReadingsRepository,
    private readonly dailyUse: DailyUseRepository,
    private readonly budgetCache: BudgetCache,
    private readonly rates: RateSchedulesService,
    private readonly alerts: AlertsService,
  ) {}

  async overview(principal: Principal, siteId: number, from: string, to: string): Promise<SiteOverviewDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    if (to < from) throw AppError.invalid('to', `${to} is before ${from}`);
    if (dayCount(from, to) > MAX_OVERVIEW_DAYS)
      throw AppError.invalid('to', `at most ${MAX_OVERVIEW_DAYS} days at a time`);
    const months = monthsBetween(from, to);
    await this.budgetCache.ensure(principal, [siteId], months);
    const budgets = await this.budgetCache.months([siteId], months[0]!, months[months.length - 1]!);
    const use = new Map((await this.dailyUse.daily(siteId, from, to)).map((d) => [d.localDate, d]));
    const engineDays = await this.budgetCache.daily(principal, siteId, months[0]!, months[months.length - 1]!);
    // ETo for the whole months, so each day's share of its month's budget is known even at the range's edges.
    const weather = await this.repo.weather(siteId, `${months[0]}-01`, lastDayOfMonth(months[months.length - 1]!));
    const days: OverviewDay[] = [];
    for (let d = from; d <= to; d = addDays(d, 1)) {
      const month = d.slice(0, 7);
      const w = weather.get(d);
      days.push({
        date: d,
        useGallons: use.get(d)?.gallons ?? null,
        budgetGallons: dailyBudget(d, budgets.find((b) => b.month === month)?.gallons ?? null, engineDays, weather),
        etoMm: w?.etoMm ?? null,
        rainMm: w?.rainMm ?? null,
        coveredMinutes: use.get(d)?.coveredMinutes ?? 0,
      });
    }
    const useTotal = days.reduce((s, d) => s + (d.useGallons ?? 0), 0);
    const budgetTotal = days.every((d) => d.budgetGallons !== null)
      ? days.reduce((s, d) => s + d.budgetGallons!, 0)
      : null;
    const alerts = await this.alerts.markers(siteId, site.timeZone, from, to);
    return {
      site: { id: site.id, name: site.name, timeZone: site.timeZone, organisationName: site.organisationName },
      from,
      to,
      figures: {
        useGallons: useTotal,
        budgetGallons: budgetTotal,
        percentOfBudget: percentOf(useTotal, budgetTotal),
        overBudgetGallons: budgetTotal === null ? 0 : Math.max(0, useTotal - budgetTotal),
        lastDataAt: (await this.repo.lastDataAt(siteId))?.toISOString() ?? null,
        openAlerts: alerts.filter((a) => a.status === 'open').length,
        daysWithData: days.filter((d) => d.useGallons !== null).length,
        days: days.length,
      },
      days,
      uploads: await this.repo.uploads(siteId, site.timeZone, from, to),
      alerts,
      budgetProblem: budgets.find((b) => b.problem)?.problem ?? null,
    };
  }

  async hourlyGrid(principal: Principal, siteId: number, month: string): Promise<HourlyGridDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    const last = lastDayOfMonth(month);
    const cells = await this.repo.hourly(siteId, site.timeZone, month, last);
    const days: HourlyGridDto['days'] = [];
    for (let d = `${month}-01`; d <= last; d = addDays(d, 1))
      days.push({ date: d, hours: Array.from({ length: 24 }, () => null) });
    for (const c of cells) {
      const day = days[Number(c.date.slice(8)) - 1];
      if (day) day.hours[c.hour] = (day.hours[c.hour] ?? 0) + c.gallons;
    }
    return {
      siteId,
      month,
      timeZone: site.timeZone,
      days,
      maxGallons: cells.reduce((m, c) => Math.max(m, c.gallons), 0),
    };
  }

  async monthly(principal: Principal, siteId: number, fromMonth: string, toMonth: string): Promise<SiteMonthlyDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    if (toMonth < fromMonth) throw AppError.invalid('to', `${toMonth} is before ${fromMonth}`);
    const months = monthsBetween(`${fromMonth}-01`, `${toMonth}-01`);
    if (months.length > MAX_MONTHS) throw AppError.invalid('to', `at most ${MAX_MONTHS} months at a time`);
    await this.budgetCache.ensure(principal, [siteId], months);
    const budgets = await this.budgetCache.months([siteId], fromMonth, toMonth);
    const use = await this.dailyUse.monthly([siteId], `${fromMonth}-01`, lastDayOfMonth(toMonth));
    const schedules = await this.rates.allOfSite(siteId);
    const rows = months.map((month) =>
      monthRow(
        month,
        budgets.find((r) => r.month === month),
        use.find((r) => r.month === month),
        scheduleInForce(schedules, `${month}-01`),
      ),
    );
    return {
      site: { id: site.id, name: site.name, timeZone: site.timeZone },
      from: fromMonth,
      to: toMonth,
      months: rows,
      totals: monthlyTotals(rows),
    };
  }

  /**
   * One month of several sites at once, for the month close (the caller has checked each site): the monthly
   * table's row per site plus its metered days and the reason a budget is missing.
   */
  async monthOfSites(principal: Principal, siteIds: number[], month: string): Promise<Map<number, SiteMonth>> {
    const out = new Map<number, SiteMonth>();
    if (!siteIds.length) return out;
    await this.budgetCache.ensure(principal, siteIds, [month]);
    const budgets = await this.budgetCache.months(siteIds, month, month);
    const use = await this.dailyUse.monthly(siteIds, `${month}-01`, lastDayOfMonth(month));
    const schedules = await this.rates.allOfSites(siteIds);
    for (const siteId of siteIds) {
      const b = budgets.find((r) => r.siteId === siteId);
      const u = use.find((r) => r.siteId === siteId);
      const row = monthRow(month, b, u, scheduleInForce(schedules.get(siteId) ?? [], `${month}-01`));
      out.set(siteId, { ...row, meteredDays: u?.days ?? 0, budgetProblem: b?.problem ?? null });
    }
    return out;
  }

  async monthlyCsv(
    principal: Principal,
    siteId: number,
    fromMonth: string,
    toMonth: string,
  ): Promise<{ fileName: string; csv: string }> {
    const table = await this.monthly(principal, siteId, fromMonth, toMonth);
    const round = (n: number | null, places: number) =>
      n === null ? null : Math.round(n * 10 ** places) / 10 ** places;
    const columns: CsvColumn<MonthlyRow>[] = [
      { header: 'Site', value: () => table.site.name },
      { header: 'Month', value: (r) => r.month },
      { header: 'Use (gal)', value: (r) => round(r.useGallons, 1) },
      { header: 'Budget (gal)', value: (r) => round(r.budgetGallons, 1) },
      { header: 'Variance (gal)', value: (r) => round(r.varianceGallons, 1) },
      { header: 'Percent of budget (%)', value: (r) => round(r.percentOfBudget, 1) },
      { header: 'ETo (mm)', value: (r) => round(r.etoMm, 1) },
      { header: 'Rain (mm)', value: (r) => round(r.rainMm, 1) },
      { header: 'Cost', value: (r) => round(r.cost, 2) },
      { header: 'Currency', value: (r) => r.currency },
      { header: 'Flags', value: (r) => r.flags.join(' ') },
    ];
    const safeName =
      table.site.name
        .replace(/[^A-Za-z0-9-]+/g, '-')
        .replace(/^-|-$/g, '')
        .slice(0, 60) || 'site';
    const totalsRow: MonthlyRow = { ...table.totals, month: `Total ${fromMonth} to ${toMonth}`, flags: [] };
    return {
      fileName: `${safeName}-monthly-${fromMonth}-to-${toMonth}.csv`,
      csv: toCsv(columns, [...table.months, totalsRow]),
    };
  }
}

/** A site's month as the monthly table shows it, with the rate schedule in force that month. */
function monthRow(
  month: string,
  b: BudgetMonthRow | undefined,
  u: MonthlyUse | undefined,
  schedule: RateScheduleDto | null,
): MonthlyRow {
  const useGallons = u?.gallons ?? 0;
  const budgetGallons = b?.gallons ?? null;
  const flags: MonthlyFlag[] = [];
  if (budgetGallons !== null && useGallons > budgetGallons) flags.push('over-budget');
  if (!u) flags.push('no-data');
  else if (u.coveredMinutes < daysInMonth(month) * 1440 * COMPLETE_SHARE) flags.push('partial-data');
  if (budgetGallons === null) flags.push('no-budget');
  if ((b?.filledDays ?? 0) > 0) flags.push('weather-filled');
  // The cache keeps a partial month's budget for its covered days, with the note in `problem`.
  if (budgetGallons !== null && b?.problem) flags.push('partial-budget');
  if ((u?.estimatedGallons ?? 0) > 0) flags.push('estimated');
  if ((u?.spreadGallons ?? 0) > 0) flags.push('from-bills');
  return {
    month,
    useGallons,
    budgetGallons,
    // A month without readings is unknown, not "0 % used": no variance or percent for it.
    varianceGallons: budgetGallons === null || !u ? null : useGallons - budgetGallons,
    percentOfBudget: u ? percentOf(useGallons, budgetGallons) : null,
    etoMm: b?.etoMm ?? null,
    rainMm: b?.rainMm ?? null,
    // The bill for the metered use, with the budget for budget-based tiers.
    cost: schedule && u ? costOfVolume(schedule, useGallons, budgetGallons ?? undefined).total : null,
    currency: schedule?.currency ?? null,
    flags,
  };
}

/**
 * The month's budget on one day: in proportion to the engine's own daily budget (each day's ETo and effective rain),
 * so the days of a month sum to the month's budget; by ETo alone when the engine had nothing for the month, and
 * evenly when ETo is missing too. A day a partial month's budget does not cover gets none.
 */
function dailyBudget(
  date: string,
  monthBudget: number | null,
  engineDays: Map<string, number>,
  weather: Map<string, { etoMm: number | null }>,
): number | null {
  if (monthBudget === null) return null;
  const month = date.slice(0, 7);
  const dates = Array.from({ length: daysInMonth(month) }, (_, i) => `${month}-${String(i + 1).padStart(2, '0')}`);
  const shape = (d: string) => engineDays.get(d);
  if (dates.some((d) => shape(d) !== undefined)) {
    const total = dates.reduce((s, d) => s + (shape(d) ?? 0), 0);
    if (shape(date) === undefined) return 0;
    return total > 0
      ? (monthBudget * shape(date)!) / total
      : monthBudget / dates.filter((d) => shape(d) !== undefined).length;
  }
  const eto = dates.map((d) => weather.get(d)?.etoMm);
  if (eto.some((e) => e === null || e === undefined)) return monthBudget / dates.length;
  const total = eto.reduce((s: number, e) => s + e!, 0);
  return total > 0 ? (monthBudget * (weather.get(date)!.etoMm ?? 0)) / total : monthBudget / dates.length;
}
