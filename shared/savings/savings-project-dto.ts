/** Savings projects and their weather-normalised savings report, as the API sends them. */
import type { BaselineCoefficient, BaselineModelForm } from './baseline-model';
import type { FitStatistics } from './fit-statistics';
import type { SavingsPeriod, SavingsUncertainty } from './savings-calculation';
import type { GuidelineCheck } from './savings-verdict';

/** A Guideline 14 check as documents show it: provenance notes stay in the code and tests. */
export type AcceptanceCheckDto = Omit<GuidelineCheck, 'fromMemory'>;

export const SAVINGS_CHANGE_KINDS = [
  'spray-to-drip',
  'pressure-regulation',
  'controller-replacement',
  'replanting',
  'other',
] as const;
export type SavingsChangeKind = (typeof SAVINGS_CHANGE_KINDS)[number];

export const SAVINGS_CHANGE_LABELS: Record<SavingsChangeKind, string> = {
  'spray-to-drip': 'Spray converted to drip',
  'pressure-regulation': 'Pressure regulation added',
  'controller-replacement': 'Controller replaced',
  replanting: 'Zones re-planted',
  other: 'Other change',
};

/** planned: being set up; installed: baseline and model locked; archived: kept, read only. */
export const SAVINGS_PROJECT_STATUSES = ['planned', 'installed', 'archived'] as const;
export type SavingsProjectStatus = (typeof SAVINGS_PROJECT_STATUSES)[number];
export const SAVINGS_PROJECT_STATUS_LABELS: Record<SavingsProjectStatus, string> = {
  planned: 'Planned',
  installed: 'Installed (baseline locked)',
  archived: 'Archived',
};

/** Fields that lock when the project is marked installed; after that only the owner's managers change them. */
export const LOCKED_FIELDS = ['installedOn', 'baselineFrom', 'baselineTo', 'modelForm'] as const;
export type LockedField = (typeof LOCKED_FIELDS)[number];

export const SAVINGS_FIELD_LABELS: Record<string, string> = {
  title: 'Title',
  changeKind: 'What changed',
  changeDescription: 'Description',
  installedOn: 'Installed on',
  baselineFrom: 'Baseline from',
  baselineTo: 'Baseline to',
  reportingFrom: 'Reporting from',
  reportingTo: 'Reporting to',
  modelForm: 'Baseline model',
  retrofits: 'Retrofit list',
  installedCost: 'Installed cost',
  costCurrency: 'Currency',
  status: 'Status',
};

export const SAVINGS_LIMITS = { retrofitsMax: 20, retrofitMax: 200, costMax: 100_000_000 } as const;

export interface SavingsProjectInput {
  title: string;
  changeKind: SavingsChangeKind;
  changeDescription?: string;
  /** What was installed, one line each ("Zones 3–7: spray heads to inline drip, 12,400 ft²"). */
  retrofits?: string[];
  /** What the retrofit cost, for the simple payback; null when not given. */
  installedCost?: number | null;
  costCurrency?: string | null;
  /** YYYY-MM-DD, the site's local date. */
  installedOn: string;
  /** Months YYYY-MM, both ends included. */
  baselineFrom: string;
  baselineTo: string;
  reportingFrom: string;
  reportingTo: string;
  modelForm: BaselineModelForm;
}

/** What the signed-in user may do with a project (the server enforces the same rules). */
export interface SavingsProjectPermissions {
  edit: boolean;
  /** Change the installation date, baseline months or model (after installation: the owner's managers only). */
  changeBaseline: boolean;
  markInstalled: boolean;
  archive: boolean;
  remove: boolean;
}

export interface SavingsProjectDto extends Required<SavingsProjectInput> {
  id: number;
  siteId: number;
  siteName: string;
  ownerName: string;
  status: SavingsProjectStatus;
  lockedAt: string | null;
  archivedAt: string | null;
  createdBy: number | null;
  createdByName: string | null;
  /** The organisation the author belongs to (the contractor firm for a contractor's project). */
  createdByOrganisation: string | null;
  createdAt: string;
  updatedAt: string;
  can: SavingsProjectPermissions;
}

/** A change to a locked project needs a reason, kept in its audit trail. */
export interface SavingsProjectPatch extends Partial<SavingsProjectInput> {
  reason?: string;
}

export interface SavingsHistoryEntryDto {
  at: string;
  userName: string;
  action: string;
  /** The change in plain words, one line per field. */
  lines: string[];
  reason: string | null;
}

/** How a project's savings stand, in one word for the savings book. */
export const SAVINGS_STANDINGS = ['proven', 'not-proven', 'no-savings', 'waiting'] as const;
export type SavingsStanding = (typeof SAVINGS_STANDINGS)[number];
export const SAVINGS_STANDING_LABELS: Record<SavingsStanding, string> = {
  proven: 'Savings proven',
  'not-proven': 'Not proven yet',
  'no-savings': 'No savings',
  waiting: 'Waiting for data',
};

export interface SavingsBookRowDto {
  project: SavingsProjectDto;
  standing: SavingsStanding;
  /** The verdict's summary, or why there is no report yet. */
  standingText: string;
  savedGal: number | null;
  savedPercent: number | null;
  savedMoney: number | null;
  currency: string | null;
  reportedMonths: number;
}

export const SAVINGS_BOOK_SORTS = ['installedOn', 'title', 'site', 'savedGal'] as const;
export type SavingsBookSort = (typeof SAVINGS_BOOK_SORTS)[number];

export interface SavingsMonthDto {
  month: string;
  days: number;
  etoMm: number;
  rainMm: number;
  /** null when the month was left out (too few days metered). */
  useGal: number | null;
  meteredDays: number;
}

export interface SavingsReportDto {
  project: SavingsProjectDto;
  site: { id: number; name: string; timeZone: string };
  station: { id: number; name: string };
  baselineMonths: (SavingsMonthDto & { fittedGal: number | null })[];
  reportingMonths: SavingsMonthDto[];
  model: {
    form: BaselineModelForm;
    equation: string;
    coefficients: BaselineCoefficient[];
    statistics: FitStatistics;
    baselineDays: number;
  };
  savings: {
    periods: SavingsPeriod[];
    predictedGal: number;
    actualGal: number;
    savedGal: number;
    savedPercent: number | null;
    savedMoney: number | null;
    currency: string | null;
    uncertainty: SavingsUncertainty;
    reportingDays: number;
    /** Money saved per year at the reporting months' pace, and the simple payback of the installed cost. */
    annualMoney: number | null;
    paybackYears: number | null;
  };
  verdict: {
    canClaimSavings: boolean;
    baselineModelAcceptable: boolean;
    route: 'prescriptive' | 'uncertainty' | null;
    checks: AcceptanceCheckDto[];
    reasons: string[];
    summary: string;
    /** The standard the checks come from and the version of the criteria applied. */
    criteria: { standard: string; clause: string; version: string };
  };
  warnings: string[];
  /** The method in plain words, as printed on the PDF. */
  method: string[];
}
