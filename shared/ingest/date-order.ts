/**
 * Day-first or month-first: decided from a whole file's numeric dates (`13/06/2026`, `6.8.2026`), never guessed.
 * A first field above 12 anywhere means day-first; a second field above 12 means month-first. A file whose dates
 * all fit both orders (every field up to 12), or that shows both kinds of evidence, cannot decide by itself: a
 * person chooses (the upload field `dateOrder`, a saved import profile, or the organisation's usual order).
 */

export const DATE_ORDERS = ['month-first', 'day-first'] as const;
export type DateOrder = (typeof DATE_ORDERS)[number];

export const DATE_ORDER_LABELS: Record<DateOrder, string> = {
  'month-first': 'month first (m/d/yyyy)',
  'day-first': 'day first (d/m/yyyy)',
};

/** The first date of a file that shows one order: its row and text. */
export interface DateOrderClue {
  row: number;
  text: string;
}

/** What a file's numeric dates say, collected as its rows are read. */
export class DateOrderEvidence {
  /** A first field above 12: only day-first reads it. */
  dayFirst: DateOrderClue | null = null;
  /** A second field above 12: only month-first reads it. */
  monthFirst: DateOrderClue | null = null;
  /** Numeric dates seen (either order possible or not). */
  numericDates = 0;

  observe(first: number, second: number, row: number, text: string): void {
    this.numericDates++;
    if (first > 12 && second <= 12 && this.dayFirst === null) this.dayFirst = { row, text };
    else if (second > 12 && first <= 12 && this.monthFirst === null) this.monthFirst = { row, text };
  }

  /** Folds another file part's evidence in (e.g. the preview's rows with the rest). */
  merge(other: DateOrderEvidence): void {
    this.numericDates += other.numericDates;
    this.dayFirst ??= other.dayFirst;
    this.monthFirst ??= other.monthFirst;
  }

  /** The order the dates show by themselves: one order, `both` (contradictory) or null (none, or every fits). */
  get shown(): DateOrder | 'both' | null {
    if (this.dayFirst && this.monthFirst) return 'both';
    if (this.dayFirst) return 'day-first';
    if (this.monthFirst) return 'month-first';
    return null;
  }
}

export type DateOrderDecision =
  /** The file has no numeric dates: nothing to decide. */
  | { kind: 'not-needed' }
  | { kind: 'decided'; order: DateOrder; source: 'chosen' | 'file' | 'organisation'; clue: DateOrderClue | null }
  /** Every numeric date fits both orders, and nobody chose: ask. */
  | { kind: 'ambiguous'; numericDates: number }
  /** Some dates only fit day-first, others only month-first, and nobody chose: ask. */
  | { kind: 'contradictory'; dayFirst: DateOrderClue; monthFirst: DateOrderClue };

export interface DateOrderChoices {
  /** Chosen for this file (upload field or import profile): wins over the file's own evidence. */
  chosen?: DateOrder;
  /** The organisation's usual order: used only when the file cannot decide. */
  organisationDefault?: DateOrder | null;
}

export function decideDateOrder(evidence: DateOrderEvidence, choices: DateOrderChoices = {}): DateOrderDecision {
  if (evidence.numericDates === 0) return { kind: 'not-needed' };
  const shown = evidence.shown;
  if (choices.chosen) {
    const clue = choices.chosen === 'day-first' ? evidence.dayFirst : evidence.monthFirst;
    return { kind: 'decided', order: choices.chosen, source: 'chosen', clue };
  }
  if (shown === 'day-first') return { kind: 'decided', order: shown, source: 'file', clue: evidence.dayFirst };
  if (shown === 'month-first') return { kind: 'decided', order: shown, source: 'file', clue: evidence.monthFirst };
  if (shown === 'both')
    return { kind: 'contradictory', dayFirst: evidence.dayFirst!, monthFirst: evidence.monthFirst! };
  if (choices.organisationDefault) {
    return { kind: 'decided', order: choices.organisationDefault, source: 'organisation', clue: null };
  }
  return { kind: 'ambiguous', numericDates: evidence.numericDates };
}

/** The order to read with while the whole file has not been seen (the head's evidence, else a choice, else m/d). */
export function provisionalDateOrder(head: DateOrderEvidence, choices: DateOrderChoices = {}): DateOrder {
  const decided = decideDateOrder(head, choices);
  return decided.kind === 'decided' ? decided.order : (choices.organisationDefault ?? 'month-first');
}

const clueText = (c: DateOrderClue) => `${c.text} on row ${c.row}`;

/** One sentence for the preview and the upload result, e.g. `day-first: 13/06/2026 on row 290`. */
export function describeDateOrder(decision: DateOrderDecision): string {
  switch (decision.kind) {
    case 'not-needed':
      return 'No day/month dates to decide (ISO dates or spreadsheet serials).';
    case 'decided': {
      const why =
        decision.source === 'chosen'
          ? 'as chosen'
          : decision.source === 'organisation'
            ? "the organisation's usual order; every date in the file fits both orders"
            : `shown by ${clueText(decision.clue!)}`;
      return `Dates read ${DATE_ORDER_LABELS[decision.order]}: ${why}.`;
    }
    case 'ambiguous':
      return (
        `All ${decision.numericDates} dates fit both day-first and month-first ` +
        '(no day above 12); choose the order.'
      );
    case 'contradictory':
      return (
        `The dates disagree: ${clueText(decision.dayFirst)} is day-first but ` +
        `${clueText(decision.monthFirst)} is month-first; choose the order (dates that do not fit it are not stored).`
      );
  }
}
