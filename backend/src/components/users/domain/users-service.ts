import type { DataSource } from 'typeorm';
import type { Page } from '@shared/api/page';
import type { Role } from '@shared/auth/roles';
import type { InviteInput, OrgUserDto } from '@shared/users/user';
import type { Config } from '../../../config';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { MailQueue } from '../../mail/domain/mail-queue';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { OrgUserQuery, UsersRepository } from '../data/users-repository';
import { invitationMail, passwordResetMail } from './account-mails';
import { newOneTimeToken } from './one-time-token';

/** Organisation user administration: invite, change role, disable, send a password reset. Admins only. */
export class UsersService {
  constructor(
    private readonly db: DataSource,
    private readonly users: UsersRepository,
    private readonly audit: AuditRepository,
    private readonly mailQueue: MailQueue,
    private readonly config: Pick<Config, 'http' | 'inviteTtlMs'>,
  ) {}

  list(principal: Principal, query: OrgUserQuery): Promise<Page<OrgUserDto>> {
    return this.users.listOrgUsers(principal.organisationId, query);
  }

  async invite(principal: Principal, input: InviteInput): Promise<OrgUserDto> {
    const orgName =
      principal.memberships.find((m) => m.organisationId === principal.organisationId)?.organisationName ?? '';
    const existing = await this.users.findByEmail(input.email);
    if (existing) {
      const already = await this.users.findOrgUser(principal.organisationId, existing.id);
      if (already)
        throw new AppError('conflict', `${input.email} is already a member of this organisation.`, [
          { field: 'email', message: 'is already a member' },
        ]);
    }
    const { token, hash } = newOneTimeToken();
    const link = `${this.config.http.publicUrl}/accept-invite?token=${token}`;
    const userId = await this.db.transaction(async (em) => {
      const id =
        existing?.id ??
        (await this.users.createUser(em, {
          email: input.email,
          displayName: input.displayName,
          status: 'invited',
          passwordHash: null,
        }));
      await this.users.addMembership(em, id, principal.organisationId, input.role);
      if (!existing || existing.status === 'invited') {
        await this.users.createToken(em, id, 'invite', hash, new Date(Date.now() + this.config.inviteTtlMs));
      }
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: principal.organisationId,
        entity: 'user',
        entityId: id,
        action: 'invite',
        changes: { email: input.email, role: input.role },
      });
      const mail = invitationMail({
        to: input.email,
        displayName: input.displayName,
        invitedBy: principal.displayName,
        organisation: orgName,
        role: input.role,
        link,
        existingAccount: !!existing && existing.status !== 'invited',
        publicUrl: this.config.http.publicUrl,
      });
      await this.mailQueue.enqueue(
        em,
        { ...mail, organisationIds: [principal.organisationId] },
        `invite:${principal.organisationId}:${hash}`,
      );
      return id;
    });
    this.mailQueue.kick();
    return (await this.users.findOrgUser(principal.organisationId, userId))!;
  }

  async update(
    principal: Principal,
    userId: number,
    patch: { role?: Role; status?: 'active' | 'disabled' },
  ): Promise<OrgUserDto> {
    const current = await this.users.findOrgUser(principal.organisationId, userId);
    if (!current) throw AppError.notFound('User');
    if (patch.status && current.status === 'invited') {
      throw AppError.invalid('status', 'an invited user becomes active by accepting the invitation');
    }
    const losesAdmin =
      current.role === 'admin' &&
      current.status === 'active' &&
      ((patch.role && patch.role !== 'admin') || patch.status === 'disabled');
    if (losesAdmin && (await this.users.countAdmins(principal.organisationId)) <= 1) {
      throw new AppError('conflict', 'The organisation must keep at least one active administrator.', [
        { field: patch.role ? 'role' : 'status', message: 'would leave no active administrator' },
      ]);
    }
    await this.db.transaction(async (em) => {
      if (patch.role && patch.role !== current.role)
        await this.users.setRole(em, userId, principal.organisationId, patch.role);
      if (patch.status && patch.status !== current.status) await this.users.setStatus(em, userId, patch.status);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: principal.organisationId,
        entity: 'user',
        entityId: userId,
        action: 'update',
        changes: patch,
      });
    });
    return (await this.users.findOrgUser(principal.organisationId, userId))!;
  }

  async sendPasswordReset(principal: Principal, userId: number): Promise<void> {
    const member = await this.users.findOrgUser(principal.organisationId, userId);
    if (!member) throw AppError.notFound('User');
    if (member.status !== 'active') throw AppError.invalid('status', `a ${member.status} user cannot reset a password`);
    const { token, hash } = newOneTimeToken();
    const link = `${this.config.http.publicUrl}/reset-password?token=${token}`;
    await this.db.transaction(async (em) => {
      await this.users.createToken(em, userId, 'reset', hash, new Date(Date.now() + this.config.inviteTtlMs));
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: principal.organisationId,
        entity: 'user',
        entityId: userId,
        action: 'password-reset-sent',
      });
      const mail = passwordResetMail({
        to: member.email,
        displayName: member.displayName,
        requestedBy: principal.displayName,
        link,
        publicUrl: this.config.http.publicUrl,
      });
      await this.mailQueue.enqueue(em, { ...mail, organisationIds: [principal.organisationId] }, `reset:${hash}`);
    });
    this.mailQueue.kick();
  }
}
