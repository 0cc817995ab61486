import type { RateSchedule } from '@shared/rates/rate-schedule';
import type { MonthlyUse, SiteWatchInput } from '@shared/watch/watch-inputs';
import { localHourOf } from '@shared/watch/site-clock';
import { DEFAULT_IRRIGATION_WINDOW } from '@shared/watch/watch-dto';
import type { Principal } from '../../../platform/auth/principal';
import type { BudgetsService } from '../../budgets/domain/budgets-service';
import { scheduleInForce, type RateSchedulesService } from '../../rates/domain/rate-schedules-service';
import type { SiteSettingsRow, WatchDataRepository, WatchSiteRow } from '../data/watch-data-repository';

/** Longest look-back any detector needs before the first new hour: 28 baseline nights, 30 runs, a month's pace. */
export const LOOK_BACK_MS = 45 * 86_400_000;

/** Gathers one site's data for `watchSite`: meter hours, runs, zones, budgets, rates and thresholds. */
export class SiteWatchInputLoader {
  constructor(
    private readonly data: WatchDataRepository,
    private readonly budgets: BudgetsService,
    private readonly rates: RateSchedulesService,
  ) {}

  async load(
    site: WatchSiteRow,
    settings: SiteSettingsRow | undefined,
    fromUtc: Date,
    asOfUtc: Date,
  ): Promise<SiteWatchInput> {
    const [meterHours, longReads, runs, zones, schedules] = await Promise.all([
      this.data.meterHours(site.siteId, fromUtc, asOfUtc),
      this.data.longReadings(site.siteId, fromUtc, asOfUtc),
      this.data.runs(site.siteId, fromUtc, asOfUtc),
      this.data.zones(site.siteId),
      this.rates.allOfSite(site.siteId),
    ]);
    const fromMonth = fromUtc.toISOString().slice(0, 7);
    const toMonth = asOfUtc.toISOString().slice(0, 7);
    const schedule = scheduleInForce(schedules, asOfUtc.toISOString().slice(0, 10));
    return {
      site: {
        siteId: String(site.siteId),
        timeZone: site.timeZone,
        irrigationWindow: settings
          ? { startHour: settings.irrigationStartHour, endHour: settings.irrigationEndHour }
          : { ...DEFAULT_IRRIGATION_WINDOW },
        monthlyBudgets: await this.monthlyBudgets(site, fromMonth, toMonth),
        ...(schedule ? { rateSchedule: rateOf(schedule) } : {}),
        thresholds: settings?.thresholds ?? {},
      },
      zones,
      ...(meterHours.length ? { meterHours } : {}),
      ...(longReads.length ? { monthlyUse: byLocalMonth(longReads, site.timeZone) } : {}),
      runs,
      asOfUtc: asOfUtc.getTime(),
    };
  }

  /**
   * The cached monthly budgets when the portfolio has filled them, else the budget engine itself. A site the
   * engine cannot budget (no hydrozones or weather station yet) simply gets no overspend check.
   */
  private async monthlyBudgets(
    site: WatchSiteRow,
    fromMonth: string,
    toMonth: string,
  ): Promise<{ month: string; gallons: number }[]> {
    const cached = await this.data.cachedMonthlyBudgets(site.siteId, fromMonth, toMonth);
    if (cached.length > 0) return cached;
    try {
      const budget = await this.budgets.budget(watchPrincipal(site), site.siteId, fromMonth, toMonth, 'none');
      return budget.months.map((m) => ({ month: m.month, gallons: m.gallons }));
    } catch {
      return [];
    }
  }
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
