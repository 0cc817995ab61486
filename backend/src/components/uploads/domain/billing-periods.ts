import type { EntityManager } from 'typeorm';
import { spreadPeriod } from '@shared/ingest/billing-spread';
import { resolveLocalTime, wallTimeAsUtcMs } from '@shared/ingest/zoned-time';
import { READING_FLAGS } from '@shared/readings/reading-flags';
import { toGallons } from '@shared/units/volume-units';
import type { RejectionDto } from '@shared/uploads/upload';
import type { BillingPeriodsRepository, StoredPeriod } from '../data/billing-periods-repository';
import { sqlUtc } from '../data/ingest-targets';
import type { DerivedVolume, RegisterReadsRepository } from '../data/register-reads-repository';
import type { IngestRefs } from './ingest-refs';

/** Daily ETo (mm) of a site's weather station over local dates, or null when the site has no station. */
export type DailyEto = (siteId: number, from: string, to: string) => Promise<Map<string, number | null> | null>;

export interface SpreadInput {
  uploadId: number;
  refs: IngestRefs;
  zoneOfSite: (siteId: number) => string;
  periods: BillingPeriodsRepository;
  volumes: RegisterReadsRepository;
  dailyEto: DailyEto;
}

export interface SpreadOutcome {
  /** Periods refused as double counting, per meter. */
  refusedByMeter: Map<number, number>;
  rejections: RejectionDto[];
}

/** The first instant of a local date in `zone` (a midnight skipped by DST: the first instant after it). */
function localMidnightMs(date: string, zone: string): number {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  const wall = { year, month, day, hour: 0, minute: 0, second: 0 };
  const r = resolveLocalTime(wall, zone);
  if (r.kind === 'unique') return r.utcMs;
  if (r.kind === 'ambiguous') return r.earlierUtcMs;
  const one = resolveLocalTime({ ...wall, hour: 1 }, zone);
  return one.kind === 'unique' ? one.utcMs : wallTimeAsUtcMs(wall);
}

const nextDate = (date: string) => new Date(Date.parse(`${date}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);

/** One period → its day volumes (start at local midnight, as long as the local day), and how it was spread. */
function dayVolumes(period: StoredPeriod, zone: string, eto: Map<string, number | null>) {
  const spread = spreadPeriod({ startDate: period.startDate, endDate: period.endDate, volume: period.original }, eto);
  const flag =
    (spread.method === 'eto' ? READING_FLAGS.spreadByEto : READING_FLAGS.spreadEvenly) |
    (period.estimated ? READING_FLAGS.estimated : 0);
  const volumes: DerivedVolume[] = spread.days.map((d) => {
    const start = localMidnightMs(d.date, zone);
    return {
      meterId: period.meterId,
      startSql: sqlUtc(new Date(start).toISOString()),
      minutes: Math.round((localMidnightMs(nextDate(d.date), zone) - start) / 60_000),
      gallons: toGallons(d.volume, period.unit),
      original: d.volume,
      unit: period.unit,
      flags: flag,
    };
  });
  return { method: spread.method, volumes };
}

/**
 * After an upload's billing periods are stored: refuses a period that overlaps another of the same meter in the
 * file, or another upload's readings of that meter (keeping both would count the water twice), and spreads each
 * other period over its local days into interval readings (flagged), in proportion to the site's daily ETo when
 * its weather covers the period, evenly otherwise.
 */
export async function spreadBillingPeriods(em: EntityManager, input: SpreadInput): Promise<SpreadOutcome> {
  const out: SpreadOutcome = { refusedByMeter: new Map(), rejections: [] };
  const byId = new Map([...input.refs.meters.values()].map((m) => [m.id, m]));
  const methods = { eto: 0, even: 0, days: 0 };
  let lastEnd = new Map<number, string>();
  for (const period of await input.periods.ofUpload(em, input.uploadId)) {
    const meter = byId.get(period.meterId)!;
    const zone = input.zoneOfSite(meter.siteId);
    const from = new Date(localMidnightMs(period.startDate, zone));
    const to = new Date(localMidnightMs(nextDate(period.endDate), zone));
    const previousEnd = lastEnd.get(period.meterId);
    const other =
      previousEnd !== undefined && previousEnd >= period.startDate
        ? 'another bill of this meter in the same file'
        : await input.periods
            .readingInside(em, period.meterId, from, to, input.uploadId)
            .then((u) => (u === null ? null : `readings of upload #${u}`));
    if (other) {
      await input.periods.remove(em, period.meterId, period.startDate, input.uploadId);
      out.refusedByMeter.set(period.meterId, (out.refusedByMeter.get(period.meterId) ?? 0) + 1);
      out.rejections.push({
        row: 0,
        column: null,
        kind: 'conflict',
        message:
          `meter ${meter.ref}, bill ${period.startDate} – ${period.endDate}: overlaps ${other}; not stored, so no ` +
          'water is counted twice. Roll back the other upload to use the bill instead.',
      });
      continue;
    }
    lastEnd = lastEnd.set(period.meterId, period.endDate);
    const eto = (await input.dailyEto(meter.siteId, period.startDate, period.endDate)) ?? new Map();
    const spread = dayVolumes(period, zone, eto);
    methods[spread.method]++;
    methods.days += spread.volumes.length;
    await input.periods.markSpread(em, period.meterId, period.startDate, spread.method);
    await input.volumes.insertVolumes(em, input.uploadId, spread.volumes);
  }
  if (methods.eto + methods.even > 0) {
    out.rejections.push({
      row: 0,
      column: null,
      kind: 'notice',
      message:
        `${methods.eto + methods.even} bill(s) spread over ${methods.days} day(s): ${methods.eto} in proportion ` +
        `to the daily ETo of the site's weather station, ${methods.even} evenly (the site's weather does not ` +
        'cover them; those days are flagged).',
    });
  }
  return out;
}
