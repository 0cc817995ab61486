import type { MeterPurpose, WaterSource } from '@shared/meters/meter';

export const METER_PURPOSE_LABELS: Record<MeterPurpose, string> = {
  'dedicated-irrigation': 'Irrigation only',
  mixed: 'Mixed (irrigation and indoor)',
};

export const WATER_SOURCE_LABELS: Record<WaterSource, string> = {
  potable: 'Potable',
  recycled: 'Recycled',
};
