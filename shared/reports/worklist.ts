/**
 * The auditor's worklist: sites needing a look come first, each in its own group, and only sites with data and a
 * budget inside it are ranked as within budget. A site without readings is never "0 % of budget".
 */
import { rankByPercentOfBudget, type RankableSite, type RankedSite } from './compliance-ranking';

export const WORKLIST_GROUPS = [
  'over-budget',
  'incomplete-data',
  'open-alerts',
  'no-data',
  'no-budget',
  'within-budget',
] as const;
export type WorklistGroup = (typeof WORKLIST_GROUPS)[number];

export const WORKLIST_GROUP_LABELS: Record<WorklistGroup, string> = {
  'over-budget': 'Over budget',
  'incomplete-data': 'Incomplete data',
  'open-alerts': 'Open alerts',
  'no-data': 'No data',
  'no-budget': 'No budget',
  'within-budget': 'Within budget',
};

/** Below this share of the period's days metered, a site's figure is not trusted as it stands. */
export const COMPLETE_ENOUGH = 0.9;

export interface WorklistFacts {
  percentOfBudget: number | null;
  presentDays: number;
  expectedDays: number;
  completeness: number;
  openAlerts: number;
  budgetGal: number | null;
}

/** The one group a site goes in: over budget beats everything (more data only adds use), then missing data. */
export function worklistGroup(f: WorklistFacts): WorklistGroup {
  if (f.percentOfBudget !== null && f.percentOfBudget > 100) return 'over-budget';
  if (f.expectedDays > 0 && f.presentDays === 0) return 'no-data';
  if (f.completeness < COMPLETE_ENOUGH) return 'incomplete-data';
  if (f.openAlerts > 0) return 'open-alerts';
  if (f.budgetGal === null) return 'no-budget';
  return 'within-budget';
}

/** Groups in the worklist's order, each ranked by percent of budget (highest first); ranks run on across groups. */
export function rankWorklist<T extends RankableSite & { group: WorklistGroup }>(rows: readonly T[]): RankedSite<T>[] {
  const out: RankedSite<T>[] = [];
  for (const group of WORKLIST_GROUPS)
    for (const row of rankByPercentOfBudget(rows.filter((r) => r.group === group)))
      out.push({ ...row, rank: out.length + 1 });
  return out;
}
