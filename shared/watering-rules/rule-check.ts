/**
 * Checks a site's watering against the agency rule in force: each controller run (or, for a site with no runtime
 * log, each stretch of metered watering) that fell on a day or at an hour the rule does not allow, or ran longer
 * than the rule's minutes per station. Manual runs are judged too but kept apart: the log says a person started
 * them (hand-watering a dry spot, a repair test), which many rules treat differently. Pure.
 */
import { HOUR_MS, inLocalWindow, localDateTimeOf, localHourOf } from '../watch/site-clock';
import { runWatered, type MeterHour, type ZoneRun } from '../watch/watch-inputs';
import { dayAllowed, ruleInForce, type SiteRule } from './watering-rule';

export const BREACH_REASONS = ['day', 'hours', 'minutes'] as const;
export type BreachReason = (typeof BREACH_REASONS)[number];

export const BREACH_REASON_LABELS: Record<BreachReason, string> = {
  day: 'not a watering day',
  hours: 'outside the allowed hours',
  minutes: 'longer than the station limit',
};

export interface RuleBreach {
  ruleId: number;
  /** Null for metered watering, which the meter cannot pin on a station. */
  zoneId: string | null;
  startUtc: number;
  minutes: number;
  /** The log marks the run as started by hand. */
  manual: boolean;
  source: 'log' | 'meter';
  reasons: BreachReason[];
  /** Local `YYYY-MM-DD HH:MM` and month of the start, in the site's zone. */
  localStart: string;
  month: string;
}

/**
 * A metered hour counts as watering when it used at least this share of a typical watering hour (the median of the
 * site's busiest 2 % of hours, at least three) and at least 1 gal (common practice, no source; docs/references.md §7),
 * so that a small leak or base flow is not taken for watering.
 */
export const METERED_WATERING_SHARE = 0.25;

export function checkWatering(input: {
  rules: readonly SiteRule[];
  runs: readonly ZoneRun[];
  meterHours?: readonly MeterHour[];
  timeZone: string;
}): RuleBreach[] {
  if (input.rules.length === 0) return [];
  const watered = input.runs.filter(runWatered);
  const stretches =
    input.runs.length > 0 || !input.meterHours ? watered.map(fromRun) : meteredStretches(input.meterHours);
  const out: RuleBreach[] = [];
  for (const s of stretches) {
    const start = localHourOf(s.startUtc, input.timeZone);
    const r = ruleInForce(input.rules, start.date);
    if (!r) continue;
    const reasons: BreachReason[] = [];
    if (dayAllowed(r, start.date) === false) reasons.push('day');
    const lastMinute = localHourOf(s.startUtc + Math.max(0, s.minutes - 1) * 60_000, input.timeZone).hour;
    if (!inLocalWindow(start.hour, r.rule.allowedHours) || !inLocalWindow(lastMinute, r.rule.allowedHours))
      reasons.push('hours');
    if (s.source === 'log' && r.rule.maxStationMinutes !== null && s.minutes > r.rule.maxStationMinutes)
      reasons.push('minutes');
    if (reasons.length === 0) continue;
    out.push({
      ruleId: r.rule.id,
      ...s,
      reasons,
      localStart: localDateTimeOf(s.startUtc, input.timeZone),
      month: start.month,
    });
  }
  return out.sort((a, b) => a.startUtc - b.startUtc);
}

type Stretch = Pick<RuleBreach, 'zoneId' | 'startUtc' | 'minutes' | 'manual' | 'source'>;

function fromRun(run: ZoneRun): Stretch {
  return {
    zoneId: run.zoneId,
    startUtc: run.startUtc,
    minutes: run.minutes,
    manual: run.cause === 'manual',
    source: 'log',
  };
}

/** Consecutive metered hours that look like watering, each stretch as one "run" of whole hours. */
function meteredStretches(hours: readonly MeterHour[]): Stretch[] {
  if (hours.length === 0) return [];
  const sorted = [...hours].sort((a, b) => a.startUtc - b.startUtc);
  const volumes = sorted.map((h) => h.gallons).sort((a, b) => a - b);
  const busiest = volumes.slice(-Math.max(3, Math.ceil(volumes.length * 0.02)));
  const typical = busiest[Math.floor(busiest.length / 2)]!;
  const limit = Math.max(1, typical * METERED_WATERING_SHARE);
  const out: Stretch[] = [];
  for (const h of sorted) {
    if (h.gallons < limit) continue;
    const last = out[out.length - 1];
    if (last && last.startUtc + last.minutes * 60_000 === h.startUtc) last.minutes += 60;
    else
      out.push({
        zoneId: null,
        startUtc: Math.floor(h.startUtc / HOUR_MS) * HOUR_MS,
        minutes: 60,
        manual: false,
        source: 'meter',
      });
  }
  return out;
}
