/** Server-side paged list: what every list endpoint returns. */
export interface Page<T> {
  items: T[];
  total: number;
  /** Zero-based page index. */
  page: number;
  pageSize: number;
}

export type SortDirection = 'asc' | 'desc';

export interface PageQuery<S extends string = string> {
  page?: number;
  pageSize?: number;
  sort?: S;
  dir?: SortDirection;
  /** Free-text filter. */
  q?: string;
}

export const MAX_PAGE_SIZE = 200;
export const DEFAULT_PAGE_SIZE = 25;
