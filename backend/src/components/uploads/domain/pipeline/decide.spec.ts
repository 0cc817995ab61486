import { describe, expect, it } from 'vitest';
import { DateOrderEvidence } from '@shared/ingest/date-order';
import type { IngestRefs } from '../ingest-refs';
import { UnitFindings } from '../unit-findings';
import { decideStaged, type StagedFacts } from './decide';

const refs: IngestRefs = {
  meters: new Map([
    [
      'M-1',
      {
        id: 7,
        ref: 'M-1',
        siteId: 1,
        unit: 'ft3',
        firstInstalledMs: null,
        removedMs: null,
        registers: [],
        multiplier: 1,
        digits: null,
      },
    ],
  ]),
  controllers: new Map(),
  zones: new Map(),
  zoneSites: new Map(),
  ambiguous: new Map([['M-2', ['North', 'South']]]),
};
const ctx = { fileName: 'usage.csv', choices: {}, refs, organisationWide: false };

function facts(over: Partial<StagedFacts> = {}): StagedFacts {
  return {
    direct: false,
    staged: 10,
    linesSent: 10,
    readOrder: undefined,
    dateEvidence: new DateOrderEvidence(),
    unknownRefs: new Map(),
    units: new UnitFindings(),
    ...over,
  };
}

function evidence(first: number, second: number, row = 2): DateOrderEvidence {
  const e = new DateOrderEvidence();
  e.observe(first, second, row, `${first}/${second}/2026`);
  return e;
}

describe('decideStaged', () => {
  it('when every date fits both orders and nobody chose, then nothing is stored and the error is named', () => {
    const decision = decideStaged(facts({ dateEvidence: evidence(1, 6) }), ctx);
    expect(decision.action).toBe('refuse');
    if (decision.action === 'refuse') {
      expect(decision.error.code).toBe('date_order_ambiguous');
      expect(decision.error.details).toEqual([{ field: 'dateOrder', message: expect.stringMatching(/choose/) }]);
    }
  });

  it('when the whole file shows another order than the one read with, then it is read again in that order', () => {
    const decision = decideStaged(facts({ dateEvidence: evidence(13, 6, 290), readOrder: 'month-first' }), ctx);
    expect(decision).toMatchObject({ action: 'restage', dateOrder: 'day-first' });
  });

  it('when the order read with is the one decided, then it merges and the notice names the evidence', () => {
    const decision = decideStaged(facts({ dateEvidence: evidence(13, 6, 290), readOrder: 'day-first' }), ctx);
    expect(decision.action).toBe('merge');
    if (decision.action === 'merge')
      expect(decision.notices[0]!.message).toBe('Dates read day first (d/m/yyyy): shown by 13/6/2026 on row 290.');
  });

  it('when a direct load skipped lines, then the file goes through the stage', () => {
    expect(decideStaged(facts({ direct: true, staged: 9 }), ctx)).toMatchObject({ action: 'restage' });
  });

  it("when the meter's unit was used or the file's differs, then both are said; unknown refs are listed once", () => {
    const units = new UnitFindings();
    units.usedMeterUnit(7);
    units.fileUnitDiffers(7, 'gal');
    const unknownRefs = new Map([
      ['meter\u0000X-9', { field: 'meter' as const, ref: 'X-9', rows: 12, firstRows: [4, 5, 6, 7, 8, 9, 10, 11] }],
      ['meter\u0000M-2', { field: 'meter' as const, ref: 'M-2', rows: 1, firstRows: [3] }],
    ]);
    const decision = decideStaged(facts({ units, unknownRefs }), ctx);
    if (decision.action !== 'merge') throw new Error(decision.action);
    expect(decision.notices.map((n) => n.message)).toEqual([
      "The file names no unit: each meter's own unit was used (M-1 in ft³).",
      "Meter M-1 is set up in ft³, but the file gives its volumes in gal; the file's unit was used. " +
        "Check the meter's unit or the file.",
    ]);
    expect(decision.unknown[0]).toMatchObject({ row: 4, kind: 'unknown', ref: { ref: 'X-9', rows: 12 } });
    expect(decision.unknown[0]!.message).toMatch(/12 row\(s\) not imported \(rows 4, 5, 6, 7, 8, 9, 10, 11, …\)/);
    expect(decision.unknown[1]!.message).toMatch(/several sites \(North, South\)/);
  });
});
