import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type {
  AlertDetailDto,
  AlertSort,
  AlertStatus,
  AlertSummaryDto,
  NotificationPreferenceDto,
} from '@shared/alerts/alert-dto';
import type { WatchRunDto, WatchSettingsDto, WatchSettingsInput } from '@shared/watch/watch-dto';
import type { FindingKind } from '@shared/watch/finding';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

export interface AlertQuery {
  status: AlertStatus | '';
  kind: FindingKind | '';
  siteId: number | null;
  page: number;
  pageSize: number;
  sort: AlertSort;
  dir: 'asc' | 'desc';
}

/** /api/alerts, /api/watch, a site's watch settings and the user's e-mail preference. */
@Injectable({ providedIn: 'root' })
export class AlertsApi {
  private readonly http = inject(HttpClient);

  list(q: AlertQuery): Observable<Page<AlertSummaryDto>> {
    return this.http.get<Page<AlertSummaryDto>>('/api/alerts', { params: queryParams({ ...q }) });
  }

  get(id: number): Observable<AlertDetailDto> {
    return this.http.get<AlertDetailDto>(`/api/alerts/${id}`);
  }

  act(id: number, action: 'acknowledge' | 'resolve' | 'notes', note: string): Observable<AlertDetailDto> {
    return this.http.post<AlertDetailDto>(`/api/alerts/${id}/${action}`, note ? { note } : {});
  }

  settings(siteId: number): Observable<WatchSettingsDto> {
    return this.http.get<WatchSettingsDto>(`/api/sites/${siteId}/watch-settings`);
  }

  saveSettings(siteId: number, input: WatchSettingsInput): Observable<WatchSettingsDto> {
    return this.http.put<WatchSettingsDto>(`/api/sites/${siteId}/watch-settings`, input);
  }

  runs(page: number, pageSize: number): Observable<Page<WatchRunDto>> {
    return this.http.get<Page<WatchRunDto>>('/api/watch/runs', { params: queryParams({ page, pageSize }) });
  }

  runNow(range?: { from: string; to: string }): Observable<WatchRunDto> {
    return this.http.post<WatchRunDto>('/api/watch/runs', range ?? {});
  }

  notifications(): Observable<NotificationPreferenceDto> {
    return this.http.get<NotificationPreferenceDto>('/api/me/notifications');
  }

  saveNotifications(pref: NotificationPreferenceDto): Observable<NotificationPreferenceDto> {
    return this.http.put<NotificationPreferenceDto>('/api/me/notifications', pref);
  }
}
