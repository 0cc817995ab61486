/**
 * Sun–earth geometry and extraterrestrial radiation Ra from FAO-56 Chapter 3 (Eqs. 21–25, 28–34).
 * Angles in radians unless the name says degrees; radiation in MJ m⁻² per day (or per period for hourly).
 */

/** Solar constant Gsc, MJ m⁻² min⁻¹ (FAO-56 Eq. 21). */
export const SOLAR_CONSTANT_MJ_PER_M2_MIN = 0.082;

export function degreesToRadians(degrees: number): number {
  return (degrees * Math.PI) / 180;
}

/** Latitude in radians from degrees and minutes; south is negative (FAO-56 Eq. 22 and Example 7). */
export function latitudeRadians(degrees: number, minutes = 0, hemisphere: 'N' | 'S' = 'N'): number {
  const value = degreesToRadians(Math.abs(degrees) + minutes / 60);
  return hemisphere === 'S' ? -value : value;
}

/** Inverse relative earth–sun distance dr (FAO-56 Eq. 23). */
export function inverseRelativeDistance(dayOfYear: number): number {
  return 1 + 0.033 * Math.cos((2 * Math.PI * dayOfYear) / 365);
}

/** Solar declination δ, rad (FAO-56 Eq. 24). */
export function solarDeclinationRad(dayOfYear: number): number {
  return 0.409 * Math.sin((2 * Math.PI * dayOfYear) / 365 - 1.39);
}

/**
 * Sunset hour angle ωs, rad (FAO-56 Eq. 25). The arccos argument is clamped so polar day (ωs = π)
 * and polar night (ωs = 0) come out instead of NaN beyond the polar circles.
 */
export function sunsetHourAngleRad(latitudeRad: number, declinationRad: number): number {
  const x = -Math.tan(latitudeRad) * Math.tan(declinationRad);
  return Math.acos(Math.min(1, Math.max(-1, x)));
}

/** Daily extraterrestrial radiation Ra, MJ m⁻² d⁻¹ (FAO-56 Eq. 21). */
export function extraterrestrialRadiationDailyMj(latitudeRad: number, dayOfYear: number): number {
  const dr = inverseRelativeDistance(dayOfYear);
  const delta = solarDeclinationRad(dayOfYear);
  const ws = sunsetHourAngleRad(latitudeRad, delta);
  const value =
    ((24 * 60) / Math.PI) *
    SOLAR_CONSTANT_MJ_PER_M2_MIN *
    dr *
    (ws * Math.sin(latitudeRad) * Math.sin(delta) + Math.cos(latitudeRad) * Math.cos(delta) * Math.sin(ws));
  return Math.max(0, value);
}

/** Daylight hours N (FAO-56 Eq. 34). */
export function daylightHours(latitudeRad: number, dayOfYear: number): number {
  return (24 / Math.PI) * sunsetHourAngleRad(latitudeRad, solarDeclinationRad(dayOfYear));
}

/** Seasonal correction for solar time Sc, hours (FAO-56 Eqs. 32–33). */
export function seasonalCorrectionHours(dayOfYear: number): number {
  const b = (2 * Math.PI * (dayOfYear - 81)) / 364;
  return 0.1645 * Math.sin(2 * b) - 0.1255 * Math.cos(b) - 0.025 * Math.sin(b);
}

/**
 * Solar time angle ω at the midpoint of a period, rad (FAO-56 Eq. 31).
 * FAO writes longitudes as degrees west of Greenwich; this takes the usual degrees east (west negative)
 * and converts, so (Lz − Lm) in FAO's sign equals (Lm,east − Lz,east) here.
 * @param clockHourMidpoint standard clock time at the middle of the period, e.g. 14.5 for 14:00–15:00
 * @param longitudeDegEast site longitude, degrees east
 * @param timeZoneMeridianDegEast centre of the local time zone, degrees east (e.g. −120 for US Pacific)
 */
export function solarTimeAngleRad(
  clockHourMidpoint: number,
  longitudeDegEast: number,
  timeZoneMeridianDegEast: number,
  dayOfYear: number,
): number {
  const lzMinusLmWest = longitudeDegEast - timeZoneMeridianDegEast;
  return (Math.PI / 12) * (clockHourMidpoint + 0.06667 * lzMinusLmWest + seasonalCorrectionHours(dayOfYear) - 12);
}

export interface HourlyExtraterrestrialRadiation {
  raMj: number;
  /** Solar time angles at the middle, start and end of the period, rad, after clamping to ±ωs. */
  omegaRad: number;
  omega1Rad: number;
  omega2Rad: number;
  sunsetHourAngleRad: number;
}

/**
 * Extraterrestrial radiation for a period of `periodHours` (FAO-56 Eqs. 28–30), MJ m⁻² per period.
 * The period's ends are clamped to sunrise and sunset, so night periods give 0.
 */
export function extraterrestrialRadiationPeriod(
  latitudeRad: number,
  dayOfYear: number,
  omegaRad: number,
  periodHours = 1,
): HourlyExtraterrestrialRadiation {
  const dr = inverseRelativeDistance(dayOfYear);
  const delta = solarDeclinationRad(dayOfYear);
  const ws = sunsetHourAngleRad(latitudeRad, delta);
  const half = (Math.PI * periodHours) / 24;
  const omega1 = Math.min(Math.max(omegaRad - half, -ws), ws);
  const omega2 = Math.min(Math.max(omegaRad + half, -ws), ws);
  const ra =
    ((12 * 60) / Math.PI) *
    SOLAR_CONSTANT_MJ_PER_M2_MIN *
    dr *
    ((omega2 - omega1) * Math.sin(latitudeRad) * Math.sin(delta) +
      Math.cos(latitudeRad) * Math.cos(delta) * (Math.sin(omega2) - Math.sin(omega1)));
  return { raMj: Math.max(0, ra), omegaRad, omega1Rad: omega1, omega2Rad: omega2, sunsetHourAngleRad: ws };
}
