import type { DataSource, EntityManager } from 'typeorm';
import type { EtafBasis, EtafSettingInput } from '@shared/etaf/etaf-dto';
import type { SiteKind } from '@shared/sites/site';
import { jsonArray } from '../../../db/json-array';
import { SiteEtafSettingEntity } from './site-etaf-setting.entity';

export interface EtafSettingRecord {
  siteId: number;
  allowedEtaf: number;
  basis: EtafBasis;
  updatedAt: Date;
}

/** One visible site's sums over whole months, as read; the ETAF arithmetic happens in shared/etaf. */
export interface EtafSiteRow {
  siteId: number;
  siteName: string;
  siteKind: SiteKind;
  organisationName: string;
  tags: string[];
  landscapeAreaFt2: number;
  specialLandscapeAreaFt2: number;
  useGal: number;
  meteredDays: number;
  /** Sum of the cached monthly ETo, mm; null unless every month of the period has one. */
  etoMm: number | null;
  budgetProblem: string | null;
  setting: { allowedEtaf: number; basis: EtafBasis } | null;
}

export interface EtafFilter {
  kind?: SiteKind;
  tag?: string;
  q?: string;
}

/**
 * Settings, and the portfolio-wide sums ETAF needs in one query: hydrozone areas, metered use from the monthly
 * rollup and ETo from the monthly budget cache (which BudgetCache keeps filled), over every site the
 * organisation may see. Read-only use of those tables, as the portfolio's own aggregate query does.
 */
export class EtafRepository {
  constructor(private readonly db: DataSource) {}

  async setting(siteId: number): Promise<EtafSettingRecord | null> {
    const row = await this.db.getRepository(SiteEtafSettingEntity).findOneBy({ siteId });
    return row ? { ...row, basis: row.basis as EtafBasis } : null;
  }

  async saveSetting(em: EntityManager, siteId: number, input: EtafSettingInput, userId: number): Promise<void> {
    await em.getRepository(SiteEtafSettingEntity).upsert({ siteId, ...input, updatedBy: userId }, ['siteId']);
  }

  async visibleSiteIds(viewerOrgId: number, f: EtafFilter): Promise<number[]> {
    const { where, params } = filterSql(f);
    const rows: { id: number }[] = await this.db.query(
      `SELECT s.id FROM site s LEFT JOIN site_share sh ON sh.site_id = s.id AND sh.organisation_id = ?
       WHERE (s.organisation_id = ? OR sh.organisation_id IS NOT NULL) ${where}`,
      [viewerOrgId, viewerOrgId, ...params],
    );
    return rows.map((r) => Number(r.id));
  }

  async siteRows(viewerOrgId: number, f: EtafFilter, fromMonth: string, toMonth: string): Promise<EtafSiteRow[]> {
    const { where, params } = filterSql(f);
    const months = monthCount(fromMonth, toMonth);
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT s.id AS siteId, s.name AS siteName, s.kind AS siteKind, o.name AS organisationName,
              (SELECT JSON_ARRAYAGG(t.tag ORDER BY t.tag) FROM site_tag t WHERE t.site_id = s.id) AS tagsJson,
              COALESCE(z.area, 0) AS area, COALESCE(z.sla, 0) AS sla,
              COALESCE(u.gal, 0) AS gal, COALESCE(u.days, 0) AS days,
              IF(COALESCE(b.n, 0) = ?, b.eto, NULL) AS eto, b.problem AS problem,
              st.allowed_etaf AS allowedEtaf, st.basis AS basis
       FROM site s
       JOIN organisation o ON o.id = s.organisation_id
       LEFT JOIN site_share sh ON sh.site_id = s.id AND sh.organisation_id = ?
       LEFT JOIN (SELECT site_id, SUM(area_ft2) AS area, SUM(IF(special_landscape_area, area_ft2, 0)) AS sla
                  FROM hydrozone GROUP BY site_id) z ON z.site_id = s.id
       LEFT JOIN (SELECT site_id, SUM(gallons) AS gal, SUM(days) AS days FROM site_monthly_use
                  WHERE month BETWEEN ? AND ? GROUP BY site_id) u ON u.site_id = s.id
       LEFT JOIN (SELECT site_id, SUM(eto_mm) AS eto, COUNT(eto_mm) AS n, MAX(problem) AS problem
                  FROM site_monthly_budget WHERE month BETWEEN ? AND ? GROUP BY site_id) b ON b.site_id = s.id
       LEFT JOIN site_etaf_setting st ON st.site_id = s.id
       WHERE (s.organisation_id = ? OR sh.organisation_id IS NOT NULL) ${where}`,
      [months, viewerOrgId, fromMonth, toMonth, fromMonth, toMonth, viewerOrgId, ...params],
    );
    return rows.map((r) => ({
      siteId: Number(r['siteId']),
      siteName: String(r['siteName']),
      siteKind: r['siteKind'] as SiteKind,
      organisationName: String(r['organisationName']),
      tags: jsonArray(r['tagsJson']),
      landscapeAreaFt2: Number(r['area']),
      specialLandscapeAreaFt2: Number(r['sla']),
      useGal: Number(r['gal']),
      meteredDays: Number(r['days']),
      etoMm: r['eto'] === null ? null : Number(r['eto']),
      budgetProblem: (r['problem'] as string | null) ?? null,
      setting:
        r['allowedEtaf'] === null ? null : { allowedEtaf: Number(r['allowedEtaf']), basis: r['basis'] as EtafBasis },
    }));
  }
}

function filterSql(f: EtafFilter): { where: string; params: unknown[] } {
  const parts: string[] = [];
  const params: unknown[] = [];
  if (f.kind) {
    parts.push('AND s.kind = ?');
    params.push(f.kind);
  }
  if (f.tag) {
    parts.push('AND EXISTS (SELECT 1 FROM site_tag t WHERE t.site_id = s.id AND t.tag = ?)');
    params.push(f.tag);
  }
  if (f.q) {
    parts.push('AND s.name LIKE ?');
    params.push(`%${f.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
  }
  return { where: parts.join(' '), params };
}

function monthCount(from: string, to: string): number {
  return (Number(to.slice(0, 4)) - Number(from.slice(0, 4))) * 12 + Number(to.slice(5)) - Number(from.slice(5)) + 1;
}
