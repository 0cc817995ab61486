import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type {
  SavingsBookRowDto,
  SavingsBookSort,
  SavingsHistoryEntryDto,
  SavingsProjectDto,
  SavingsProjectInput,
  SavingsProjectPatch,
  SavingsProjectStatus,
  SavingsReportDto,
} from '@shared/savings/savings-project-dto';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

export interface SavingsBookQuery {
  page: number;
  pageSize: number;
  sort: SavingsBookSort;
  dir: 'asc' | 'desc';
  q?: string | null;
  scope?: 'mine' | 'all' | null;
  status?: SavingsProjectStatus | null;
}

/** Savings projects and their reports; export links are plain URLs the browser downloads. */
@Injectable({ providedIn: 'root' })
export class SavingsApi {
  private readonly http = inject(HttpClient);

  projects(siteId: number): Observable<SavingsProjectDto[]> {
    return this.http.get<SavingsProjectDto[]>(`/api/sites/${siteId}/savings-projects`);
  }

  createProject(siteId: number, input: SavingsProjectInput): Observable<SavingsProjectDto> {
    return this.http.post<SavingsProjectDto>(`/api/sites/${siteId}/savings-projects`, input);
  }

  book(q: SavingsBookQuery): Observable<Page<SavingsBookRowDto>> {
    return this.http.get<Page<SavingsBookRowDto>>('/api/savings-projects', { params: queryParams({ ...q }) });
  }

  markInstalled(id: number): Observable<SavingsProjectDto> {
    return this.http.post<SavingsProjectDto>(`/api/savings-projects/${id}/installed`, {});
  }

  setArchived(id: number, archived: boolean): Observable<SavingsProjectDto> {
    return this.http.post<SavingsProjectDto>(`/api/savings-projects/${id}/${archived ? 'archive' : 'restore'}`, {});
  }

  history(id: number): Observable<Page<SavingsHistoryEntryDto>> {
    return this.http.get<Page<SavingsHistoryEntryDto>>(`/api/savings-projects/${id}/history`, {
      params: queryParams({ pageSize: 100 }),
    });
  }

  handoutUrl(id: number): string {
    return `/api/savings-projects/${id}/handout.pdf`;
  }

  updateProject(id: number, input: SavingsProjectPatch): Observable<SavingsProjectDto> {
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
}
