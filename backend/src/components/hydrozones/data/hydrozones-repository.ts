import type { DataSource, EntityManager } from 'typeorm';
import type { IrrigationMethod, PlantWaterUseCategory } from '@shared/budgets/hydrozone';
import type { HydrozoneSort, SpecialLandscapeKind } from '@shared/hydrozones/hydrozone-dto';
import { escapeLike } from '../../users/data/users-repository';
import { HydrozoneEntity } from './hydrozone.entity';

export interface HydrozoneFields {
  name: string;
  areaFt2: number;
  plantWaterUse: PlantWaterUseCategory | null;
  plantFactor: number | null;
  irrigationMethod: IrrigationMethod;
  efficiencyOverride: number | null;
  specialLandscapeArea: boolean;
  specialLandscapeKind: SpecialLandscapeKind | null;
  designFlowGpm: number | null;
  emitterCount: number | null;
  emitterGph: number | null;
  soilIntakeInPerHour: number | null;
  notes: string;
}

export interface HydrozoneRecord extends HydrozoneFields {
  id: number;
  siteId: number;
  updatedAt: Date;
}

const SORT_COLUMNS: Record<HydrozoneSort, string> = {
  name: 'h.name',
  areaFt2: 'h.area_ft2',
  irrigationMethod: 'h.irrigation_method',
  updatedAt: 'h.updated_at',
};

export class HydrozonesRepository {
  constructor(private readonly db: DataSource) {}

  async list(
    siteId: number,
    f: { page: number; pageSize: number; sort: HydrozoneSort; dir: 'asc' | 'desc'; q?: string },
  ): Promise<{ rows: HydrozoneRecord[]; total: number }> {
    const qb = this.db.getRepository(HydrozoneEntity).createQueryBuilder('h').where('h.site_id = :siteId', { siteId });
    if (f.q) qb.andWhere('h.name LIKE :q', { q: `%${escapeLike(f.q)}%` });
    const [rows, total] = await qb
      .orderBy(SORT_COLUMNS[f.sort], f.dir === 'asc' ? 'ASC' : 'DESC')
      .addOrderBy('h.id', 'ASC')
      .skip(f.page * f.pageSize)
      .take(f.pageSize)
      .getManyAndCount();
    return { rows: rows.map(toRecord), total };
  }

  async all(siteId: number): Promise<HydrozoneRecord[]> {
    return (
      await this.db.getRepository(HydrozoneEntity).find({ where: { siteId }, order: { name: 'ASC', id: 'ASC' } })
    ).map(toRecord);
  }

  async find(siteId: number, id: number): Promise<HydrozoneRecord | null> {
    const row = await this.db.getRepository(HydrozoneEntity).findOneBy({ siteId, id });
    return row ? toRecord(row) : null;
  }

  async nameTaken(siteId: number, name: string, exceptId?: number): Promise<boolean> {
    const qb = this.db
      .getRepository(HydrozoneEntity)
      .createQueryBuilder('h')
      .where('h.site_id = :siteId AND h.name = :name', { siteId, name });
    if (exceptId) qb.andWhere('h.id <> :exceptId', { exceptId });
    return (await qb.getCount()) > 0;
  }

  async insert(em: EntityManager, siteId: number, fields: HydrozoneFields): Promise<number> {
    return Number((await em.getRepository(HydrozoneEntity).insert({ siteId, ...fields })).identifiers[0]!['id']);
  }

  async update(em: EntityManager, id: number, fields: Partial<HydrozoneFields>): Promise<void> {
    if (Object.keys(fields).length) await em.getRepository(HydrozoneEntity).update({ id }, fields);
  }

  async delete(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(HydrozoneEntity).delete({ id });
  }
}

function toRecord(h: HydrozoneEntity): HydrozoneRecord {
  return {
    id: h.id,
    siteId: h.siteId,
    name: h.name,
    areaFt2: h.areaFt2,
    plantWaterUse: h.plantWaterUse,
    plantFactor: h.plantFactor,
    irrigationMethod: h.irrigationMethod,
    efficiencyOverride: h.efficiencyOverride,
    specialLandscapeArea: Boolean(h.specialLandscapeArea),
    specialLandscapeKind: h.specialLandscapeKind,
    designFlowGpm: h.designFlowGpm,
    emitterCount: h.emitterCount,
    emitterGph: h.emitterGph,
    soilIntakeInPerHour: h.soilIntakeInPerHour,
    notes: h.notes,
    updatedAt: h.updatedAt,
  };
}
