import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type {
  BoardPacketDto,
  BoardPacketInput,
  MonthCloseDto,
  MonthCloseSort,
  MonthReviewDto,
} from '@shared/month-close/month-close-dto';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

export interface MonthCloseQuery {
  month: string;
  page: number;
  pageSize: number;
  sort: MonthCloseSort;
  dir: 'asc' | 'desc';
  q?: string | null;
  tag?: string | null;
}

/** The month close, review marks and board packets; a packet's PDF is a plain URL the browser downloads. */
@Injectable({ providedIn: 'root' })
export class MonthCloseApi {
  private readonly http = inject(HttpClient);

  table(q: MonthCloseQuery): Observable<MonthCloseDto> {
    return this.http.get<MonthCloseDto>('/api/month-close', { params: queryParams({ ...q }) });
  }

  markReviewed(siteId: number, month: string, note: string): Observable<MonthReviewDto> {
    return this.http.put<MonthReviewDto>(`/api/sites/${siteId}/month-reviews/${month}`, { note });
  }

  clearReview(siteId: number, month: string): Observable<void> {
    return this.http.delete<void>(`/api/sites/${siteId}/month-reviews/${month}`);
  }

  packets(month: string): Observable<Page<BoardPacketDto>> {
    return this.http.get<Page<BoardPacketDto>>('/api/month-close/packets', {
      params: queryParams({ month, pageSize: 20 }),
    });
  }

  startPacket(input: BoardPacketInput): Observable<BoardPacketDto> {
    return this.http.post<BoardPacketDto>('/api/month-close/packets', input);
  }

  packetFileUrl(id: number): string {
    return `/api/month-close/packets/${id}/file`;
  }
}
