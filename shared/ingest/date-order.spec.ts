import { describe, expect, it } from 'vitest';
import { DateOrderEvidence, decideDateOrder, describeDateOrder } from './date-order';

function evidenceOf(dates: string[]): DateOrderEvidence {
  const evidence = new DateOrderEvidence();
  dates.forEach((text, i) => {
    const [a, b] = text.split('/').map(Number);
    evidence.observe(a!, b!, i + 2, text);
  });
  return evidence;
}

describe('decideDateOrder', () => {
  it('when a first field is above 12 anywhere, then the file is day-first, and the evidence names the row', () => {
    const decision = decideDateOrder(evidenceOf(['01/06/2026', '12/06/2026', '13/06/2026']));
    expect(decision).toEqual({
      kind: 'decided',
      order: 'day-first',
      source: 'file',
      clue: { row: 4, text: '13/06/2026' },
    });
    expect(describeDateOrder(decision)).toBe('Dates read day first (d/m/yyyy): shown by 13/06/2026 on row 4.');
  });

  it('when a second field is above 12, then month-first', () => {
    expect(decideDateOrder(evidenceOf(['06/01/2026', '06/13/2026']))).toMatchObject({ order: 'month-first' });
  });

  it('when every date fits both orders, then it asks, unless the organisation has a usual order', () => {
    const evidence = evidenceOf(['01/06/2026', '01/07/2026']);
    expect(decideDateOrder(evidence)).toEqual({ kind: 'ambiguous', numericDates: 2 });
    expect(decideDateOrder(evidence, { organisationDefault: 'day-first' })).toMatchObject({
      order: 'day-first',
      source: 'organisation',
    });
  });

  it('when the dates disagree, then it asks even with an organisation default; a choice wins', () => {
    const evidence = evidenceOf(['13/06/2026', '06/14/2026']);
    expect(decideDateOrder(evidence, { organisationDefault: 'day-first' }).kind).toBe('contradictory');
    expect(decideDateOrder(evidence, { chosen: 'month-first' })).toMatchObject({
      order: 'month-first',
      source: 'chosen',
    });
  });

  it('when there are no numeric dates, then nothing is decided or asked', () => {
    expect(decideDateOrder(new DateOrderEvidence()).kind).toBe('not-needed');
  });
});
