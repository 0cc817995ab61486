import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { capabilities } from '@shared/auth/roles';
import type { ApiKeyDto, NewApiKeyDto } from '@shared/uploads/upload';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { AuthService } from '../../auth/domain/auth-service';
import type { SitesService } from '../../sites/domain/sites-service';
import type { ApiKeysRepository } from '../data/api-keys-repository';

/** `rk_` + 8 hex (the public prefix, stored) + `_` + 43 base64url characters (256 random bits, only hashed). */
const TOKEN = /^(rk_[0-9a-f]{8})_([A-Za-z0-9_-]{43})$/;
const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

export interface KeyCaller {
  principal: Principal;
  apiKey: { id: number; siteIds: number[] };
}

/**
 * Machine-upload keys. An administrator creates one for chosen sites; the secret is shown once and only its
 * SHA-256 is kept. A key acts with contributor rights on its sites and nothing else.
 */
export class ApiKeysService {
  constructor(
    private readonly db: DataSource,
    private readonly repo: ApiKeysRepository,
    private readonly sites: SitesService,
    private readonly auth: AuthService,
    private readonly audit: AuditRepository,
  ) {}

  list(principal: Principal): Promise<ApiKeyDto[]> {
    this.assertAdmin(principal);
    return this.repo.list(principal.organisationId);
  }

  async create(principal: Principal, name: string, siteIds: number[]): Promise<NewApiKeyDto> {
    this.assertAdmin(principal);
    for (const siteId of siteIds) await this.sites.requireLevel(principal, siteId, 'contribute');
    const prefix = `rk_${randomBytes(4).toString('hex')}`;
    const secret = `${prefix}_${randomBytes(32).toString('base64url')}`;
    const id = await this.db.transaction(async (em) => {
      const keyId = await this.repo.insert(em, {
        organisationId: principal.organisationId,
        name,
        prefix,
        secretHash: sha256(secret),
        createdBy: principal.userId,
        siteIds,
      });
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: principal.organisationId,
        entity: 'api-key',
        entityId: keyId,
        action: 'create',
        changes: { name, prefix, siteIds },
      });
      return keyId;
    });
    const dto = (await this.repo.list(principal.organisationId)).find((k) => k.id === id)!;
    return { ...dto, secret };
  }

  async revoke(principal: Principal, id: number): Promise<void> {
    this.assertAdmin(principal);
    await this.db.transaction(async (em) => {
      if (!(await this.repo.revoke(em, principal.organisationId, id))) throw AppError.notFound('Active API key');
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: principal.organisationId,
        entity: 'api-key',
        entityId: id,
        action: 'revoke',
      });
    });
  }

  /** The caller behind a bearer token, or null when the token is unknown, wrong or revoked. */
  async authenticate(token: string): Promise<KeyCaller | null> {
    const match = TOKEN.exec(token);
    if (!match) return null;
    const key = await this.repo.findByPrefix(match[1]!);
    if (!key || key.revokedAt || key.createdBy === null) return null;
    if (!timingSafeEqual(Buffer.from(sha256(token), 'hex'), Buffer.from(key.secretHash, 'hex'))) return null;
    const creator = await this.auth.principal(key.createdBy, key.organisationId);
    // The admin who made it left the organisation or was disabled: the key stops working with them.
    if (!creator || creator.organisationId !== key.organisationId) return null;
    // Stamp use at most once a minute, so a nightly script does not write on every request.
    if (!key.lastUsedAt || Date.now() - key.lastUsedAt.getTime() > 60_000) await this.repo.touch(key.id);
    // Contributor rights: enough to upload to the key's own and contribute-shared sites, never to edit them.
    return { principal: { ...creator, role: 'contractor' }, apiKey: { id: key.id, siteIds: key.siteIds } };
  }

  private assertAdmin(principal: Principal): void {
    if (!capabilities(principal.role).manageSettings) throw AppError.forbidden('Only administrators manage API keys.');
  }
}
