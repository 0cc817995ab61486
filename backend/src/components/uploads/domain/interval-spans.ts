import type { MeterSpan } from '../data/interval-overlaps-repository';

/** `2026-11-01 08:00:00` (a DATETIME in UTC) → the instant. */
const instant = (sql: string) => new Date(`${sql.slice(0, 10)}T${sql.slice(11)}Z`);

interface LengthSpan {
  first: string;
  last: string;
  count: number;
}

/**
 * The first and last start of each interval length per meter, collected as an interval file's lines are sent.
 * After a direct load every line sent was stored, so these equal what SQL would find under the upload id, without
 * reading a million rows back (that took seconds per million rows). Times are compared as DATETIME text, which
 * sorts in time order.
 */
export class IntervalSpans {
  private readonly byMeter = new Map<number, Map<number, LengthSpan>>();
  private lastMeterId = -1;
  private lastLengths: Map<number, LengthSpan> | undefined;

  add(meterId: number, startSql: string, minutes: number): void {
    if (meterId !== this.lastMeterId) {
      this.lastMeterId = meterId;
      this.lastLengths = this.byMeter.get(meterId);
      if (!this.lastLengths) this.byMeter.set(meterId, (this.lastLengths = new Map()));
    }
    const span = this.lastLengths!.get(minutes);
    if (!span) this.lastLengths!.set(minutes, { first: startSql, last: startSql, count: 1 });
    else {
      span.count++;
      if (startSql < span.first) span.first = startSql;
      else if (startSql > span.last) span.last = startSql;
    }
  }

  /** Lines sent per meter (after a direct load, the readings stored per meter). */
  countsByMeter(): Map<number, number> {
    const out = new Map<number, number>();
    for (const [meterId, lengths] of this.byMeter) {
      let n = 0;
      for (const span of lengths.values()) n += span.count;
      out.set(meterId, n);
    }
    return out;
  }

  /** Per meter, over the lengths up to `maxMinutes`: earliest start, latest end, the lengths seen. */
  meterSpans(maxMinutes: number): MeterSpan[] {
    const out: MeterSpan[] = [];
    for (const [meterId, lengths] of this.byMeter) {
      let first: string | null = null;
      let lastEnd = -Infinity;
      const seen: number[] = [];
      for (const [minutes, span] of lengths) {
        if (minutes > maxMinutes) continue;
        seen.push(minutes);
        if (first === null || span.first < first) first = span.first;
        lastEnd = Math.max(lastEnd, instant(span.last).getTime() + minutes * 60_000);
      }
      if (first !== null) out.push({ meterId, first: instant(first), last: new Date(lastEnd), lengths: seen });
    }
    return out;
  }

  /** Earliest and latest start over the lines of the meters `include` accepts (null when none was sent). */
  overall(include: (meterId: number) => boolean = () => true): { from: Date; to: Date } | null {
    let first: string | null = null;
    let last: string | null = null;
    for (const [meterId, lengths] of this.byMeter) {
      if (!include(meterId)) continue;
      for (const span of lengths.values()) {
        if (first === null || span.first < first) first = span.first;
        if (last === null || span.last > last) last = span.last;
      }
    }
    return first === null || last === null ? null : { from: instant(first), to: instant(last) };
  }
}
