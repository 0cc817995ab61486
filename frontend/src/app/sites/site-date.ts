import { resolveLocalTime } from '@shared/ingest/zoned-time';

/** The calendar date (YYYY-MM-DD) on the site's clock at `at`: a site's days start at its local midnight. */
export function siteDate(timeZone: string, at: Date = new Date()): string {
  const parts = new Intl.DateTimeFormat('en-US', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).formatToParts(at);
  const part = (type: string) => parts.find((p) => p.type === type)!.value;
  return `${part('year')}-${part('month')}-${part('day')}`;
}

/**
 * The UTC instant (ISO) of local midnight starting `date` in the site's zone; 01:00 where midnight is skipped by DST.
 */
export function siteMidnight(date: string, timeZone: string): string {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  for (const hour of [0, 1]) {
    const r = resolveLocalTime({ year, month, day, hour, minute: 0, second: 0 }, timeZone);
    if (r.kind === 'unique') return new Date(r.utcMs).toISOString();
    if (r.kind === 'ambiguous') return new Date(r.earlierUtcMs).toISOString();
  }
  throw new RangeError(`${date} has no midnight in ${timeZone}`);
}

/** "1–14 Dec 2026": the span month-to-date figures cover, ending `today`. */
export function monthToDateLabel(today: string): string {
  const date = new Date(`${today}T12:00:00Z`);
  const month = date.toLocaleString('en-US', { month: 'short', year: 'numeric', timeZone: 'UTC' });
  const day = date.getUTCDate();
  return day === 1 ? `1 ${month}` : `1–${day} ${month}`;
}
