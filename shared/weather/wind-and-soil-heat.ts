/** Wind height adjustment and soil heat flux, FAO-56 Chapter 3 (Eqs. 42–47). */

/** FAO-56 default when no wind data exist, m/s (p.63). */
export const DEFAULT_WIND_SPEED_2M = 2;
/** FAO-56 lower limit for u2 in the equation, m/s (p.63): calm air still exchanges some heat by convection. */
export const MINIMUM_WIND_SPEED_2M = 0.5;

/** Factor that turns wind at height `heightM` into wind at 2 m (FAO-56 Eq. 47; 0.748 at 10 m). */
export function windFactorTo2m(heightM: number): number {
  if (!(heightM > 0.1)) throw new RangeError(`Wind measurement height ${heightM} m is too low; it must be above 0.1 m`);
  return 4.87 / Math.log(67.8 * heightM - 5.42);
}

/** Wind speed at 2 m from speed `speedMs` measured at `heightM` (FAO-56 Eq. 47). */
export function windSpeedAt2m(speedMs: number, heightM: number): number {
  return speedMs * windFactorTo2m(heightM);
}

/**
 * Monthly soil heat flux G, MJ m⁻² d⁻¹ (FAO-56 Eqs. 43–44): 0.07·(T next − T previous) when next month's
 * mean is known, otherwise 0.14·(T this − T previous). The daily G under grass is taken as 0 (Eq. 42).
 */
export function monthlySoilHeatFluxMj(previousMonthC: number, thisMonthC: number, nextMonthC?: number): number {
  return nextMonthC === undefined ? 0.14 * (thisMonthC - previousMonthC) : 0.07 * (nextMonthC - previousMonthC);
}
