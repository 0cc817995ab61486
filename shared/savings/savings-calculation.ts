/**
 * Weather-normalised savings (IPMVP Option C, avoided use): what the baseline model predicts the site would have
 * used under the reporting period's weather, minus what it did use.
 */
import { predictBaseline, type BaselineModel, type MeteredPeriod, type WeatherPeriod } from './baseline-model';
import { roundToCents } from '../rates/water-cost';
import { twoSidedT } from './student-t';

/** Money for a volume in one period, e.g. `(gal, p) => costOfVolume(schedule, gal).total` from shared/rates. */
export type PeriodPrice = (volumeGal: number, period: WeatherPeriod) => number;

/** Guideline 14 states savings uncertainty at 68 % confidence (docs/references.md §6, from memory). */
export const DEFAULT_SAVINGS_CONFIDENCE = 0.68;

export interface SavingsPeriod {
  label: string;
  days: number;
  predictedGal: number;
  actualGal: number;
  /** predicted − actual; positive means water saved. */
  savedGal: number;
  /** Money at the predicted use minus money at the actual use; null without a price. */
  savedMoney: number | null;
}

export interface SavingsUncertainty {
  confidence: number;
  degreesOfFreedom: number;
  t: number;
  standardErrorGal: number;
  /** Half-width of the interval: savings ± this at `confidence`. */
  plusMinusGal: number;
  /** plusMinus / |savings|: Guideline 14's fractional savings uncertainty; null when savings are zero. */
  fractional: number | null;
}

export interface SavingsResult {
  periods: SavingsPeriod[];
  reportingDays: number;
  predictedGal: number;
  actualGal: number;
  savedGal: number;
  /** savings / predicted baseline use × 100; null when the model predicts no use. */
  savedPercent: number | null;
  savedMoney: number | null;
  uncertainty: SavingsUncertainty;
  warnings: string[];
}

export function calculateSavings(
  model: BaselineModel,
  reporting: readonly MeteredPeriod[],
  options: { price?: PeriodPrice; confidence?: number } = {},
): SavingsResult {
  if (reporting.length === 0) throw new RangeError('The reporting period has no metered periods');
  reporting.forEach((period) => {
    if (!(period.useGal >= 0)) throw new RangeError(`Period "${period.label}": use must be zero or more`);
  });
  const prediction = predictBaseline(model, reporting);
  const warnings: string[] = [];
  const { price } = options;

  const periods = reporting.map((period, i): SavingsPeriod => {
    const predictedGal = prediction.perPeriodGal[i]!;
    // A line fitted to summer months can go below zero in a wet winter; nobody pays for negative water.
    const billablePredicted = Math.max(0, predictedGal);
    return {
      label: period.label,
      days: period.days,
      predictedGal,
      actualGal: period.useGal,
      savedGal: predictedGal - period.useGal,
      savedMoney: price ? roundToCents(price(billablePredicted, period) - price(period.useGal, period)) : null,
    };
  });
  const negative = periods.filter((p) => p.predictedGal < 0).map((p) => p.label);
  if (negative.length > 0) {
    warnings.push(
      `The baseline model predicts negative use for ${negative.join(', ')}; ` +
        'its weather lies outside what the baseline saw.',
    );
  }
  const [low, high] = model.etoPerDayRange;
  // 5 % slack so a reporting month just past the baseline's extremes is not flagged.
  const outside = reporting
    .filter((p) => p.etoMm / p.days < low * 0.95 || p.etoMm / p.days > high * 1.05)
    .map((p) => p.label);
  if (outside.length > 0) {
    warnings.push(
      `ETo in ${outside.join(', ')} is outside the baseline's range, so those predictions are extrapolations.`,
    );
  }

  const predictedGal = prediction.totalGal;
  const actualGal = reporting.reduce((sum, p) => sum + p.useGal, 0);
  const savedGal = predictedGal - actualGal;
  const confidence = options.confidence ?? DEFAULT_SAVINGS_CONFIDENCE;
  const degreesOfFreedom = model.statistics.n - model.statistics.p;
  const t = twoSidedT(confidence, degreesOfFreedom);
  const standardErrorGal = Math.sqrt(prediction.totalVarianceGal2);
  const plusMinusGal = t * standardErrorGal;
  return {
    periods,
    reportingDays: reporting.reduce((sum, p) => sum + p.days, 0),
    predictedGal,
    actualGal,
    savedGal,
    savedPercent: predictedGal > 0 ? (100 * savedGal) / predictedGal : null,
    savedMoney: price ? roundToCents(periods.reduce((sum, p) => sum + p.savedMoney!, 0)) : null,
    uncertainty: {
      confidence,
      degreesOfFreedom,
      t,
      standardErrorGal,
      plusMinusGal,
      fractional: savedGal !== 0 ? plusMinusGal / Math.abs(savedGal) : null,
    },
    warnings,
  };
}
