/**
 * Hargreaves reference ET, mm/d (FAO-56 Eq. 52), for days with temperatures only.
 * Ra in MJ m⁻² d⁻¹ is turned into its evaporation equivalent with 0.408 mm per MJ m⁻² (FAO-56 Eq. 20).
 */
export function hargreavesEtoMm(tMaxC: number, tMinC: number, raMj: number): number {
  const tMean = (tMaxC + tMinC) / 2;
  return 0.0023 * (tMean + 17.8) * Math.sqrt(Math.max(0, tMaxC - tMinC)) * 0.408 * raMj;
}
