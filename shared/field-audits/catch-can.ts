/**
 * Catch-can test arithmetic: catches to depths, the measured precipitation rate, lower-quarter distribution
 * uniformity (DU_lq) and the scheduling multiplier that follows from it. Depths in inches, times in minutes.
 */

export const CATCH_UNITS = ['ml', 'in', 'mm'] as const;
/** Volumes (mL, needing the can's throat) or depths read off a graduated can (in, mm). */
export type CatchUnit = (typeof CATCH_UNITS)[number];

export const THROAT_UNITS = ['in', 'mm'] as const;
export type ThroatUnit = (typeof THROAT_UNITS)[number];

/** 1 in = 2.54 cm exactly, so 1 in³ = 16.387064 mL. */
const ML_PER_CUBIC_INCH = 2.54 ** 3;
const MM_PER_INCH = 25.4;

/** Fewer cans than this make DU_lq rest on one or two catches (common practice, no source). */
export const MIN_CANS_FOR_DU = 8;

function requirePositive(name: string, value: number): void {
  if (!Number.isFinite(value) || value <= 0) throw new RangeError(`${name} must be greater than 0 (got ${value})`);
}

/** The can's opening in in², from its throat (inside rim) diameter. */
export function throatAreaIn2(diameter: number, unit: ThroatUnit): number {
  requirePositive('Throat diameter', diameter);
  const inches = unit === 'mm' ? diameter / MM_PER_INCH : diameter;
  return Math.PI * (inches / 2) ** 2;
}

/**
 * Each catch as a depth in inches. Volumes are divided by the opening (mL → in³ → in); depths are converted.
 * A throat is required for volumes only.
 */
export function catchDepthsIn(
  catches: readonly number[],
  unit: CatchUnit,
  throat?: { diameter: number; unit: ThroatUnit },
): number[] {
  catches.forEach((c, i) => {
    if (!Number.isFinite(c) || c < 0) throw new RangeError(`Can ${i + 1}: a catch must be zero or more (got ${c})`);
  });
  if (unit === 'in') return [...catches];
  if (unit === 'mm') return catches.map((c) => c / MM_PER_INCH);
  if (!throat) throw new RangeError('Catches in mL need the throat diameter of the cans');
  const area = throatAreaIn2(throat.diameter, throat.unit);
  return catches.map((ml) => ml / ML_PER_CUBIC_INCH / area);
}

export function mean(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('No values');
  return values.reduce((s, v) => s + v, 0) / values.length;
}

/** Measured (catch-can) precipitation rate, in/h: mean caught depth ÷ run time × 60. */
export function catchCanPrecipitationRate(depthsIn: readonly number[], runMinutes: number): number {
  requirePositive('Run time', runMinutes);
  return (mean(depthsIn) / runMinutes) * 60;
}

/** Rounds half to even, as R's round() does (the published DU example is computed in R). */
function roundHalfEven(x: number): number {
  const floor = Math.floor(x);
  const diff = x - floor;
  if (Math.abs(diff - 0.5) > 1e-9) return Math.round(x);
  return floor % 2 === 0 ? floor : floor + 1;
}

/** How many of `n` catches form the lowest quarter: n ÷ 4 rounded (halves to even), at least one. */
export function lowQuarterCount(n: number): number {
  return Math.max(1, roundHalfEven(n / 4));
}

export interface LowQuarterUniformity {
  /** DU_lq as a fraction (0..1). */
  du: number;
  mean: number;
  lowQuarterMean: number;
  lowQuarterCount: number;
  count: number;
}

/**
 * Lower-quarter distribution uniformity: mean of the lowest quarter of catches ÷ mean of all catches
 * (Keller & Bliesner, Sprinkler and Trickle Irrigation). Catches may be volumes or depths, as long as every can
 * has the same opening. The lowest quarter is n ÷ 4 catches, rounded as the NC State implementation does.
 */
export function lowQuarterUniformity(catches: readonly number[]): LowQuarterUniformity {
  if (catches.length < 4) throw new RangeError(`DU_lq needs at least 4 catches (got ${catches.length})`);
  const sorted = [...catches].sort((a, b) => a - b);
  const all = mean(sorted);
  if (!(all > 0)) throw new RangeError('Every can is empty: run the zone longer or check that it ran');
  const k = lowQuarterCount(sorted.length);
  const low = mean(sorted.slice(0, k));
  return { du: low / all, mean: all, lowQuarterMean: low, lowQuarterCount: k, count: sorted.length };
}

/**
 * Scheduling (run-time) multiplier SM = 1 ÷ (0.4 + 0.6 × DU_lq): how much longer than the mean need to run so the
 * drier parts get enough. Irrigation Association auditor practice — from memory.
 */
export function schedulingMultiplier(du: number): number {
  if (!(du > 0 && du <= 1)) throw new RangeError(`DU_lq must be greater than 0 and at most 1 (got ${du})`);
  return 1 / (0.4 + 0.6 * du);
}

/**
 * The zone efficiency an audit implies: 1 ÷ SM = 0.4 + 0.6 × DU_lq, the share of the water applied that the
 * schedule counts as reaching the plants once the multiplier is used. Derived from the multiplier (from memory).
 */
export function auditedEfficiency(du: number): number {
  return 1 / schedulingMultiplier(du);
}

/** Typical DU_lq people aim for, by head type — common practice, from memory (not a standard). */
export const DU_TARGETS: Readonly<Record<string, number>> = {
  spray: 0.65,
  'rotary-nozzle': 0.7,
  rotor: 0.7,
  microspray: 0.65,
};

export type UniformityRating = 'good' | 'fair' | 'poor';

/** At or above the target is good; within 0.15 below it fair; below that poor (common practice, no source). */
export function rateUniformity(du: number, target: number): UniformityRating {
  if (du >= target) return 'good';
  if (du >= target - 0.15) return 'fair';
  return 'poor';
}
