import type { RegisterPeriod } from '@shared/ingest/register-differencing';

/** What an upload needs to know about a site's meters, controllers and zones, loaded once per upload. */
export interface IngestMeter {
  id: number;
  ref: string;
  /** The earliest install of any of its registers; readings before it are refused. */
  firstInstalledMs: number | null;
  removedMs: number | null;
  registers: RegisterPeriod[];
}

export interface IngestRefs {
  meters: Map<string, IngestMeter>;
  controllers: Set<string>;
  /** `controllerRef \u0000 station` → zone id. */
  zones: Map<string, number>;
}

export const zoneKey = (controllerRef: string, station: string) => `${controllerRef}\u0000${station}`;
