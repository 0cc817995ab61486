/**
 * The auditor's ranking: sites ordered by how far over budget they are, most over first.
 */

export interface RankableSite {
  siteId: number;
  siteName: string;
  /** null when the site has no budget for the period; such sites go last. */
  percentOfBudget: number | null;
}

export type RankedSite<T extends RankableSite> = T & { rank: number };

// Code-unit comparison, not localeCompare: the browser and the server must order identically.
const compareText = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);

/**
 * Sorts by percent of budget, highest first; sites without a budget last; ties by name (case-folded, then exact)
 * and finally by id, so the same data always gives the same order. Ranks are 1, 2, 3… in that order.
 */
export function rankByPercentOfBudget<T extends RankableSite>(sites: readonly T[]): RankedSite<T>[] {
  for (const site of sites) {
    if (site.percentOfBudget !== null && !Number.isFinite(site.percentOfBudget))
      throw new RangeError(`Site ${site.siteId}: percent of budget must be a finite number or null`);
  }
  const sorted = [...sites].sort((a, b) => {
    if (a.percentOfBudget === null || b.percentOfBudget === null) {
      if (a.percentOfBudget !== b.percentOfBudget) return a.percentOfBudget === null ? 1 : -1;
    } else if (a.percentOfBudget !== b.percentOfBudget) {
      return b.percentOfBudget - a.percentOfBudget;
    }
    return (
      compareText(a.siteName.toLowerCase(), b.siteName.toLowerCase()) ||
      compareText(a.siteName, b.siteName) ||
      a.siteId - b.siteId
    );
  });
  return sorted.map((site, index) => ({ ...site, rank: index + 1 }));
}
