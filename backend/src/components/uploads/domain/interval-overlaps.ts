import type { EntityManager } from 'typeorm';
import type { RejectionDto } from '@shared/uploads/upload';
import type { IntervalOverlapsRepository, MeterSpan } from '../data/interval-overlaps-repository';
import type { IngestRefs } from './ingest-refs';

const LISTED = 1000;
const utc = (v: unknown) => `${new Date(v as string).toISOString().slice(0, 16).replace('T', ' ')} UTC`;

export interface Withdrawn {
  withdrawn: number;
  byMeter: Map<number, number>;
  rejections: RejectionDto[];
}

/**
 * Same meter, overlapping time, different interval length (an hourly utility file and a 15-minute logger file, or a
 * bill spread over days): keeping both would count that water twice, and the key (meter, start, minutes) cannot see
 * it. Readings this upload just stored that overlap another upload's readings of another length are taken out again
 * and reported as conflicts. `known` are the upload's spans when the caller knows them exactly (every line sent was
 * stored); otherwise they are read back, which costs seconds per million rows.
 */
export async function withdrawLengthOverlaps(
  em: EntityManager,
  repo: IntervalOverlapsRepository,
  input: { uploadId: number; refs: IngestRefs; known?: MeterSpan[] },
): Promise<Withdrawn> {
  const meterRefs = new Map([...input.refs.meters.values()].map((m) => [m.id, m.ref]));
  const spans = input.known ?? (await repo.storedSpans(em, input.uploadId));
  const out: Withdrawn = { withdrawn: 0, byMeter: new Map(), rejections: [] };
  for (const span of spans) {
    if (!(await repo.anyOtherLength(em, span, input.uploadId))) continue;
    for (const p of await repo.overlaps(em, span.meterId, input.uploadId)) {
      const n = await repo.withdraw(em, span.meterId, p, input.uploadId);
      out.withdrawn += n;
      out.byMeter.set(span.meterId, (out.byMeter.get(span.meterId) ?? 0) + n);
      if (out.rejections.length >= LISTED) continue;
      out.rejections.push({
        row: 0,
        column: null,
        kind: 'conflict',
        message:
          `meter ${meterRefs.get(span.meterId)}, ${p.minutes} min from ${utc(p.start)}: overlaps a stored ` +
          `${p.otherMinutes}-minute reading from ${utc(p.otherStart)} (upload #${p.otherUpload}); not stored, ` +
          'so no water is counted twice. Roll back one of the two uploads to keep the other.',
      });
    }
  }
  return out;
}
