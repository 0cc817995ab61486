import { GALLONS_PER_INCH_SQUARE_FOOT } from '../units/area-depth-units';

/**
 * California MWELO (23 CCR ch. 2.7, 2015) annual water allowance and estimated use. ETo and effective
 * precipitation in inches per year, areas in ft², results in gallons per year.
 */

/** The ordinance prints 0.62 gal per inch per ft² ("converts acre-inches per acre per year to gallons per ft²"). */
export const MWELO_CONVERSION_FACTOR = 0.62;

/** `ordinance` = 0.62 as MWELO prints it (compliance figures); `exact` = 144/231 ≈ 0.623377. */
export type GallonsPerInchFactor = 'ordinance' | 'exact';

export function gallonsPerInchSquareFoot(factor: GallonsPerInchFactor): number {
  return factor === 'ordinance' ? MWELO_CONVERSION_FACTOR : GALLONS_PER_INCH_SQUARE_FOOT;
}

export type MweloProjectType = 'residential' | 'non-residential';

/** Maximum ETAF for regular landscape areas, MWELO § 492.4(a). */
export const MWELO_MAX_ETAF: Readonly<Record<MweloProjectType, number>> = {
  residential: 0.55,
  'non-residential': 0.45,
};
/** ETAF of special landscape areas (MWELO § 491, from memory per docs/references.md §3). */
export const SLA_ETAF = 1.0;
/** ETAF of existing, non-rehabilitated landscapes, MWELO § 493.1. */
export const EXISTING_LANDSCAPE_ETAF = 0.8;

export interface MawaInputs {
  etoInPerYear: number;
  /** Total landscape area LA, including the special landscape area, ft². */
  landscapeAreaFt2: number;
  /** Special landscape area SLA, ft² (part of LA). */
  specialLandscapeAreaFt2: number;
  /** ETAF for regular areas; usually MWELO_MAX_ETAF[type], a local agency may set a lower one. */
  etaf: number;
  /** Effective precipitation, in/yr, where the local agency allows it (25 % of annual rain); 0 otherwise. */
  effectivePrecipitationInPerYear?: number;
  factor?: GallonsPerInchFactor;
}

export interface MawaResult {
  gallons: number;
  formula: string;
}

function requireNonNegative(name: string, value: number): void {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be zero or more (got ${value})`);
}

/** MAWA = (ETo − Eppt) × 0.62 × [ETAF × LA + (1 − ETAF) × SLA] (MWELO App. B note e). */
export function maximumAppliedWaterAllowance(inputs: MawaInputs): MawaResult {
  const { etoInPerYear, landscapeAreaFt2: la, specialLandscapeAreaFt2: sla, etaf } = inputs;
  const eppt = inputs.effectivePrecipitationInPerYear ?? 0;
  requireNonNegative('ETo', etoInPerYear);
  requireNonNegative('Landscape area', la);
  requireNonNegative('Special landscape area', sla);
  requireNonNegative('Effective precipitation', eppt);
  if (sla > la)
    throw new RangeError(`Special landscape area ${sla} ft² exceeds the landscape area ${la} ft² it is part of`);
  if (!(etaf > 0 && etaf <= 1)) throw new RangeError(`ETAF must be greater than 0 and at most 1 (got ${etaf})`);
  const k = gallonsPerInchSquareFoot(inputs.factor ?? 'ordinance');
  const gallons = Math.max(0, etoInPerYear - eppt) * k * (etaf * la + (1 - etaf) * sla);
  return {
    gallons,
    formula: `(ETo − Eppt) × ${k === MWELO_CONVERSION_FACTOR ? '0.62' : '0.623377'} × [ETAF × LA + (1 − ETAF) × SLA]`,
  };
}

/** MAWA for an existing landscape = 0.8 × ETo × LA × 0.62 (MWELO § 493.1). */
export function existingLandscapeAllowance(
  etoInPerYear: number,
  landscapeAreaFt2: number,
  factor: GallonsPerInchFactor = 'ordinance',
): MawaResult {
  requireNonNegative('ETo', etoInPerYear);
  requireNonNegative('Landscape area', landscapeAreaFt2);
  const k = gallonsPerInchSquareFoot(factor);
  return { gallons: EXISTING_LANDSCAPE_ETAF * etoInPerYear * landscapeAreaFt2 * k, formula: '0.8 × ETo × LA × 0.62' };
}

export interface EtwuZone {
  areaFt2: number;
  plantFactor: number;
  irrigationEfficiency: number;
  specialLandscapeArea: boolean;
}

export interface EtwuResult {
  gallons: number;
  zones: { etaf: number; gallons: number }[];
  /** Sitewide ETAF = (B + D)/(A + C): ETAF-weighted area over total area (MWELO App. B). */
  sitewideEtaf: number;
  /** Regular-area ETAF = B/A, the figure held to 0.55 / 0.45; null without regular areas. */
  regularAreaEtaf: number | null;
}

/**
 * ETWU per hydrozone = ETo × 0.62 × ETAF × area with ETAF = PF/IE (MWELO App. B note d); special landscape
 * areas use ETAF 1.0.
 */
export function estimatedTotalWaterUse(
  etoInPerYear: number,
  zones: readonly EtwuZone[],
  factor: GallonsPerInchFactor = 'ordinance',
): EtwuResult {
  requireNonNegative('ETo', etoInPerYear);
  const k = gallonsPerInchSquareFoot(factor);
  let regularArea = 0;
  let regularEtafArea = 0;
  let slaArea = 0;
  let slaEtafArea = 0;
  const rows = zones.map((zone, index) => {
    if (!(zone.areaFt2 > 0))
      throw new RangeError(`Zone ${index + 1}: area must be greater than 0 ft² (got ${zone.areaFt2})`);
    if (!(zone.plantFactor >= 0 && zone.plantFactor <= 1))
      throw new RangeError(`Zone ${index + 1}: plant factor must be 0..1 (got ${zone.plantFactor})`);
    if (!(zone.irrigationEfficiency > 0 && zone.irrigationEfficiency <= 1)) {
      throw new RangeError(
        `Zone ${index + 1}: irrigation efficiency must be in (0, 1] (got ${zone.irrigationEfficiency})`,
      );
    }
    const etaf = zone.specialLandscapeArea ? SLA_ETAF : zone.plantFactor / zone.irrigationEfficiency;
    if (zone.specialLandscapeArea) {
      slaArea += zone.areaFt2;
      slaEtafArea += etaf * zone.areaFt2;
    } else {
      regularArea += zone.areaFt2;
      regularEtafArea += etaf * zone.areaFt2;
    }
    return { etaf, gallons: etoInPerYear * k * etaf * zone.areaFt2 };
  });
  const totalArea = regularArea + slaArea;
  return {
    gallons: rows.reduce((sum, r) => sum + r.gallons, 0),
    zones: rows,
    sitewideEtaf: totalArea > 0 ? (regularEtafArea + slaEtafArea) / totalArea : 0,
    regularAreaEtaf: regularArea > 0 ? regularEtafArea / regularArea : null,
  };
}

export interface MweloCompliance {
  complies: boolean;
  reasons: string[];
}

/** ETWU must not exceed MAWA, and the regular areas' ETAF must not exceed the project type's maximum. */
export function mweloCompliance(etwu: EtwuResult, mawa: MawaResult, maxEtaf: number): MweloCompliance {
  const reasons: string[] = [];
  if (etwu.gallons > mawa.gallons) {
    reasons.push(
      `Estimated use ${Math.round(etwu.gallons)} gal/yr exceeds the allowance ${Math.round(mawa.gallons)} gal/yr`,
    );
  }
  if (etwu.regularAreaEtaf !== null && etwu.regularAreaEtaf > maxEtaf) {
    reasons.push(`Regular-area ETAF ${etwu.regularAreaEtaf.toFixed(2)} exceeds the maximum ${maxEtaf}`);
  }
  return { complies: reasons.length === 0, reasons };
}
