/**
 * Watering rules as a water agency publishes them, by stage: which days, which hours, how many minutes per station,
 * and the dates each stage is in force. Restrictions are set by the local water agency; Rillmark only records what
 * the agency entered and checks logs against it, it never decides what is allowed. Pure types and rules.
 */
import type { LocalHourWindow } from '../watch/watch-inputs';

/** How the allowed days are given: every day, fixed weekdays, odd/even dates by address number, or per site. */
export const DAY_MODES = ['any', 'weekdays', 'odd-even', 'assigned'] as const;
export type DayMode = (typeof DAY_MODES)[number];

export const DAY_MODE_LABELS: Record<DayMode, string> = {
  any: 'Any day',
  weekdays: 'Set weekdays for everyone',
  'odd-even': 'Odd/even dates by address number',
  assigned: 'Assigned weekdays per site',
};

/** 0 = Sunday … 6 = Saturday, as JavaScript's getUTCDay. */
export const WEEKDAY_LABELS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'] as const;

/** One stage of an agency's rule. Hours are local wall-clock hours of each site, [start, end), wrapping midnight. */
export interface WateringRule {
  id: number;
  name: string;
  stage: string;
  dayMode: DayMode;
  /** For `weekdays`: the days watering is allowed. */
  weekdays: number[];
  allowedHours: LocalHourWindow;
  /** Longest run allowed per station, or null for no limit. */
  maxStationMinutes: number | null;
  /** `YYYY-MM-DD`, both inclusive; `inForceTo` null = until further notice. */
  inForceFrom: string;
  inForceTo: string | null;
}

/** A site under a rule: its street number (for odd/even dates) or its assigned weekdays. */
export interface RuleAssignment {
  siteId: number;
  addressNumber: number | null;
  assignedWeekdays: number[];
}

export interface WateringRuleDto extends WateringRule {
  sites: (RuleAssignment & { siteName: string })[];
  updatedAt: string;
}

export type WateringRuleInput = Omit<WateringRule, 'id'> & { sites: RuleAssignment[] };

/** A rule as it applies to one site. */
export interface SiteRule {
  rule: WateringRule;
  assignment: RuleAssignment;
}

/** The rule in force at a site on a local date (the latest stage to start wins when stages overlap). */
export function ruleInForce(rules: readonly SiteRule[], date: string): SiteRule | null {
  let best: SiteRule | null = null;
  for (const r of rules) {
    if (r.rule.inForceFrom > date || (r.rule.inForceTo !== null && r.rule.inForceTo < date)) continue;
    if (!best || r.rule.inForceFrom > best.rule.inForceFrom) best = r;
  }
  return best;
}

/** The first number of a street address ("1420 Vale Rd" → 1420), for odd/even rules; null when there is none. */
export function addressNumberOf(address: string): number | null {
  const m = /^\s*(\d{1,9})/.exec(address);
  return m ? Number(m[1]) : null;
}

/**
 * Whether watering is allowed on a local date under the rule: null when the rule cannot tell (odd/even without an
 * address number, assigned days without any assigned).
 */
export function dayAllowed(r: SiteRule, date: string): boolean | null {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  const weekday = new Date(Date.UTC(y, m - 1, d)).getUTCDay();
  switch (r.rule.dayMode) {
    case 'any':
      return true;
    case 'weekdays':
      return r.rule.weekdays.includes(weekday);
    case 'odd-even':
      return r.assignment.addressNumber === null ? null : r.assignment.addressNumber % 2 === d % 2;
    case 'assigned':
      return r.assignment.assignedWeekdays.length === 0 ? null : r.assignment.assignedWeekdays.includes(weekday);
  }
}

/** "Mon, Wed, Fri" */
export function weekdaysText(days: readonly number[]): string {
  return [...days]
    .sort((a, b) => a - b)
    .map((d) => WEEKDAY_LABELS[d])
    .join(', ');
}

/** A rule's days in words, for one site when given. */
export function daysText(rule: WateringRule, assignment?: RuleAssignment): string {
  switch (rule.dayMode) {
    case 'any':
      return 'any day';
    case 'weekdays':
      return weekdaysText(rule.weekdays);
    case 'odd-even':
      if (!assignment) return 'odd dates for odd address numbers, even dates for even ones';
      if (assignment.addressNumber === null) return 'odd/even dates (no address number on record)';
      return assignment.addressNumber % 2 ? 'odd dates' : 'even dates';
    case 'assigned':
      return assignment ? weekdaysText(assignment.assignedWeekdays) || 'no days assigned' : 'assigned per site';
  }
}

/** "21:00–06:00" */
export function hoursText(w: LocalHourWindow): string {
  const h = (n: number) => `${String(n).padStart(2, '0')}:00`;
  return `${h(w.startHour)}–${h(w.endHour)}`;
}
