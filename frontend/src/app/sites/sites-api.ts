import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page, SortDirection } from '@shared/api/page';
import type { SiteDto, SiteInput, SiteKind, SiteSort } from '@shared/sites/site';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

export interface SiteQuery {
  page: number;
  pageSize: number;
  sort: SiteSort;
  dir: SortDirection;
  q: string;
  tag: string;
  kind: SiteKind | '';
}

/** The /api/sites endpoints. */
@Injectable({ providedIn: 'root' })
export class SitesApi {
  private readonly http = inject(HttpClient);

  list(query: SiteQuery): Observable<Page<SiteDto>> {
    return this.http.get<Page<SiteDto>>('/api/sites', { params: queryParams({ ...query }) });
  }

  tags(): Observable<string[]> {
    return this.http.get<string[]>('/api/sites/tags');
  }

  get(id: number): Observable<SiteDto> {
    return this.http.get<SiteDto>(`/api/sites/${id}`);
  }

  create(input: SiteInput): Observable<SiteDto> {
    return this.http.post<SiteDto>('/api/sites', input);
  }

  update(id: number, changes: Partial<SiteInput>): Observable<SiteDto> {
    return this.http.patch<SiteDto>(`/api/sites/${id}`, changes);
  }

  remove(id: number): Observable<void> {
    return this.http.delete<void>(`/api/sites/${id}`);
  }
}
