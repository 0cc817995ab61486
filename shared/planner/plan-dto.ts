/** What-if plans as the API sends and takes them. Volumes in gallons per year, areas in ft². */
import type { IrrigationMethod } from '../budgets/hydrozone';
import type { EtafBasis } from '../etaf/etaf-dto';

export const PLAN_STATUSES = ['draft', 'carried-out'] as const;
export type PlanStatus = (typeof PLAN_STATUSES)[number];

/** One hydrozone as changed on the plan's copy; fields left out keep the zone's current value. */
export interface ZoneChange {
  hydrozoneId: number;
  /** New irrigation method (e.g. spray → drip); its default efficiency applies unless `efficiency` is given. */
  irrigationMethod?: IrrigationMethod | null;
  /** New plant factor (e.g. turf 0.8 → low-water plants 0.2). */
  plantFactor?: number | null;
  /** Area taken out of irrigation, ft² (up to the zone's whole area). */
  areaRemovedFt2?: number | null;
  /** An efficiency to use instead of the method's default (e.g. a smart-controller-and-audit figure). */
  efficiency?: number | null;
}

export interface PlanInput {
  title: string;
  notes?: string;
  /** The calendar year whose ETo and rain the comparison uses. */
  weatherYear: number;
  /** What the work costs, in `currency`. */
  costOfWork: number;
  currency: string;
  /** Expected cut in estimated use from a smart controller, % (an assumption you enter). */
  smartControllerReductionPercent?: number | null;
  /** A rain sensor lets MWELO's effective precipitation (25 % of annual rain) count against use. */
  rainSensor?: boolean;
  zoneChanges: ZoneChange[];
}

export const PLAN_LIMITS = {
  titleMax: 160,
  notesMax: 4000,
  zoneChangesMax: 200,
  costMax: 100_000_000,
} as const;

export interface PlanZoneState {
  areaFt2: number;
  plantFactor: number;
  irrigationMethod: IrrigationMethod;
  efficiency: number;
  specialLandscapeArea: boolean;
  etaf: number;
  etwuGal: number;
}

export interface PlanZoneRowDto {
  hydrozoneId: number;
  name: string;
  before: PlanZoneState;
  after: PlanZoneState;
  /** Plain words for what the plan changes on this zone; empty when nothing. */
  changes: string[];
}

export interface PlanScenarioDto {
  landscapeAreaFt2: number;
  specialLandscapeAreaFt2: number;
  /** MWELO maximum applied water allowance with the site's allowed ETAF. */
  mawaGal: number;
  /** MWELO estimated total water use: (ETo − Eppt) × 0.62 × Σ ETAF × area. */
  etwuGal: number;
  /** ETWU after the controller assumptions (smart controller cut). */
  estimatedUseGal: number;
  sitewideEtaf: number;
  regularAreaEtaf: number | null;
  /** Estimated use priced month by month at the site's rate schedule; null without a schedule. */
  annualCost: number | null;
}

export interface PlanComparisonDto {
  planId: number;
  siteName: string;
  weather: { year: number; stationName: string; etoIn: number; rainIn: number; filledDays: number };
  allowedEtaf: number;
  allowedEtafSource: string;
  allowedBasis: EtafBasis;
  before: PlanScenarioDto;
  after: PlanScenarioDto;
  savedGal: number;
  savedPercent: number | null;
  savedMoney: number | null;
  currency: string;
  rateScheduleName: string | null;
  costOfWork: number;
  /** costOfWork ÷ savedMoney, years; null when nothing is saved or there is no rate schedule. */
  paybackYears: number | null;
  zones: PlanZoneRowDto[];
  assumptions: string[];
  cautions: string[];
  method: string[];
}

export interface PlanDto extends Required<Omit<PlanInput, 'smartControllerReductionPercent'>> {
  id: number;
  siteId: number;
  siteName: string;
  smartControllerReductionPercent: number | null;
  status: PlanStatus;
  savingsProjectId: number | null;
  carriedOutOn: string | null;
  canEdit: boolean;
  createdAt: string;
  updatedAt: string;
}

export interface CarryOutInput {
  /** The local date the work was finished, YYYY-MM-DD. */
  installedOn: string;
  /** Months; by default the 12 months before the install month. */
  baselineFrom?: string;
  baselineTo?: string;
  /** Months; by default the 12 months after the install month. */
  reportingFrom?: string;
  reportingTo?: string;
}

export const PLAN_SORTS = ['updatedAt', 'title', 'status'] as const;
export type PlanSort = (typeof PLAN_SORTS)[number];

export const PLAN_CAUTIONS = [
  'Converting spray to drip: fit a pressure regulator and filter at the valve (drip usually wants about 25–30 ' +
    'psi; common practice, no source) and keep the zone backflow preventer in place.',
  'Removing turf: locate and cap laterals at the valve side; a capped line left under pressure can burst.',
  'Controllers and rain sensors are wired to mains-powered equipment: switch off power and have a licensed ' +
    'electrician or irrigation professional connect them.',
  'Watering-day restrictions and local landscape ordinances apply to the new plants as well; check with the ' +
    'water agency.',
];
