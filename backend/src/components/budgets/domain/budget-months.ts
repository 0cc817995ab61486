import type { BudgetMonthDto, BudgetZoneMonthDto, RainCreditKind } from '@shared/budgets/budget-dto';
import { effectiveIrrigationEfficiency, effectivePlantFactor, type Hydrozone } from '@shared/budgets/hydrozone';
import { siteBudgetForPeriod, type BudgetStep } from '@shared/budgets/water-budget';
import {
  describeEffectiveRainMethod,
  MWELO_EFFECTIVE_RAIN_FRACTION,
  type EffectiveRainMethod,
} from '@shared/weather/effective-rain';
import type { DailyWeatherMethod } from '@shared/weather/weather-station-dto';

/**
 * Splits a site's gap-filled weather into calendar months and runs the shared engine on each, adding the
 * month's "how computed" lines with the actual numbers so a reader can redo the sum by hand.
 */

export interface BudgetDay {
  date: string;
  etoMm: number;
  rainMm: number;
  filled: boolean;
  estimated?: boolean;
  method: DailyWeatherMethod;
}

const fmt = (value: number, digits: number) =>
  value.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });

export function rainMethodOf(kind: RainCreditKind, value: number | undefined): EffectiveRainMethod {
  switch (kind) {
    case 'none':
      return { kind: 'none' };
    case 'fixed-fraction':
      return { kind: 'fixed-fraction', fraction: value ?? MWELO_EFFECTIVE_RAIN_FRACTION };
    case 'threshold':
      // 5 mm: a light shower that wets leaves and evaporates: common practice, no source.
      return { kind: 'threshold', minimumMm: value ?? 5 };
  }
}

/** One entry per month from `fromMonth` to `toMonth`; a month with days missing covers the others and says so. */
export function budgetMonths(
  zones: Hydrozone[],
  weather: { days: BudgetDay[]; missingDates: string[]; fromMonth: string; toMonth: string },
  rain: EffectiveRainMethod,
): Omit<BudgetMonthDto, 'cost' | 'indoorGallons'>[] {
  const byMonth = new Map<string, BudgetDay[]>();
  for (let m = weather.fromMonth; m <= weather.toMonth; m = nextMonth(m)) byMonth.set(m, []);
  for (const day of weather.days) byMonth.get(day.date.slice(0, 7))?.push(day);
  return [...byMonth.entries()].map(([month, monthDays]) => {
    const missingDates = weather.missingDates.filter((d) => d.startsWith(month));
    if (monthDays.length === 0) return emptyMonth(month, missingDates);
    return { ...coveredMonth(zones, month, monthDays, rain), partial: missingDates.length > 0, missingDates };
  });
}

function nextMonth(month: string): string {
  const [y, m] = month.split('-').map(Number) as [number, number];
  return new Date(Date.UTC(y, m, 1)).toISOString().slice(0, 7);
}

function emptyMonth(month: string, missingDates: string[]): Omit<BudgetMonthDto, 'cost' | 'indoorGallons'> {
  return {
    month,
    days: 0,
    partial: true,
    missingDates,
    estimatedDays: 0,
    daily: [],
    etoMm: 0,
    rainMm: 0,
    filledDays: 0,
    methods: [],
    gallons: 0,
    litres: 0,
    zones: [],
  };
}

function coveredMonth(
  zones: Hydrozone[],
  month: string,
  monthDays: BudgetDay[],
  rain: EffectiveRainMethod,
): Omit<BudgetMonthDto, 'cost' | 'indoorGallons' | 'partial' | 'missingDates'> {
  const site = siteBudgetForPeriod(zones, monthDays, rain);
  const etoMm = monthDays.reduce((s, d) => s + d.etoMm, 0);
  const rainMm = monthDays.reduce((s, d) => s + d.rainMm, 0);
  const zoneRows: BudgetZoneMonthDto[] = site.zones.map((z, i) => {
    const zone = zones[i]!;
    const pf = effectivePlantFactor(zone);
    const ie = effectiveIrrigationEfficiency(zone);
    return {
      zoneId: Number(zone.id),
      zoneName: zone.name,
      areaFt2: zone.areaFt2,
      plantFactor: pf,
      irrigationEfficiency: ie.efficiency,
      etoMm: z.etoMm,
      rainMm: z.rainMm,
      effectiveRainMm: z.effectiveRainMm,
      grossGallons: z.grossGallons,
      rainCreditGallons: z.rainCreditGallons,
      gallons: z.gallons,
      litres: z.litres,
      steps: monthSteps(zone, pf, ie, z, rain, monthDays.length),
    };
  });
  const methods = [...new Set(monthDays.map((d) => (d.filled ? 'normal-filled' : d.method)))] as DailyWeatherMethod[];
  const estimated = new Set(monthDays.filter((d) => d.estimated).map((d) => d.date));
  const perDay = new Map<string, number>();
  for (const z of site.zones) for (const d of z.daily) perDay.set(d.date, (perDay.get(d.date) ?? 0) + d.gallons);
  return {
    month,
    days: monthDays.length,
    estimatedDays: estimated.size,
    daily: [...perDay].map(([date, gallons]) => ({ date, gallons, estimated: estimated.has(date) })),
    etoMm,
    rainMm,
    filledDays: monthDays.filter((d) => d.filled).length,
    methods,
    gallons: site.gallons,
    litres: site.litres,
    zones: zoneRows,
  };
}

function monthSteps(
  zone: Hydrozone,
  pf: number,
  ie: { efficiency: number; source: string },
  z: {
    etoMm: number;
    effectiveRainMm: number;
    grossGallons: number;
    rainCreditGallons: number;
    gallons: number;
    litres: number;
    filledDays: number;
  },
  rain: EffectiveRainMethod,
  dayCount: number,
): BudgetStep[] {
  const etoIn = z.etoMm / 25.4;
  const peffIn = z.effectiveRainMm / 25.4;
  const floored = z.gallons > z.grossGallons - z.rainCreditGallons + 1e-6;
  return [
    {
      label: 'Reference ET for the month',
      formula:
        `Σ of ${dayCount} daily values = ${fmt(z.etoMm, 1)} mm ÷ 25.4` +
        (z.filledDays ? ` (${z.filledDays} day(s) from monthly normals)` : ''),
      value: etoIn,
      unit: 'in',
    },
    {
      label: 'Plant factor (PF)',
      formula:
        zone.plantFactor === undefined
          ? `default for "${zone.plantWaterUse}" plants (midpoint of the MWELO range)`
          : 'entered for this hydrozone',
      value: pf,
      unit: '',
    },
    { label: 'Irrigation efficiency (IE)', formula: ie.source, value: ie.efficiency, unit: '' },
    { label: 'Area', formula: 'entered for this hydrozone', value: zone.areaFt2, unit: 'ft²' },
    {
      label: 'Gross irrigation',
      formula:
        `${fmt(etoIn, 3)} in × ${fmt(pf, 2)} × ${fmt(zone.areaFt2, 0)} ` +
        `ft² × 0.623377 gal/(in·ft²) ÷ ${fmt(ie.efficiency, 2)}`,
      value: z.grossGallons,
      unit: 'gal',
    },
    { label: 'Effective rain', formula: describeEffectiveRainMethod(rain), value: peffIn, unit: 'in' },
    {
      label: 'Rain credit',
      formula: `${fmt(peffIn, 3)} in × ${fmt(zone.areaFt2, 0)} ft² × 0.623377 ÷ ${fmt(ie.efficiency, 2)}`,
      value: z.rainCreditGallons,
      unit: 'gal',
    },
    {
      label: 'Budget',
      formula: floored
        ? 'gross irrigation − rain credit, worked day by day; days when ' +
          'rain covered the whole need count as 0, so the total is a little ' +
          'above the difference of the monthly sums'
        : `${fmt(z.grossGallons, 0)} gal − ${fmt(z.rainCreditGallons, 0)} gal`,
      value: z.gallons,
      unit: 'gal',
    },
    {
      label: 'Budget (metric)',
      formula: 'max(0, ETo (mm) × PF − effective rain (mm)) × area (m²) ÷ IE, day by day; 1 mm over 1 m² = 1 L',
      value: z.litres,
      unit: 'L',
    },
  ];
}
