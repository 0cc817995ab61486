/**
 * A hydrozone: an area of plants with similar water needs watered by one kind of device.
 * Areas in ft², plant factors and efficiencies as fractions (0..1).
 */

export const PLANT_WATER_USE_CATEGORIES = ['very-low', 'low', 'moderate', 'high'] as const;
export type PlantWaterUseCategory = (typeof PLANT_WATER_USE_CATEGORIES)[number];

/**
 * Plant factor ranges by water-use category, MWELO § 492.4(b)(1) after WUCOLS — from memory (docs/references.md §3).
 * The gaps between ranges (0.3–0.4, 0.6–0.7) are as the ordinance prints them.
 * `default` is the midpoint, used when only the category is known: common practice, no source.
 */
export const PLANT_FACTOR_RANGES: Readonly<
  Record<PlantWaterUseCategory, { min: number; max: number; default: number }>
> = {
  'very-low': { min: 0, max: 0.1, default: 0.05 },
  low: { min: 0.1, max: 0.3, default: 0.2 },
  moderate: { min: 0.4, max: 0.6, default: 0.5 },
  high: { min: 0.7, max: 1.0, default: 0.85 },
};

export const IRRIGATION_METHODS = [
  'drip',
  'subsurface-drip',
  'bubbler',
  'microspray',
  'spray',
  'rotor',
  'rotary-nozzle',
] as const;
export type IrrigationMethod = (typeof IRRIGATION_METHODS)[number];

/** Default irrigation efficiency per method and where the figure comes from, for the "how computed" view. */
export const DEFAULT_IRRIGATION_EFFICIENCY: Readonly<Record<IrrigationMethod, { efficiency: number; source: string }>> =
  {
    drip: { efficiency: 0.81, source: 'MWELO App. B note c: 0.81 for drip system devices' },
    'subsurface-drip': { efficiency: 0.81, source: 'MWELO App. B note c: 0.81 for drip system devices' },
    bubbler: { efficiency: 0.81, source: 'Treated as a low-volume (drip-class) device: common practice, no source' },
    microspray: { efficiency: 0.75, source: 'Treated as an overhead spray device: common practice, no source' },
    spray: { efficiency: 0.75, source: 'MWELO App. B note c: 0.75 for overhead spray devices' },
    rotor: {
      efficiency: 0.75,
      source: 'Overhead device, MWELO App. B note c value 0.75 applied: common practice, no source',
    },
    'rotary-nozzle': {
      efficiency: 0.75,
      source: 'Overhead device, MWELO App. B note c value 0.75 applied: common practice, no source',
    },
  };

export interface Hydrozone {
  id: string;
  name: string;
  areaFt2: number;
  /** Category, plant factor, or both; with both, the factor must lie in the category's range. */
  plantWaterUse?: PlantWaterUseCategory;
  plantFactor?: number;
  irrigationMethod: IrrigationMethod;
  /** Replaces the method's default efficiency, e.g. from an audit. */
  efficiencyOverride?: number;
  /** Special landscape area (MWELO): recreation turf, edible plants, recycled-water areas; ETAF up to 1.0. */
  specialLandscapeArea: boolean;
}

export interface HydrozoneIssue {
  field: keyof Hydrozone;
  message: string;
}

/** Every problem with a hydrozone, each naming its field; empty when valid. */
export function validateHydrozone(zone: Hydrozone): HydrozoneIssue[] {
  const issues: HydrozoneIssue[] = [];
  if (!zone.name.trim()) issues.push({ field: 'name', message: 'Name is required' });
  if (!Number.isFinite(zone.areaFt2) || zone.areaFt2 <= 0) {
    issues.push({ field: 'areaFt2', message: `Area must be greater than 0 ft² (got ${zone.areaFt2})` });
  }
  if (zone.plantFactor === undefined && zone.plantWaterUse === undefined) {
    issues.push({ field: 'plantFactor', message: 'Give a plant factor or a plant water-use category' });
  }
  if (zone.plantWaterUse !== undefined && !PLANT_WATER_USE_CATEGORIES.includes(zone.plantWaterUse)) {
    issues.push({ field: 'plantWaterUse', message: `Unknown plant water-use category "${zone.plantWaterUse}"` });
  } else if (zone.plantFactor !== undefined) {
    if (!Number.isFinite(zone.plantFactor) || zone.plantFactor < 0 || zone.plantFactor > 1) {
      issues.push({ field: 'plantFactor', message: `Plant factor must be between 0 and 1 (got ${zone.plantFactor})` });
    } else if (zone.plantWaterUse !== undefined) {
      const range = PLANT_FACTOR_RANGES[zone.plantWaterUse];
      if (zone.plantFactor < range.min || zone.plantFactor > range.max) {
        issues.push({
          field: 'plantFactor',
          message:
            `Plant factor ${zone.plantFactor} is outside the ${zone.plantWaterUse} ` +
            `range ${range.min}–${range.max}`,
        });
      }
    }
  }
  if (!IRRIGATION_METHODS.includes(zone.irrigationMethod)) {
    issues.push({ field: 'irrigationMethod', message: `Unknown irrigation method "${zone.irrigationMethod}"` });
  }
  if (zone.efficiencyOverride !== undefined && !(zone.efficiencyOverride > 0 && zone.efficiencyOverride <= 1)) {
    issues.push({
      field: 'efficiencyOverride',
      message: `Irrigation efficiency must be greater than 0 and at most 1 (got ${zone.efficiencyOverride})`,
    });
  }
  return issues;
}

/** Throws a RangeError listing every problem; used by the calculators so they never run on bad input. */
export function assertValidHydrozone(zone: Hydrozone): void {
  const issues = validateHydrozone(zone);
  if (issues.length > 0) {
    throw new RangeError(`Hydrozone "${zone.name}": ${issues.map((i) => `${i.field}: ${i.message}`).join('; ')}`);
  }
}

/** The plant factor used in calculations: the given one, else the category's default. */
export function effectivePlantFactor(zone: Hydrozone): number {
  if (zone.plantFactor !== undefined) return zone.plantFactor;
  if (zone.plantWaterUse !== undefined) return PLANT_FACTOR_RANGES[zone.plantWaterUse].default;
  throw new RangeError(`Hydrozone "${zone.name}" has neither a plant factor nor a water-use category`);
}

/** The irrigation efficiency used in calculations, with where it came from. */
export function effectiveIrrigationEfficiency(zone: Hydrozone): { efficiency: number; source: string } {
  if (zone.efficiencyOverride !== undefined)
    return { efficiency: zone.efficiencyOverride, source: 'Entered for this hydrozone' };
  return DEFAULT_IRRIGATION_EFFICIENCY[zone.irrigationMethod];
}
