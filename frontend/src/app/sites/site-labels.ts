import type { SiteLevel } from '@shared/auth/roles';

/** How the user's level on a site reads in lists and on the site page. */
export const SITE_LEVEL_LABELS: Record<SiteLevel, string> = {
  read: 'View only',
  contribute: 'Contribute',
  edit: 'Edit',
  own: 'Owner',
};
