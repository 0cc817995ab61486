import { achievedEtaf, allowanceEtaf, gallonsPerSquareFoot, isPeer, percentileRank } from './achieved-etaf';
import type { EtafBasis, EtafRowDto, EtafSort } from './etaf-dto';
import type { SiteKind } from '../sites/site';

/** At least this share of the period's days metered for a site to be ranked (as the savings report does). */
export const COMPLETE_SHARE = 0.9;

/** What the server reads per site; everything else is worked out here. */
export interface EtafSiteFigures {
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
  allowedEtaf: number;
  allowedBasis: EtafBasis;
  /** Why ETo is missing (no station, no hydrozones…), from the budget cache. */
  problem: string | null;
}

/** Rows with achieved ETAF, rank among complete sites (lowest first) and standing among comparable sites. */
export function etafRows(figures: readonly EtafSiteFigures[]): EtafRowDto[] {
  const rows = figures.map(toRow);
  const ranked = rows.filter((r) => r.complete && r.achievedEtaf !== null);
  [...ranked]
    .sort((a, b) => a.achievedEtaf! - b.achievedEtaf! || a.siteName.localeCompare(b.siteName))
    .forEach((r, i) => (r.rank = i + 1));
  for (const row of ranked) {
    const peers = ranked.filter((p) => isPeer(row, p));
    row.peerCount = peers.length;
    row.peerPercentile = percentileRank(
      row.achievedEtaf!,
      peers.map((p) => p.achievedEtaf!),
    );
  }
  return rows;
}

function toRow(f: EtafSiteFigures): EtafRowDto {
  const la = f.landscapeAreaFt2;
  // No metered day at all is no figure, not an ETAF of zero.
  const etaf = f.etoIn !== null && f.meteredDays > 0 ? achievedEtaf(f.useGal, f.etoIn, la) : null;
  const allowance = allowanceEtaf(f.allowedEtaf, la, f.specialLandscapeAreaFt2);
  const complete = f.periodDays > 0 && f.meteredDays >= COMPLETE_SHARE * f.periodDays;
  return {
    rank: null,
    siteId: f.siteId,
    siteName: f.siteName,
    siteKind: f.siteKind,
    organisationName: f.organisationName,
    tags: f.tags,
    landscapeAreaFt2: la,
    specialLandscapeAreaFt2: f.specialLandscapeAreaFt2,
    useGal: f.useGal,
    etoIn: f.etoIn,
    meteredDays: f.meteredDays,
    periodDays: f.periodDays,
    complete,
    achievedEtaf: etaf,
    allowedEtaf: f.allowedEtaf,
    allowedBasis: f.allowedBasis,
    allowanceEtaf: allowance,
    percentOfAllowance: etaf !== null && allowance ? (100 * etaf) / allowance : null,
    galPerFt2: gallonsPerSquareFoot(f.useGal, la),
    peerCount: 0,
    peerPercentile: null,
    problem: problemOf(f, complete),
  };
}

function problemOf(f: EtafSiteFigures, complete: boolean): string | null {
  if (!(f.landscapeAreaFt2 > 0)) return 'No hydrozones: the landscape area is unknown.';
  if (f.etoIn === null || !(f.etoIn > 0)) return f.problem ?? 'No ETo for the period (link a weather station).';
  if (f.meteredDays === 0) return 'No metered use in the period.';
  if (!complete) return `Only ${f.meteredDays} of ${f.periodDays} days metered (needs 90 %).`;
  return null;
}

/** Sort keys computed once per row; rows without a value go last in either direction; ties by name. */
export function sortEtafRows(rows: readonly EtafRowDto[], sort: EtafSort, dir: 'asc' | 'desc'): EtafRowDto[] {
  const key = (r: EtafRowDto): number | string | null =>
    sort === 'name'
      ? r.siteName.toLowerCase()
      : sort === 'rank'
        ? r.rank
        : sort === 'achievedEtaf'
          ? r.achievedEtaf
          : sort === 'galPerFt2'
            ? r.galPerFt2
            : r.percentOfAllowance;
  const sign = dir === 'asc' ? 1 : -1;
  return rows
    .map((row) => ({ row, k: key(row) }))
    .sort((a, b) => {
      if (a.k === null && b.k !== null) return 1;
      if (b.k === null && a.k !== null) return -1;
      if (a.k !== null && b.k !== null && a.k !== b.k) return (a.k < b.k ? -1 : 1) * sign;
      return a.row.siteName.localeCompare(b.row.siteName) || a.row.siteId - b.row.siteId;
    })
    .map((x) => x.row);
}
