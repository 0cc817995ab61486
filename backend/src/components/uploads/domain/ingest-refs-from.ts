import type { ControllerDto, MeterDto } from '@shared/meters/meter';
import { zoneKey, type IngestMeter, type IngestRefs } from './ingest-refs';

const ms = (iso: string | null) => (iso ? Date.parse(iso) : null);

function ingestMeter(m: MeterDto): IngestMeter {
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
  return {
    id: m.id,
    ref: m.ref,
    siteId: m.siteId,
    unit: m.unit,
    // With earlier registers, the meter was there from the first one's install.
    firstInstalledMs: m.installedAt === null && earlier.length === 0 ? null : Math.min(...installs),
    removedMs: ms(m.removedAt),
    registers: [...earlier, current],
    multiplier: m.registerMultiplier,
    digits: m.registerDigits,
  };
}

/**
 * Builds the lookups an upload needs from the meters and controllers of the sites in scope. A ref used on two of
 * those sites cannot route a row, so it is set apart (`ambiguous`) with the sites' names.
 */
export function ingestRefsFrom(
  equipment: { meters: MeterDto[]; controllers: ControllerDto[] },
  siteNames: ReadonlyMap<number, string> = new Map(),
): IngestRefs {
  const refs: IngestRefs = {
    meters: new Map(),
    controllers: new Map(),
    zones: new Map(),
    zoneSites: new Map(),
    ambiguous: new Map(),
  };
  const clash = (ref: string, sites: number[]) =>
    refs.ambiguous.set(ref, [
      ...new Set([...(refs.ambiguous.get(ref) ?? []), ...sites.map((s) => siteNames.get(s) ?? `#${s}`)]),
    ]);
  for (const m of equipment.meters) {
    const seen = refs.meters.get(m.ref);
    if (seen || refs.ambiguous.has(m.ref)) {
      clash(m.ref, seen ? [seen.siteId, m.siteId] : [m.siteId]);
      refs.meters.delete(m.ref);
      continue;
    }
    refs.meters.set(m.ref, ingestMeter(m));
  }
  for (const c of equipment.controllers) {
    const seen = refs.controllers.get(c.ref);
    if (seen !== undefined || refs.ambiguous.has(c.ref)) {
      clash(c.ref, seen !== undefined ? [seen, c.siteId] : [c.siteId]);
      refs.controllers.delete(c.ref);
      continue;
    }
    refs.controllers.set(c.ref, c.siteId);
    for (const z of c.zones) {
      refs.zones.set(zoneKey(c.ref, z.station), z.id);
      refs.zoneSites.set(z.id, c.siteId);
    }
  }
  return refs;
}
