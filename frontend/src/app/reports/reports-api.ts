import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { ComplianceNoticeDto, ComplianceReportDto, ComplianceSort } from '@shared/reports/compliance-report-dto';
import type { SavingsProjectDto, SavingsProjectInput, SavingsReportDto } from '@shared/savings/savings-project-dto';
import type { SiteKind } from '@shared/sites/site';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

export interface ComplianceQuery {
  year: number;
  month?: string | null;
  kind?: SiteKind | null;
  tag?: string | null;
  page: number;
  pageSize: number;
  sort: ComplianceSort;
  dir: 'asc' | 'desc';
}

/** Savings projects, their reports and the compliance ranking; export links are plain URLs the browser downloads. */
@Injectable({ providedIn: 'root' })
export class ReportsApi {
  private readonly http = inject(HttpClient);

  projects(siteId: number): Observable<SavingsProjectDto[]> {
    return this.http.get<SavingsProjectDto[]>(`/api/sites/${siteId}/savings-projects`);
  }

  createProject(siteId: number, input: SavingsProjectInput): Observable<SavingsProjectDto> {
    return this.http.post<SavingsProjectDto>(`/api/sites/${siteId}/savings-projects`, input);
  }

  updateProject(id: number, input: Partial<SavingsProjectInput>): Observable<SavingsProjectDto> {
    return this.http.patch<SavingsProjectDto>(`/api/savings-projects/${id}`, input);
  }

  deleteProject(id: number): Observable<void> {
    return this.http.delete<void>(`/api/savings-projects/${id}`);
  }

  savingsReport(id: number): Observable<SavingsReportDto> {
    return this.http.get<SavingsReportDto>(`/api/savings-projects/${id}/report`);
  }

  savingsExportUrl(id: number, format: 'csv' | 'pdf'): string {
    return format === 'pdf'
      ? `/api/savings-projects/${id}/report.pdf`
      : `/api/savings-projects/${id}/report?format=csv`;
  }

  compliance(q: ComplianceQuery): Observable<ComplianceReportDto> {
    return this.http.get<ComplianceReportDto>('/api/reports/compliance', { params: queryParams({ ...q }) });
  }

  complianceExportUrl(q: ComplianceQuery, format: 'csv' | 'pdf'): string {
    const params = queryParams({
      year: q.year,
      month: q.month,
      kind: q.kind,
      tag: q.tag,
      sort: q.sort,
      dir: q.dir,
      format: format === 'csv' ? 'csv' : null,
    }).toString();
    return `/api/reports/compliance${format === 'pdf' ? '.pdf' : ''}?${params}`;
  }

  sendNotice(siteId: number, month: string, message: string): Observable<ComplianceNoticeDto> {
    return this.http.post<ComplianceNoticeDto>(`/api/reports/compliance/${siteId}/notice`, {
      month,
      ...(message.trim() ? { message } : {}),
    });
  }
}
