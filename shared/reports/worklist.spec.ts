import { describe, expect, it } from 'vitest';
import { rankWorklist, worklistGroup, type WorklistFacts } from './worklist';

const facts = (f: Partial<WorklistFacts>): WorklistFacts => ({
  percentOfBudget: 80,
  presentDays: 30,
  expectedDays: 30,
  completeness: 1,
  openAlerts: 0,
  budgetGal: 1000,
  ...f,
});

describe('auditor worklist', () => {
  it('when a site has no readings at all, then it is in "no data", never ranked as compliant', () => {
    expect(worklistGroup(facts({ percentOfBudget: null, presentDays: 0, completeness: 0 }))).toBe('no-data');
  });

  it('when a site is over budget, then that group wins over missing days and open alerts', () => {
    expect(worklistGroup(facts({ percentOfBudget: 120, presentDays: 10, completeness: 1 / 3, openAlerts: 2 }))).toBe(
      'over-budget',
    );
  });

  it('when some days are missing, or alerts are open, or no budget exists, then each has its own group', () => {
    expect(worklistGroup(facts({ presentDays: 20, completeness: 2 / 3 }))).toBe('incomplete-data');
    expect(worklistGroup(facts({ openAlerts: 1 }))).toBe('open-alerts');
    expect(worklistGroup(facts({ percentOfBudget: null, budgetGal: null }))).toBe('no-budget');
    expect(worklistGroup(facts({}))).toBe('within-budget');
  });

  it('when ranked, then groups come in worklist order, each by percent of budget, with ranks running on', () => {
    const rows = [
      { siteId: 1, siteName: 'A', percentOfBudget: 90, group: 'within-budget' as const },
      { siteId: 2, siteName: 'B', percentOfBudget: null, group: 'no-data' as const },
      { siteId: 3, siteName: 'C', percentOfBudget: 140, group: 'over-budget' as const },
      { siteId: 4, siteName: 'D', percentOfBudget: 60, group: 'incomplete-data' as const },
      { siteId: 5, siteName: 'E', percentOfBudget: 95, group: 'within-budget' as const },
      { siteId: 6, siteName: 'F', percentOfBudget: 110, group: 'over-budget' as const },
    ];
    const ranked = rankWorklist(rows);
    expect(ranked.map((r) => [r.rank, r.siteId])).toEqual([
      [1, 3],
      [2, 6],
      [3, 4],
      [4, 2],
      [5, 5],
      [6, 1],
    ]);
  });
});
