import { describe, expect, it } from 'vitest';
import { rankByPercentOfBudget } from './compliance-ranking';

// Invented sites.
const sites = [
  { siteId: 4, siteName: 'Willow Court', percentOfBudget: 96.5 },
  { siteId: 2, siteName: 'Alder Park', percentOfBudget: 131.2 },
  { siteId: 9, siteName: 'no-budget median', percentOfBudget: null },
  { siteId: 7, siteName: 'birch row', percentOfBudget: 110 },
  { siteId: 3, siteName: 'Birch Row', percentOfBudget: 110 },
  { siteId: 8, siteName: 'Cedar Walk', percentOfBudget: 110 },
  { siteId: 5, siteName: 'Cedar Walk', percentOfBudget: 110 },
  { siteId: 1, siteName: 'Aspen Lane', percentOfBudget: null },
];

describe('compliance ranking', () => {
  it('when sorting, then most over budget first, ties by name then id, sites without a budget last', () => {
    const ranked = rankByPercentOfBudget(sites);
    expect(ranked.map((s) => s.siteId)).toEqual([2, 3, 7, 5, 8, 4, 1, 9]);
    expect(ranked.map((s) => s.rank)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
  });

  it('when the input order changes, then the ranking does not', () => {
    const expected = rankByPercentOfBudget(sites).map((s) => s.siteId);
    expect(rankByPercentOfBudget([...sites].reverse()).map((s) => s.siteId)).toEqual(expected);
    expect(
      rankByPercentOfBudget([
        sites[5]!,
        sites[0]!,
        sites[7]!,
        sites[3]!,
        sites[1]!,
        sites[6]!,
        sites[2]!,
        sites[4]!,
      ]).map((s) => s.siteId),
    ).toEqual(expected);
  });

  it('when given extra fields, then they are kept and the input is not reordered', () => {
    const withArea = sites.map((s) => ({ ...s, area: 'North' }));
    const ranked = rankByPercentOfBudget(withArea);
    expect(ranked[0]).toMatchObject({ siteId: 2, area: 'North', rank: 1 });
    expect(withArea[0]!.siteId).toBe(4);
  });

  it('when a percent is NaN, then it refuses rather than sorting unpredictably', () => {
    expect(() => rankByPercentOfBudget([{ siteId: 1, siteName: 'X', percentOfBudget: Number.NaN }])).toThrow(
      RangeError,
    );
  });
});
