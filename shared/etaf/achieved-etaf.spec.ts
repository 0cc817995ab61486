import { describe, expect, it } from 'vitest';
import {
  achievedEtaf,
  allowanceEtaf,
  defaultEtafSetting,
  etafHistogram,
  median,
  percentileRank,
} from './achieved-etaf';
import { etafRows, sortEtafRows, type EtafSiteFigures } from './etaf-ranking';

const site = (id: number, over: Partial<EtafSiteFigures> = {}): EtafSiteFigures => ({
  siteId: id,
  siteName: `Site ${id}`,
  siteKind: 'office-park',
  organisationName: 'Invented Org',
  tags: [],
  landscapeAreaFt2: 10_000,
  specialLandscapeAreaFt2: 0,
  useGal: 0,
  etoIn: 50,
  meteredDays: 365,
  periodDays: 365,
  allowedEtaf: 0.45,
  allowedBasis: 'non-residential',
  problem: null,
  ...over,
});

describe('achieved ETAF', () => {
  it('when a site uses exactly its MWELO allowance, then its achieved ETAF is the allowed one', () => {
    const mawa = 50 * 0.62 * 0.45 * 10_000;
    expect(achievedEtaf(mawa, 50, 10_000)).toBeCloseTo(0.45, 12);
    expect(achievedEtaf(100, 0, 10_000)).toBeNull();
    expect(achievedEtaf(100, 50, 0)).toBeNull();
  });

  it('counts special landscape areas at ETAF 1.0 in the allowance', () => {
    expect(allowanceEtaf(0.45, 10_000, 2_000)).toBeCloseTo(0.45 + 0.55 * 0.2, 12);
    expect(allowanceEtaf(0.55, 0, 0)).toBeNull();
  });

  it('defaults from the kind of site', () => {
    expect(defaultEtafSetting('hoa-common-area')).toEqual({ allowedEtaf: 0.55, basis: 'residential' });
    expect(defaultEtafSetting('park')).toEqual({ allowedEtaf: 0.45, basis: 'non-residential' });
  });

  it('bins, ranks and finds the median', () => {
    const bins = etafHistogram([0.05, 0.45, 0.45, 2]);
    expect(bins).toHaveLength(16);
    expect(bins[0]!.count).toBe(1);
    expect(bins[4]!.count).toBe(2);
    expect(bins[15]).toEqual({ from: 1.5, to: null, count: 1 });
    expect(percentileRank(0.45, [0.3, 0.45, 0.6, 0.9])).toBe(50);
    expect(median([3, 1, 2, 4])).toBe(2.5);
  });
});

describe('ETAF ranking', () => {
  const perEtaf = (etaf: number) => etaf * 50 * 0.62 * 10_000;
  const rows = etafRows([
    site(1, { useGal: perEtaf(0.6) }),
    site(2, { useGal: perEtaf(0.3) }),
    site(3, { useGal: 0.4 * 70 * 0.62 * 10_000, etoIn: 70 }),
    site(4, { useGal: perEtaf(0.2), meteredDays: 200 }),
    site(5, { landscapeAreaFt2: 0 }),
    site(6, { useGal: perEtaf(0.5), siteKind: 'park' }),
  ]);

  it('ranks complete sites from the lowest achieved ETAF', () => {
    expect(rows.map((r) => r.rank)).toEqual([4, 1, 2, null, null, 3]);
    expect(rows[0]!.achievedEtaf).toBeCloseTo(0.6, 12);
    expect(rows[3]!.problem).toMatch(/200 of 365/);
    expect(rows[4]!.problem).toMatch(/No hydrozones/);
  });

  it('compares a site with sites of its kind and climate only', () => {
    // Sites 1 and 2: same kind and ETo; site 3's ETo is 40 % higher and site 6 is a park.
    expect(rows[0]!.peerCount).toBe(2);
    expect(rows[0]!.peerPercentile).toBe(100);
    expect(rows[1]!.peerPercentile).toBe(50);
    expect(rows[2]!.peerCount).toBe(1);
  });

  it('sorts with missing values last either way', () => {
    expect(sortEtafRows(rows, 'achievedEtaf', 'desc').map((r) => r.siteId)).toEqual([1, 6, 3, 2, 4, 5]);
    expect(sortEtafRows(rows, 'rank', 'asc').map((r) => r.siteId)).toEqual([2, 3, 6, 1, 4, 5]);
  });
});
