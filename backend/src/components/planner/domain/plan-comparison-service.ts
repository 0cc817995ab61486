import type { PlanComparisonDto, PlanInput } from '@shared/planner/plan-dto';
import { PLAN_CAUTIONS } from '@shared/planner/plan-dto';
import { comparePlan } from '@shared/planner/plan-comparison';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { BudgetsService } from '../../budgets/domain/budgets-service';
import type { EtafService } from '../../etaf/domain/etaf-service';
import { scheduleInForce, type RateSchedulesService } from '../../rates/domain/rate-schedules-service';
import type { PlanZones } from './plan-zones-source';
import type { PlansService } from './plans-service';

export const PLAN_METHOD = [
  'Estimated use is MWELO Appendix B ETWU: (ETo − Eppt) × 0.62 × Σ (plant factor ÷ irrigation efficiency × ' +
    'area), special landscape areas at ETAF 1.0.',
  "The allowance is MWELO's MAWA: ETo × 0.62 × [ETAF × LA + (1 − ETAF) × SLA], with the site's allowed ETAF.",
  'A changed irrigation method takes its default efficiency (MWELO App. B note c: 0.75 overhead spray, 0.81 ' +
    'drip) unless another is entered.',
  'Money is priced month by month at the rate schedule in force today (tiers apply per billing month); use is ' +
    'spread over the months by ETo.',
  'Simple payback = cost of the work ÷ money saved per year; no interest, inflation or maintenance.',
];

/** The plan worked out against the site: both sides in one weather year, the site's own rate schedule. */
export class PlanComparisonService {
  constructor(
    private readonly plans: PlansService,
    private readonly zones: PlanZones,
    private readonly budgets: BudgetsService,
    private readonly rates: RateSchedulesService,
    private readonly etaf: EtafService,
  ) {}

  async compare(principal: Principal, planId: number, today = new Date()): Promise<PlanComparisonDto> {
    const { plan, site } = await this.plans.load(principal, planId);
    const year = plan.weatherYear;
    // The budget reads the station's weather with gaps filled from normals, as every budget page does.
    const budget = await this.budgets.budget(principal, site.id, `${year}-01`, `${year}-12`, 'none');
    const zones = await this.zones.ofSite(site.id);
    const allowed = await this.etaf.allowedFor(site);
    const schedule = scheduleInForce(await this.rates.allOfSite(site.id), today.toISOString().slice(0, 10));
    let c;
    try {
      c = comparePlan({
        zones,
        changes: plan.zoneChanges.filter((ch) => zones.some((z) => z.id === ch.hydrozoneId)),
        months: budget.months.map((m) => ({ month: m.month, etoMm: m.etoMm, rainMm: m.rainMm })),
        allowedEtaf: allowed.allowedEtaf,
        smartControllerReductionPercent: plan.smartControllerReductionPercent,
        rainSensor: plan.rainSensor,
        schedule,
        costOfWork: plan.costOfWork,
      });
    } catch (error) {
      if (error instanceof RangeError) throw AppError.invalid('plan', error.message);
      throw error;
    }
    const sameCurrency = !schedule || schedule.currency === plan.currency;
    return {
      planId: plan.id,
      siteName: site.name,
      weather: {
        year,
        stationName: budget.station.name,
        etoIn: budget.totals.etoMm / 25.4,
        rainIn: budget.totals.rainMm / 25.4,
        filledDays: budget.totals.filledDays,
      },
      allowedEtaf: allowed.allowedEtaf,
      allowedEtafSource: allowed.source,
      allowedBasis: allowed.basis,
      before: c.before,
      after: c.after,
      savedGal: c.savedGal,
      savedPercent: c.savedPercent,
      savedMoney: c.savedMoney,
      currency: schedule?.currency ?? plan.currency,
      rateScheduleName: schedule?.name ?? null,
      costOfWork: plan.costOfWork,
      paybackYears: sameCurrency ? c.paybackYears : null,
      zones: c.zones,
      assumptions: assumptions(plan, budget.station.name, schedule?.name ?? null, sameCurrency),
      cautions: PLAN_CAUTIONS,
      method: PLAN_METHOD,
    };
  }
}

function assumptions(
  plan: Pick<PlanInput, 'weatherYear' | 'rainSensor' | 'smartControllerReductionPercent' | 'currency'>,
  station: string,
  schedule: string | null,
  sameCurrency: boolean,
): string[] {
  const out = [`Weather: ${plan.weatherYear} at ${station}; the same year on both sides.`];
  if (plan.rainSensor)
    out.push(
      "Rain sensor: a quarter of the year's rain is counted as effective precipitation (MWELO's Eppt); a " +
        'Rillmark modelling choice, not an ordinance rule.',
    );
  if (plan.smartControllerReductionPercent)
    out.push(
      `Smart controller: estimated use cut by ${plan.smartControllerReductionPercent} %, as entered — ` +
        'your assumption, not a published figure.',
    );
  out.push(
    schedule
      ? `Money: rate schedule "${schedule}".`
      : 'Money: the site has no rate schedule, so savings are not priced.',
  );
  if (!sameCurrency)
    out.push(`The cost of the work is in ${plan.currency}, the rates are not: no payback is worked out.`);
  return out;
}
