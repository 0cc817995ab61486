/** `2026-11-01 08:00:00` (a DATETIME in UTC) → the instant. */
const instant = (sql: string) => new Date(`${sql.slice(0, 10)}T${sql.slice(11)}Z`);

export interface MeterSpan {
  meterId: number;
  /** Earliest start. */
  first: Date;
  /** Latest end (start + minutes). */
  last: Date;
  lengths: number[];
}

/**
 * The first and last start of each interval length per meter, collected as an interval file's lines are sent.
 * After a direct load every line sent was stored, so these equal what SQL would find under the upload id, without
 * reading a million rows back (that took seconds per million rows). Times are compared as DATETIME text, which
 * sorts in time order.
 */
export class IntervalSpans {
  private readonly byMeter = new Map<number, Map<number, { first: string; last: string }>>();
  private lastMeterId = -1;
  private lastLengths: Map<number, { first: string; last: string }> | undefined;

  add(meterId: number, startSql: string, minutes: number): void {
    if (meterId !== this.lastMeterId) {
      this.lastMeterId = meterId;
      this.lastLengths = this.byMeter.get(meterId);
      if (!this.lastLengths) this.byMeter.set(meterId, (this.lastLengths = new Map()));
    }
    const span = this.lastLengths!.get(minutes);
    if (!span) this.lastLengths!.set(minutes, { first: startSql, last: startSql });
    else if (startSql < span.first) span.first = startSql;
    else if (startSql > span.last) span.last = startSql;
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

  /** Earliest and latest start over every line (null when none was sent). */
  overall(): { from: Date; to: Date } | null {
    let first: string | null = null;
    let last: string | null = null;
    for (const lengths of this.byMeter.values()) {
      for (const span of lengths.values()) {
        if (first === null || span.first < first) first = span.first;
        if (last === null || span.last > last) last = span.last;
      }
    }
    return first === null || last === null ? null : { from: instant(first), to: instant(last) };
  }
}
