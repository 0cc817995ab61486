import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type {
  AlertDetailDto,
  AlertResolution,
  AlertSort,
  AlertStatus,
  AlertSummaryDto,
  NotificationPreferenceDto,
  RepairTimesDto,
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

  /** Resolves with how it was resolved; "fixed" with the repair's day asks the watch to confirm it from the data. */
  resolve(
    id: number,
    body: { note?: string; resolution: AlertResolution; repairedOn?: string },
  ): Observable<AlertDetailDto> {
    return this.http.post<AlertDetailDto>(`/api/alerts/${id}/resolve`, body);
  }

  repairTimes(from: string, to: string): Observable<RepairTimesDto> {
    return this.http.get<RepairTimesDto>('/api/alerts/repair-times', { params: { from, to } });
  }

  notifications(): Observable<NotificationPreferenceDto> {
    return this.http.get<NotificationPreferenceDto>('/api/me/notifications');
  }

  saveNotifications(pref: NotificationPreferenceDto): Observable<NotificationPreferenceDto> {
    return this.http.put<NotificationPreferenceDto>('/api/me/notifications', pref);
  }
}
