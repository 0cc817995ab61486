import type { RegisterPeriod } from '@shared/ingest/register-differencing';
import type { VolumeUnit } from '@shared/units/volume-units';

/** What an upload needs to know about a meter, loaded once per upload. */
export interface IngestMeter {
  id: number;
  ref: string;
  siteId: number;
  /** The unit the meter is set up in (used when the file names none). */
  unit: VolumeUnit;
  /** The earliest install of any of its registers; readings before it are refused. */
  firstInstalledMs: number | null;
  removedMs: number | null;
  registers: RegisterPeriod[];
  multiplier: number;
  digits: number | null;
}

/** The meters, controllers and zones the rows of one upload may name (one site's, or an organisation's). */
export interface IngestRefs {
  meters: Map<string, IngestMeter>;
  /** Controller ref → its site. */
  controllers: Map<string, number>;
  /** `controllerRef \u0000 station` → zone id. */
  zones: Map<string, number>;
  /** Zone id → its site. */
  zoneSites: Map<number, number>;
  /** Refs that several sites in scope use: rows naming them cannot be routed. Ref → the sites' names. */
  ambiguous: Map<string, string[]>;
}

export const zoneKey = (controllerRef: string, station: string) => `${controllerRef}\u0000${station}`;

/** The site a stored row belongs to, from its owner (a meter, or a zone for runtime logs). */
export function ownerSite(refs: IngestRefs, owner: 'meter_id' | 'zone_id'): (ownerId: number) => number | undefined {
  if (owner === 'zone_id') return (id) => refs.zoneSites.get(id);
  const byId = new Map([...refs.meters.values()].map((m) => [m.id, m.siteId]));
  return (id) => byId.get(id);
}
