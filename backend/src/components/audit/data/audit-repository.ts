import type { DataSource, EntityManager } from 'typeorm';
import type { Page } from '@shared/api/page';
import { AuditEntryEntity } from './audit-entry.entity';

export interface AuditEntry {
  userId: number | null;
  organisationId: number | null;
  entity: string;
  entityId: string | number;
  action: string;
  changes?: unknown;
}

export interface AuditEntryDto {
  id: string;
  at: string;
  userId: number | null;
  entity: string;
  entityId: string;
  action: string;
  changes: unknown;
}

/** Writes audit entries inside the caller's transaction, so a change and its record commit together. */
export class AuditRepository {
  constructor(private readonly db: DataSource) {}

  async record(em: EntityManager, entry: AuditEntry): Promise<void> {
    await em.getRepository(AuditEntryEntity).insert({
      userId: entry.userId,
      organisationId: entry.organisationId,
      entity: entry.entity,
      entityId: String(entry.entityId),
      action: entry.action,
      changes: entry.changes === undefined ? null : JSON.stringify(entry.changes),
    });
  }

  /** Everything recorded about one record, newest first, whichever organisation it was logged under. */
  async trail(
    entity: string,
    entityId: string | number,
    page: { page: number; pageSize: number },
  ): Promise<Page<AuditTrailEntry>> {
    const [{ n }]: { n: number | string }[] = await this.db.query(
      'SELECT COUNT(*) AS n FROM audit_entry WHERE entity = ? AND entity_id = ?',
      [entity, String(entityId)],
    );
    const rows: { at: Date; userName: string | null; action: string; changes: string | null }[] = await this.db.query(
      `SELECT a.at, u.display_name AS userName, a.action, a.changes FROM audit_entry a
       LEFT JOIN \`user\` u ON u.id = a.user_id WHERE a.entity = ? AND a.entity_id = ?
       ORDER BY a.id DESC LIMIT ? OFFSET ?`,
      [entity, String(entityId), page.pageSize, page.page * page.pageSize],
    );
    return {
      items: rows.map((r) => ({
        at: new Date(r.at).toISOString(),
        userName: r.userName,
        action: r.action,
        changes: r.changes ? JSON.parse(r.changes) : null,
      })),
      total: Number(n),
      page: page.page,
      pageSize: page.pageSize,
    };
  }

  async list(
    organisationId: number,
    filter: { entity?: string; entityId?: string; page: number; pageSize: number },
  ): Promise<Page<AuditEntryDto>> {
    const qb = this.db
      .getRepository(AuditEntryEntity)
      .createQueryBuilder('a')
      .where('a.organisation_id = :organisationId', { organisationId });
    if (filter.entity) qb.andWhere('a.entity = :entity', { entity: filter.entity });
    if (filter.entityId) qb.andWhere('a.entity_id = :entityId', { entityId: filter.entityId });
    const [rows, total] = await qb
      .orderBy('a.id', 'DESC')
      .skip(filter.page * filter.pageSize)
      .take(filter.pageSize)
      .getManyAndCount();
    return {
      items: rows.map((a) => ({
        id: String(a.id),
        at: a.at.toISOString(),
        userId: a.userId,
        entity: a.entity,
        entityId: a.entityId,
        action: a.action,
        changes: a.changes ? JSON.parse(a.changes) : null,
      })),
      total,
      page: filter.page,
      pageSize: filter.pageSize,
    };
  }
}

/** One entry of a record's trail, with the author's name. */
export interface AuditTrailEntry {
  at: string;
  userName: string | null;
  action: string;
  changes: unknown;
}

/** `{ field: [before, after] }` for the fields whose values differ. */
export function diff<T extends object>(before: T, after: Partial<T>): Record<string, [unknown, unknown]> {
  const changes: Record<string, [unknown, unknown]> = {};
  for (const key of Object.keys(after) as (keyof T)[]) {
    const a = before[key];
    const b = after[key];
    if (b !== undefined && JSON.stringify(a) !== JSON.stringify(b)) changes[String(key)] = [a, b];
  }
  return changes;
}
