import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { MetersService } from '../../meters/domain/meters-service';
import type { SitesService } from '../../sites/domain/sites-service';
import type { UploadScopeKey } from '../data/uploads-repository';
import { ingestRefsFrom } from './ingest-refs-from';
import type { IngestRefs } from './ingest-refs';

/** Where an upload goes: one site, or the organisation's sites (each row to its meter's or controller's site). */
export type UploadTarget = { siteId: number } | { organisation: true };

export interface ScopeSite {
  id: number;
  name: string;
  timeZone: string;
}

/** Everything an upload needs to know about where its rows may go. */
export interface IngestScope {
  key: UploadScopeKey;
  sites: Map<number, ScopeSite>;
  refs: IngestRefs;
  /** The zone wall times are read in when a row's site is not known (one site's upload: that site's). */
  timeZone: string;
  /** The zone of the site a meter or controller ref belongs to. */
  zoneOf(ref: string): string | undefined;
  zoneOfSite(siteId: number): string;
}

/**
 * Resolves an upload's target: a site the user may contribute to, or every site they may (an API key: only its
 * sites), with the meters and controllers the rows may name.
 */
export async function resolveScope(
  deps: { sites: SitesService; meters: MetersService },
  principal: Principal,
  target: UploadTarget,
  keySiteIds?: number[],
): Promise<IngestScope> {
  let sites: ScopeSite[];
  let key: UploadScopeKey;
  if ('siteId' in target) {
    const site = await deps.sites.requireLevel(principal, target.siteId, 'contribute');
    sites = [{ id: site.id, name: site.name, timeZone: site.timeZone }];
    key = { siteId: site.id, organisationId: site.organisationId };
  } else {
    const allowed = await deps.sites.sitesAtLevel(principal, 'contribute');
    sites = allowed
      .filter((s) => !keySiteIds || keySiteIds.includes(s.id))
      .map((s) => ({ id: s.id, name: s.name, timeZone: s.timeZone }));
    if (sites.length === 0) throw AppError.forbidden('You may not send files to any site.');
    key = { siteId: null, organisationId: principal.organisationId };
  }
  const byId = new Map(sites.map((s) => [s.id, s]));
  const refs = ingestRefsFrom(
    await deps.meters.equipment(sites.map((s) => s.id)),
    new Map(sites.map((s) => [s.id, s.name])),
  );
  const timeZone = sites[0]!.timeZone;
  const zoneOfSite = (siteId: number) => byId.get(siteId)?.timeZone ?? timeZone;
  const zoneOf = (ref: string) => {
    const siteId = refs.meters.get(ref)?.siteId ?? refs.controllers.get(ref);
    return siteId === undefined ? undefined : zoneOfSite(siteId);
  };
  return { key, sites: byId, refs, timeZone, zoneOf: sites.length > 1 ? zoneOf : () => undefined, zoneOfSite };
}
