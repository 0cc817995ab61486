import { In, type DataSource, type EntityManager } from 'typeorm';
import type { BillingUnit, VolumeCharge } from '@shared/rates/rate-schedule';
import type { RateScheduleDto, RateScheduleInput } from '@shared/rates/rate-schedule-dto';
import { RateScheduleEntity } from './rate-schedule.entity';

export class RateSchedulesRepository {
  constructor(private readonly db: DataSource) {}

  /** Every schedule of the site, oldest first (few per site, so no paging). */
  async all(siteId: number): Promise<RateScheduleDto[]> {
    return (
      await this.db.getRepository(RateScheduleEntity).find({ where: { siteId }, order: { effectiveFrom: 'ASC' } })
    ).map(toDto);
  }

  /** Every schedule of each site, oldest first; sites without one are absent from the map. */
  async allOfSites(siteIds: number[]): Promise<Map<number, RateScheduleDto[]>> {
    const map = new Map<number, RateScheduleDto[]>();
    if (!siteIds.length) return map;
    const rows = await this.db
      .getRepository(RateScheduleEntity)
      .find({ where: { siteId: In(siteIds) }, order: { siteId: 'ASC', effectiveFrom: 'ASC' } });
    for (const row of rows) map.set(row.siteId, [...(map.get(row.siteId) ?? []), toDto(row)]);
    return map;
  }

  async find(siteId: number, id: number): Promise<RateScheduleDto | null> {
    const row = await this.db.getRepository(RateScheduleEntity).findOneBy({ siteId, id });
    return row ? toDto(row) : null;
  }

  async startTaken(siteId: number, effectiveFrom: string, exceptId?: number): Promise<boolean> {
    const qb = this.db
      .getRepository(RateScheduleEntity)
      .createQueryBuilder('r')
      .where('r.site_id = :siteId AND r.effective_from = :effectiveFrom', { siteId, effectiveFrom });
    if (exceptId) qb.andWhere('r.id <> :exceptId', { exceptId });
    return (await qb.getCount()) > 0;
  }

  async insert(em: EntityManager, siteId: number, input: RateScheduleInput): Promise<number> {
    return Number(
      (await em.getRepository(RateScheduleEntity).insert({ siteId, ...columns(input) })).identifiers[0]!['id'],
    );
  }

  async update(em: EntityManager, id: number, input: RateScheduleInput): Promise<void> {
    await em.getRepository(RateScheduleEntity).update({ id }, columns(input));
  }

  async delete(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(RateScheduleEntity).delete({ id });
  }
}

function columns(input: RateScheduleInput) {
  return {
    name: input.name,
    unit: input.unit,
    currency: input.currency,
    fixedChargePerPeriod: input.fixedChargePerPeriod,
    structure: JSON.stringify(input.volumeCharge),
    effectiveFrom: input.effectiveFrom,
  };
}

function toDto(r: RateScheduleEntity): RateScheduleDto {
  return {
    id: r.id,
    siteId: r.siteId,
    name: r.name,
    unit: r.unit as BillingUnit,
    currency: r.currency,
    fixedChargePerPeriod: r.fixedChargePerPeriod,
    volumeCharge: JSON.parse(r.structure) as VolumeCharge,
    effectiveFrom: r.effectiveFrom,
    updatedAt: r.updatedAt.toISOString(),
  };
}
