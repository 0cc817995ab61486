import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type {
  ComplianceNoticeDto,
  ComplianceReportDto,
  ComplianceSort,
  NoticeHistoryDto,
} from '@shared/reports/compliance-report-dto';
import type { SiteKind } from '@shared/sites/site';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

export interface ComplianceQuery {
  year: number;
  month?: string | null;
  kind?: SiteKind | null;
  tag?: string | null;
  /** The owning organisation's id. */
  owner?: number | null;
  page: number;
  pageSize: number;
  sort: ComplianceSort;
  dir: 'asc' | 'desc';
}

/** The compliance ranking and budget notices; export links are plain URLs the browser downloads. */
@Injectable({ providedIn: 'root' })
export class ReportsApi {
  private readonly http = inject(HttpClient);

  compliance(q: ComplianceQuery): Observable<ComplianceReportDto> {
    return this.http.get<ComplianceReportDto>('/api/reports/compliance', { params: queryParams({ ...q }) });
  }

  complianceExportUrl(q: ComplianceQuery, format: 'csv' | 'pdf'): string {
    const params = queryParams({
      year: q.year,
      month: q.month,
      kind: q.kind,
      tag: q.tag,
      owner: q.owner,
      sort: q.sort,
      dir: q.dir,
      format: format === 'csv' ? 'csv' : null,
    }).toString();
    return `/api/reports/compliance${format === 'pdf' ? '.pdf' : ''}?${params}`;
  }

  noticeHistory(siteId: number): Observable<Page<NoticeHistoryDto>> {
    return this.http.get<Page<NoticeHistoryDto>>(`/api/reports/compliance/${siteId}/notices`, {
      params: queryParams({ pageSize: 50 }),
    });
  }

  sendNotice(siteId: number, month: string, message: string): Observable<ComplianceNoticeDto> {
    return this.http.post<ComplianceNoticeDto>(`/api/reports/compliance/${siteId}/notice`, {
      month,
      ...(message.trim() ? { message } : {}),
    });
  }
}
