import type { ControllerDto, MeterDto } from '@shared/meters/meter';
import { zoneKey, type IngestMeter, type IngestRefs } from './ingest-refs';

const ms = (iso: string | null) => (iso ? Date.parse(iso) : null);

/** Builds the lookups an upload needs from a site's meters and controllers. */
export function ingestRefsFrom(equipment: { meters: MeterDto[]; controllers: ControllerDto[] }): IngestRefs {
  const meters = new Map<string, IngestMeter>();
  for (const m of equipment.meters) {
    const current = {
      installedUtc: m.installedAt ?? new Date(0).toISOString(),
      removedUtc: m.removedAt,
      multiplier: m.registerMultiplier,
      digits: m.registerDigits,
    };
    const earlier = m.previousRegisters.map((p) => ({
      installedUtc: p.installedAt,
      removedUtc: p.removedAt,
      multiplier: p.multiplier,
      digits: p.digits,
    }));
    const installs = [m.installedAt, ...m.previousRegisters.map((p) => p.installedAt)]
      .map(ms)
      .filter((x): x is number => x !== null);
    meters.set(m.ref, {
      id: m.id,
      ref: m.ref,
      // With earlier registers, the meter was there from the first one's install.
      firstInstalledMs: m.installedAt === null && earlier.length === 0 ? null : Math.min(...installs),
      removedMs: ms(m.removedAt),
      registers: [...earlier, current],
    });
  }
  const zones = new Map<string, number>();
  for (const c of equipment.controllers) for (const z of c.zones) zones.set(zoneKey(c.ref, z.station), z.id);
  return { meters, controllers: new Set(equipment.controllers.map((c) => c.ref)), zones };
}
