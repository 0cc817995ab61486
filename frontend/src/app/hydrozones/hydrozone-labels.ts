import { PLANT_FACTOR_RANGES, type IrrigationMethod, type PlantWaterUseCategory } from '@shared/budgets/hydrozone';

export const PLANT_WATER_USE_LABELS: Readonly<Record<PlantWaterUseCategory, string>> = {
  'very-low': `Very low (PF ${PLANT_FACTOR_RANGES['very-low'].min}–${PLANT_FACTOR_RANGES['very-low'].max})`,
  low: `Low (PF ${PLANT_FACTOR_RANGES.low.min}–${PLANT_FACTOR_RANGES.low.max})`,
  moderate: `Moderate (PF ${PLANT_FACTOR_RANGES.moderate.min}–${PLANT_FACTOR_RANGES.moderate.max})`,
  high: `High (PF ${PLANT_FACTOR_RANGES.high.min}–${PLANT_FACTOR_RANGES.high.max})`,
};

export const IRRIGATION_METHOD_LABELS: Readonly<Record<IrrigationMethod, string>> = {
  drip: 'Drip',
  'subsurface-drip': 'Subsurface drip',
  bubbler: 'Bubbler',
  microspray: 'Micro-spray',
  spray: 'Fixed spray',
  rotor: 'Rotor',
  'rotary-nozzle': 'Rotary nozzle',
};
