import type { MembershipDto } from '@shared/users/user';
import type { Role } from '@shared/auth/roles';

/** The signed-in user as every route and domain function sees it: who, and for which organisation. */
export interface Principal {
  userId: number;
  email: string;
  displayName: string;
  organisationId: number;
  role: Role;
  memberships: MembershipDto[];
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport's req.user
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends Principal {}
  }
}

declare module 'express-session' {
  interface SessionData {
    /** Set when the CSRF token is issued, so an anonymous session is saved and its id stays stable. */
    csrfIssued?: boolean;
    /** The organisation the user acts for (a user may belong to several). */
    organisationId?: number;
  }
}
