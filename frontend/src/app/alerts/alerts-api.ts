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

/** /api/alerts and the user's alert e-mail preference. */
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

  notifications(): Observable<NotificationPreferenceDto> {
    return this.http.get<NotificationPreferenceDto>('/api/me/notifications');
  }

  saveNotifications(pref: NotificationPreferenceDto): Observable<NotificationPreferenceDto> {
    return this.http.put<NotificationPreferenceDto>('/api/me/notifications', pref);
  }
}
