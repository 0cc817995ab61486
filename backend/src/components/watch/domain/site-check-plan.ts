import { resolveThresholds } from '@shared/watch/alert-thresholds';
import { localHourOf } from '@shared/watch/site-clock';
import type { SiteStateRow } from '../data/watch-data-repository';
import { LOOK_BACK_MS } from './site-watch-input';

/**
 * Whether a run checks a site, and from when. A re-check always looks at its range. Otherwise a site is checked
 * only when it has data newer than last time, or when its silence has just grown long enough to flag; the window
 * starts the longest look-back before the first new data. A scheduled run also waits until the site's local clock
 * has passed the night hour, once per local date (`night` is that date, to be remembered).
 */
export function planSiteCheck(
  trigger: 'scheduled' | 'manual' | 'recheck',
  rangeFrom: Date | undefined,
  timeZone: string,
  state: SiteStateRow | undefined,
  latest: Date | null,
  asOf: Date,
  localHour: number,
  overrides?: Record<string, number>,
): { fromUtc: Date; night: string | null } | null {
  if (trigger === 'recheck') return { fromUtc: new Date((rangeFrom ?? asOf).getTime() - LOOK_BACK_MS), night: null };
  let night: string | null = null;
  if (trigger === 'scheduled') {
    const local = localHourOf(asOf.getTime(), timeZone);
    if (local.hour < localHour || state?.lastNight === local.date) return null;
    night = local.date;
  }
  const lastSeen = state?.lastDataUtc ?? null;
  const hasNewData = latest !== null && (lastSeen === null || latest > lastSeen);
  const silentMs = resolveThresholds(overrides).silentHours * 3_600_000;
  const lastAsOf = state?.lastCheckedAsOfUtc ?? null;
  const silenceJustLong =
    latest !== null &&
    asOf.getTime() - latest.getTime() >= silentMs &&
    (lastAsOf === null || lastAsOf.getTime() - latest.getTime() < silentMs);
  if (!hasNewData && !silenceJustLong) return null;
  const firstNew = lastSeen && hasNewData ? lastSeen : asOf;
  return { fromUtc: new Date(Math.min(firstNew.getTime(), asOf.getTime()) - LOOK_BACK_MS), night };
}
