/**
 * How much of a day's rain counts toward the landscape's water need.
 *
 * - `none`: rain is ignored; the budget is the full irrigation requirement (the conservative default).
 * - `fixed-fraction`: a fixed share of rain counts, e.g. 25 %. Under MWELO a local agency may count effective
 *   precipitation at 25 % of annual precipitation (local-code wording, e.g. the ecode360.com/48417262 copy cited
 *   in docs/references.md §3). Applied per day here, which gives the same annual total.
 * - `threshold`: rain below `minimumMm` on a day is ignored (it wets the canopy and evaporates); rain
 *   above it counts up to that day's plant water demand, the excess being runoff or deep drainage.
 *   Common practice, no source.
 */
export type EffectiveRainMethod =
  { kind: 'none' } | { kind: 'fixed-fraction'; fraction: number } | { kind: 'threshold'; minimumMm: number };

export const MWELO_EFFECTIVE_RAIN_FRACTION = 0.25;

export function validateEffectiveRainMethod(method: EffectiveRainMethod): string[] {
  switch (method.kind) {
    case 'none':
      return [];
    case 'fixed-fraction':
      return method.fraction >= 0 && method.fraction <= 1
        ? []
        : [`Effective-rain fraction ${method.fraction} must be between 0 and 1`];
    case 'threshold':
      return method.minimumMm >= 0 && Number.isFinite(method.minimumMm)
        ? []
        : [`Effective-rain threshold ${method.minimumMm} mm must be zero or more`];
  }
}

/**
 * Effective rain for one day, mm.
 * @param rainMm measured rain for the day
 * @param demandMm the day's plant water demand (ETo × plant factor), which caps the threshold method
 */
export function effectiveRainMm(method: EffectiveRainMethod, rainMm: number, demandMm: number): number {
  if (!(rainMm >= 0)) throw new RangeError(`Rain ${rainMm} mm must be zero or more`);
  const problems = validateEffectiveRainMethod(method);
  if (problems.length > 0) throw new RangeError(problems.join('; '));
  switch (method.kind) {
    case 'none':
      return 0;
    case 'fixed-fraction':
      return rainMm * method.fraction;
    case 'threshold':
      return rainMm < method.minimumMm ? 0 : Math.min(rainMm, Math.max(0, demandMm));
  }
}

/** A sentence for the "how computed" view. */
export function describeEffectiveRainMethod(method: EffectiveRainMethod): string {
  switch (method.kind) {
    case 'none':
      return 'Rain is not credited: the budget is the full irrigation requirement.';
    case 'fixed-fraction':
      return (
        `${Math.round(method.fraction * 1000) / 10} % of each day's rain ` +
        'is credited (MWELO allows local agencies 25 % of annual precipitation).'
      );
    case 'threshold':
      return (
        `Rain under ${method.minimumMm} mm on a day is ignored; rain ` +
        "above it is credited up to that day's plant water demand (common " +
        'practice, no published source).'
      );
  }
}
