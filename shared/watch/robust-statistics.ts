/**
 * Robust location and spread for baselines. Median and MAD ignore the odd wild value (a hose left on for an
 * hour, a meter spike) that would drag a mean and standard deviation, so one bad night cannot hide the next leak.
 */

/** Scales the MAD so that, for normally distributed data, it estimates the standard deviation (1/Φ⁻¹(3/4)). */
export const MAD_TO_SD = 1.4826;

/** The middle value (mean of the two middle values for an even count). Throws on an empty list. */
export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('The median of no values is undefined');
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** Median absolute deviation from the median, unscaled. Throws on an empty list. */
export function mad(values: readonly number[]): number {
  const centre = median(values);
  return median(values.map((v) => Math.abs(v - centre)));
}

/** MAD scaled to be comparable with a standard deviation. */
export function scaledMad(values: readonly number[]): number {
  return MAD_TO_SD * mad(values);
}

export interface RobustLimit {
  median: number;
  scaledMad: number;
  /** median + max(k·scaledMad, minMargin): values above it are unusual for this history. */
  limit: number;
}

/**
 * An upper limit for "unusual" from a history. `minMargin` keeps a perfectly steady history (MAD = 0) from
 * flagging the smallest wobble.
 */
export function robustUpperLimit(history: readonly number[], k: number, minMargin: number): RobustLimit {
  const centre = median(history);
  const spread = scaledMad(history);
  return { median: centre, scaledMad: spread, limit: centre + Math.max(k * spread, minMargin) };
}
