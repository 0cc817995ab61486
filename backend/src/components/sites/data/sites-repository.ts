import type { DataSource, EntityManager, SelectQueryBuilder } from 'typeorm';
import type { OrganisationKind, ShareAccess, SiteRelation } from '@shared/auth/roles';
import type { SiteKind, SiteShareDto, SiteSort } from '@shared/sites/site';
import { OrganisationEntity } from '../../organisations/data/organisation.entity';
import { escapeLike } from '../../users/data/users-repository';
import { SiteShareEntity } from './site-share.entity';
import { SiteTagEntity } from './site-tag.entity';
import { SiteEntity } from './site.entity';
import { jsonArray } from '../../../db/json-array';

/** A site as the data layer returns it, with how the asking organisation relates to it. */
export interface SiteRecord {
  id: number;
  organisationId: number;
  organisationName: string;
  name: string;
  kind: SiteKind;
  address: string;
  timeZone: string;
  notes: string;
  tags: string[];
  relation: SiteRelation;
  /** When the owner shared the site with the asking organisation (null for its own sites). */
  sharedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}

export interface SiteListFilter {
  page: number;
  pageSize: number;
  sort: SiteSort;
  dir: 'asc' | 'desc';
  q?: string;
  tag?: string;
  kind?: SiteKind;
}

export interface SiteFields {
  name: string;
  kind: SiteKind;
  address: string;
  timeZone: string;
  notes: string;
}

const SORT_COLUMNS: Record<SiteSort, string> = {
  name: 's.name',
  kind: 's.kind',
  timeZone: 's.time_zone',
  organisationName: 'o.name',
  updatedAt: 's.updated_at',
};

/** Data access for sites, their tags and shares. Every read is scoped to what one organisation may see. */
export class SitesRepository {
  constructor(private readonly db: DataSource) {}

  /** Sites the organisation owns, plus those shared with it. */
  private visible(organisationId: number): SelectQueryBuilder<SiteEntity> {
    return this.db
      .getRepository(SiteEntity)
      .createQueryBuilder('s')
      .innerJoin(OrganisationEntity, 'o', 'o.id = s.organisation_id')
      .leftJoin(SiteShareEntity, 'sh', 'sh.site_id = s.id AND sh.organisation_id = :viewer', { viewer: organisationId })
      .where('(s.organisation_id = :viewer OR sh.organisation_id IS NOT NULL)');
  }

  async list(organisationId: number, f: SiteListFilter): Promise<{ rows: SiteRecord[]; total: number }> {
    const qb = this.visible(organisationId);
    if (f.q) qb.andWhere('(s.name LIKE :q OR s.address LIKE :q)', { q: `%${escapeLike(f.q)}%` });
    if (f.kind) qb.andWhere('s.kind = :kind', { kind: f.kind });
    if (f.tag) qb.andWhere('EXISTS (SELECT 1 FROM site_tag t WHERE t.site_id = s.id AND t.tag = :tag)', { tag: f.tag });
    const total = await qb.getCount();
    const raw = await withColumns(qb)
      .orderBy(SORT_COLUMNS[f.sort], f.dir === 'asc' ? 'ASC' : 'DESC')
      .addOrderBy('s.id', 'ASC')
      .offset(f.page * f.pageSize)
      .limit(f.pageSize)
      .getRawMany();
    return { rows: raw.map((r) => toRecord(r, organisationId)), total };
  }

  async findVisible(organisationId: number, siteId: number): Promise<SiteRecord | null> {
    const raw = await withColumns(this.visible(organisationId).andWhere('s.id = :siteId', { siteId })).getRawOne();
    if (!raw) return null;
    return toRecord(raw, organisationId);
  }

  /** Every site the organisation sees (an organisation's upload routes rows among them). */
  async allVisible(organisationId: number): Promise<SiteRecord[]> {
    const raw = await withColumns(this.visible(organisationId)).orderBy('s.name', 'ASC').getRawMany();
    return raw.map((r) => toRecord(r, organisationId));
  }

  async tags(organisationId: number): Promise<string[]> {
    const rows = await this.visible(organisationId)
      .innerJoin(SiteTagEntity, 't', 't.site_id = s.id')
      .select('DISTINCT t.tag', 'tag')
      .orderBy('t.tag', 'ASC')
      .getRawMany<{ tag: string }>();
    return rows.map((r) => r.tag);
  }

  async nameTaken(organisationId: number, name: string, exceptId?: number): Promise<boolean> {
    const qb = this.db
      .getRepository(SiteEntity)
      .createQueryBuilder('s')
      .where('s.organisation_id = :organisationId AND s.name = :name', { organisationId, name });
    if (exceptId) qb.andWhere('s.id <> :exceptId', { exceptId });
    return (await qb.getCount()) > 0;
  }

  async insert(em: EntityManager, organisationId: number, fields: SiteFields, tags: string[]): Promise<number> {
    const result = await em.getRepository(SiteEntity).insert({ organisationId, ...fields });
    const id = Number(result.identifiers[0]!['id']);
    await this.replaceTags(em, id, tags);
    return id;
  }

  async update(em: EntityManager, siteId: number, fields: Partial<SiteFields>): Promise<void> {
    if (Object.keys(fields).length) await em.getRepository(SiteEntity).update({ id: siteId }, fields);
  }

  async replaceTags(em: EntityManager, siteId: number, tags: string[]): Promise<void> {
    await em.getRepository(SiteTagEntity).delete({ siteId });
    if (tags.length) await em.getRepository(SiteTagEntity).insert(tags.map((tag) => ({ siteId, tag })));
  }

  async delete(em: EntityManager, siteId: number): Promise<void> {
    await em.getRepository(SiteEntity).delete({ id: siteId });
  }

  async shares(siteIds: number[]): Promise<Map<number, SiteShareDto[]>> {
    const map = new Map<number, SiteShareDto[]>();
    if (!siteIds.length) return map;
    const rows = await this.db
      .getRepository(SiteShareEntity)
      .createQueryBuilder('sh')
      .innerJoin(OrganisationEntity, 'o', 'o.id = sh.organisation_id')
      .select([
        'sh.site_id AS siteId',
        'sh.organisation_id AS organisationId',
        'o.name AS organisationName',
        'o.kind AS organisationKind',
        'sh.access AS access',
      ])
      .where('sh.site_id IN (:...siteIds)', { siteIds })
      .orderBy('o.name', 'ASC')
      .getRawMany();
    for (const r of rows) {
      const list = map.get(Number(r.siteId)) ?? [];
      list.push({
        organisationId: Number(r.organisationId),
        organisationName: r.organisationName,
        organisationKind: r.organisationKind as OrganisationKind,
        access: r.access as ShareAccess,
      });
      map.set(Number(r.siteId), list);
    }
    return map;
  }

  async upsertShare(em: EntityManager, siteId: number, organisationId: number, access: ShareAccess): Promise<void> {
    await em.getRepository(SiteShareEntity).upsert({ siteId, organisationId, access }, ['siteId', 'organisationId']);
  }

  async deleteShare(em: EntityManager, siteId: number, organisationId: number): Promise<boolean> {
    const r = await em.getRepository(SiteShareEntity).delete({ siteId, organisationId });
    return (r.affected ?? 0) > 0;
  }

  async organisationExists(organisationId: number): Promise<boolean> {
    return this.db.getRepository(OrganisationEntity).existsBy({ id: organisationId });
  }
}

function withColumns(qb: SelectQueryBuilder<SiteEntity>): SelectQueryBuilder<SiteEntity> {
  return qb.select([
    's.id AS id',
    's.organisation_id AS organisationId',
    'o.name AS organisationName',
    's.name AS name',
    's.kind AS kind',
    's.address AS address',
    's.time_zone AS timeZone',
    's.notes AS notes',
    's.created_at AS createdAt',
    's.updated_at AS updatedAt',
    'sh.access AS shareAccess',
    'sh.created_at AS sharedAt',
    // The tags in the same round trip (this runs behind every site-scoped request, through requireLevel).
    '(SELECT JSON_ARRAYAGG(t.tag ORDER BY t.tag) FROM site_tag t WHERE t.site_id = s.id) AS tagsJson',
  ]);
}

function toRecord(r: Record<string, unknown>, viewer: number): SiteRecord {
  const organisationId = Number(r['organisationId']);
  return {
    id: Number(r['id']),
    organisationId,
    organisationName: String(r['organisationName']),
    name: String(r['name']),
    kind: r['kind'] as SiteKind,
    address: String(r['address']),
    timeZone: String(r['timeZone']),
    notes: String(r['notes'] ?? ''),
    tags: jsonArray(r['tagsJson']),
    relation:
      organisationId === viewer ? { kind: 'owner' } : { kind: 'shared', access: r['shareAccess'] as ShareAccess },
    sharedAt: organisationId === viewer || !r['sharedAt'] ? null : new Date(r['sharedAt'] as string),
    createdAt: new Date(r['createdAt'] as string),
    updatedAt: new Date(r['updatedAt'] as string),
  };
}
