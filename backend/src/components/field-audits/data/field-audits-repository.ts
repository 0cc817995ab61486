import type { DataSource, EntityManager } from 'typeorm';
import type { AuditStatus, FieldAuditInput, FieldAuditSort } from '@shared/field-audits/field-audit-dto';
import { FieldAuditEntity } from './field-audit.entity';

export interface FieldAuditRecord {
  id: number;
  siteId: number;
  organisationId: number;
  organisationName: string;
  title: string;
  auditedOn: string;
  scheduleMonth: string;
  daysPerWeek: number;
  staticPressurePsi: number | null;
  notes: string;
  status: AuditStatus;
  createdByName: string | null;
  zoneTestCount: number;
  openFaultCount: number;
  updatedAt: Date;
}

export interface FieldAuditListFilter {
  page: number;
  pageSize: number;
  sort: FieldAuditSort;
  dir: 'asc' | 'desc';
  q?: string;
}

const SORT_COLUMNS: Record<FieldAuditSort, string> = {
  auditedOn: 'a.audited_on',
  title: 'a.title',
  status: 'a.status',
};

const SELECT = `SELECT a.id, a.site_id AS siteId, a.organisation_id AS organisationId, o.name AS organisationName,
    a.title, a.audited_on AS auditedOn, a.schedule_month AS scheduleMonth, a.days_per_week AS daysPerWeek,
    a.static_pressure_psi AS staticPressurePsi, a.notes, a.status, u.display_name AS createdByName,
    (SELECT COUNT(*) FROM field_audit_zone_test t WHERE t.audit_id = a.id) AS zoneTestCount,
    (SELECT COUNT(*) FROM field_audit_fault f WHERE f.audit_id = a.id AND f.status = 'open') AS openFaultCount,
    a.updated_at AS updatedAt
  FROM field_audit a JOIN organisation o ON o.id = a.organisation_id LEFT JOIN user u ON u.id = a.created_by`;

/** Audits of a site; callers check access to the site first. */
export class FieldAuditsRepository {
  constructor(private readonly db: DataSource) {}

  async list(siteId: number, f: FieldAuditListFilter): Promise<{ rows: FieldAuditRecord[]; total: number }> {
    const where = f.q ? 'a.site_id = ? AND a.title LIKE ?' : 'a.site_id = ?';
    const params: unknown[] = f.q ? [siteId, `%${f.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`] : [siteId];
    const [count]: { n: number }[] = await this.db.query(
      `SELECT COUNT(*) AS n FROM field_audit a WHERE ${where}`,
      params,
    );
    const rows: Record<string, unknown>[] = await this.db.query(
      `${SELECT} WHERE ${where} ORDER BY ${SORT_COLUMNS[f.sort]} ${f.dir === 'asc' ? 'ASC' : 'DESC'}, a.id DESC
       LIMIT ? OFFSET ?`,
      [...params, f.pageSize, f.page * f.pageSize],
    );
    return { rows: rows.map(toRecord), total: Number(count?.n ?? 0) };
  }

  async find(id: number): Promise<FieldAuditRecord | null> {
    const rows: Record<string, unknown>[] = await this.db.query(`${SELECT} WHERE a.id = ?`, [id]);
    return rows[0] ? toRecord(rows[0]) : null;
  }

  async insert(
    em: EntityManager,
    owner: { siteId: number; organisationId: number; createdBy: number },
    input: FieldAuditInput,
  ): Promise<number> {
    const result = await em.getRepository(FieldAuditEntity).insert({ notes: '', ...owner, ...columns(input) });
    return Number(result.identifiers[0]!['id']);
  }

  async update(em: EntityManager, id: number, input: Partial<FieldAuditInput>): Promise<void> {
    const patch = columns(input);
    if (Object.keys(patch).length) await em.getRepository(FieldAuditEntity).update({ id }, patch);
  }

  /** Stamps the audit as changed when one of its tests, faults or photos changes. */
  async touch(em: EntityManager, id: number): Promise<void> {
    await em.query('UPDATE field_audit SET updated_at = CURRENT_TIMESTAMP(3) WHERE id = ?', [id]);
  }

  async delete(em: EntityManager, id: number): Promise<void> {
    await em.getRepository(FieldAuditEntity).delete({ id });
  }
}

function columns(input: Partial<FieldAuditInput>): Partial<FieldAuditEntity> {
  const out: Partial<FieldAuditEntity> = {};
  if (input.title !== undefined) out.title = input.title;
  if (input.auditedOn !== undefined) out.auditedOn = input.auditedOn;
  if (input.scheduleMonth !== undefined) out.scheduleMonth = input.scheduleMonth;
  if (input.daysPerWeek !== undefined) out.daysPerWeek = input.daysPerWeek;
  if (input.staticPressurePsi !== undefined) out.staticPressurePsi = input.staticPressurePsi;
  if (input.notes !== undefined) out.notes = input.notes;
  if (input.status !== undefined) out.status = input.status;
  return out;
}

function toRecord(r: Record<string, unknown>): FieldAuditRecord {
  return {
    id: Number(r['id']),
    siteId: Number(r['siteId']),
    organisationId: Number(r['organisationId']),
    organisationName: String(r['organisationName']),
    title: String(r['title']),
    auditedOn: dateOnly(r['auditedOn'] as string | Date),
    scheduleMonth: String(r['scheduleMonth']),
    daysPerWeek: Number(r['daysPerWeek']),
    staticPressurePsi: r['staticPressurePsi'] === null ? null : Number(r['staticPressurePsi']),
    notes: String(r['notes'] ?? ''),
    status: r['status'] as AuditStatus,
    createdByName: (r['createdByName'] as string | null) ?? null,
    zoneTestCount: Number(r['zoneTestCount']),
    openFaultCount: Number(r['openFaultCount']),
    updatedAt: new Date(r['updatedAt'] as string),
  };
}

export function dateOnly(value: string | Date): string {
  return value instanceof Date ? value.toISOString().slice(0, 10) : String(value).slice(0, 10);
}
