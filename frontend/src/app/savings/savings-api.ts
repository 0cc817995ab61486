import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { SavingsProjectDto, SavingsProjectInput, SavingsReportDto } from '@shared/savings/savings-project-dto';
import { Observable } from 'rxjs';

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
}
