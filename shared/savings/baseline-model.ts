/**
 * The baseline model behind weather-normalised savings (IPMVP Option C, whole-meter): use in each baseline period
 * regressed on that period's reference evapotranspiration and rain.
 */
import { fitStatistics, lagOneAutocorrelation, type FitStatistics } from './fit-statistics';
import { CollinearColumnsError, solveLeastSquares } from './least-squares';

/** One billing or metering period's weather: monthly bills, or single days for daily models. */
export interface WeatherPeriod {
  label: string;
  /** Length in days, for the per-day models and for judging how much of a year the data cover. */
  days: number;
  etoMm: number;
  rainMm: number;
}

export interface MeteredPeriod extends WeatherPeriod {
  useGal: number;
}

/**
 * - `eto`: use = a + b·ETo
 * - `eto-rain`: use = a + b·ETo + c·rain
 * - `*-per-day`: the same on daily averages (use/days against ETo/days and rain/days), so bills of 28 and 33 days
 *   compare fairly; fitted with weights = days because an average over more days is proportionally less noisy,
 *   which also makes the residuals of the period totals sum to zero.
 */
export type BaselineModelForm = 'eto' | 'eto-rain' | 'eto-per-day' | 'eto-rain-per-day';

export const BASELINE_MODEL_FORMS: readonly BaselineModelForm[] = [
  'eto',
  'eto-rain',
  'eto-per-day',
  'eto-rain-per-day',
];

export interface BaselineCoefficient {
  term: 'base use' | 'ETo' | 'rain';
  /** gal per period (or per day for per-day forms) for base use; gal per mm for ETo and rain. */
  value: number;
  standardError: number;
  unit: string;
}

export interface BaselineModel {
  form: BaselineModelForm;
  coefficients: BaselineCoefficient[];
  /** In baseline-period order. */
  periods: { label: string; days: number; actualGal: number; fittedGal: number; residualGal: number }[];
  /** R², CV(RMSE), NMBE on the period totals, the figures a savings claim stands on. */
  statistics: FitStatistics;
  baselineDays: number;
  residualLagOneAutocorrelation: number | null;
  /** Weather range seen in the baseline, to warn when the reporting period lies outside it. */
  etoPerDayRange: [number, number];
  /** Inputs for prediction uncertainty: (XᵀWX)⁻¹ and σ̂² in model units. */
  unscaledCovariance: number[][];
  residualVariance: number;
}

const usesRain = (form: BaselineModelForm): boolean => form === 'eto-rain' || form === 'eto-rain-per-day';
const isPerDay = (form: BaselineModelForm): boolean => form.endsWith('-per-day');

/** The regression row for a period, in model units (per day for per-day forms). */
export function designRow(form: BaselineModelForm, period: WeatherPeriod): number[] {
  const scale = isPerDay(form) ? period.days : 1;
  const row = [1, period.etoMm / scale];
  if (usesRain(form)) row.push(period.rainMm / scale);
  return row;
}

/** Converts model units to a period total (days for per-day forms) and the period's regression weight. */
export function periodScale(form: BaselineModelForm, period: WeatherPeriod): number {
  return isPerDay(form) ? period.days : 1;
}

export function checkWeatherPeriod(period: WeatherPeriod): void {
  if (!(period.days > 0)) throw new RangeError(`Period "${period.label}": days must be positive`);
  if (!(period.etoMm >= 0) || !(period.rainMm >= 0))
    throw new RangeError(`Period "${period.label}": ETo and rain must be zero or more`);
}

export function fitBaselineModel(baseline: readonly MeteredPeriod[], form: BaselineModelForm): BaselineModel {
  baseline.forEach((period) => {
    checkWeatherPeriod(period);
    if (!(period.useGal >= 0)) throw new RangeError(`Period "${period.label}": use must be zero or more`);
  });
  const scales = baseline.map((period) => periodScale(form, period));
  const design = baseline.map((period) => designRow(form, period));
  const y = baseline.map((period, i) => period.useGal / scales[i]!);
  let solution;
  try {
    solution = solveLeastSquares(design, y, isPerDay(form) ? scales : undefined);
  } catch (error) {
    if (error instanceof CollinearColumnsError) {
      const term = ['base use', 'ETo', 'rain'][error.columnIndex];
      throw new RangeError(
        `The baseline cannot separate the effect of ${term}: it is constant ` +
          'or tracks the other terms in every baseline period' +
          (term === 'rain' ? ' (no rain in the baseline?); use a model without rain' : ''),
      );
    }
    throw error;
  }
  const { coefficients, standardErrors } = solution;
  const rows = baseline.map((period, i) => {
    const fittedGal = scales[i]! * design[i]!.reduce((sum, x, j) => sum + x * coefficients[j]!, 0);
    return {
      label: period.label,
      days: period.days,
      actualGal: period.useGal,
      fittedGal,
      residualGal: period.useGal - fittedGal,
    };
  });
  const baseUnit = isPerDay(form) ? 'gal/day' : 'gal/period';
  const terms: BaselineCoefficient[] = [
    { term: 'base use', value: coefficients[0]!, standardError: standardErrors[0]!, unit: baseUnit },
    { term: 'ETo', value: coefficients[1]!, standardError: standardErrors[1]!, unit: 'gal/mm' },
  ];
  if (usesRain(form))
    terms.push({ term: 'rain', value: coefficients[2]!, standardError: standardErrors[2]!, unit: 'gal/mm' });
  const etoPerDay = baseline.map((period) => period.etoMm / period.days);
  return {
    form,
    coefficients: terms,
    periods: rows,
    statistics: fitStatistics(
      rows.map((r) => r.actualGal),
      rows.map((r) => r.fittedGal),
      coefficients.length,
    ),
    baselineDays: baseline.reduce((sum, period) => sum + period.days, 0),
    residualLagOneAutocorrelation: lagOneAutocorrelation(rows.map((r) => r.residualGal)),
    etoPerDayRange: [Math.min(...etoPerDay), Math.max(...etoPerDay)],
    unscaledCovariance: solution.unscaledCovariance,
    residualVariance: solution.residualVariance,
  };
}

export interface BaselinePrediction {
  /** Predicted baseline use per reporting period, gal. */
  perPeriodGal: number[];
  totalGal: number;
  /**
   * Variance of (baseline total the site would really have used − predicted total): the coefficients' uncertainty,
   * gᵀ·σ̂²(XᵀWX)⁻¹·g with g the summed design rows, plus each period's own scatter σ̂²·scale²/weight. Assumes
   * independent residuals.
   */
  totalVarianceGal2: number;
}

export function predictBaseline(model: BaselineModel, reporting: readonly WeatherPeriod[]): BaselinePrediction {
  reporting.forEach(checkWeatherPeriod);
  const beta = model.coefficients.map((c) => c.value);
  const p = beta.length;
  const g = new Array<number>(p).fill(0);
  let scatter = 0;
  const perPeriodGal = reporting.map((period) => {
    const scale = periodScale(model.form, period);
    const row = designRow(model.form, period);
    row.forEach((x, j) => (g[j] = g[j]! + scale * x));
    // Per-day forms weight by days (weight = scale), so a period's total scatters with variance σ̂²·days.
    scatter += isPerDay(model.form) ? scale : 1;
    return scale * row.reduce((sum, x, j) => sum + x * beta[j]!, 0);
  });
  let quadratic = 0;
  for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) quadratic += g[i]! * model.unscaledCovariance[i]![j]! * g[j]!;
  return {
    perPeriodGal,
    totalGal: perPeriodGal.reduce((sum, v) => sum + v, 0),
    totalVarianceGal2: model.residualVariance * (quadratic + scatter),
  };
}
