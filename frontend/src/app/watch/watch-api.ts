import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type { WatchRunDto, WatchSettingsDto, WatchSettingsInput } from '@shared/watch/watch-dto';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

/** /api/watch (runs, run now, re-check) and a site's watch settings. */
@Injectable({ providedIn: 'root' })
export class WatchApi {
  private readonly http = inject(HttpClient);

  settings(siteId: number): Observable<WatchSettingsDto> {
    return this.http.get<WatchSettingsDto>(`/api/sites/${siteId}/watch-settings`);
  }

  saveSettings(siteId: number, input: WatchSettingsInput): Observable<WatchSettingsDto> {
    return this.http.put<WatchSettingsDto>(`/api/sites/${siteId}/watch-settings`, input);
  }

  runs(page: number, pageSize: number): Observable<Page<WatchRunDto>> {
    return this.http.get<Page<WatchRunDto>>('/api/watch/runs', { params: queryParams({ page, pageSize }) });
  }

  /** Starts a run in the background (202): the run to follow, with its progress. */
  runNow(body: { from?: string; to?: string; siteIds?: number[] } = {}): Observable<WatchRunDto> {
    return this.http.post<WatchRunDto>('/api/watch/runs', body);
  }

  run(id: number): Observable<WatchRunDto> {
    return this.http.get<WatchRunDto>(`/api/watch/runs/${id}`);
  }
}
