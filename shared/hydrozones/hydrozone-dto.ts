import type { IrrigationMethod, PlantWaterUseCategory } from '../budgets/hydrozone';
import type { AreaUnit } from '../units/area-depth-units';

/** Why an area counts as a MWELO special landscape area (ETAF up to 1.0). */
export const SPECIAL_LANDSCAPE_KINDS = ['recycled-water', 'edible', 'recreation-turf'] as const;
export type SpecialLandscapeKind = (typeof SPECIAL_LANDSCAPE_KINDS)[number];

export const SPECIAL_LANDSCAPE_KIND_LABELS: Readonly<Record<SpecialLandscapeKind, string>> = {
  'recycled-water': 'Watered with recycled water',
  edible: 'Edible plants',
  'recreation-turf': 'Recreation turf',
};

export const HYDROZONE_AREA_UNITS = ['ft2', 'm2'] as const satisfies readonly AreaUnit[];
export type HydrozoneAreaUnit = (typeof HYDROZONE_AREA_UNITS)[number];

/** Limits shared by the server's validation and the browser's form. */
export const HYDROZONE_LIMITS = {
  nameMax: 120,
  notesMax: 2000,
  /** About 230 acres: larger figures are almost always a unit mistake. */
  areaMaxFt2: 10_000_000,
  flowMaxGpm: 500,
  emitterCountMax: 100_000,
  emitterGphMax: 60,
  soilIntakeMaxInPerHour: 10,
} as const;

/**
 * A hydrozone as the API returns it. Area is always stored in ft²; the browser converts for metric users.
 * Zone flow (design gpm, or emitter count × gph) stands in for controller zones until those are imported.
 */
export interface HydrozoneDto {
  id: number;
  siteId: number;
  name: string;
  areaFt2: number;
  plantWaterUse: PlantWaterUseCategory | null;
  plantFactor: number | null;
  /** The factor the budget uses: the entered one, else the category's default. */
  effectivePlantFactor: number;
  irrigationMethod: IrrigationMethod;
  efficiencyOverride: number | null;
  effectiveEfficiency: number;
  efficiencySource: string;
  specialLandscapeArea: boolean;
  specialLandscapeKind: SpecialLandscapeKind | null;
  designFlowGpm: number | null;
  emitterCount: number | null;
  emitterGph: number | null;
  soilIntakeInPerHour: number | null;
  notes: string;
  updatedAt: string;
}

export interface HydrozoneInput {
  name: string;
  area: number;
  areaUnit: HydrozoneAreaUnit;
  plantWaterUse?: PlantWaterUseCategory | null;
  plantFactor?: number | null;
  irrigationMethod: IrrigationMethod;
  efficiencyOverride?: number | null;
  specialLandscapeArea?: boolean;
  specialLandscapeKind?: SpecialLandscapeKind | null;
  designFlowGpm?: number | null;
  emitterCount?: number | null;
  emitterGph?: number | null;
  soilIntakeInPerHour?: number | null;
  notes?: string;
}

export const HYDROZONE_SORTS = ['name', 'areaFt2', 'irrigationMethod', 'updatedAt'] as const;
export type HydrozoneSort = (typeof HYDROZONE_SORTS)[number];
