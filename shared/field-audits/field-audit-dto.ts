/** Irrigation field audits as the API sends and takes them. Depths in inches, pressures in psi. */
import type { AuditSchedule } from './audit-schedule';
import type { CatchUnit, ThroatUnit, UniformityRating } from './catch-can';

export const AUDIT_STATUSES = ['draft', 'complete'] as const;
export type AuditStatus = (typeof AUDIT_STATUSES)[number];

/** Catch cans measure overhead heads only; drip zones need an emitter flow check instead. */
export const AUDITED_HEAD_TYPES = ['spray', 'rotary-nozzle', 'rotor', 'microspray'] as const;
export type AuditedHeadType = (typeof AUDITED_HEAD_TYPES)[number];

export const HEAD_TYPE_LABELS: Record<AuditedHeadType, string> = {
  spray: 'Fixed spray',
  'rotary-nozzle': 'Rotary nozzle',
  rotor: 'Rotor',
  microspray: 'Micro-spray',
};

export const FAULT_KINDS = [
  'tilted-head',
  'sunken-head',
  'mismatched-nozzles',
  'broken-lateral',
  'clogged-nozzle',
  'misaligned-arc',
  'blocked-spray',
  'leaking-valve',
  'high-pressure-misting',
  'low-pressure',
  'other',
] as const;
export type FaultKind = (typeof FAULT_KINDS)[number];

export const FAULT_LABELS: Record<FaultKind, string> = {
  'tilted-head': 'Tilted head',
  'sunken-head': 'Sunken head',
  'mismatched-nozzles': 'Mismatched nozzles',
  'broken-lateral': 'Broken lateral',
  'clogged-nozzle': 'Clogged nozzle',
  'misaligned-arc': 'Arc or radius off target',
  'blocked-spray': 'Spray blocked by plants',
  'leaking-valve': 'Leaking or weeping valve',
  'high-pressure-misting': 'Misting (pressure too high)',
  'low-pressure': 'Low pressure',
  other: 'Other',
};

export const FAULT_STATUSES = ['open', 'fixed'] as const;
export type FaultStatus = (typeof FAULT_STATUSES)[number];

/** Limits shared by the server's validation and the phone form. */
export const FIELD_AUDIT_LIMITS = {
  titleMax: 160,
  notesMax: 4000,
  catchesMax: 200,
  pressuresMax: 20,
  locationMax: 120,
  photoMaxBytes: 8 * 1024 * 1024,
  photosPerFault: 6,
} as const;

export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export type PhotoType = (typeof PHOTO_TYPES)[number];

export interface PressureReading {
  /** Where it was read, e.g. "valve 3 outlet", "last head". */
  location: string;
  psi: number;
}

export interface FieldAuditInput {
  title: string;
  /** YYYY-MM-DD, the site's local date. */
  auditedOn: string;
  /** The month whose budget the run times are worked out for, YYYY-MM. */
  scheduleMonth: string;
  daysPerWeek: number;
  /** Static pressure at the point of connection, psi. */
  staticPressurePsi?: number | null;
  notes?: string;
  status?: AuditStatus;
}

export interface ZoneTestInput {
  hydrozoneId: number;
  headType: AuditedHeadType;
  runMinutes: number;
  catchUnit: CatchUnit;
  /** Needed when catches are volumes (mL). */
  throatDiameter?: number | null;
  throatUnit?: ThroatUnit | null;
  catches: number[];
  pressures?: PressureReading[];
  soilIntakeInPerHour?: number | null;
  slopePercent?: number | null;
  notes?: string;
}

export interface ZoneTestResults {
  meanDepthIn: number;
  prInPerHour: number;
  du: number;
  lowQuarterCount: number;
  canCount: number;
  schedulingMultiplier: number;
  /** 1 ÷ SM, what "apply to hydrozone" writes as the zone's efficiency. */
  auditedEfficiency: number;
  duTarget: number;
  rating: UniformityRating;
  /** Zone flow that gives the measured rate over the hydrozone's area: PR × area ÷ 96.25. */
  equivalentFlowGpm: number;
  warnings: string[];
}

export interface ZoneTestDto extends Required<Omit<ZoneTestInput, 'throatDiameter' | 'throatUnit' | 'hydrozoneId'>> {
  id: number;
  auditId: number;
  /** Null once the hydrozone has been deleted; its name and area were copied at test time. */
  hydrozoneId: number | null;
  throatDiameter: number | null;
  throatUnit: ThroatUnit | null;
  hydrozoneName: string;
  hydrozoneAreaFt2: number;
  /** Null when the catches cannot be evaluated (see `problem`). */
  results: ZoneTestResults | null;
  schedule: AuditSchedule | null;
  /** Why there are no results or no schedule (e.g. no weather station linked). */
  problem: string | null;
  appliedAt: string | null;
}

export interface FaultInput {
  zoneTestId?: number | null;
  kind: FaultKind;
  /** Where on the site, e.g. "head 12 by the north gate". */
  location: string;
  description?: string;
  status?: FaultStatus;
}

export interface FaultPhotoDto {
  id: number;
  faultId: number;
  contentType: PhotoType;
  sizeBytes: number;
  /** Same-origin URL served only to users who can read the site. */
  url: string;
  createdAt: string;
}

export interface FaultDto extends Required<Omit<FaultInput, 'zoneTestId'>> {
  id: number;
  auditId: number;
  zoneTestId: number | null;
  photos: FaultPhotoDto[];
}

export interface FieldAuditSummaryDto {
  id: number;
  siteId: number;
  siteName: string;
  title: string;
  auditedOn: string;
  status: AuditStatus;
  /** The organisation that did the audit; only its writers may change it. */
  organisationName: string;
  zoneTestCount: number;
  openFaultCount: number;
  /** Mean DU_lq of the zones tested, null before any test. */
  meanDu: number | null;
  canEdit: boolean;
  updatedAt: string;
}

export interface FieldAuditDto extends FieldAuditSummaryDto {
  scheduleMonth: string;
  daysPerWeek: number;
  staticPressurePsi: number | null;
  notes: string;
  createdByName: string | null;
  /** Whether the user may write audit results into the hydrozones (needs `contribute`). */
  canApply: boolean;
  zoneTests: ZoneTestDto[];
  faults: FaultDto[];
  cautions: string[];
  method: string[];
}

export interface ApplyZoneTestInput {
  efficiency: boolean;
  flow: boolean;
  soilIntake: boolean;
}

export const FIELD_AUDIT_SORTS = ['auditedOn', 'title', 'status'] as const;
export type FieldAuditSort = (typeof FIELD_AUDIT_SORTS)[number];

/** Shown with every audit: things the person at the site must not skip. */
export const FIELD_AUDIT_CAUTIONS = [
  'Test only with the backflow preventer in place and working; never remove or bypass it to raise pressure.',
  'Static pressure above about 80 psi can burst fittings and makes spray heads mist: have a licensed plumber fit or ' +
    'adjust a pressure regulator (common practice, no source).',
  'Controller and valve wiring: switch the controller off before opening a valve box; low-voltage wiring still ' +
    'shares boxes with mains power on some sites.',
  'Local codes and water-agency rules come first; defer to licensed irrigation professionals for repairs.',
];
