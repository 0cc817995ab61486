import { localHourOf, localMidnightUtc, nextDate } from '@shared/watch/site-clock';

/**
 * The moment a nightly job would first have seen something detectable at `detectedAtUtc`: the next time the site's
 * clock passed the night hour, never later than the run's "as of". A re-check files findings at these moments.
 */
export function replayNight(detectedAtUtc: number, timeZone: string, localHour: number, asOf: Date): Date {
  const local = localHourOf(detectedAtUtc, timeZone);
  const date = local.hour < localHour ? local.date : nextDate(local.date);
  const night = localMidnightUtc(date, timeZone) + localHour * 3_600_000;
  return new Date(Math.min(night, asOf.getTime()));
}
