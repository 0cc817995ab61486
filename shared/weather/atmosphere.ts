/**
 * Air and vapour-pressure relations from FAO-56 (Allen et al. 1998), Chapter 3.
 * Temperatures in °C, pressures in kPa, elevations in metres.
 */

/** Atmospheric pressure at elevation `elevationM` (FAO-56 Eq. 7), kPa. */
export function atmosphericPressureKpa(elevationM: number): number {
  return 101.3 * Math.pow((293 - 0.0065 * elevationM) / 293, 5.26);
}

/**
 * Psychrometric constant γ (FAO-56 Eq. 8), kPa/°C: cp·P/(ε·λ) with λ = 2.45 MJ/kg, which FAO rounds to
 * 0.665×10⁻³·P.
 */
export function psychrometricConstantKpaPerC(pressureKpa: number): number {
  return 0.000665 * pressureKpa;
}

/** Saturation vapour pressure e°(T) (FAO-56 Eq. 11), kPa. */
export function saturationVapourPressureKpa(tempC: number): number {
  return 0.6108 * Math.exp((17.27 * tempC) / (tempC + 237.3));
}

/**
 * Mean saturation vapour pressure es for a day (FAO-56 Eq. 12). FAO averages e° at Tmax and Tmin
 * rather than taking e° at Tmean, because e° is convex and the latter underestimates es.
 */
export function meanSaturationVapourPressureKpa(tMaxC: number, tMinC: number): number {
  return (saturationVapourPressureKpa(tMaxC) + saturationVapourPressureKpa(tMinC)) / 2;
}

/** Slope Δ of the saturation vapour-pressure curve (FAO-56 Eq. 13), kPa/°C. */
export function vapourPressureSlopeKpaPerC(tempC: number): number {
  return (4098 * saturationVapourPressureKpa(tempC)) / Math.pow(tempC + 237.3, 2);
}
