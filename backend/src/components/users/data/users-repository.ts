import { DataSource, EntityManager, IsNull, MoreThan } from 'typeorm';
import type { MembershipDto, OrgUserDto, UserSort, UserStatus } from '@shared/users/user';
import type { Page } from '@shared/api/page';
import type { OrganisationKind, Role } from '@shared/auth/roles';
import { MembershipEntity } from './membership.entity';
import { UserTokenEntity, type TokenPurpose } from './user-token.entity';
import { UserEntity } from './user.entity';

export interface UserRecord {
  id: number;
  email: string;
  displayName: string;
  passwordHash: string | null;
  status: UserStatus;
}

export interface OrgUserQuery {
  page: number;
  pageSize: number;
  sort: UserSort;
  dir: 'asc' | 'desc';
  q?: string;
}

const SORT_COLUMNS: Record<UserSort, string> = {
  displayName: 'u.display_name',
  email: 'u.email',
  role: 'm.role',
  status: 'u.status',
  lastSignInAt: 'u.last_sign_in_at',
};

/** Data access for users, memberships and one-time tokens. Returns plain objects. */
export class UsersRepository {
  constructor(private readonly db: DataSource) {}

  async findByEmail(email: string): Promise<UserRecord | null> {
    const u = await this.db.getRepository(UserEntity).findOneBy({ email: email.toLowerCase() });
    return u && toRecord(u);
  }

  async findById(id: number): Promise<UserRecord | null> {
    const u = await this.db.getRepository(UserEntity).findOneBy({ id });
    return u && toRecord(u);
  }

  /**
   * An active user with their memberships, in one round trip (this runs on every signed-in request).
   * Null when the user is gone or not active; `memberships` is empty when none is left.
   */
  async activeUserWithMemberships(userId: number): Promise<{ user: UserRecord; memberships: MembershipDto[] } | null> {
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT u.id, u.email, u.display_name AS displayName, u.status, m.organisation_id AS
        organisationId, o.name AS organisationName,
              o.kind AS organisationKind, m.role
       FROM user u LEFT JOIN membership m ON m.user_id = u.id LEFT JOIN organisation o ON o.id = m.organisation_id
       WHERE u.id = ? AND u.status = 'active' ORDER BY m.id`,
      [userId],
    );
    const first = rows[0];
    if (!first) return null;
    return {
      user: {
        id: Number(first['id']),
        email: String(first['email']),
        displayName: String(first['displayName']),
        passwordHash: null,
        status: first['status'] as UserStatus,
      },
      memberships: rows
        .filter((r) => r['organisationId'] !== null && r['organisationName'] !== null)
        .map((r): MembershipDto => ({
          organisationId: Number(r['organisationId']),
          organisationName: String(r['organisationName']),
          organisationKind: r['organisationKind'] as OrganisationKind,
          role: r['role'] as Role,
        })),
    };
  }

  async recordSignIn(userId: number): Promise<void> {
    await this.db.getRepository(UserEntity).update({ id: userId }, { lastSignInAt: new Date() });
  }

  async listOrgUsers(organisationId: number, query: OrgUserQuery): Promise<Page<OrgUserDto>> {
    const qb = this.db
      .getRepository(UserEntity)
      .createQueryBuilder('u')
      .innerJoin(MembershipEntity, 'm', 'm.user_id = u.id AND m.organisation_id = :organisationId', { organisationId });
    if (query.q) {
      qb.andWhere('(u.display_name LIKE :q OR u.email LIKE :q)', { q: `%${escapeLike(query.q)}%` });
    }
    const total = await qb.getCount();
    const rows = await qb
      .select([
        'u.id AS id',
        'u.email AS email',
        'u.display_name AS displayName',
        'm.role AS role',
        'u.status AS status',
        'u.last_sign_in_at AS lastSignInAt',
        'u.created_at AS createdAt',
      ])
      .orderBy(SORT_COLUMNS[query.sort], query.dir === 'asc' ? 'ASC' : 'DESC')
      .addOrderBy('u.id', 'ASC')
      .offset(query.page * query.pageSize)
      .limit(query.pageSize)
      .getRawMany();
    return { items: rows.map(toOrgUser), total, page: query.page, pageSize: query.pageSize };
  }

  async findOrgUser(organisationId: number, userId: number): Promise<OrgUserDto | null> {
    const row = await this.db
      .getRepository(UserEntity)
      .createQueryBuilder('u')
      .innerJoin(MembershipEntity, 'm', 'm.user_id = u.id AND m.organisation_id = :organisationId', { organisationId })
      .select([
        'u.id AS id',
        'u.email AS email',
        'u.display_name AS displayName',
        'm.role AS role',
        'u.status AS status',
        'u.last_sign_in_at AS lastSignInAt',
        'u.created_at AS createdAt',
      ])
      .where('u.id = :userId', { userId })
      .getRawOne();
    return row ? toOrgUser(row) : null;
  }

  async createUser(
    em: EntityManager,
    data: { email: string; displayName: string; status: UserStatus; passwordHash: string | null },
  ): Promise<number> {
    const saved = await em
      .getRepository(UserEntity)
      .save(em.getRepository(UserEntity).create({ ...data, email: data.email.toLowerCase() }));
    return saved.id;
  }

  async addMembership(em: EntityManager, userId: number, organisationId: number, role: Role): Promise<void> {
    await em.getRepository(MembershipEntity).insert({ userId, organisationId, role });
  }

  async setRole(em: EntityManager, userId: number, organisationId: number, role: Role): Promise<void> {
    await em.getRepository(MembershipEntity).update({ userId, organisationId }, { role });
  }

  async setStatus(em: EntityManager, userId: number, status: UserStatus): Promise<void> {
    await em.getRepository(UserEntity).update({ id: userId }, { status });
  }

  async setPassword(em: EntityManager, userId: number, passwordHash: string): Promise<void> {
    await em.getRepository(UserEntity).update({ id: userId }, { passwordHash });
  }

  async countAdmins(organisationId: number): Promise<number> {
    return this.db
      .getRepository(MembershipEntity)
      .createQueryBuilder('m')
      .innerJoin(UserEntity, 'u', 'u.id = m.user_id')
      .where('m.organisation_id = :organisationId AND m.role = :role AND u.status = :status', {
        organisationId,
        role: 'admin',
        status: 'active',
      })
      .getCount();
  }

  async createToken(
    em: EntityManager,
    userId: number,
    purpose: TokenPurpose,
    tokenHash: string,
    expiresAt: Date,
  ): Promise<void> {
    // A new link replaces any earlier unused one of the same purpose.
    await em.getRepository(UserTokenEntity).update({ userId, purpose, usedAt: IsNull() }, { usedAt: new Date() });
    await em.getRepository(UserTokenEntity).insert({ userId, purpose, tokenHash, expiresAt, usedAt: null });
  }

  async findLiveToken(tokenHash: string): Promise<{ id: number; userId: number; purpose: TokenPurpose } | null> {
    const t = await this.db
      .getRepository(UserTokenEntity)
      .findOneBy({ tokenHash, usedAt: IsNull(), expiresAt: MoreThan(new Date()) });
    return t && { id: t.id, userId: t.userId, purpose: t.purpose };
  }

  /** Marks the token used; false when another request used it first. */
  async useToken(em: EntityManager, id: number): Promise<boolean> {
    const result = await em.getRepository(UserTokenEntity).update({ id, usedAt: IsNull() }, { usedAt: new Date() });
    return (result.affected ?? 0) === 1;
  }
}

function toRecord(u: UserEntity): UserRecord {
  return { id: u.id, email: u.email, displayName: u.displayName, passwordHash: u.passwordHash, status: u.status };
}

function toOrgUser(r: Record<string, unknown>): OrgUserDto {
  return {
    id: Number(r['id']),
    email: String(r['email']),
    displayName: String(r['displayName']),
    role: r['role'] as Role,
    status: r['status'] as UserStatus,
    lastSignInAt: r['lastSignInAt'] ? new Date(r['lastSignInAt'] as string).toISOString() : null,
    createdAt: new Date(r['createdAt'] as string).toISOString(),
  };
}

export function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => '\\' + c);
}
