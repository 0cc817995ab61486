/**
 * Plausibility bounds for daily grass-reference ETo.
 * Upper bound 20 mm/d: common practice, no source — a screening limit above the highest daily values
 * reported for hot, dry, windy sites (FAO-56 itself gives no hard maximum).
 * Lower bound 0: a daily budget does not credit condensation.
 */
export const ETO_DAILY_BOUNDS_MM = { min: 0, max: 20 } as const;

export type EtoCheck = { ok: true } | { ok: false; message: string };

export function validateEto(etoMm: number): EtoCheck {
  if (!Number.isFinite(etoMm)) return { ok: false, message: `ETo ${etoMm} is not a number` };
  if (etoMm < ETO_DAILY_BOUNDS_MM.min) return { ok: false, message: `ETo ${etoMm} mm/d is negative` };
  if (etoMm > ETO_DAILY_BOUNDS_MM.max) {
    return {
      ok: false,
      message: `ETo ${etoMm} mm/d is above ${ETO_DAILY_BOUNDS_MM.max} mm/d, beyond any plausible daily value`,
    };
  }
  return { ok: true };
}
