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
  /** Earlier registers replaced in meter swaps, oldest first (`serial` and `uploadId` when an upload saw the swap). */
  previousRegisters: Array<{
    installedAt: string;
    removedAt: string;
    multiplier: number;
    digits: number | null;
    serial?: string | null;
    uploadId?: number | null;
  }>;
}

/** A meter swap entered by a person: the new register from `swappedAt` on, the old one kept as a period. */
export interface MeterSwapInput {
  swappedAt: string;
  /** The new register's multiplier and digits (the old one's are kept with its period). */
  multiplier: number;
  digits: number | null;
}

/** A meter and the site it belongs to, for files that name meters of many sites. */
export interface SiteMeterDto extends MeterDto {
  siteName: string;
  timeZone: string;
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
