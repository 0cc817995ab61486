import { MWELO_CONVERSION_FACTOR, MWELO_MAX_ETAF } from '../budgets/mwelo-allowance';
import type { SiteKind } from '../sites/site';
import type { EtafBasis, EtafBin } from './etaf-dto';

/** Achieved ETAF = use ÷ (ETo × LA × 0.62); null when there is no area or no ETo to divide by. */
export function achievedEtaf(useGal: number, etoIn: number, landscapeAreaFt2: number): number | null {
  if (!(useGal >= 0)) throw new RangeError(`Use must be zero or more (got ${useGal})`);
  if (!(etoIn > 0) || !(landscapeAreaFt2 > 0)) return null;
  return useGal / (etoIn * landscapeAreaFt2 * MWELO_CONVERSION_FACTOR);
}

export function gallonsPerSquareFoot(useGal: number, landscapeAreaFt2: number): number | null {
  return landscapeAreaFt2 > 0 ? useGal / landscapeAreaFt2 : null;
}

/**
 * The ETAF an allowance amounts to over the whole landscape: MAWA ÷ (ETo × LA × 0.62) =
 * ETAF + (1 − ETAF) × SLA ÷ LA, since special landscape areas are allowed ETAF 1.0 (MWELO App. B).
 */
export function allowanceEtaf(allowedEtaf: number, landscapeAreaFt2: number, specialAreaFt2: number): number | null {
  if (!(landscapeAreaFt2 > 0)) return null;
  return allowedEtaf + ((1 - allowedEtaf) * Math.min(specialAreaFt2, landscapeAreaFt2)) / landscapeAreaFt2;
}

/** Without a saved setting: HOA common areas count as residential, everything else as non-residential. */
export function defaultEtafSetting(kind: SiteKind): { allowedEtaf: number; basis: EtafBasis } {
  const basis: EtafBasis = kind === 'hoa-common-area' ? 'residential' : 'non-residential';
  return { allowedEtaf: MWELO_MAX_ETAF[basis], basis };
}

export const HISTOGRAM_STEP = 0.1;
export const HISTOGRAM_TOP = 1.5;

/** Counts per 0.1 of ETAF from 0 to 1.5, the last bin open-ended. */
export function etafHistogram(values: readonly number[]): EtafBin[] {
  const bins = Math.round(HISTOGRAM_TOP / HISTOGRAM_STEP);
  const out: EtafBin[] = Array.from({ length: bins + 1 }, (_, i) => ({
    from: Number((i * HISTOGRAM_STEP).toFixed(1)),
    to: i === bins ? null : Number(((i + 1) * HISTOGRAM_STEP).toFixed(1)),
    count: 0,
  }));
  for (const v of values) out[Math.min(bins, Math.max(0, Math.floor(v / HISTOGRAM_STEP + 1e-9)))]!.count++;
  return out;
}

/** Share of `values` at or below `value`, %. */
export function percentileRank(value: number, values: readonly number[]): number | null {
  if (values.length === 0) return null;
  return (100 * values.filter((v) => v <= value + 1e-12).length) / values.length;
}

export function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

/** Peers: same kind, ETo within ±10 % (a Rillmark rule). */
export const PEER_ETO_TOLERANCE = 0.1;

export function isPeer(
  a: { siteKind: string; etoIn: number | null },
  b: { siteKind: string; etoIn: number | null },
): boolean {
  if (a.siteKind !== b.siteKind || a.etoIn === null || b.etoIn === null) return false;
  return Math.abs(b.etoIn - a.etoIn) <= PEER_ETO_TOLERANCE * a.etoIn;
}
