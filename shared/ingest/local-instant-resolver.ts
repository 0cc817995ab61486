/**
 * Turns parsed timestamps into UTC instants in the site's zone, with the DST policy for row sequences:
 * - Fall-back (a local hour happens twice): the first occurrence in a meter's rows is the earlier instant; once a
 *   meter's rows have reached or passed that instant, the same wall time again means the later instant. So
 *   01:00, 01:15 … 01:45, 01:00, 01:15 … map to PDT then PST. Rows must be in time order per key (utility exports
 *   are); a file sorted any other way cannot be disambiguated from wall times alone.
 * - Spring-forward (a local hour does not exist): the row is an ERROR, not shifted. A reading stamped 02:30 on a
 *   day that skips 02:00–03:00 means the exporter's clock or the site's zone is wrong; guessing would misplace
 *   water use by an hour, silently.
 * - Values that carry `Z` or an offset are exact and need no zone.
 */
import type { ParsedTimestamp } from './timestamp-parsing';
import { formatWallTime, resolveLocalTime, type WallTime } from './zoned-time';

export type ResolvedInstant = { ok: true; utcMs: number } | { ok: false; message: string };

type ParsedOk = Extract<ParsedTimestamp, { ok: true }>;

export function springGapMessage(wall: WallTime, zone: string): string {
  return (
    `${formatWallTime(wall)} does not exist in ${zone} (clocks spring ` +
    "forward past it); check the export's clock or the site's time zone"
  );
}

export interface InstantResolver {
  /**
   * Resolves a timestamp for the row sequence named by `key` (a meter, or a controller and station), in `zone` (the
   * resolver's own zone unless a file of many sites names the row's site zone).
   */
  resolve(key: string, parsed: ParsedOk, zone?: string): ResolvedInstant;
  /** Resolves a wall time to the first instant not before `notBeforeUtcMs` (a run's end after its start). */
  resolveNotBefore(parsed: ParsedOk, notBeforeUtcMs: number, zone?: string): ResolvedInstant;
}

export function createInstantResolver(defaultZone: string): InstantResolver {
  // Boxed so that moving a key's latest instant on (every row of a big file) is a field write, not a Map.set.
  const latestByKey = new Map<string, { ms: number }>();

  const remember = (key: string, utcMs: number) => {
    const latest = latestByKey.get(key);
    if (latest === undefined) latestByKey.set(key, { ms: utcMs });
    else if (utcMs > latest.ms) latest.ms = utcMs;
  };

  return {
    resolve(key, parsed, zone = defaultZone) {
      if (parsed.kind === 'instant') {
        remember(key, parsed.utcMs);
        return { ok: true, utcMs: parsed.utcMs };
      }
      const r = resolveLocalTime(parsed.wall, zone);
      if (r.kind === 'gap') return { ok: false, message: springGapMessage(parsed.wall, zone) };
      let utcMs: number;
      if (r.kind === 'unique') utcMs = r.utcMs;
      else {
        const latest = latestByKey.get(key);
        utcMs = latest !== undefined && latest.ms >= r.earlierUtcMs ? r.laterUtcMs : r.earlierUtcMs;
      }
      remember(key, utcMs);
      return { ok: true, utcMs };
    },
    resolveNotBefore(parsed, notBeforeUtcMs, zone = defaultZone) {
      if (parsed.kind === 'instant') return { ok: true, utcMs: parsed.utcMs };
      const r = resolveLocalTime(parsed.wall, zone);
      if (r.kind === 'gap') return { ok: false, message: springGapMessage(parsed.wall, zone) };
      if (r.kind === 'unique') return { ok: true, utcMs: r.utcMs };
      return { ok: true, utcMs: r.earlierUtcMs >= notBeforeUtcMs ? r.earlierUtcMs : r.laterUtcMs };
    },
  };
}
