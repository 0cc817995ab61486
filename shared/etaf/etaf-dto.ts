/** Achieved ETAF across a portfolio, as the API sends it. */
import type { Page } from '../api/page';
import type { SiteKind } from '../sites/site';

export const ETAF_BASES = ['residential', 'non-residential', 'local'] as const;
/** Which rule the site's allowed ETAF comes from: MWELO's two values, or a local agency's own. */
export type EtafBasis = (typeof ETAF_BASES)[number];

export const ETAF_BASIS_LABELS: Record<EtafBasis, string> = {
  residential: 'Residential (MWELO 0.55)',
  'non-residential': 'Non-residential (MWELO 0.45)',
  local: 'Local ordinance',
};

export interface EtafSettingInput {
  allowedEtaf: number;
  basis: EtafBasis;
}

export interface EtafSettingDto extends EtafSettingInput {
  siteId: number;
  /** True when nothing was saved and the value follows from the site's kind. */
  isDefault: boolean;
  source: string;
  updatedAt: string | null;
}

export interface EtafRowDto {
  /** 1 = lowest achieved ETAF among complete sites; null when the site can't be ranked. */
  rank: number | null;
  siteId: number;
  siteName: string;
  siteKind: SiteKind;
  organisationName: string;
  tags: string[];
  landscapeAreaFt2: number;
  specialLandscapeAreaFt2: number;
  useGal: number;
  etoIn: number | null;
  meteredDays: number;
  periodDays: number;
  /** At least 90 % of the period's days metered. */
  complete: boolean;
  achievedEtaf: number | null;
  allowedEtaf: number;
  allowedBasis: EtafBasis;
  /** The allowance's own ETAF once special landscape areas (ETAF 1.0) are counted: MAWA ÷ (ETo × LA × 0.62). */
  allowanceEtaf: number | null;
  percentOfAllowance: number | null;
  galPerFt2: number | null;
  /** Comparable sites: same kind, period ETo within ±10 %; the site itself included. */
  peerCount: number;
  /** Share of those peers whose achieved ETAF is at or below this site's, %. */
  peerPercentile: number | null;
  problem: string | null;
}

export interface EtafBin {
  from: number;
  /** null for the last, open-ended bin. */
  to: number | null;
  count: number;
}

export interface EtafReportDto extends Page<EtafRowDto> {
  from: string;
  to: string;
  histogram: EtafBin[];
  summary: { sites: number; ranked: number; medianEtaf: number | null; overAllowance: number };
  method: string[];
}

export interface SiteEtafStandingDto {
  from: string;
  to: string;
  row: EtafRowDto;
  peers: { label: string; count: number; medianEtaf: number | null; histogram: EtafBin[] };
  setting: EtafSettingDto;
  method: string[];
}

export const ETAF_SORTS = ['rank', 'achievedEtaf', 'galPerFt2', 'percentOfAllowance', 'name'] as const;
export type EtafSort = (typeof ETAF_SORTS)[number];

export const ETAF_METHOD = [
  'Achieved ETAF = metered use (gal) ÷ (ETo (in) × landscape area (ft²) × 0.62): the ETAF the site actually ' +
    'watered at, in the units of California MWELO Appendix B.',
  "ETo is the sum of the site's station's daily ETo over the period (gaps filled from its monthly normals), as " +
    'on its budget page; rain is not subtracted.',
  'Allowed ETAF: a setting per site; by default MWELO 2015 § 492.4: 0.55 residential, 0.45 non-residential. ' +
    'With special landscape areas (ETAF 1.0) the allowance works out to ETAF + (1 − ETAF) × SLA ÷ LA, which is ' +
    'the figure a site is held to here.',
  'Sites with less than 90 % of the period metered are shown but neither ranked nor counted in the distribution.',
  "Comparable sites: the same kind of site whose ETo over the period is within ±10 % of this site's (a Rillmark " +
    'rule, no published source).',
];
