/**
 * Whether a savings figure can be claimed under ASHRAE Guideline 14 and IPMVP, with reasons a contractor or an
 * auditor can read. Every threshold here is from memory (docs/references.md §6): the Guideline's text was not at hand.
 */
import type { BaselineModel } from './baseline-model';
import type { SavingsResult } from './savings-calculation';
import { twoSidedT } from './student-t';

const DAYS_PER_MONTH = 365.25 / 12;

/** G14-2002 §5.2.11, whole-building regression, energy (use) column — from memory (docs/references.md §6). */
export const CV_RMSE_LIMITS: readonly { reportingMonthsAtMost: number; maxPercent: number; describe: string }[] = [
  { reportingMonthsAtMost: 11, maxPercent: 20, describe: 'with less than 12 months of reporting data' },
  { reportingMonthsAtMost: 60, maxPercent: 25, describe: 'with 12 to 60 months of reporting data' },
  {
    reportingMonthsAtMost: Number.POSITIVE_INFINITY,
    maxPercent: 30,
    describe: 'with more than 60 months of reporting data',
  },
];
/** Net determination bias limit, G14-2002 §5.2.11 — from memory. */
export const MAX_ABS_NMBE_PERCENT = 0.005;
/** Expected savings must exceed this share of use on the prescriptive path, G14-2002 §5.2.11 — from memory. */
export const MIN_SAVINGS_PERCENT = 10;
/** Otherwise the fractional savings uncertainty must be below this at 68 % confidence, G14-2002 — from memory. */
export const MAX_FRACTIONAL_UNCERTAINTY = 0.5;
export const UNCERTAINTY_CONFIDENCE = 0.68;
/** IPMVP: the baseline should span a full operating cycle, about 12 months — from memory. Slack for bill dates. */
export const MIN_BASELINE_DAYS = 350;
/** Our own cut-off: above it the independent-residuals uncertainty is likely too small. */
export const MAX_COMFORTABLE_AUTOCORRELATION = 0.5;

export type GuidelineCheckId = 'cv-rmse' | 'nmbe' | 'savings-share' | 'savings-uncertainty';

export interface GuidelineCheck {
  id: GuidelineCheckId;
  label: string;
  value: number | null;
  limit: string;
  passed: boolean;
  source: string;
  fromMemory: boolean;
}

export interface SavingsVerdict {
  /** CV(RMSE) and NMBE both within Guideline 14's limits. */
  baselineModelAcceptable: boolean;
  canClaimSavings: boolean;
  /** Which Guideline 14 route the claim stands on, if any. */
  route: 'prescriptive' | 'uncertainty' | null;
  checks: GuidelineCheck[];
  /** Plain-language reasons the savings cannot be claimed; empty when they can. */
  reasons: string[];
  warnings: string[];
  summary: string;
}

// `+ 0` turns −0 into 0, so a bias of −1e-15 prints as 0.0000 %, not −0.0000 %.
const pct = (value: number, digits = 1): string => `${(Number(value.toFixed(digits)) + 0).toFixed(digits)} %`;

export function cvRmseLimitFor(reportingDays: number): (typeof CV_RMSE_LIMITS)[number] {
  // Nearest whole month: twelve monthly bills total 360–366 days and should count as 12 months.
  const months = Math.round(reportingDays / DAYS_PER_MONTH);
  return CV_RMSE_LIMITS.find((limit) => months <= limit.reportingMonthsAtMost)!;
}

export function judgeSavings(model: BaselineModel, savings: SavingsResult): SavingsVerdict {
  const { cvRmsePercent, nmbePercent, n, p } = model.statistics;
  const cvLimit = cvRmseLimitFor(savings.reportingDays);
  // The uncertainty route is defined at 68 %; rescale if the caller computed it at another confidence.
  const t68 = twoSidedT(UNCERTAINTY_CONFIDENCE, n - p);
  const fsu68 =
    savings.uncertainty.fractional === null ? null : (savings.uncertainty.fractional * t68) / savings.uncertainty.t;
  const g14 = 'ASHRAE Guideline 14-2002 §5.2.11';

  const cv: GuidelineCheck = {
    id: 'cv-rmse',
    label: 'CV(RMSE)',
    value: cvRmsePercent,
    limit: `≤ ${cvLimit.maxPercent} %`,
    passed: cvRmsePercent <= cvLimit.maxPercent,
    source: g14,
    fromMemory: true,
  };
  const nmbe: GuidelineCheck = {
    id: 'nmbe',
    label: 'NMBE',
    value: nmbePercent,
    limit: `within ±${MAX_ABS_NMBE_PERCENT} %`,
    passed: Math.abs(nmbePercent) <= MAX_ABS_NMBE_PERCENT,
    source: g14,
    fromMemory: true,
  };
  const share: GuidelineCheck = {
    id: 'savings-share',
    label: 'Savings as a share of baseline use',
    value: savings.savedPercent,
    limit: `> ${MIN_SAVINGS_PERCENT} %`,
    passed: savings.savedPercent !== null && savings.savedPercent > MIN_SAVINGS_PERCENT,
    source: g14,
    fromMemory: true,
  };
  const uncertainty: GuidelineCheck = {
    id: 'savings-uncertainty',
    label: 'Fractional savings uncertainty at 68 % confidence',
    value: fsu68 === null ? null : 100 * fsu68,
    limit: `< ${100 * MAX_FRACTIONAL_UNCERTAINTY} %`,
    passed: savings.savedGal > 0 && fsu68 !== null && fsu68 < MAX_FRACTIONAL_UNCERTAINTY,
    source: 'ASHRAE Guideline 14-2002',
    fromMemory: true,
  };

  const baselineModelAcceptable = cv.passed && nmbe.passed;
  const saved = savings.savedGal > 0;
  // Prescriptive route: model limits plus savings above 10 %. Uncertainty route: a computed FSU under 50 % stands in
  // for the CV limit, but a biased model is never acceptable.
  const route = !saved
    ? null
    : baselineModelAcceptable && share.passed
      ? 'prescriptive'
      : nmbe.passed && uncertainty.passed
        ? 'uncertainty'
        : null;

  const reasons: string[] = [];
  if (!saved) {
    reasons.push(
      `the site used ${Math.round(-savings.savedGal).toLocaleString('en-US')} ` +
        'gal more than the weather-adjusted baseline predicts, so there are no savings',
    );
  } else if (route === null) {
    if (!cv.passed)
      reasons.push(
        `its CV(RMSE) is ${pct(cvRmsePercent)}, above the ${cvLimit.maxPercent} ` +
          `% Guideline 14 allows ${cvLimit.describe}: use scatters too ` +
          'much around the weather line',
      );
    if (!nmbe.passed)
      reasons.push(
        `its NMBE is ${pct(nmbePercent, 4)}, outside ±${MAX_ABS_NMBE_PERCENT} %: the model is biased over the baseline`,
      );
    if (cv.passed && nmbe.passed && !share.passed)
      reasons.push(
        `the savings (${pct(savings.savedPercent ?? 0)}) are not above ${MIN_SAVINGS_PERCENT} % of baseline use`,
      );
    if (!uncertainty.passed) {
      reasons.push(
        fsu68 === null
          ? 'the savings uncertainty could not be computed'
          : `the savings are uncertain by ±${pct(100 * fsu68, 0)} of their ` +
              `size at 68 % confidence, more than the ${100 * MAX_FRACTIONAL_UNCERTAINTY} % allowed`,
      );
    }
  }

  const warnings = [...savings.warnings];
  if (model.baselineDays < MIN_BASELINE_DAYS) {
    warnings.push(
      `The baseline covers ${model.baselineDays} days (about ${(model.baselineDays / DAYS_PER_MONTH).toFixed(1)} ` +
        'months); IPMVP expects about 12 months so every season is in it.',
    );
  }
  const rho = model.residualLagOneAutocorrelation;
  if (rho !== null && rho > MAX_COMFORTABLE_AUTOCORRELATION) {
    warnings.push(
      `Consecutive residuals are correlated (lag-1 ${rho.toFixed(2)}), ` +
        'so the stated uncertainty is probably too small.',
    );
  }

  const canClaimSavings = route !== null;
  const summary = canClaimSavings
    ? route === 'prescriptive'
      ? `The baseline model meets Guideline 14 (CV(RMSE) ${pct(cvRmsePercent)}, ` +
        `NMBE ${pct(nmbePercent, 4)}) and the savings of ${pct(savings.savedPercent ?? 0)} can be claimed.`
      : `The savings of ${pct(savings.savedPercent ?? 0)} can be claimed ` +
        `on Guideline 14's uncertainty route: ±${pct(100 * fsu68!, 0)} ` +
        'of the savings at 68 % confidence' +
        (cv.passed
          ? '.'
          : `, although the baseline's CV(RMSE) of ${pct(cvRmsePercent)} ` +
            `is above the ${cvLimit.maxPercent} % prescriptive limit.`)
    : !saved
      ? `No savings to claim: ${reasons[0]}.`
      : baselineModelAcceptable
        ? `The baseline model meets Guideline 14, but the savings cannot be claimed because ${reasons.join('; and ')}.`
        : `The baseline model is not good enough to claim savings because ${reasons.join('; and ')}.`;

  return {
    baselineModelAcceptable,
    canClaimSavings,
    route,
    checks: [cv, nmbe, share, uncertainty],
    reasons,
    warnings,
    summary,
  };
}
