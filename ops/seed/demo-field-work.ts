import type { FaultInput, FieldAuditInput, ZoneTestInput } from '@shared/field-audits/field-audit-dto';
import type { ZoneChange } from '@shared/planner/plan-dto';

/**
 * The demo's field work on South Greenbelt, all invented: in February 2026 the contractor cooperative audits the
 * greenbelt (the path spray is uneven and over-pressured), plans the spray-to-drip retrofit, and carries it out in
 * April, which is the savings project `seed-savings` writes. A second plan on North Commons is left as a draft.
 */
export const DEMO_AUDIT_SITE = 'Willowmere HOA — South Greenbelt';

export const DEMO_AUDIT: FieldAuditInput = {
  title: 'Winter audit before the path retrofit',
  auditedOn: '2026-02-18',
  scheduleMonth: '2025-07',
  daysPerWeek: 3,
  staticPressurePsi: 92,
  notes: 'Dry, still morning; cans set on a 10-ft grid along the path and across the slope. Invented demo data.',
  status: 'complete',
};

/** Zone tests by hydrozone name (ids are looked up); catches in mL in cans with a 3-inch throat. */
export const DEMO_ZONE_TESTS: (Omit<ZoneTestInput, 'hydrozoneId'> & { zone: string })[] = [
  {
    zone: 'Greenbelt path spray',
    headType: 'spray',
    runMinutes: 20,
    catchUnit: 'ml',
    throatDiameter: 3,
    throatUnit: 'in',
    catches: [11, 9, 12, 4, 10, 13, 3, 9, 12, 11, 6, 10, 14, 5, 9, 11],
    pressures: [
      { location: 'valve 4 outlet', psi: 58 },
      { location: 'last head by the footbridge', psi: 31 },
    ],
    soilIntakeInPerHour: 0.35,
    slopePercent: 3,
    notes: 'Misting at the first heads, dry arcs near the lamp posts.',
  },
  {
    zone: 'Slope groundcover',
    headType: 'rotary-nozzle',
    runMinutes: 30,
    catchUnit: 'ml',
    throatDiameter: 3,
    throatUnit: 'in',
    catches: [9, 10, 8, 11, 9, 10, 7, 9, 10, 8, 11, 9],
    pressures: [{ location: 'valve 5 outlet', psi: 44 }],
    soilIntakeInPerHour: 0.2,
    slopePercent: 14,
  },
];

/** Faults with the zone they were found in; `photos` invented pictures to store for each. */
export const DEMO_FAULTS: (FaultInput & { zone: string | null; photos: number })[] = [
  {
    zone: 'Greenbelt path spray',
    kind: 'broken-lateral',
    location: 'Path lamp post 7, east side',
    description: 'Wet spot and low pressure downstream; lateral cracked under the edging.',
    status: 'fixed',
    photos: 1,
  },
  {
    zone: 'Greenbelt path spray',
    kind: 'mismatched-nozzles',
    location: 'Heads 14–19',
    description: '10-ft and 15-ft nozzles mixed on one valve.',
    status: 'open',
    photos: 1,
  },
  {
    zone: 'Greenbelt path spray',
    kind: 'high-pressure-misting',
    location: 'Heads 1–6 by valve 4',
    description: 'Fine mist drifting onto the path; static 92 psi at the meter, no regulator.',
    status: 'open',
    photos: 0,
  },
  {
    zone: 'Slope groundcover',
    kind: 'tilted-head',
    location: 'Head 22 at the slope edge',
    description: 'Tilted about 15° downhill.',
    status: 'fixed',
    photos: 0,
  },
];

export interface DemoPlan {
  site: string;
  title: string;
  notes: string;
  weatherYear: number;
  costOfWork: number;
  rainSensor: boolean;
  smartControllerReductionPercent: number | null;
  /** Changes by hydrozone name. */
  changes: (Omit<ZoneChange, 'hydrozoneId'> & { zone: string })[];
  /** Carried out into the savings project of this title (written by seed-savings), or a draft. */
  carriedOut: { savingsProjectTitle: string; on: string } | null;
}

export const DEMO_PLANS: DemoPlan[] = [
  {
    site: DEMO_AUDIT_SITE,
    title: 'Greenbelt path: spray to drip',
    notes: 'From the February audit: DU below half on the path spray. Inline drip under mulch, pressure regulated.',
    weatherYear: 2025,
    costOfWork: 18_400,
    rainSensor: false,
    smartControllerReductionPercent: null,
    changes: [{ zone: 'Greenbelt path spray', irrigationMethod: 'drip', plantFactor: 0.35 }],
    carriedOut: { savingsProjectTitle: 'Greenbelt path: spray to drip', on: '2026-04-14' },
  },
  {
    site: 'Willowmere HOA — North Commons',
    title: 'Turf bowl: half to low-water meadow',
    notes: 'Board asked for options before the next budget year.',
    weatherYear: 2025,
    costOfWork: 42_000,
    rainSensor: true,
    smartControllerReductionPercent: 10,
    changes: [{ zone: 'Turf bowl (rotors)', areaRemovedFt2: 9_000 }],
    carriedOut: null,
  },
];
