/**
 * Silent meter: the meter stops telling us anything. Either no readings arrive for `silentHours`, or it reads
 * zero on days the controller says zones watered (broken register, or a bypass around the meter). Water lost is
 * unknown here; the harm is that every other check is blind.
 */
import { formatVolume } from '../units/format-quantity';
import { completeFinding, type Finding } from './finding';
import { groupConsecutive, itemAtCount, type TimelineHour } from './hour-timeline';
import { HOUR_MS } from './site-clock';
import type { WatchContext } from './watch-inputs';

export function detectNoReads(timeline: readonly TimelineHour[], ctx: WatchContext): Finding[] {
  const t = ctx.thresholds;
  const gaps: Array<{ start: number; end: number; ongoing: boolean; month: string }> = [];
  const missing = timeline.filter((h) => h.gallons === null);
  for (const g of groupConsecutive(missing, (a, b) => b.startUtc - a.startUtc === HOUR_MS)) {
    gaps.push({
      start: g[0]!.startUtc,
      end: g[g.length - 1]!.startUtc + HOUR_MS,
      ongoing: false,
      month: g[0]!.local.month,
    });
  }
  const last = timeline[timeline.length - 1];
  if (last)
    gaps.push({
      start: last.startUtc + HOUR_MS,
      end: Math.max(last.startUtc + HOUR_MS, ctx.asOfUtc),
      ongoing: true,
      month: last.local.month,
    });
  return gaps
    .filter((g) => (g.end - g.start) / HOUR_MS >= t.silentHours)
    .map((g) => {
      const hours = Math.round((g.end - g.start) / HOUR_MS);
      return completeFinding(
        {
          kind: 'silent-meter',
          subKind: 'no-reads',
          periodStartUtc: g.start,
          periodEndUtc: g.end,
          detectedAtUtc: g.start + t.silentHours * HOUR_MS,
          ongoing: g.ongoing,
          evidence: { silentHours: hours },
          series: [],
          waterLostGal: null,
          severity: 'act-soon',
          explanation:
            `No readings for ${(hours / 24).toFixed(1)} days${g.ongoing ? ' and counting' : ''}; ` +
            'until the meter reports again no leak or overspend can be seen.',
          pricingMonth: g.month,
        },
        ctx.site,
        t,
      );
    });
}

export function detectZeroWhileRunning(timeline: readonly TimelineHour[], ctx: WatchContext): Finding[] {
  const t = ctx.thresholds;
  const days = new Map<string, { date: string; first: number; last: number; expected: number; metered: number }>();
  for (const h of timeline) {
    if (h.gallons === null || h.expectedGal <= 0) continue;
    const day = days.get(h.local.date) ?? {
      date: h.local.date,
      first: h.startUtc,
      last: h.startUtc,
      expected: 0,
      metered: 0,
    };
    day.last = h.startUtc;
    day.expected += h.expectedGal;
    day.metered += h.gallons;
    days.set(h.local.date, day);
  }
  const judged = [...days.values()]
    .filter((d) => d.expected >= t.zeroFlowMinExpectedGal)
    .sort((a, b) => a.first - b.first)
    .map((d) => ({ ...d, zero: d.metered <= t.zeroFlowMaxShare * d.expected }));
  const lastDay = judged[judged.length - 1];
  const episodes = groupConsecutive(judged, (a, b) => a.zero && b.zero).filter(
    (g) => g[0]!.zero && g.length >= t.zeroFlowMinDays,
  );
  return episodes.map((episode) => {
    const unmeasured = episode.reduce((s, d) => s + d.expected - d.metered, 0);
    const first = episode[0]!;
    const last = episode[episode.length - 1]!;
    return completeFinding(
      {
        kind: 'silent-meter',
        subKind: 'zero-while-running',
        periodStartUtc: first.first,
        periodEndUtc: last.last + HOUR_MS,
        detectedAtUtc: itemAtCount(episode, t.zeroFlowMinDays).last + HOUR_MS,
        ongoing: last === lastDay,
        evidence: {
          days: episode.length,
          expectedGal: episode.reduce((s, d) => s + d.expected, 0),
          meteredGal: episode.reduce((s, d) => s + d.metered, 0),
          unmeasuredGal: unmeasured,
        },
        series: [
          {
            label: 'Expected from runs, gallons per day',
            unit: 'gal',
            points: judged.map((d) => ({ atUtc: d.first, value: d.expected })),
          },
          {
            label: 'Metered while running, gallons per day',
            unit: 'gal',
            points: judged.map((d) => ({ atUtc: d.first, value: d.metered })),
          },
        ],
        waterLostGal: null,
        severity: 'act-soon',
        explanation:
          `On ${episode.length} watering days the zones should have drawn ` +
          `${formatVolume(unmeasured, 'gal')} but the meter read next to ` +
          'nothing: it is broken or bypassed.',
        pricingMonth: timeline.find((h) => h.startUtc === first.first)!.local.month,
      },
      ctx.site,
      t,
    );
  });
}
