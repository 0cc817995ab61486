import type { MweloProjectType } from './mwelo-allowance';
import type { BudgetStep } from './water-budget';
import type { CycleSoakPlan } from './run-time-advice';
import type { BillingUnit } from '../rates/rate-schedule';
import type { CostLine } from '../rates/water-cost';
import type { DailyWeatherMethod } from '../weather/weather-station-dto';

/** The organisation's display preference; values always travel in their base units with their unit named. */
export const UNIT_SYSTEMS = ['us', 'metric'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export interface OrganisationSettingsDto {
  organisationId: number;
  organisationName: string;
  unitSystem: UnitSystem;
  /** The day/month order of the organisation's usual exports, used only for files whose dates fit both. */
  dateOrder: 'month-first' | 'day-first' | null;
}

/** `none`, `fixed-fraction` (25 % by default) or `threshold` (5 mm by default); see weather/effective-rain.ts. */
export const RAIN_CREDIT_KINDS = ['none', 'fixed-fraction', 'threshold'] as const;
export type RainCreditKind = (typeof RAIN_CREDIT_KINDS)[number];

export interface BudgetCostDto {
  scheduleId: number;
  scheduleName: string;
  unit: BillingUnit;
  currency: string;
  units: number;
  fixedCharge: number;
  volumeCharge: number;
  total: number;
  lines: CostLine[];
}

export interface BudgetZoneMonthDto {
  zoneId: number;
  zoneName: string;
  areaFt2: number;
  plantFactor: number;
  irrigationEfficiency: number;
  etoMm: number;
  rainMm: number;
  effectiveRainMm: number;
  grossGallons: number;
  rainCreditGallons: number;
  gallons: number;
  litres: number;
  /** The month worked by hand, each line with its numbers filled in. */
  steps: BudgetStep[];
}

export interface BudgetMonthDto {
  month: string;
  /** Days the budget covers: the month's days less those with no weather at all. */
  days: number;
  /** True when some days had no weather (no measurement, normal or estimate): the budget covers the others only. */
  partial: boolean;
  /** The days left out of a partial month. */
  missingDates: string[];
  /** Days whose weather was estimated (the station's own days around them, or the nearest station). */
  estimatedDays: number;
  /** The site's budget per covered day, following that day's ETo and effective rain; sums to `gallons`. */
  daily: { date: string; gallons: number; estimated: boolean }[];
  etoMm: number;
  rainMm: number;
  filledDays: number;
  methods: DailyWeatherMethod[];
  gallons: number;
  litres: number;
  zones: BudgetZoneMonthDto[];
  /** Indoor allotment for a mixed meter (occupants × gal per person per day × days); null when not asked for. */
  indoorGallons: number | null;
  /** Cost of the budget, indoor allotment included when given. */
  cost: BudgetCostDto | null;
}

export interface SiteBudgetDto {
  siteId: number;
  siteName: string;
  from: string;
  to: string;
  unitSystem: UnitSystem;
  station: { id: number; name: string };
  rainCredit: { kind: RainCreditKind; value: number | null; description: string };
  months: BudgetMonthDto[];
  totals: {
    gallons: number;
    litres: number;
    indoorGallons: number | null;
    etoMm: number;
    rainMm: number;
    filledDays: number;
    cost: number | null;
    currency: string | null;
  };
  indoor: { occupants: number; gallonsPerPersonPerDay: number } | null;
  formula: string;
  sources: string[];
}

export interface ComplianceDto {
  siteId: number;
  year: number;
  projectType: MweloProjectType;
  projectTypeSource: string;
  etoIn: number;
  rainIn: number;
  effectivePrecipitationIn: number;
  filledDays: number;
  landscapeAreaFt2: number;
  specialLandscapeAreaFt2: number;
  maxEtaf: number;
  mawaGallons: number;
  mawaFormula: string;
  etwuGallons: number;
  sitewideEtaf: number;
  regularAreaEtaf: number | null;
  zones: {
    zoneId: number;
    zoneName: string;
    areaFt2: number;
    etaf: number;
    gallons: number;
    specialLandscapeArea: boolean;
  }[];
  complies: boolean;
  reasons: string[];
  steps: BudgetStep[];
}

export interface RunTimeAdviceDto {
  zoneId: number;
  zoneName: string;
  month: string;
  daysPerWeek: number;
  isDrip: boolean;
  flowGpm: number;
  flowSource: string;
  prInPerHour: number;
  weeklyDepthIn: number;
  minutesPerWeek: number;
  minutesPerWateringDay: number;
  cycleSoak: CycleSoakPlan | null;
  cautions: string[];
  steps: BudgetStep[];
}
