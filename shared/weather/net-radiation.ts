/**
 * Solar and net radiation terms from FAO-56 Chapter 3 (Eqs. 35–40, 50). MJ m⁻² per day unless noted;
 * the longwave function also serves hourly periods when given the hourly Stefan–Boltzmann constant.
 */

/** Stefan–Boltzmann constant per day, MJ K⁻⁴ m⁻² d⁻¹ (FAO-56 Eq. 39). */
export const STEFAN_BOLTZMANN_DAILY = 4.903e-9;
/** Stefan–Boltzmann constant per hour, MJ K⁻⁴ m⁻² h⁻¹ (FAO-56 Eq. 53 notes). */
export const STEFAN_BOLTZMANN_HOURLY = 2.043e-10;
/** FAO-56 uses K = °C + 273.16 in the longwave term. */
export const KELVIN_OFFSET_FAO = 273.16;

/** Angström coefficients FAO-56 recommends when no local calibration exists (Eq. 35). */
export const ANGSTROM_DEFAULT = { a: 0.25, b: 0.5 } as const;

/** Grass reference albedo (FAO-56 Eq. 38). */
export const REFERENCE_ALBEDO = 0.23;

/** Hargreaves radiation coefficient kRs (FAO-56 Eq. 50): interior 0.16, coastal 0.19 °C⁻⁰·⁵. */
export const KRS = { interior: 0.16, coastal: 0.19 } as const;

/** Solar radiation from sunshine hours (FAO-56 Eq. 35). */
export function solarRadiationFromSunshineMj(
  raMj: number,
  sunshineHours: number,
  daylightHours: number,
  angstrom: { a: number; b: number } = ANGSTROM_DEFAULT,
): number {
  return (angstrom.a + (angstrom.b * sunshineHours) / daylightHours) * raMj;
}

/** Solar radiation from the temperature range (Hargreaves, FAO-56 Eq. 50). */
export function solarRadiationFromTemperatureMj(raMj: number, tMaxC: number, tMinC: number, krs: number): number {
  return krs * Math.sqrt(Math.max(0, tMaxC - tMinC)) * raMj;
}

/** Clear-sky solar radiation Rso with no calibrated Angström values (FAO-56 Eq. 37). */
export function clearSkyRadiationMj(raMj: number, elevationM: number): number {
  return (0.75 + 2e-5 * elevationM) * raMj;
}

/** Net shortwave radiation Rns = (1 − α)·Rs (FAO-56 Eq. 38). */
export function netShortwaveRadiationMj(rsMj: number, albedo = REFERENCE_ALBEDO): number {
  return (1 - albedo) * rsMj;
}

/** σ·TK⁴ for a temperature in °C: the blackbody term FAO-56 tabulates in Annex 2 Table 2.8. */
export function blackbodyRadiationMj(tempC: number, sigma = STEFAN_BOLTZMANN_DAILY): number {
  return sigma * Math.pow(tempC + KELVIN_OFFSET_FAO, 4);
}

export interface NetLongwaveParts {
  rnlMj: number;
  /** Mean of σTmax,K⁴ and σTmin,K⁴ (or σT⁴ hourly). */
  blackbodyMj: number;
  /** 0.34 − 0.14√ea */
  humidityFactor: number;
  /** 1.35·Rs/Rso − 0.35 */
  cloudinessFactor: number;
  /** Rs/Rso after limiting to ≤ 1.0 */
  relativeShortwave: number;
}

/**
 * Net outgoing longwave radiation Rnl (FAO-56 Eq. 39).
 * Rs/Rso is limited to 1.0 as FAO-56 requires; the cloudiness factor is not allowed below zero, because a
 * negative value would mean the sky gives the surface net longwave energy, which the equation does not model.
 */
export function netLongwaveRadiation(
  tMaxC: number,
  tMinC: number,
  eaKpa: number,
  rsOverRso: number,
  sigma = STEFAN_BOLTZMANN_DAILY,
): NetLongwaveParts {
  const blackbodyMj = (blackbodyRadiationMj(tMaxC, sigma) + blackbodyRadiationMj(tMinC, sigma)) / 2;
  const humidityFactor = 0.34 - 0.14 * Math.sqrt(eaKpa);
  const relativeShortwave = Math.min(1, rsOverRso);
  const cloudinessFactor = Math.max(0, 1.35 * relativeShortwave - 0.35);
  return {
    rnlMj: blackbodyMj * humidityFactor * cloudinessFactor,
    blackbodyMj,
    humidityFactor,
    cloudinessFactor,
    relativeShortwave,
  };
}

/** Net radiation Rn = Rns − Rnl (FAO-56 Eq. 40). */
export function netRadiationMj(rnsMj: number, rnlMj: number): number {
  return rnsMj - rnlMj;
}
