import { DEFAULT_IRRIGATION_EFFICIENCY, type IrrigationMethod } from '../budgets/hydrozone';
import type { ZoneChange } from './plan-dto';

/** A hydrozone as the planner sees it: the figures MWELO's ETWU needs. */
export interface PlanZone {
  id: number;
  name: string;
  areaFt2: number;
  plantFactor: number;
  irrigationMethod: IrrigationMethod;
  efficiency: number;
  specialLandscapeArea: boolean;
}

export interface ChangedZone {
  before: PlanZone;
  after: PlanZone;
  changes: string[];
}

/** Problems with a plan's changes against the site's zones, each naming the zone; empty when sound. */
export function checkZoneChanges(zones: readonly PlanZone[], changes: readonly ZoneChange[]): string[] {
  const problems: string[] = [];
  const seen = new Set<number>();
  for (const change of changes) {
    const zone = zones.find((z) => z.id === change.hydrozoneId);
    if (!zone) {
      problems.push(`Hydrozone ${change.hydrozoneId} is not on this site`);
      continue;
    }
    if (seen.has(zone.id)) problems.push(`"${zone.name}" is changed twice`);
    seen.add(zone.id);
    if (change.areaRemovedFt2 != null && !(change.areaRemovedFt2 >= 0 && change.areaRemovedFt2 <= zone.areaFt2 + 1e-9))
      problems.push(`"${zone.name}": area removed must be 0–${Math.round(zone.areaFt2)} ft²`);
    if (change.plantFactor != null && !(change.plantFactor >= 0 && change.plantFactor <= 1))
      problems.push(`"${zone.name}": plant factor must be 0–1`);
    if (change.efficiency != null && !(change.efficiency > 0 && change.efficiency <= 1))
      problems.push(`"${zone.name}": efficiency must be above 0 and at most 1`);
  }
  return problems;
}

/**
 * The plan's copy of each zone next to the zone as it is. A new method brings its default efficiency (MWELO
 * App. B note c values, as the budget uses) unless an efficiency is given; an unchanged method keeps the zone's.
 */
export function applyZoneChanges(zones: readonly PlanZone[], changes: readonly ZoneChange[]): ChangedZone[] {
  return zones.map((before) => {
    const change = changes.find((c) => c.hydrozoneId === before.id);
    if (!change) return { before, after: before, changes: [] };
    const method = change.irrigationMethod ?? before.irrigationMethod;
    const methodChanged = method !== before.irrigationMethod;
    const efficiency =
      change.efficiency ?? (methodChanged ? DEFAULT_IRRIGATION_EFFICIENCY[method].efficiency : before.efficiency);
    const after: PlanZone = {
      ...before,
      irrigationMethod: method,
      efficiency,
      plantFactor: change.plantFactor ?? before.plantFactor,
      areaFt2: Math.max(0, before.areaFt2 - (change.areaRemovedFt2 ?? 0)),
    };
    return { before, after, changes: describeChange(before, after) };
  });
}

function describeChange(before: PlanZone, after: PlanZone): string[] {
  const out: string[] = [];
  if (after.irrigationMethod !== before.irrigationMethod)
    out.push(`${before.irrigationMethod} → ${after.irrigationMethod}`);
  if (after.plantFactor !== before.plantFactor)
    out.push(`plant factor ${before.plantFactor.toFixed(2)} → ${after.plantFactor.toFixed(2)}`);
  if (after.areaFt2 !== before.areaFt2)
    out.push(
      after.areaFt2 === 0
        ? 'taken out of irrigation'
        : `${Math.round(before.areaFt2 - after.areaFt2).toLocaleString('en-US')} ft² removed`,
    );
  if (after.efficiency !== before.efficiency)
    out.push(`efficiency ${before.efficiency.toFixed(2)} → ${after.efficiency.toFixed(2)}`);
  return out;
}
