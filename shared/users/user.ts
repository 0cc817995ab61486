import type { Capabilities, OrganisationKind, Role } from '../auth/roles';

export interface MembershipDto {
  organisationId: number;
  organisationName: string;
  organisationKind: OrganisationKind;
  role: Role;
}

/** GET /api/auth/me */
export interface CurrentUserDto {
  id: number;
  email: string;
  displayName: string;
  /** The organisation the session acts for. */
  organisation: MembershipDto;
  memberships: MembershipDto[];
  capabilities: Capabilities;
}

export type UserStatus = 'active' | 'invited' | 'disabled';

/** A member of the admin's organisation (GET /api/users). */
export interface OrgUserDto {
  id: number;
  email: string;
  displayName: string;
  role: Role;
  status: UserStatus;
  lastSignInAt: string | null;
  createdAt: string;
}

export interface InviteInput {
  email: string;
  displayName: string;
  role: Role;
}

export const USER_SORTS = ['displayName', 'email', 'role', 'status', 'lastSignInAt'] as const;
export type UserSort = (typeof USER_SORTS)[number];

export const PASSWORD_MIN_LENGTH = 10;
