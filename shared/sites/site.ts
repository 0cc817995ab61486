import type { OrganisationKind, ShareAccess, SiteLevel } from '../auth/roles';

export const SITE_KINDS = ['hoa-common-area', 'office-park', 'school-ground', 'streetscape', 'park', 'other'] as const;
export type SiteKind = (typeof SITE_KINDS)[number];

export const SITE_KIND_LABELS: Record<SiteKind, string> = {
  'hoa-common-area': 'HOA common area',
  'office-park': 'Office or business park',
  'school-ground': 'School ground',
  streetscape: 'Streetscape / median',
  park: 'Park',
  other: 'Other',
};

/** Limits shared by the server's validation and the browser's form. */
export const SITE_LIMITS = {
  nameMax: 120,
  addressMax: 300,
  notesMax: 4000,
  tagMax: 40,
  tagsMax: 20,
} as const;

/** A tag: lower-case letters, digits and dashes, e.g. `reclaimed`, `zone-3`. */
export const TAG_PATTERN = /^[a-z0-9][a-z0-9-]*$/;

export interface SiteShareDto {
  organisationId: number;
  organisationName: string;
  organisationKind: OrganisationKind;
  access: ShareAccess;
}

export interface SiteDto {
  id: number;
  name: string;
  kind: SiteKind;
  address: string;
  /** IANA time zone, e.g. `America/Los_Angeles`; all of the site's local times are in it. */
  timeZone: string;
  notes: string;
  tags: string[];
  organisationId: number;
  organisationName: string;
  /** What the signed-in user may do on this site. */
  access: SiteLevel;
  /** Sites the owner shares with. Empty for a viewer through a share, who sees `sharedWithYou` instead. */
  shares: SiteShareDto[];
  /** For a site another organisation (`organisationName`) shared with yours: what it grants and since when. */
  sharedWithYou: { access: ShareAccess; since: string | null } | null;
  createdAt: string;
  updatedAt: string;
}

export interface SiteInput {
  name: string;
  kind: SiteKind;
  address: string;
  timeZone: string;
  notes?: string;
  tags?: string[];
}

export const SITE_SORTS = ['name', 'kind', 'timeZone', 'organisationName', 'updatedAt'] as const;
export type SiteSort = (typeof SITE_SORTS)[number];

/** True when `zone` is an IANA time zone this runtime knows (both Node and browsers ship the list). */
export function isTimeZone(zone: string): boolean {
  if (!zone || zone.length > 64) return false;
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return zone.includes('/') || zone === 'UTC';
  } catch {
    return false;
  }
}
