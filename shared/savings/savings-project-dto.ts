/** Savings projects and their weather-normalised savings report, as the API sends them. */
import type { BaselineCoefficient, BaselineModelForm } from './baseline-model';
import type { FitStatistics } from './fit-statistics';
import type { SavingsPeriod, SavingsUncertainty } from './savings-calculation';
import type { GuidelineCheck } from './savings-verdict';

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

export interface SavingsProjectInput {
  title: string;
  changeKind: SavingsChangeKind;
  changeDescription?: string;
  /** YYYY-MM-DD, the site's local date. */
  installedOn: string;
  /** Months YYYY-MM, both ends included. */
  baselineFrom: string;
  baselineTo: string;
  reportingFrom: string;
  reportingTo: string;
  modelForm: BaselineModelForm;
}

export interface SavingsProjectDto extends Required<SavingsProjectInput> {
  id: number;
  siteId: number;
  siteName: string;
  createdBy: number | null;
  createdAt: string;
  updatedAt: string;
}

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
  };
  verdict: {
    canClaimSavings: boolean;
    baselineModelAcceptable: boolean;
    route: 'prescriptive' | 'uncertainty' | null;
    checks: GuidelineCheck[];
    reasons: string[];
    summary: string;
  };
  warnings: string[];
  /** The method in plain words, as printed on the PDF. */
  method: string[];
}
