/**
 * Area and depth units. Square feet and inches are the base units (US-first product);
 * the factors follow from the exact inch (25.4 mm), which the exact gallon definition also rests on.
 */

export const MILLIMETRES_PER_INCH = 25.4;
export const SQUARE_METRES_PER_SQUARE_FOOT = 0.3048 * 0.3048;
export const SQUARE_FEET_PER_ACRE = 43_560;

/**
 * Gallons from one inch of water over one square foot: 144 in³ / 231 in³ ≈ 0.623377.
 * MWELO prints this as 0.62; the budget engine offers both (see budgets/mwelo-allowance.ts).
 */
export const GALLONS_PER_INCH_SQUARE_FOOT = 144 / 231;

export const AREA_UNITS = ['ft2', 'm2', 'acre'] as const;
export type AreaUnit = (typeof AREA_UNITS)[number];

export const AREA_UNIT_LABELS: Readonly<Record<AreaUnit, string>> = { ft2: 'ft²', m2: 'm²', acre: 'acre' };

const SQUARE_FEET_PER_UNIT: Readonly<Record<AreaUnit, number>> = {
  ft2: 1,
  m2: 1 / SQUARE_METRES_PER_SQUARE_FOOT,
  acre: SQUARE_FEET_PER_ACRE,
};

export function convertArea(value: number, from: AreaUnit, to: AreaUnit): number {
  if (from === to) return value;
  return (value * SQUARE_FEET_PER_UNIT[from]) / SQUARE_FEET_PER_UNIT[to];
}

export const DEPTH_UNITS = ['in', 'mm'] as const;
export type DepthUnit = (typeof DEPTH_UNITS)[number];

export function mmToInches(mm: number): number {
  return mm / MILLIMETRES_PER_INCH;
}

export function inchesToMm(inches: number): number {
  return inches * MILLIMETRES_PER_INCH;
}

export function convertDepth(value: number, from: DepthUnit, to: DepthUnit): number {
  if (from === to) return value;
  return from === 'in' ? inchesToMm(value) : mmToInches(value);
}

/** Gallons of water in a layer `depthIn` deep over `areaFt2`. */
export function depthToGallons(depthIn: number, areaFt2: number): number {
  return depthIn * areaFt2 * GALLONS_PER_INCH_SQUARE_FOOT;
}

/** Litres in a layer `depthMm` deep over `areaM2`: 1 mm over 1 m² is exactly 1 L. */
export function depthToLitres(depthMm: number, areaM2: number): number {
  return depthMm * areaM2;
}
