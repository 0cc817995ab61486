/**
 * The Penman–Monteith reference equation in the general ASCE-EWRI form
 *   ET = [0.408Δ(Rn − G) + γ·Cn/(T + 273)·u2(es − ea)] / [Δ + γ(1 + Cd·u2)].
 * FAO-56 Eq. 6 is the daily case with Cn 900, Cd 0.34; FAO-56 Eq. 53 is the hourly case with Cn 37, Cd 0.34.
 */

export interface PenmanMonteithConstants {
  /** Numerator constant, K mm s³ Mg⁻¹ per time step. */
  cn: number;
  /** Denominator constant, s/m. */
  cd: number;
}

/** FAO-56 Eq. 6, daily grass reference (identical to ASCE standardized short reference, daily). */
export const FAO56_DAILY: PenmanMonteithConstants = { cn: 900, cd: 0.34 };
/** FAO-56 Eq. 53, hourly grass reference: FAO keeps Cd = 0.34 by day and night. */
export const FAO56_HOURLY: PenmanMonteithConstants = { cn: 37, cd: 0.34 };

export type ReferenceSurface = 'short' | 'tall';

/**
 * ASCE-EWRI (2005) standardized constants, Table 1 of the report ("ASCE-EWRI p.21").
 * From memory: the report text was not available; the values match several independent implementations.
 */
export const ASCE_STANDARDIZED = {
  daily: { short: { cn: 900, cd: 0.34 }, tall: { cn: 1600, cd: 0.38 } },
  hourlyDay: { short: { cn: 37, cd: 0.24 }, tall: { cn: 66, cd: 0.25 } },
  hourlyNight: { short: { cn: 37, cd: 0.96 }, tall: { cn: 66, cd: 1.7 } },
  /** Hourly soil heat flux as a fraction of Rn (from memory, as above). */
  hourlySoilHeatFraction: { short: { day: 0.1, night: 0.5 }, tall: { day: 0.04, night: 0.2 } },
} as const;

export interface PenmanMonteithInputs {
  /** Δ, kPa/°C */
  slopeKpaPerC: number;
  /** γ, kPa/°C */
  psychrometricKpaPerC: number;
  /** Rn, MJ m⁻² per time step */
  netRadiationMj: number;
  /** G, MJ m⁻² per time step */
  soilHeatFluxMj: number;
  /** Mean air temperature for the time step, °C */
  meanTempC: number;
  /** Wind at 2 m, m/s */
  windSpeed2mMs: number;
  esKpa: number;
  eaKpa: number;
}

export interface PenmanMonteithResult {
  /** Reference ET for the time step, mm. */
  etMm: number;
  /** 0.408Δ(Rn − G)/denominator, mm: the energy part. */
  radiationTermMm: number;
  /** γ·Cn/(T+273)·u2(es − ea)/denominator, mm: the drying-power part. */
  aerodynamicTermMm: number;
}

export function penmanMonteith(inputs: PenmanMonteithInputs, constants: PenmanMonteithConstants): PenmanMonteithResult {
  const { slopeKpaPerC: delta, psychrometricKpaPerC: gamma, windSpeed2mMs: u2 } = inputs;
  const denominator = delta + gamma * (1 + constants.cd * u2);
  const radiationTermMm = (0.408 * delta * (inputs.netRadiationMj - inputs.soilHeatFluxMj)) / denominator;
  const aerodynamicTermMm =
    (gamma * (constants.cn / (inputs.meanTempC + 273)) * u2 * (inputs.esKpa - inputs.eaKpa)) / denominator;
  return { etMm: radiationTermMm + aerodynamicTermMm, radiationTermMm, aerodynamicTermMm };
}
