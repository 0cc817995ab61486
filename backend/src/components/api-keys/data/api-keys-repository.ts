import type { DataSource, EntityManager } from 'typeorm';
import type { ApiKeyDto } from '@shared/uploads/upload';
import { ApiKeySiteEntity } from './api-key-site.entity';
import { ApiKeyEntity } from './api-key.entity';

export interface StoredKey {
  id: number;
  organisationId: number;
  secretHash: string;
  createdBy: number | null;
  revokedAt: Date | null;
  lastUsedAt: Date | null;
  siteIds: number[];
}

/** API keys and the sites each may reach. */
export class ApiKeysRepository {
  constructor(private readonly db: DataSource) {}

  async insert(
    em: EntityManager,
    k: {
      organisationId: number;
      name: string;
      prefix: string;
      secretHash: string;
      createdBy: number;
      siteIds: number[];
    },
  ): Promise<number> {
    const id = Number(
      (
        await em.getRepository(ApiKeyEntity).insert({
          organisationId: k.organisationId,
          name: k.name,
          prefix: k.prefix,
          secretHash: k.secretHash,
          createdBy: k.createdBy,
        })
      ).identifiers[0]!['id'],
    );
    await em.getRepository(ApiKeySiteEntity).insert(k.siteIds.map((siteId) => ({ apiKeyId: id, siteId })));
    return id;
  }

  async list(organisationId: number): Promise<ApiKeyDto[]> {
    const rows = await this.db.query(
      `SELECT k.*, u.display_name AS by_name, GROUP_CONCAT(ks.site_id ORDER BY ks.site_id) AS site_ids
       FROM api_key k LEFT JOIN user u ON u.id = k.created_by LEFT JOIN api_key_site ks ON ks.api_key_id = k.id
       WHERE k.organisation_id = ? GROUP BY k.id ORDER BY k.revoked_at IS NOT NULL, k.name`,
      [organisationId],
    );
    const iso = (v: unknown) => (v ? new Date(v as string).toISOString() : null);
    return rows.map((r: Record<string, unknown>) => ({
      id: Number(r['id']),
      name: String(r['name']),
      prefix: String(r['prefix']),
      siteIds: r['site_ids'] ? String(r['site_ids']).split(',').map(Number) : [],
      createdBy: (r['by_name'] as string | null) ?? null,
      createdAt: iso(r['created_at'])!,
      lastUsedAt: iso(r['last_used_at']),
      revokedAt: iso(r['revoked_at']),
    }));
  }

  async findByPrefix(prefix: string): Promise<StoredKey | null> {
    const key = await this.db.getRepository(ApiKeyEntity).findOneBy({ prefix });
    if (!key) return null;
    const sites = await this.db.getRepository(ApiKeySiteEntity).findBy({ apiKeyId: key.id });
    return {
      id: key.id,
      organisationId: key.organisationId,
      secretHash: key.secretHash,
      createdBy: key.createdBy,
      revokedAt: key.revokedAt,
      lastUsedAt: key.lastUsedAt,
      siteIds: sites.map((s) => s.siteId),
    };
  }

  async touch(id: number): Promise<void> {
    await this.db.getRepository(ApiKeyEntity).update({ id }, { lastUsedAt: new Date() });
  }

  async revoke(em: EntityManager, organisationId: number, id: number): Promise<boolean> {
    const result = await em.query(
      `UPDATE api_key SET revoked_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND organisation_id = ?
        AND revoked_at IS NULL`,
      [id, organisationId],
    );
    return Number((result as { affectedRows?: number }).affectedRows ?? 0) > 0;
  }
}
