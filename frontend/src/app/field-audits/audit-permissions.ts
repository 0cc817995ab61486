import { atLeast, type Role, type SiteLevel } from '@shared/auth/roles';

/** Mirrors the server's rule so the page only offers what will be accepted: auditors and contributors record audits. */
export function mayRecordAudits(role: Role | undefined, access: SiteLevel | undefined): boolean {
  return role === 'auditor' || (access !== undefined && atLeast(access, 'contribute'));
}
