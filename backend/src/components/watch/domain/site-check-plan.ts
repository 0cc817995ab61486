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
export interface SiteCheckQuestion {
  trigger: 'scheduled' | 'manual' | 'recheck';
  /** A re-check's range start. */
  rangeFrom?: Date;
  timeZone: string;
  state: SiteStateRow | undefined;
  /** The site's newest reading or runtime start. */
  latest: Date | null;
  asOf: Date;
  /** Local hour after which a scheduled night check is due. */
  localHour: number;
  overrides?: Record<string, number>;
}

export function planSiteCheck(q: SiteCheckQuestion): { fromUtc: Date; night: string | null } | null {
  const { trigger, rangeFrom, timeZone, state, latest, asOf, localHour, overrides } = q;
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
