/**
 * Who may do what in Rillmark. Pure rules used by the server (which enforces them) and by the
 * browser (which only hides what a role may not do).
 */
export const ROLES = ['admin', 'manager', 'contractor', 'auditor'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  manager: 'Manager',
  contractor: 'Contractor',
  auditor: 'Auditor (read-only)',
};

export const ORGANISATION_KINDS = ['property-manager', 'contractor', 'utility'] as const;
export type OrganisationKind = (typeof ORGANISATION_KINDS)[number];

/** What a sharing organisation grants on one site. */
export const SHARE_ACCESS = ['contribute', 'read'] as const;
export type ShareAccess = (typeof SHARE_ACCESS)[number];

/**
 * A user's effective level on one site, from weakest to strongest.
 * - read: see everything about the site, change nothing.
 * - contribute: upload data, edit technical data (hydrozones, meters, zones), act on alerts.
 * - edit: also edit the site's identity (name, address, time zone, tags, notes).
 * - own: also delete the site and manage its shares.
 */
export const SITE_LEVELS = ['read', 'contribute', 'edit', 'own'] as const;
export type SiteLevel = (typeof SITE_LEVELS)[number];

/** How the user's organisation relates to the site. */
export type SiteRelation = { kind: 'owner' } | { kind: 'shared'; access: ShareAccess };

export function siteLevel(role: Role, relation: SiteRelation): SiteLevel {
  if (relation.kind === 'owner') {
    switch (role) {
      case 'admin':
        return 'own';
      case 'manager':
        return 'edit';
      case 'contractor':
        return 'contribute';
      case 'auditor':
        return 'read';
    }
  }
  if (role === 'auditor' || relation.access === 'read') return 'read';
  return 'contribute';
}

export function atLeast(level: SiteLevel, needed: SiteLevel): boolean {
  return SITE_LEVELS.indexOf(level) >= SITE_LEVELS.indexOf(needed);
}

/** Organisation-wide capabilities that do not depend on a particular site. */
export interface Capabilities {
  createSites: boolean;
  manageUsers: boolean;
  manageSettings: boolean;
  viewOutbox: boolean;
}

export function capabilities(role: Role): Capabilities {
  return {
    createSites: role === 'admin' || role === 'manager',
    manageUsers: role === 'admin',
    manageSettings: role === 'admin',
    viewOutbox: role === 'admin',
  };
}
