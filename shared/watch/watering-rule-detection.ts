/**
 * "Watering outside the rules": one finding per site and local month in which scheduled (or unmarked) runs broke
 * the agency rule in force, with the runs listed; manual runs that broke it are listed apart and never raise the
 * finding on their own. The rules themselves are the local water agency's; the text says so.
 */
import { BREACH_REASON_LABELS, checkWatering, type RuleBreach } from '../watering-rules/rule-check';
import { completeFinding, type Finding } from './finding';
import type { SiteWatchInput, WatchContext } from './watch-inputs';
import { zoneName } from './watch-inputs';

/** Runs listed in the explanation; the chart and the worklist carry all of them. */
const LISTED = 12;
/** From this many rule-breaking runs in a month the alert asks for action soon, not just a look. */
const ACT_SOON_BREACHES = 4;

export const RULES_DEFER =
  'Watering restrictions are set by the local water agency: check its current rules before changing a schedule.';

export function detectRuleBreaches(input: SiteWatchInput, ctx: WatchContext): Finding[] {
  const rules = input.wateringRules ?? [];
  if (rules.length === 0) return [];
  const breaches = checkWatering({
    rules,
    runs: input.runs,
    ...(input.meterHours ? { meterHours: input.meterHours } : {}),
    timeZone: ctx.site.timeZone,
  });
  const months = new Map<string, RuleBreach[]>();
  for (const b of breaches) months.set(b.month, [...(months.get(b.month) ?? []), b]);
  return [...months].flatMap(([month, all]) => {
    const counted = all.filter((b) => !b.manual);
    if (counted.length === 0) return [];
    const manual = all.filter((b) => b.manual);
    const first = counted[0]!;
    const last = counted[counted.length - 1]!;
    const endOf = (b: RuleBreach) => b.startUtc + b.minutes * 60_000;
    const count = (reason: RuleBreach['reasons'][number]) => counted.filter((b) => b.reasons.includes(reason)).length;
    return [
      completeFinding(
        {
          kind: 'watering-rules',
          subKind: 'outside-rules',
          scope: month,
          periodStartUtc: first.startUtc,
          periodEndUtc: endOf(last),
          detectedAtUtc: endOf(first),
          ongoing: false,
          severity: counted.length >= ACT_SOON_BREACHES ? 'act-soon' : 'watch',
          evidence: {
            runsOutsideRules: counted.length,
            manualRunsOutsideRules: manual.length,
            minutesOutsideRules: counted.reduce((s, b) => s + b.minutes, 0),
            notAWateringDay: count('day'),
            outsideAllowedHours: count('hours'),
            overStationLimit: count('minutes'),
            fromMeterOnly: counted.filter((b) => b.source === 'meter').length,
          },
          series: [
            { label: 'Runs outside the rules, minutes', unit: 'min', points: points(counted) },
            ...(manual.length
              ? [
                  {
                    label: 'Manual runs outside the rules (shown apart), minutes',
                    unit: 'min' as const,
                    points: points(manual),
                  },
                ]
              : []),
          ],
          waterLostGal: null,
          explanation: explain(counted, manual, ctx),
          pricingMonth: month,
        },
        ctx.site,
        ctx.thresholds,
      ),
    ];
  });
}

function points(list: readonly RuleBreach[]) {
  return list.map((b) => ({ atUtc: b.startUtc, value: b.minutes }));
}

function line(b: RuleBreach, ctx: WatchContext): string {
  const where = b.zoneId === null ? 'metered watering' : zoneName(ctx.zones, b.zoneId);
  return `${b.localStart} ${where}, ${b.minutes} min: ${b.reasons.map((r) => BREACH_REASON_LABELS[r]).join(', ')}`;
}

function explain(counted: readonly RuleBreach[], manual: readonly RuleBreach[], ctx: WatchContext): string {
  const listed = counted.slice(0, LISTED).map((b) => line(b, ctx));
  const more = counted.length > LISTED ? [`… and ${counted.length - LISTED} more.`] : [];
  const manualText = manual.length
    ? [
        `Manual runs, shown apart (${manual.length}): ${manual
          .slice(0, LISTED)
          .map((b) => line(b, ctx))
          .join('; ')}.`,
      ]
    : [];
  return [
    `${counted.length} run(s) broke the watering rule in force:`,
    `${listed.join('; ')}.`,
    ...more,
    ...manualText,
    RULES_DEFER,
  ].join(' ');
}
