import type { DataSource } from 'typeorm';
import { capabilities } from '@shared/auth/roles';
import type { CurrentUserDto } from '@shared/users/user';
import { AppError } from '../../../platform/app-error';
import { hashPassword, verifyPassword } from '../../../platform/auth/password';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { UsersRepository } from '../../users/data/users-repository';
import { hashToken } from '../../users/domain/one-time-token';

/** Sign-in, the session's principal, and one-time links (invitation, password reset). */
export class AuthService {
  constructor(
    private readonly db: DataSource,
    private readonly users: UsersRepository,
    private readonly audit: AuditRepository,
  ) {}

  /** Null for a wrong e-mail or password, or a user who is not active (the caller says the same for all). */
  async checkCredentials(email: string, password: string): Promise<Principal | null> {
    const user = await this.users.findByEmail(email.trim());
    const ok = await verifyPassword(password, user?.passwordHash ?? null);
    if (!user || !ok || user.status !== 'active') return null;
    await this.users.recordSignIn(user.id);
    return this.principal(user.id);
  }

  /**
   * Loads the principal fresh from the database (each request), so a disabled user or a changed role
   * takes effect at once. Null when the user is gone, disabled or has no membership left.
   */
  async principal(userId: number, organisationId?: number): Promise<Principal | null> {
    const found = await this.users.activeUserWithMemberships(userId);
    if (!found) return null;
    const { user, memberships } = found;
    const active = memberships.find((m) => m.organisationId === organisationId) ?? memberships[0];
    if (!active) return null;
    return {
      userId: user.id,
      email: user.email,
      displayName: user.displayName,
      organisationId: active.organisationId,
      role: active.role,
      memberships,
    };
  }

  currentUser(principal: Principal): CurrentUserDto {
    const organisation = principal.memberships.find((m) => m.organisationId === principal.organisationId)!;
    return {
      id: principal.userId,
      email: principal.email,
      displayName: principal.displayName,
      organisation,
      memberships: principal.memberships,
      capabilities: capabilities(principal.role),
    };
  }

  async tokenInfo(token: string): Promise<{ email: string; displayName: string; purpose: 'invite' | 'reset' }> {
    const live = await this.users.findLiveToken(hashToken(token));
    const user = live && (await this.users.findById(live.userId));
    if (!live || !user)
      throw new AppError(
        'not_found',
        'This link has expired or was already used. Ask your administrator for a new one.',
      );
    return { email: user.email, displayName: user.displayName, purpose: live.purpose };
  }

  /** Sets the password from an invitation or reset link; returns the user id to sign in. */
  async completeToken(token: string, password: string, purpose: 'invite' | 'reset'): Promise<number> {
    const live = await this.users.findLiveToken(hashToken(token));
    if (!live || live.purpose !== purpose)
      throw new AppError(
        'not_found',
        'This link has expired or was already used. Ask your administrator for a new one.',
      );
    const passwordHash = await hashPassword(password);
    await this.db.transaction(async (em) => {
      if (!(await this.users.useToken(em, live.id))) throw new AppError('conflict', 'This link was just used.');
      await this.users.setPassword(em, live.userId, passwordHash);
      if (purpose === 'invite') await this.users.setStatus(em, live.userId, 'active');
      await this.audit.record(em, {
        userId: live.userId,
        organisationId: null,
        entity: 'user',
        entityId: live.userId,
        action: purpose === 'invite' ? 'accept-invite' : 'reset-password',
      });
    });
    return live.userId;
  }
}
