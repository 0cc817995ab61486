import { saturationVapourPressureKpa } from './atmosphere';

/**
 * Actual vapour pressure ea, kPa, from whichever humidity data a station reports.
 * FAO-56 ranks them: dew point (Eq. 14) and RHmax/RHmin (Eq. 17) first, RHmean (Eq. 19) next, and
 * Tmin as dew point (Eq. 48, "missing humidity data") only when no humidity is measured.
 */

/** From dew point (FAO-56 Eq. 14). */
export function actualVapourPressureFromDewPoint(dewPointC: number): number {
  return saturationVapourPressureKpa(dewPointC);
}

/** From daily RHmax and RHmin, % (FAO-56 Eq. 17). RHmax pairs with Tmin, RHmin with Tmax. */
export function actualVapourPressureFromRhExtremes(
  tMaxC: number,
  tMinC: number,
  rhMaxPct: number,
  rhMinPct: number,
): number {
  return (
    (saturationVapourPressureKpa(tMinC) * (rhMaxPct / 100) + saturationVapourPressureKpa(tMaxC) * (rhMinPct / 100)) / 2
  );
}

/** From RHmax only, % (FAO-56 Eq. 18): used when RHmin is unreliable. */
export function actualVapourPressureFromRhMax(tMinC: number, rhMaxPct: number): number {
  return saturationVapourPressureKpa(tMinC) * (rhMaxPct / 100);
}

/** From mean RH, % (FAO-56 Eq. 19); FAO calls this less desirable than Eqs. 14 and 17. */
export function actualVapourPressureFromRhMean(tMaxC: number, tMinC: number, rhMeanPct: number): number {
  return (rhMeanPct / 100) * ((saturationVapourPressureKpa(tMaxC) + saturationVapourPressureKpa(tMinC)) / 2);
}

/**
 * Fallback with no humidity data: dew point taken as Tmin (FAO-56 Eq. 48), optionally lowered by
 * `aridityOffsetC` (FAO suggests 2–3 °C for arid sites).
 */
export function actualVapourPressureFromTmin(tMinC: number, aridityOffsetC = 0): number {
  return saturationVapourPressureKpa(tMinC - aridityOffsetC);
}

/**
 * From psychrometer readings (FAO-56 Eq. 15): ea = e°(Twet) − γpsy·(Tdry − Twet), with γpsy = apsy·P.
 * apsy is 0.000662 °C⁻¹ for ventilated (aspirated) psychrometers, 0.000800 for natural ventilation.
 */
export function actualVapourPressureFromPsychrometer(
  dryBulbC: number,
  wetBulbC: number,
  pressureKpa: number,
  apsyPerC = 0.000662,
): number {
  return saturationVapourPressureKpa(wetBulbC) - apsyPerC * pressureKpa * (dryBulbC - wetBulbC);
}
