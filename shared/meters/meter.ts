/** Meters, controllers and zones as the API carries them. Pure types and constants. */
import type { VolumeUnit } from '../units/volume-units';

export const METER_PURPOSES = ['dedicated-irrigation', 'mixed'] as const;
export type MeterPurpose = (typeof METER_PURPOSES)[number];

export const WATER_SOURCES = ['potable', 'recycled'] as const;
export type WaterSource = (typeof WATER_SOURCES)[number];

export interface MeterDto {
  id: number;
  siteId: number;
  ref: string;
  unit: VolumeUnit;
  registerMultiplier: number;
  registerDigits: number | null;
  purpose: MeterPurpose;
  waterSource: WaterSource;
  /** ISO instants; null when not known. */
  installedAt: string | null;
  removedAt: string | null;
  /** Earlier registers replaced in meter swaps, oldest first. */
  previousRegisters: Array<{ installedAt: string; removedAt: string; multiplier: number; digits: number | null }>;
}

export type MeterInput = Omit<MeterDto, 'id' | 'siteId'>;

export interface ZoneDto {
  id: number;
  controllerId: number;
  station: string;
  name: string;
  hydrozoneId: number | null;
  designGpm: number | null;
  emitterCount: number | null;
  emitterGph: number | null;
}

export type ZoneInput = Omit<ZoneDto, 'id' | 'controllerId'>;

export interface ControllerDto {
  id: number;
  siteId: number;
  ref: string;
  name: string;
  zones: ZoneDto[];
}
