import { calculateSavings } from '@shared/savings/savings-calculation';
import { fitBaselineModel, type BaselineModelForm, type MeteredPeriod } from '@shared/savings/baseline-model';
import { ACCEPTANCE_CRITERIA } from '@shared/savings/acceptance-criteria';
import { annualSavings, simplePaybackYears } from '@shared/savings/simple-payback';
import { judgeSavings } from '@shared/savings/savings-verdict';
import type { SavingsMonthDto, SavingsReportDto } from '@shared/savings/savings-project-dto';
import { costOfVolume } from '@shared/rates/water-cost';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { lastDayOf } from '../../budgets/domain/budgets-service';
import { scheduleInForce, type RateSchedulesService } from '../../rates/domain/rate-schedules-service';
import type { DailyUseRepository } from '../../readings/data/daily-use-repository';
import type { DailyWeatherService } from '../../weather/domain/daily-weather-service';
import type { WeatherStationsService } from '../../weather/domain/weather-stations-service';
import { toDto, type SavingsProjectsService } from './savings-projects-service';

/** A month counts only when this share of its days has metered use; a half-metered month would look like savings. */
export const MIN_METERED_SHARE = 0.9;

const EQUATIONS: Record<string, string> = {
  eto: 'use (gal/month) = base use + b × ETo (mm/month)',
  'eto-rain': 'use (gal/month) = base use + b × ETo (mm/month) + c × rain (mm/month)',
  'eto-per-day': 'use (gal/day) = base use + b × ETo (mm/day), weighted by days in the month',
  'eto-rain-per-day': 'use (gal/day) = base use + b × ETo (mm/day) + c × rain (mm/day), weighted by days in the month',
};

/**
 * Weather-normalised savings of one project (IPMVP Option C on the site's metered use), with the Guideline 14 verdict.
 */
export class SavingsReportService {
  constructor(
    private readonly projects: SavingsProjectsService,
    private readonly stations: WeatherStationsService,
    private readonly weather: DailyWeatherService,
    private readonly dailyUse: DailyUseRepository,
    private readonly rates: RateSchedulesService,
  ) {}

  async report(principal: Principal, id: number): Promise<SavingsReportDto> {
    const { project, site } = await this.projects.load(principal, id);
    const dto = toDto(project, site, principal);
    const station = await this.stations.stationOfSite(principal, site.id);
    if (!station)
      throw AppError.invalid(
        'weatherStation',
        'This site is not linked to a weather station; the baseline is fitted against its ETo and rain.',
      );
    const baselineMonths = await this.months(station, site.id, dto.baselineFrom, dto.baselineTo);
    const reportingMonths = await this.months(station, site.id, dto.reportingFrom, dto.reportingTo);
    const warnings: string[] = [];
    const usable = (months: SavingsMonthDto[], what: string): MeteredPeriod[] => {
      const left = months.filter((m) => m.useGal === null).map((m) => m.month);
      if (left.length)
        warnings.push(
          `${what} months left out because less than ${MIN_METERED_SHARE * 100} ` +
            `% of their days are metered: ${left.join(', ')}.`,
        );
      return months
        .filter((m) => m.useGal !== null)
        .map((m) => ({ label: m.month, days: m.days, etoMm: m.etoMm, rainMm: m.rainMm, useGal: m.useGal! }));
    };
    const baseline = usable(baselineMonths, 'Baseline');
    const reporting = usable(reportingMonths, 'Reporting');
    const minimum = dto.modelForm.includes('rain') ? 4 : 3;
    if (baseline.length < minimum)
      throw AppError.invalid(
        'baseline',
        `only ${baseline.length} baseline months have metered use; the model needs at least ${minimum}.`,
      );
    if (reporting.length === 0) throw AppError.invalid('reporting', 'no reporting month has metered use yet.');

    let model;
    try {
      model = fitBaselineModel(baseline, dto.modelForm);
    } catch (error) {
      if (error instanceof RangeError) throw AppError.invalid('baseline', error.message);
      throw error;
    }
    const schedules = await this.rates.allOfSite(site.id);
    const inForce = reporting.map((p) => scheduleInForce(schedules, `${p.label}-01`));
    const currencies = new Set(inForce.map((s) => s?.currency ?? null));
    // Money only when every reporting month has a schedule in one currency; mixed currencies are not added.
    const priced = inForce.every(Boolean) && currencies.size === 1;
    const price = priced
      ? (gal: number, p: { label: string }) => costOfVolume(scheduleInForce(schedules, `${p.label}-01`)!, gal).total
      : undefined;
    if (!priced)
      warnings.push('Savings are not priced: not every reporting month has a rate schedule (in one currency).');
    const savings = calculateSavings(model, reporting, { price });
    const verdict = judgeSavings(model, savings);
    const fitted = new Map(model.periods.map((p) => [p.label, p.fittedGal]));

    return {
      project: dto,
      site: { id: site.id, name: site.name, timeZone: site.timeZone },
      station: { id: station.id, name: station.name },
      baselineMonths: baselineMonths.map((m) => ({ ...m, fittedGal: fitted.get(m.month) ?? null })),
      reportingMonths,
      model: {
        form: model.form,
        equation: EQUATIONS[model.form]!,
        coefficients: model.coefficients,
        statistics: model.statistics,
        baselineDays: model.baselineDays,
      },
      savings: {
        periods: savings.periods,
        predictedGal: savings.predictedGal,
        actualGal: savings.actualGal,
        savedGal: savings.savedGal,
        savedPercent: savings.savedPercent,
        savedMoney: savings.savedMoney,
        currency: priced ? [...currencies][0]! : null,
        uncertainty: savings.uncertainty,
        reportingDays: savings.reportingDays,
        annualMoney: annualSavings(savings.savedMoney, savings.reportingDays),
        paybackYears: simplePaybackYears({
          installedCost: dto.installedCost,
          savedMoney: savings.savedMoney,
          reportingDays: savings.reportingDays,
        }),
      },
      verdict: {
        canClaimSavings: verdict.canClaimSavings,
        baselineModelAcceptable: verdict.baselineModelAcceptable,
        route: verdict.route,
        checks: verdict.checks.map(({ fromMemory: _provenance, ...check }) => check),
        reasons: verdict.reasons,
        summary: verdict.summary,
        criteria: { ...ACCEPTANCE_CRITERIA },
      },
      warnings: [...warnings, ...verdict.warnings],
      method: methodSentences({
        baseline: [dto.baselineFrom, dto.baselineTo],
        reporting: [dto.reportingFrom, dto.reportingTo],
        form: model.form,
        stationName: station.name,
      }),
    };
  }

  /** Calendar months with the station's ETo and rain (gaps filled from normals) and the site's metered use. */
  private async months(
    station: Parameters<DailyWeatherService['forBudget']>[0],
    siteId: number,
    from: string,
    to: string,
  ): Promise<SavingsMonthDto[]> {
    const { days } = await this.weather.forWholePeriod(station, `${from}-01`, lastDayOf(to));
    const use = new Map((await this.dailyUse.monthly([siteId], `${from}-01`, lastDayOf(to))).map((m) => [m.month, m]));
    const byMonth = new Map<string, SavingsMonthDto>();
    for (const d of days) {
      const month = d.date.slice(0, 7);
      const m = byMonth.get(month) ?? {
        month,
        days: 0,
        etoMm: 0,
        rainMm: 0,
        useGal: null,
        meteredDays: use.get(month)?.days ?? 0,
      };
      m.days++;
      m.etoMm += d.etoMm;
      m.rainMm += d.rainMm;
      byMonth.set(month, m);
    }
    return [...byMonth.values()].map((m) => ({
      ...m,
      useGal: m.meteredDays >= MIN_METERED_SHARE * m.days ? use.get(m.month)!.gallons : null,
    }));
  }
}

/**
 * The method in words a board member can follow; printed on the report, the PDF and the handout. It names only the
 * weather the fitted model uses (ETo, and rain only for the forms that include it) and whether it fits whole months
 * or the daily average of each month.
 */
export function methodSentences(m: {
  baseline: [string, string];
  reporting: [string, string];
  form: BaselineModelForm;
  stationName: string;
}): string[] {
  const rain = m.form.includes('rain');
  const weather = rain ? 'reference evapotranspiration (ETo) and rain' : 'reference evapotranspiration (ETo) alone';
  const perDay = m.form.endsWith('per-day');
  const use = perDay ? "each month's average daily metered use" : "the site's monthly metered use";
  const span = ([a, b]: [string, string]) => `${monthName(a)} to ${monthName(b)}`;
  return [
    `We fitted a straight line relating ${use} to ${weather} at weather station "${m.stationName}" over ` +
      `the baseline months ${span(m.baseline)}, by least squares` +
      (perDay ? ', each month weighted by its number of days.' : '.') +
      (rain ? '' : ' Rain is not part of this model.'),
    `We then fed the reporting months' (${span(m.reporting)}) ETo` +
      (rain ? ' and rain' : '') +
      ' into that line to predict what the site would have used without the change; savings are that ' +
      'prediction minus the metered use.',
    `The fit is judged with ${ACCEPTANCE_CRITERIA.standard} statistics (R², CV(RMSE), NMBE) and its acceptance ` +
      'thresholds; savings are claimed only when the model meets them.',
  ];
}

function monthName(month: string): string {
  return new Intl.DateTimeFormat('en-US', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(`${month}-01T00:00:00Z`),
  );
}
