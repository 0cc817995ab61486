import type { DataSource, EntityManager } from 'typeorm';
import type { PlanInput, PlanSort, PlanStatus, ZoneChange } from '@shared/planner/plan-dto';
import { WhatIfPlanEntity } from './what-if-plan.entity';

export interface PlanRecord extends Required<Omit<PlanInput, 'smartControllerReductionPercent'>> {
  id: number;
  siteId: number;
  smartControllerReductionPercent: number | null;
  status: PlanStatus;
  savingsProjectId: number | null;
  carriedOutOn: string | null;
  createdAt: Date;
  updatedAt: Date;
}

export interface PlanListFilter {
  page: number;
  pageSize: number;
  sort: PlanSort;
  dir: 'asc' | 'desc';
  q?: string;
}

const SORT_COLUMNS: Record<PlanSort, string> = { updatedAt: 'p.updated_at', title: 'p.title', status: 'p.status' };

/** What-if plans of a site; callers check access to the site first. */
export class PlansRepository {
  constructor(private readonly db: DataSource) {}

  async list(siteId: number, f: PlanListFilter): Promise<{ rows: PlanRecord[]; total: number }> {
    const qb = this.db.getRepository(WhatIfPlanEntity).createQueryBuilder('p').where('p.site_id = :siteId', { siteId });
    if (f.q) qb.andWhere('p.title LIKE :q', { q: `%${f.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%` });
    const [rows, total] = await qb
      .orderBy(SORT_COLUMNS[f.sort], f.dir === 'asc' ? 'ASC' : 'DESC')
      .addOrderBy('p.id', 'DESC')
      .skip(f.page * f.pageSize)
      .take(f.pageSize)
      .getManyAndCount();
    return { rows: rows.map(toRecord), total };
  }

  async find(id: number): Promise<PlanRecord | null> {
    const row = await this.db.getRepository(WhatIfPlanEntity).findOneBy({ id });
    return row ? toRecord(row) : null;
  }

  async insert(em: EntityManager, siteId: number, createdBy: number, input: PlanInput): Promise<number> {
    const result = await em.getRepository(WhatIfPlanEntity).insert({ notes: '', siteId, createdBy, ...columns(input) });
    return Number(result.identifiers[0]!['id']);
  }

  async update(em: EntityManager, id: number, input: Partial<PlanInput>): Promise<void> {
    const patch = columns(input);
    if (Object.keys(patch).length) await em.getRepository(WhatIfPlanEntity).update({ id }, patch);
  }

  async markCarriedOut(em: EntityManager, id: number, savingsProjectId: number, on: string): Promise<void> {
    await em
      .getRepository(WhatIfPlanEntity)
      .update({ id }, { status: 'carried-out', savingsProjectId, carriedOutOn: on });
  }

  async delete(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(WhatIfPlanEntity).delete({ id });
  }
}

function columns(input: Partial<PlanInput>): Partial<WhatIfPlanEntity> {
  const out: Partial<WhatIfPlanEntity> = {};
  if (input.title !== undefined) out.title = input.title;
  if (input.notes !== undefined) out.notes = input.notes;
  if (input.weatherYear !== undefined) out.weatherYear = input.weatherYear;
  if (input.costOfWork !== undefined) out.costOfWork = input.costOfWork;
  if (input.currency !== undefined) out.currency = input.currency;
  if (input.smartControllerReductionPercent !== undefined)
    out.smartControllerPercent = input.smartControllerReductionPercent;
  if (input.rainSensor !== undefined) out.rainSensor = input.rainSensor;
  if (input.zoneChanges !== undefined) out.zoneChanges = JSON.stringify(input.zoneChanges);
  return out;
}

function toRecord(r: WhatIfPlanEntity): PlanRecord {
  return {
    id: r.id,
    siteId: r.siteId,
    title: r.title,
    notes: r.notes,
    weatherYear: r.weatherYear,
    costOfWork: r.costOfWork,
    currency: r.currency,
    smartControllerReductionPercent: r.smartControllerPercent,
    rainSensor: Boolean(r.rainSensor),
    zoneChanges: JSON.parse(r.zoneChanges) as ZoneChange[],
    status: r.status,
    savingsProjectId: r.savingsProjectId,
    carriedOutOn: r.carriedOutOn === null ? null : dateOnly(r.carriedOutOn),
    createdAt: r.createdAt,
    updatedAt: r.updatedAt,
  };
}

function dateOnly(value: string | Date): string {
  return value instanceof Date ? value.toISOString().slice(0, 10) : String(value).slice(0, 10);
}
