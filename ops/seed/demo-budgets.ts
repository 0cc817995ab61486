import type { IrrigationMethod, PlantWaterUseCategory } from '@shared/budgets/hydrozone';
import type { SpecialLandscapeKind } from '@shared/hydrozones/hydrozone-dto';
import type { VolumeCharge } from '@shared/rates/rate-schedule';

/**
 * Budget data for the demo scenario: two invented weather stations, hydrozones for every Cobalt Ridge site and
 * one rate schedule per site. Names, figures and prices are invented; the coordinates only give the ETo
 * equations a plausible latitude and climate.
 */

export interface DemoStation {
  name: string;
  latitude: number;
  longitude: number;
  elevationM: number;
  exposure: 'interior' | 'coastal';
}

export const DEMO_STATIONS: DemoStation[] = [
  { name: 'Verdella Valley floor', latitude: 36.9, longitude: -120.4, elevationM: 88, exposure: 'interior' },
  { name: 'Red Tamarack mesa', latitude: 33.6, longitude: -111.9, elevationM: 420, exposure: 'interior' },
];

export interface DemoZone {
  name: string;
  areaFt2: number;
  plantWaterUse?: PlantWaterUseCategory;
  plantFactor?: number;
  irrigationMethod: IrrigationMethod;
  efficiencyOverride?: number;
  specialLandscapeKind?: SpecialLandscapeKind;
  designFlowGpm?: number;
  emitters?: { count: number; gph: number };
  soilIntakeInPerHour?: number;
  notes?: string;
}

export interface DemoSiteBudget {
  site: string;
  station: string;
  zones: DemoZone[];
  rate: { name: string; unit: 'ccf' | 'kgal'; fixedChargePerPeriod: number; volumeCharge: VolumeCharge };
}

const reclaimedUniform = {
  name: 'Reclaimed irrigation, uniform',
  unit: 'ccf' as const,
  fixedChargePerPeriod: 28.5,
  volumeCharge: { kind: 'uniform', pricePerUnit: 2.35 } as VolumeCharge,
};
const potableTiered = {
  name: 'Potable irrigation, increasing blocks',
  unit: 'ccf' as const,
  fixedChargePerPeriod: 41,
  volumeCharge: {
    kind: 'tiered',
    tiers: [
      { upToUnits: 40, pricePerUnit: 3.9 },
      { upToUnits: 120, pricePerUnit: 5.2 },
      { upToUnits: null, pricePerUnit: 7.75 },
    ],
  } as VolumeCharge,
};
const budgetBased = {
  name: 'Budget-based irrigation rate',
  unit: 'kgal' as const,
  fixedChargePerPeriod: 35,
  volumeCharge: {
    kind: 'budget-based',
    tiers: [
      { upToPercentOfBudget: 100, pricePerUnit: 4.1 },
      { upToPercentOfBudget: 130, pricePerUnit: 7.4 },
      { upToPercentOfBudget: null, pricePerUnit: 12.6 },
    ],
  } as VolumeCharge,
};

const VALLEY = 'Verdella Valley floor';
const MESA = 'Red Tamarack mesa';

export const DEMO_SITE_BUDGETS: DemoSiteBudget[] = [
  {
    site: 'Willowmere HOA — North Commons',
    station: VALLEY,
    rate: reclaimedUniform,
    zones: [
      {
        name: 'Turf bowl (rotors)',
        areaFt2: 18500,
        plantWaterUse: 'high',
        irrigationMethod: 'rotor',
        designFlowGpm: 42,
        soilIntakeInPerHour: 0.4,
      },
      {
        name: 'Shrub beds north (drip)',
        areaFt2: 9200,
        plantWaterUse: 'low',
        irrigationMethod: 'drip',
        emitters: { count: 820, gph: 1 },
      },
      {
        name: 'Entry perennials (drip)',
        areaFt2: 2400,
        plantFactor: 0.5,
        plantWaterUse: 'moderate',
        irrigationMethod: 'drip',
        emitters: { count: 310, gph: 2 },
      },
    ],
  },
  {
    site: 'Willowmere HOA — South Greenbelt',
    station: VALLEY,
    rate: reclaimedUniform,
    zones: [
      {
        name: 'Greenbelt path spray',
        areaFt2: 12600,
        plantWaterUse: 'moderate',
        irrigationMethod: 'spray',
        designFlowGpm: 38,
        soilIntakeInPerHour: 0.35,
        notes: 'Retrofit to drip planned for spring.',
      },
      {
        name: 'Slope groundcover',
        areaFt2: 6800,
        plantWaterUse: 'low',
        irrigationMethod: 'rotary-nozzle',
        designFlowGpm: 11,
        soilIntakeInPerHour: 0.2,
      },
    ],
  },
  {
    site: 'Sagebrook Village Entry and Parks',
    station: VALLEY,
    rate: potableTiered,
    zones: [
      {
        name: 'Entry monument beds',
        areaFt2: 3100,
        plantWaterUse: 'low',
        irrigationMethod: 'drip',
        emitters: { count: 260, gph: 1 },
      },
      {
        name: 'Tot-lot lawn east',
        areaFt2: 5400,
        plantWaterUse: 'high',
        irrigationMethod: 'spray',
        designFlowGpm: 24,
        specialLandscapeKind: 'recreation-turf',
      },
      {
        name: 'Tot-lot lawn west',
        areaFt2: 4900,
        plantWaterUse: 'high',
        irrigationMethod: 'spray',
        designFlowGpm: 22,
        specialLandscapeKind: 'recreation-turf',
      },
    ],
  },
  {
    site: 'Tannery Point Office Park',
    station: VALLEY,
    rate: reclaimedUniform,
    zones: [
      {
        name: 'Bioswales',
        areaFt2: 7600,
        plantWaterUse: 'low',
        irrigationMethod: 'drip',
        emitters: { count: 640, gph: 1 },
      },
      {
        name: 'Parking-lot islands',
        areaFt2: 5200,
        plantWaterUse: 'very-low',
        plantFactor: 0.1,
        irrigationMethod: 'drip',
        emitters: { count: 390, gph: 0.5 },
      },
      {
        name: 'Courtyard lawn',
        areaFt2: 4300,
        plantWaterUse: 'high',
        irrigationMethod: 'rotary-nozzle',
        designFlowGpm: 9,
      },
    ],
  },
  {
    site: 'Quarry Oaks Business Campus',
    station: VALLEY,
    rate: potableTiered,
    zones: [
      {
        name: 'Frontage shrubs',
        areaFt2: 8800,
        plantWaterUse: 'moderate',
        irrigationMethod: 'microspray',
        designFlowGpm: 16,
      },
      {
        name: 'Oak understory (bubblers)',
        areaFt2: 3500,
        plantWaterUse: 'low',
        irrigationMethod: 'bubbler',
        designFlowGpm: 6,
      },
    ],
  },
  {
    site: 'Juniper Hollow Elementary Fields',
    station: VALLEY,
    rate: reclaimedUniform,
    zones: [
      {
        name: 'Playing field (recreation turf)',
        areaFt2: 62000,
        plantWaterUse: 'high',
        irrigationMethod: 'rotor',
        designFlowGpm: 118,
        specialLandscapeKind: 'recreation-turf',
        soilIntakeInPerHour: 0.5,
      },
      {
        name: 'School garden (edible)',
        areaFt2: 1800,
        plantFactor: 0.7,
        plantWaterUse: 'high',
        irrigationMethod: 'drip',
        emitters: { count: 300, gph: 1 },
        specialLandscapeKind: 'edible',
      },
      {
        name: 'Perimeter shrubs',
        areaFt2: 9500,
        plantWaterUse: 'low',
        irrigationMethod: 'drip',
        efficiencyOverride: 0.78,
        emitters: { count: 700, gph: 1 },
        notes: 'Efficiency from the last audit.',
      },
    ],
  },
  {
    site: 'Alder Creek Parkway Medians',
    station: VALLEY,
    rate: budgetBased,
    zones: [
      {
        name: 'Medians km 2–3',
        areaFt2: 14200,
        plantWaterUse: 'low',
        irrigationMethod: 'drip',
        emitters: { count: 1100, gph: 1 },
      },
      {
        name: 'Medians km 3–5',
        areaFt2: 21800,
        plantWaterUse: 'very-low',
        irrigationMethod: 'subsurface-drip',
        emitters: { count: 1500, gph: 0.6 },
      },
    ],
  },
  {
    site: 'Foxtail Mesa Office Commons',
    station: MESA,
    rate: potableTiered,
    zones: [
      {
        name: 'Desert garden',
        areaFt2: 11500,
        plantWaterUse: 'very-low',
        irrigationMethod: 'drip',
        emitters: { count: 480, gph: 1 },
      },
      {
        name: 'Shade trees (bubblers)',
        areaFt2: 2600,
        plantWaterUse: 'low',
        irrigationMethod: 'bubbler',
        designFlowGpm: 5,
      },
    ],
  },
];

/** Daily weather from this date to yesterday: a full year and more. */
export const DEMO_WEATHER_FROM = '2025-01-01';
/** Normals are the invented generator's averages over these years. */
export const DEMO_NORMAL_YEARS = [2019, 2020, 2021, 2022, 2023];
