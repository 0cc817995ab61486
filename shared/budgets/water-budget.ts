import {
  GALLONS_PER_INCH_SQUARE_FOOT,
  MILLIMETRES_PER_INCH,
  SQUARE_METRES_PER_SQUARE_FOOT,
} from '../units/area-depth-units';
import { describeEffectiveRainMethod, effectiveRainMm, type EffectiveRainMethod } from '../weather/effective-rain';
import { assertValidHydrozone, effectiveIrrigationEfficiency, effectivePlantFactor, type Hydrozone } from './hydrozone';

/**
 * Irrigation budgets from daily weather:
 *   gross (gal)       = ETo(in) × PF × area(ft²) × 0.623377 ÷ IE
 *   rain credit (gal) = effective rain(in) × area(ft²) × 0.623377 ÷ IE
 *   budget (gal)      = max(0, gross − rain credit)
 * The credit is divided by IE too: rain that meets part of the plants' need saves the gross water irrigation
 * would have applied to deliver it, so the result equals max(0, ETo·PF − Peff) ÷ IE over the area.
 * 0.623377 = 144/231 gal per inch per ft², exact (the budget uses it; MWELO compliance uses 0.62).
 */

/** One day of weather as the budget needs it (see weather/weather-gap-filling.ts for filling gaps). */
export interface BudgetWeatherDay {
  date: string;
  etoMm: number;
  rainMm: number;
  /** True when the values came from long-term normals. */
  filled?: boolean;
}

/** One line of the "how computed" view. */
export interface BudgetStep {
  label: string;
  formula: string;
  value: number;
  unit: string;
}

export interface ZoneDailyBudget {
  zoneId: string;
  date: string;
  filled: boolean;
  etoMm: number;
  rainMm: number;
  effectiveRainMm: number;
  plantFactor: number;
  irrigationEfficiency: number;
  grossGallons: number;
  rainCreditGallons: number;
  gallons: number;
  /** The same budget worked in metric: mm × m² = L. */
  litres: number;
  steps: BudgetStep[];
}

function checkDay(day: BudgetWeatherDay): void {
  if (!(day.etoMm >= 0)) throw new RangeError(`ETo on ${day.date} must be zero or more (got ${day.etoMm} mm)`);
  if (!(day.rainMm >= 0)) throw new RangeError(`Rain on ${day.date} must be zero or more (got ${day.rainMm} mm)`);
}

/** A hydrozone's irrigation budget for one day, with every step for the "how computed" view. */
export function zoneBudgetForDay(
  zone: Hydrozone,
  day: BudgetWeatherDay,
  rainMethod: EffectiveRainMethod,
): ZoneDailyBudget {
  assertValidHydrozone(zone);
  checkDay(day);
  const pf = effectivePlantFactor(zone);
  const ie = effectiveIrrigationEfficiency(zone);
  const k = GALLONS_PER_INCH_SQUARE_FOOT;
  const etoIn = day.etoMm / MILLIMETRES_PER_INCH;
  const demandMm = day.etoMm * pf;
  const peffMm = effectiveRainMm(rainMethod, day.rainMm, demandMm);
  const peffIn = peffMm / MILLIMETRES_PER_INCH;
  const grossGallons = (etoIn * pf * zone.areaFt2 * k) / ie.efficiency;
  const rainCreditGallons = (peffIn * zone.areaFt2 * k) / ie.efficiency;
  const gallons = Math.max(0, grossGallons - rainCreditGallons);
  const areaM2 = zone.areaFt2 * SQUARE_METRES_PER_SQUARE_FOOT;
  const litres = (Math.max(0, demandMm - peffMm) * areaM2) / ie.efficiency;
  const steps: BudgetStep[] = [
    { label: 'Reference ET', formula: 'ETo (in) = ETo (mm) ÷ 25.4', value: etoIn, unit: 'in' },
    {
      label: 'Plant factor',
      formula: zone.plantFactor === undefined ? `default for "${zone.plantWaterUse}" plants` : 'entered',
      value: pf,
      unit: '',
    },
    { label: 'Irrigation efficiency', formula: ie.source, value: ie.efficiency, unit: '' },
    { label: 'Area', formula: 'entered', value: zone.areaFt2, unit: 'ft²' },
    {
      label: 'Gross irrigation',
      formula: 'ETo (in) × PF × area (ft²) × 0.623377 ÷ IE',
      value: grossGallons,
      unit: 'gal',
    },
    { label: 'Effective rain', formula: describeEffectiveRainMethod(rainMethod), value: peffIn, unit: 'in' },
    {
      label: 'Rain credit',
      formula: 'effective rain (in) × area (ft²) × 0.623377 ÷ IE',
      value: rainCreditGallons,
      unit: 'gal',
    },
    { label: 'Budget', formula: 'max(0, gross irrigation − rain credit)', value: gallons, unit: 'gal' },
    {
      label: 'Budget (metric)',
      formula: 'max(0, ETo (mm) × PF − effective rain (mm)) × area (m²) ÷ IE; 1 mm over 1 m² = 1 L',
      value: litres,
      unit: 'L',
    },
  ];
  return {
    zoneId: zone.id,
    date: day.date,
    filled: day.filled ?? false,
    etoMm: day.etoMm,
    rainMm: day.rainMm,
    effectiveRainMm: peffMm,
    plantFactor: pf,
    irrigationEfficiency: ie.efficiency,
    grossGallons,
    rainCreditGallons,
    gallons,
    litres,
    steps,
  };
}

export interface ZonePeriodBudget {
  zoneId: string;
  zoneName: string;
  startDate: string;
  endDate: string;
  etoMm: number;
  rainMm: number;
  effectiveRainMm: number;
  grossGallons: number;
  rainCreditGallons: number;
  gallons: number;
  litres: number;
  /** Days whose weather came from normals rather than the station. */
  filledDays: number;
  daily: { date: string; gallons: number; filled: boolean }[];
  /** Month ("YYYY-MM") → zone gallons, in date order. */
  byMonth: { month: string; gallons: number }[];
  formula: string;
}

function sumByMonth(daily: readonly { date: string; gallons: number }[]): { month: string; gallons: number }[] {
  const monthly = new Map<string, number>();
  for (const d of daily) monthly.set(d.date.slice(0, 7), (monthly.get(d.date.slice(0, 7)) ?? 0) + d.gallons);
  return [...monthly.entries()].sort(([a], [b]) => a.localeCompare(b)).map(([month, gallons]) => ({ month, gallons }));
}

/** Sum of the daily budgets over `days` (the daily floor at zero is why it is not one formula on the totals). */
export function zoneBudgetForPeriod(
  zone: Hydrozone,
  days: readonly BudgetWeatherDay[],
  rainMethod: EffectiveRainMethod,
): ZonePeriodBudget {
  if (days.length === 0) throw new RangeError('A budget period needs at least one day of weather');
  const seen = new Set<string>();
  const totals = {
    etoMm: 0,
    rainMm: 0,
    effectiveRainMm: 0,
    grossGallons: 0,
    rainCreditGallons: 0,
    gallons: 0,
    litres: 0,
    filledDays: 0,
  };
  const daily: ZonePeriodBudget['daily'] = [];
  for (const day of days) {
    if (seen.has(day.date)) throw new RangeError(`Weather for ${day.date} appears more than once`);
    seen.add(day.date);
    const b = zoneBudgetForDay(zone, day, rainMethod);
    totals.etoMm += b.etoMm;
    totals.rainMm += b.rainMm;
    totals.effectiveRainMm += b.effectiveRainMm;
    totals.grossGallons += b.grossGallons;
    totals.rainCreditGallons += b.rainCreditGallons;
    totals.gallons += b.gallons;
    totals.litres += b.litres;
    if (b.filled) totals.filledDays += 1;
    daily.push({ date: b.date, gallons: b.gallons, filled: b.filled });
  }
  const dates = [...seen].sort();
  return {
    zoneId: zone.id,
    zoneName: zone.name,
    startDate: dates[0]!,
    endDate: dates[dates.length - 1]!,
    ...totals,
    daily,
    byMonth: sumByMonth(daily),
    formula: 'Σ over days of max(0, ETo (in) × PF × area (ft²) × 0.623377 ÷ IE − rain credit)',
  };
}

export interface SitePeriodBudget {
  zones: ZonePeriodBudget[];
  gallons: number;
  litres: number;
  /** Month ("YYYY-MM") → site gallons, in date order. */
  byMonth: { month: string; gallons: number }[];
  rainMethod: string;
}

/** Budget for every hydrozone of a site over the same days, with site totals and monthly sums. */
export function siteBudgetForPeriod(
  zones: readonly Hydrozone[],
  days: readonly BudgetWeatherDay[],
  rainMethod: EffectiveRainMethod,
): SitePeriodBudget {
  if (zones.length === 0) throw new RangeError('A site budget needs at least one hydrozone');
  const ids = new Set<string>();
  for (const zone of zones) {
    if (ids.has(zone.id)) throw new RangeError(`Hydrozone id "${zone.id}" appears more than once`);
    ids.add(zone.id);
  }
  const zoneBudgets = zones.map((zone) => zoneBudgetForPeriod(zone, days, rainMethod));
  return {
    zones: zoneBudgets,
    gallons: zoneBudgets.reduce((sum, z) => sum + z.gallons, 0),
    litres: zoneBudgets.reduce((sum, z) => sum + z.litres, 0),
    byMonth: sumByMonth(zoneBudgets.flatMap((z) => z.daily)),
    rainMethod: describeEffectiveRainMethod(rainMethod),
  };
}
