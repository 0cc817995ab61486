import type {
  BudgetCostDto,
  ComplianceDto,
  RainCreditKind,
  RunTimeAdviceDto,
  SiteBudgetDto,
} from '@shared/budgets/budget-dto';
import { effectiveIrrigationEfficiency, effectivePlantFactor } from '@shared/budgets/hydrozone';
import {
  estimatedTotalWaterUse,
  maximumAppliedWaterAllowance,
  MWELO_MAX_ETAF,
  mweloCompliance,
  type MweloProjectType,
} from '@shared/budgets/mwelo-allowance';
import { describeEffectiveRainMethod, MWELO_EFFECTIVE_RAIN_FRACTION } from '@shared/weather/effective-rain';
import { indoorAllotmentGallons } from '@shared/budgets/indoor-allotment';
import { costOfBudget } from '@shared/rates/water-cost';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { engineZone, type HydrozonesService } from '../../hydrozones/domain/hydrozones-service';
import type { OrganisationSettingsService } from '../../organisations/domain/organisation-settings-service';
import { scheduleInForce, type RateSchedulesService } from '../../rates/domain/rate-schedules-service';
import type { SitesService } from '../../sites/domain/sites-service';
import type { DailyWeatherService } from '../../weather/domain/daily-weather-service';
import type { WeatherStationsService } from '../../weather/domain/weather-stations-service';
import { budgetMonths, rainMethodOf } from './budget-months';
import { runTimeAdvice } from './run-time';

export const BUDGET_MAX_MONTHS = 25;

/** Budgets, MWELO compliance and run-time advice for a site: reads only, so `read` access suffices. */
export class BudgetsService {
  constructor(
    private readonly sites: SitesService,
    private readonly zones: HydrozonesService,
    private readonly stations: WeatherStationsService,
    private readonly weather: DailyWeatherService,
    private readonly rates: RateSchedulesService,
    private readonly settings: OrganisationSettingsService,
  ) {}

  async budget(
    principal: Principal,
    siteId: number,
    fromMonth: string,
    toMonth: string,
    rainKind: RainCreditKind,
    rainValue?: number,
    indoor?: { occupants: number; gallonsPerPersonPerDay: number },
  ): Promise<SiteBudgetDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    if (toMonth < fromMonth) throw AppError.invalid('to', `${toMonth} is before ${fromMonth}`);
    const monthCount =
      (Number(toMonth.slice(0, 4)) - Number(fromMonth.slice(0, 4))) * 12 +
      Number(toMonth.slice(5)) -
      Number(fromMonth.slice(5)) +
      1;
    if (monthCount > BUDGET_MAX_MONTHS) throw AppError.invalid('to', `at most ${BUDGET_MAX_MONTHS} months at a time`);
    const { zones, station } = await this.inputs(principal, siteId);
    const rain = rainMethodOf(rainKind, rainValue);
    const weather = await this.weather.forBudget(station, `${fromMonth}-01`, lastDayOf(toMonth));
    const schedules = await this.rates.allOfSite(siteId);
    const inputs = { days: weather.days, missingDates: weather.missingDates, fromMonth, toMonth };
    const months = budgetMonths(zones.map(engineZone), inputs, rain).map((m) => {
      const schedule = scheduleInForce(schedules, `${m.month}-01`);
      // A mixed meter's bill covers the indoor allotment too (occupants × gal/person/day × days).
      const indoorGallons = indoor
        ? indoorAllotmentGallons(indoor.occupants, indoor.gallonsPerPersonPerDay, m.days)
        : null;
      let cost: BudgetCostDto | null = null;
      if (schedule) {
        const c = costOfBudget(schedule, m.gallons + (indoorGallons ?? 0));
        cost = {
          scheduleId: schedule.id,
          scheduleName: schedule.name,
          unit: schedule.unit,
          currency: schedule.currency,
          units: c.units,
          fixedCharge: c.fixedCharge,
          volumeCharge: c.volumeCharge,
          total: c.total,
          lines: c.lines,
        };
      }
      return { ...m, indoorGallons, cost };
    });
    const costed = months.filter((m) => m.cost);
    const currencies = new Set(costed.map((m) => m.cost!.currency));
    const { unitSystem } = await this.settings.get(principal);
    return {
      siteId,
      siteName: site.name,
      from: fromMonth,
      to: toMonth,
      unitSystem,
      station: { id: station.id, name: station.name },
      rainCredit: {
        kind: rainKind,
        value: rain.kind === 'fixed-fraction' ? rain.fraction : rain.kind === 'threshold' ? rain.minimumMm : null,
        description: describeEffectiveRainMethod(rain),
      },
      months,
      totals: {
        gallons: months.reduce((s, m) => s + m.gallons, 0),
        litres: months.reduce((s, m) => s + m.litres, 0),
        indoorGallons: indoor ? months.reduce((s, m) => s + (m.indoorGallons ?? 0), 0) : null,
        etoMm: months.reduce((s, m) => s + m.etoMm, 0),
        rainMm: months.reduce((s, m) => s + m.rainMm, 0),
        filledDays: months.reduce((s, m) => s + m.filledDays, 0),
        // Costs in different currencies are not added up.
        cost:
          costed.length === months.length && currencies.size === 1
            ? Math.round(costed.reduce((s, m) => s + m.cost!.total, 0) * 100) / 100
            : null,
        currency: currencies.size === 1 ? [...currencies][0]! : null,
      },
      indoor: indoor ?? null,
      formula:
        'Per hydrozone and day: max(0, ETo (in) × PF × area (ft²) × 0.623377 ' +
        '÷ IE − effective rain (in) × area (ft²) × 0.623377 ÷ IE), summed by month',
      sources: [
        'Budget formula: California MWELO (2015) Appendix B form ETo ' +
          '× PF × area × conversion ÷ IE, with 0.623377 = 144/231 gal per ' +
          'inch per ft² (exact; the ordinance prints 0.62).',
        'Default irrigation efficiencies: MWELO App. B note c (0.81 drip, ' +
          '0.75 overhead spray); others as noted on each hydrozone.',
        "Missing days are filled from the station's monthly normals (total " +
          '÷ days in the month) and counted as filled days; without normals they are estimated from the ' +
          "station's own days within a week (at least three) or the nearest station of the organisation " +
          '(within 50 km) on the same date, and counted as estimated; a day with none of these is left out ' +
          'and its month is marked partial, with the budget for the days it covers.',
        ...(weather.neighbourName ? [`Neighbouring station used for missed days: ${weather.neighbourName}.`] : []),
      ],
    };
  }

  async compliance(
    principal: Principal,
    siteId: number,
    year: number,
    projectType: MweloProjectType | undefined,
    effectivePrecipitation: boolean,
  ): Promise<ComplianceDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    const { zones, station } = await this.inputs(principal, siteId);
    const { days } = await this.weather.forWholePeriod(station, `${year}-01-01`, `${year}-12-31`);
    const type: MweloProjectType = projectType ?? (site.kind === 'hoa-common-area' ? 'residential' : 'non-residential');
    const etoIn = days.reduce((s, d) => s + d.etoMm, 0) / 25.4;
    const rainIn = days.reduce((s, d) => s + d.rainMm, 0) / 25.4;
    const eppt = effectivePrecipitation ? MWELO_EFFECTIVE_RAIN_FRACTION * rainIn : 0;
    const la = zones.reduce((s, z) => s + z.areaFt2, 0);
    const sla = zones.filter((z) => z.specialLandscapeArea).reduce((s, z) => s + z.areaFt2, 0);
    const maxEtaf = MWELO_MAX_ETAF[type];
    const mawa = maximumAppliedWaterAllowance({
      etoInPerYear: etoIn,
      landscapeAreaFt2: la,
      specialLandscapeAreaFt2: sla,
      etaf: maxEtaf,
      effectivePrecipitationInPerYear: eppt,
    });
    const etwuInputs = zones.map(engineZone).map((z) => ({
      areaFt2: z.areaFt2,
      plantFactor: effectivePlantFactor(z),
      irrigationEfficiency: effectiveIrrigationEfficiency(z).efficiency,
      specialLandscapeArea: z.specialLandscapeArea,
    }));
    // MWELO App. B: ETWU = (ETo − Eppt) × 0.62 × (Σ PF × HA ÷ IE + SLA).
    const etwu = estimatedTotalWaterUse(Math.max(0, etoIn - eppt), etwuInputs);
    const verdict = mweloCompliance(etwu, mawa, maxEtaf);
    return {
      siteId,
      year,
      projectType: type,
      projectTypeSource: projectType
        ? 'chosen in the request'
        : site.kind === 'hoa-common-area'
          ? "from the site's kind (HOA common areas count as residential)"
          : "from the site's kind (non-HOA sites count as non-residential)",
      etoIn,
      rainIn,
      effectivePrecipitationIn: eppt,
      filledDays: days.filter((d) => d.filled).length,
      landscapeAreaFt2: la,
      specialLandscapeAreaFt2: sla,
      maxEtaf,
      mawaGallons: mawa.gallons,
      mawaFormula: mawa.formula,
      etwuGallons: etwu.gallons,
      sitewideEtaf: etwu.sitewideEtaf,
      regularAreaEtaf: etwu.regularAreaEtaf,
      zones: zones.map((z, i) => ({
        zoneId: z.id,
        zoneName: z.name,
        areaFt2: z.areaFt2,
        etaf: etwu.zones[i]!.etaf,
        gallons: etwu.zones[i]!.gallons,
        specialLandscapeArea: z.specialLandscapeArea,
      })),
      complies: verdict.complies,
      reasons: verdict.reasons,
      steps: [
        { label: 'Annual ETo', formula: `Σ daily ETo for ${year} ÷ 25.4`, value: etoIn, unit: 'in' },
        {
          label: 'Effective precipitation (Eppt)',
          formula: effectivePrecipitation ? '25 % of annual rain (where the local agency allows it)' : 'not counted',
          value: eppt,
          unit: 'in',
        },
        { label: 'Landscape area (LA)', formula: 'Σ hydrozone areas', value: la, unit: 'ft²' },
        {
          label: 'Special landscape area (SLA)',
          formula: 'Σ areas flagged as special landscape',
          value: sla,
          unit: 'ft²',
        },
        {
          label: 'MAWA',
          formula:
            `(${etoIn.toFixed(2)} − ${eppt.toFixed(2)}) × 0.62 × [${maxEtaf} ` +
            `× ${Math.round(la)} + (1 − ${maxEtaf}) × ${Math.round(sla)}] (MWELO App. B)`,
          value: mawa.gallons,
          unit: 'gal/yr',
        },
        {
          label: 'ETWU',
          formula: '(ETo − Eppt) × 0.62 × Σ (PF ÷ IE × area), SLA at ETAF 1.0 (MWELO App. B)',
          value: etwu.gallons,
          unit: 'gal/yr',
        },
      ],
    };
  }

  /**
   * The share of a period's ETo that fell on or before `through` (the rest of the period from the station's normals):
   * what prorates an allowance to date. With no rain credit a budget is proportional to ETo, so this is exact for
   * MAWA without Eppt and for monthly budgets.
   */
  async etoShareToDate(
    principal: Principal,
    siteId: number,
    period: { from: string; to: string; through: string },
  ): Promise<{ share: number; etoToDateMm: number; etoPeriodMm: number }> {
    const station = await this.stations.stationOfSite(principal, siteId);
    if (!station)
      throw AppError.invalid(
        'weatherStation',
        'This site is not linked to a weather station; link one to compute a budget.',
      );
    const { days } = await this.weather.forBudget(station, period.from, period.to);
    const etoPeriodMm = days.reduce((s, d) => s + d.etoMm, 0);
    const etoToDateMm = days.filter((d) => d.date <= period.through).reduce((s, d) => s + d.etoMm, 0);
    return { share: etoPeriodMm > 0 ? etoToDateMm / etoPeriodMm : 0, etoToDateMm, etoPeriodMm };
  }

  async advice(
    principal: Principal,
    siteId: number,
    zoneId: number,
    month: string,
    daysPerWeek: number,
  ): Promise<RunTimeAdviceDto> {
    await this.sites.requireLevel(principal, siteId, 'read');
    const zone = await this.zones.load(siteId, zoneId);
    const station = await this.stations.stationOfSite(principal, siteId);
    if (!station)
      throw AppError.invalid(
        'weatherStation',
        'Link the site to a weather station first; run times follow the budget.',
      );
    const { days } = await this.weather.forBudget(station, `${month}-01`, lastDayOf(month));
    return runTimeAdvice(zone, days, month, daysPerWeek);
  }

  private async inputs(principal: Principal, siteId: number) {
    const zones = await this.zones.allOfSite(siteId);
    if (zones.length === 0)
      throw AppError.invalid('hydrozones', 'This site has no hydrozones yet; add at least one to compute a budget.');
    const station = await this.stations.stationOfSite(principal, siteId);
    if (!station)
      throw AppError.invalid(
        'weatherStation',
        'This site is not linked to a weather station; link one to compute a budget.',
      );
    return { zones, station };
  }
}

export function lastDayOf(month: string): string {
  const [y, m] = month.split('-').map(Number) as [number, number];
  return new Date(Date.UTC(y, m, 0)).toISOString().slice(0, 10);
}
