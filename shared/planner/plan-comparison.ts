import { estimatedTotalWaterUse, maximumAppliedWaterAllowance } from '../budgets/mwelo-allowance';
import type { RateSchedule } from '../rates/rate-schedule';
import { costOfVolume, roundToCents } from '../rates/water-cost';
import { MWELO_EFFECTIVE_RAIN_FRACTION } from '../weather/effective-rain';
import type { PlanScenarioDto, PlanZoneRowDto, PlanZoneState, ZoneChange } from './plan-dto';
import { applyZoneChanges, type PlanZone } from './plan-zones';

const MM_PER_INCH = 25.4;

export interface PlanWeatherMonth {
  month: string;
  etoMm: number;
  rainMm: number;
}

export interface ComparePlanInput {
  zones: readonly PlanZone[];
  changes: readonly ZoneChange[];
  /** The weather year, month by month. */
  months: readonly PlanWeatherMonth[];
  /** The ETAF the site's ordinance allows for regular areas (MAWA). */
  allowedEtaf: number;
  smartControllerReductionPercent: number | null;
  rainSensor: boolean;
  schedule: RateSchedule | null;
  costOfWork: number;
}

export interface PlanComparison {
  before: PlanScenarioDto;
  after: PlanScenarioDto;
  zones: PlanZoneRowDto[];
  savedGal: number;
  savedPercent: number | null;
  savedMoney: number | null;
  paybackYears: number | null;
}

interface ScenarioOptions {
  rainSensor: boolean;
  controllerCut: number;
}

/**
 * The site as it is and as the plan would leave it, a year apart in nothing but the plan: both use the same
 * weather year, the ordinance's 0.62 and the same rate schedule, so the difference is the plan's alone.
 */
export function comparePlan(input: ComparePlanInput): PlanComparison {
  if (!(input.costOfWork >= 0)) throw new RangeError(`Cost of work must be zero or more (got ${input.costOfWork})`);
  const cut = (input.smartControllerReductionPercent ?? 0) / 100;
  if (!(cut >= 0 && cut < 1)) throw new RangeError('Smart-controller reduction must be 0–99 %');
  const changed = applyZoneChanges(input.zones, input.changes);
  const before = scenario(
    changed.map((c) => c.before),
    input,
    { rainSensor: false, controllerCut: 0 },
  );
  const after = scenario(
    changed.map((c) => c.after),
    input,
    { rainSensor: input.rainSensor, controllerCut: cut },
  );
  const savedGal = before.dto.estimatedUseGal - after.dto.estimatedUseGal;
  const savedMoney =
    before.dto.annualCost !== null && after.dto.annualCost !== null
      ? roundToCents(before.dto.annualCost - after.dto.annualCost)
      : null;
  return {
    before: before.dto,
    after: after.dto,
    zones: changed.map((c, i) => ({
      hydrozoneId: c.before.id,
      name: c.before.name,
      before: before.zoneStates[i]!,
      after: after.zoneStates[i]!,
      changes: c.changes,
    })),
    savedGal,
    savedPercent: before.dto.estimatedUseGal > 0 ? (100 * savedGal) / before.dto.estimatedUseGal : null,
    savedMoney,
    paybackYears: savedMoney !== null && savedMoney > 0 ? input.costOfWork / savedMoney : null,
  };
}

function scenario(
  zones: PlanZone[],
  input: ComparePlanInput,
  options: ScenarioOptions,
): { dto: PlanScenarioDto; zoneStates: PlanZoneState[] } {
  const etoIn = input.months.reduce((s, m) => s + m.etoMm, 0) / MM_PER_INCH;
  const rainIn = input.months.reduce((s, m) => s + m.rainMm, 0) / MM_PER_INCH;
  const epptIn = options.rainSensor ? MWELO_EFFECTIVE_RAIN_FRACTION * rainIn : 0;
  const watered = zones.filter((z) => z.areaFt2 > 0);
  const la = watered.reduce((s, z) => s + z.areaFt2, 0);
  const sla = watered.filter((z) => z.specialLandscapeArea).reduce((s, z) => s + z.areaFt2, 0);
  const etwu = estimatedTotalWaterUse(
    Math.max(0, etoIn - epptIn),
    watered.map((z) => ({
      areaFt2: z.areaFt2,
      plantFactor: z.plantFactor,
      irrigationEfficiency: z.efficiency,
      specialLandscapeArea: z.specialLandscapeArea,
    })),
  );
  const mawa =
    la > 0
      ? maximumAppliedWaterAllowance({
          etoInPerYear: etoIn,
          landscapeAreaFt2: la,
          specialLandscapeAreaFt2: sla,
          etaf: input.allowedEtaf,
        }).gallons
      : 0;
  const estimatedUseGal = etwu.gallons * (1 - options.controllerCut);
  const zoneStates = zones.map((z): PlanZoneState => {
    const i = watered.indexOf(z);
    return {
      areaFt2: z.areaFt2,
      plantFactor: z.plantFactor,
      irrigationMethod: z.irrigationMethod,
      efficiency: z.efficiency,
      specialLandscapeArea: z.specialLandscapeArea,
      etaf: z.specialLandscapeArea ? 1 : z.plantFactor / z.efficiency,
      etwuGal: i >= 0 ? etwu.zones[i]!.gallons : 0,
    };
  });
  return {
    dto: {
      landscapeAreaFt2: la,
      specialLandscapeAreaFt2: sla,
      mawaGal: mawa,
      etwuGal: etwu.gallons,
      estimatedUseGal,
      sitewideEtaf: etwu.sitewideEtaf,
      regularAreaEtaf: etwu.regularAreaEtaf,
      annualCost: input.schedule ? annualCost(input, options, estimatedUseGal, mawa) : null,
    },
    zoneStates,
  };
}

/**
 * Prices a year's use month by month (tiers are per billing month): use is spread over the months by each month's
 * share of the water demand (ETo, less a quarter of the rain with a rain sensor), the allowance by ETo.
 */
function annualCost(input: ComparePlanInput, options: ScenarioOptions, useGal: number, mawaGal: number): number {
  const demand = input.months.map((m) =>
    Math.max(0, m.etoMm - (options.rainSensor ? MWELO_EFFECTIVE_RAIN_FRACTION * m.rainMm : 0)),
  );
  const demandTotal = demand.reduce((s, d) => s + d, 0);
  const etoTotal = input.months.reduce((s, m) => s + m.etoMm, 0);
  let total = 0;
  input.months.forEach((m, i) => {
    const use = demandTotal > 0 ? (useGal * demand[i]!) / demandTotal : 0;
    const budget = etoTotal > 0 ? (mawaGal * m.etoMm) / etoTotal : 0;
    total += costOfVolume(input.schedule!, use, budget).total;
  });
  return roundToCents(total);
}
