import type { ParamMap, Params } from '@angular/router';
import { DEFAULT_PAGE_SIZE, MAX_PAGE_SIZE } from '@shared/api/page';
import { SITE_KINDS, SITE_SORTS } from '@shared/sites/site';
import type { SiteQuery } from '../sites-api';

/**
 * The list's sort, filters and page live in the address bar, so "back" from a site and shared links land on
 * the same view. Unknown or malformed values fall back to the defaults.
 */
export const DEFAULT_SITE_QUERY: SiteQuery = {
  page: 0,
  pageSize: DEFAULT_PAGE_SIZE,
  sort: 'name',
  dir: 'asc',
  q: '',
  tag: '',
  kind: '',
};

function whole(value: string | null, min: number, max: number, fallback: number): number {
  const n = Number(value);
  return value !== null && Number.isInteger(n) && n >= min && n <= max ? n : fallback;
}

export function siteQueryFromUrl(params: ParamMap): SiteQuery {
  const d = DEFAULT_SITE_QUERY;
  return {
    page: whole(params.get('page'), 0, 1_000_000, d.page),
    pageSize: whole(params.get('size'), 1, MAX_PAGE_SIZE, d.pageSize),
    sort: SITE_SORTS.find((s) => s === params.get('sort')) ?? d.sort,
    dir: params.get('dir') === 'desc' ? 'desc' : 'asc',
    q: params.get('q') ?? d.q,
    tag: params.get('tag') ?? d.tag,
    kind: SITE_KINDS.find((k) => k === params.get('kind')) ?? d.kind,
  };
}

/** Only what differs from the defaults, to keep the address short; `null` removes a parameter. */
export function siteQueryToUrl(query: SiteQuery): Params {
  const d = DEFAULT_SITE_QUERY;
  const keep = <T>(value: T, fallback: T) => (value === fallback ? null : value);
  return {
    page: keep(query.page, d.page),
    size: keep(query.pageSize, d.pageSize),
    sort: keep(query.sort, d.sort),
    dir: keep(query.dir, d.dir),
    q: keep(query.q, d.q),
    tag: keep(query.tag, d.tag),
    kind: keep(query.kind, d.kind),
  };
}
