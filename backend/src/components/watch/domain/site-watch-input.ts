import type { RateSchedule } from '@shared/rates/rate-schedule';
import type { SiteRule } from '@shared/watering-rules/watering-rule';
import type { MonthlyUse, SiteWatchInput } from '@shared/watch/watch-inputs';
import { localHourOf } from '@shared/watch/site-clock';
import { DEFAULT_IRRIGATION_WINDOW } from '@shared/watch/watch-dto';
import type { Principal } from '../../../platform/auth/principal';
import type { BudgetMonthDto, SiteBudgetDto } from '@shared/budgets/budget-dto';
import { budgetFactsOf, type BudgetFacts } from '@shared/watch/budget-facts';
import { AppError } from '../../../platform/app-error';
import type { BudgetsService } from '../../budgets/domain/budgets-service';
import { scheduleInForce, type RateSchedulesService } from '../../rates/domain/rate-schedules-service';
import type { SiteSettingsRow, WatchDataRepository, WatchSiteRow } from '../data/watch-data-repository';

/** Longest look-back any detector needs before the first new hour: 28 baseline nights, 30 runs, a month's pace. */
export const LOOK_BACK_MS = 45 * 86_400_000;

/** What the loader gives the run: the detectors' input, and what the run should say about weakened checks. */
export interface LoadedSite {
  input: SiteWatchInput;
  warnings: SiteWarning[];
}

export interface SiteWarning {
  message: string;
  /** The site is not set up for the check (no hydrozones or weather station yet), rather than short of data. */
  setupOnly: boolean;
}

/** The budget errors that mean "not set up yet" rather than "data missing". */
const SETUP_FIELDS = new Set(['hydrozones', 'weatherStation']);

/** Gathers one site's data for `watchSite`: meter hours, runs, zones, budgets, rates and thresholds. */
export class SiteWatchInputLoader {
  constructor(
    private readonly data: WatchDataRepository,
    private readonly budgets: BudgetsService,
    private readonly rates: RateSchedulesService,
    private readonly rules: { siteRules(siteId: number): Promise<SiteRule[]> },
  ) {}

  async load(
    site: WatchSiteRow,
    settings: SiteSettingsRow | undefined,
    fromUtc: Date,
    asOfUtc: Date,
  ): Promise<LoadedSite> {
    const [meterHours, longReads, runs, zones, schedules, wateringRules] = await Promise.all([
      this.data.meterHours(site.siteId, fromUtc, asOfUtc),
      this.data.longReadings(site.siteId, fromUtc, asOfUtc),
      this.data.runs(site.siteId, fromUtc, asOfUtc),
      this.data.zones(site.siteId),
      this.rates.allOfSite(site.siteId),
      this.rules.siteRules(site.siteId),
    ]);
    const fromMonth = fromUtc.toISOString().slice(0, 7);
    const toMonth = asOfUtc.toISOString().slice(0, 7);
    const schedule = scheduleInForce(schedules, asOfUtc.toISOString().slice(0, 10));
    const budget = await this.budgetFacts(site, fromMonth, toMonth);
    const input: SiteWatchInput = {
      site: {
        siteId: String(site.siteId),
        timeZone: site.timeZone,
        irrigationWindow: settings
          ? { startHour: settings.irrigationStartHour, endHour: settings.irrigationEndHour }
          : { ...DEFAULT_IRRIGATION_WINDOW },
        monthlyBudgets: budget.facts.monthlyBudgets,
        dailyBudgets: budget.facts.dailyBudgets,
        ...(schedule ? { rateSchedule: rateOf(schedule) } : {}),
        thresholds: settings?.thresholds ?? {},
      },
      zones,
      ...(meterHours.length ? { meterHours } : {}),
      ...(longReads.length ? { monthlyUse: byLocalMonth(longReads, site.timeZone) } : {}),
      runs,
      ...(wateringRules.length ? { wateringRules } : {}),
      asOfUtc: asOfUtc.getTime(),
    };
    // Overspend needs hourly data; a monthly-read site's budget only feeds the monthly leak check.
    return { input, warnings: meterHours.length || longReads.length ? budget.warnings : [] };
  }

  /**
   * The budget day by day from the engine, months on their own (a partial month covers its days with weather). A site
   * the engine cannot budget gets no overspend check, and the run says why: never a silent "no budget".
   */
  private async budgetFacts(
    site: WatchSiteRow,
    fromMonth: string,
    toMonth: string,
  ): Promise<{ facts: BudgetFacts; warnings: SiteWarning[] }> {
    let budget: SiteBudgetDto;
    try {
      budget = await this.budgets.budget(watchPrincipal(site), site.siteId, fromMonth, toMonth, 'none');
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
      const setupOnly = (error.details ?? []).some((d) => SETUP_FIELDS.has(d.field));
      const warning = { message: `overspend not checked: ${error.message}`, setupOnly };
      return { facts: { monthlyBudgets: [], dailyBudgets: [] }, warnings: [warning] };
    }
    const days = budget.months.flatMap((m) => [
      ...m.daily.map((d) => ({ date: d.date, gallons: d.gallons, estimated: d.estimated })),
      ...m.missingDates.map((date) => ({ date, gallons: null, estimated: false })),
    ]);
    const warnings = budget.months.flatMap(monthWarning).map((message) => ({ message, setupOnly: false }));
    return { facts: budgetFactsOf(days), warnings };
  }
}

/** What the run says about a month whose budget stands on estimated or missing weather. */
function monthWarning(m: BudgetMonthDto): string[] {
  if (m.days === 0) return [`overspend not checked for ${m.month}: no weather for any of its days`];
  const notes: string[] = [];
  if (m.estimatedDays > 0) notes.push(`${m.estimatedDays} day(s) of weather estimated`);
  if (m.partial) notes.push(`partial: covers ${m.days} days, no weather for ${m.missingDates.join(', ')}`);
  return notes.length ? [`budget for ${m.month} ${notes.join('; ')}`] : [];
}

/** Daily or monthly reads totalled per local month, counted in the month each read starts. */
function byLocalMonth(reads: { startUtc: number; gallons: number }[], timeZone: string): MonthlyUse[] {
  const months = new Map<string, number>();
  for (const r of reads) {
    const month = localHourOf(r.startUtc, timeZone).month;
    months.set(month, (months.get(month) ?? 0) + r.gallons);
  }
  return [...months].map(([month, gallons]) => ({ month, gallons }));
}

function rateOf(s: RateSchedule): RateSchedule {
  return {
    name: s.name,
    unit: s.unit,
    currency: s.currency,
    fixedChargePerPeriod: s.fixedChargePerPeriod,
    volumeCharge: s.volumeCharge,
  };
}

/** The watch reads budgets as the owning organisation's administrator would; it never writes through this. */
function watchPrincipal(site: WatchSiteRow): Principal {
  return {
    userId: 0,
    email: 'watch@rillmark.invalid',
    displayName: 'Nightly watch',
    organisationId: site.organisationId,
    role: 'admin',
    memberships: [],
  };
}
