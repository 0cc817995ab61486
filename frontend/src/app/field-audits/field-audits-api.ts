import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type {
  ApplyZoneTestInput,
  FaultInput,
  FieldAuditDto,
  FieldAuditInput,
  FieldAuditSummaryDto,
  ZoneTestInput,
} from '@shared/field-audits/field-audit-dto';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

/** Field audits of a site, their catch-can tests, faults and photos; the report PDF is a plain link. */
@Injectable({ providedIn: 'root' })
export class FieldAuditsApi {
  private readonly http = inject(HttpClient);

  list(siteId: number, page = 0, pageSize = 50): Observable<Page<FieldAuditSummaryDto>> {
    return this.http.get<Page<FieldAuditSummaryDto>>(`/api/sites/${siteId}/field-audits`, {
      params: queryParams({ page, pageSize, sort: 'auditedOn', dir: 'desc' }),
    });
  }

  get(id: number): Observable<FieldAuditDto> {
    return this.http.get<FieldAuditDto>(`/api/field-audits/${id}`);
  }

  create(siteId: number, input: FieldAuditInput): Observable<FieldAuditDto> {
    return this.http.post<FieldAuditDto>(`/api/sites/${siteId}/field-audits`, input);
  }

  update(id: number, patch: Partial<FieldAuditInput>): Observable<FieldAuditDto> {
    return this.http.patch<FieldAuditDto>(`/api/field-audits/${id}`, patch);
  }

  remove(id: number): Observable<void> {
    return this.http.delete<void>(`/api/field-audits/${id}`);
  }

  addTest(id: number, input: ZoneTestInput): Observable<FieldAuditDto> {
    return this.http.post<FieldAuditDto>(`/api/field-audits/${id}/zone-tests`, input);
  }

  updateTest(id: number, testId: number, input: ZoneTestInput): Observable<FieldAuditDto> {
    return this.http.put<FieldAuditDto>(`/api/field-audits/${id}/zone-tests/${testId}`, input);
  }

  removeTest(id: number, testId: number): Observable<void> {
    return this.http.delete<void>(`/api/field-audits/${id}/zone-tests/${testId}`);
  }

  apply(id: number, testId: number, choice: ApplyZoneTestInput): Observable<FieldAuditDto> {
    return this.http.post<FieldAuditDto>(`/api/field-audits/${id}/zone-tests/${testId}/apply`, choice);
  }

  addFault(id: number, input: FaultInput): Observable<FieldAuditDto> {
    return this.http.post<FieldAuditDto>(`/api/field-audits/${id}/faults`, input);
  }

  updateFault(id: number, faultId: number, input: FaultInput): Observable<FieldAuditDto> {
    return this.http.put<FieldAuditDto>(`/api/field-audits/${id}/faults/${faultId}`, input);
  }

  removeFault(id: number, faultId: number): Observable<void> {
    return this.http.delete<void>(`/api/field-audits/${id}/faults/${faultId}`);
  }

  /** The photo goes as the raw body with its own type; the server checks the bytes, not the name. */
  addPhoto(id: number, faultId: number, file: File): Observable<FieldAuditDto> {
    return this.http.post<FieldAuditDto>(`/api/field-audits/${id}/faults/${faultId}/photos`, file, {
      headers: { 'Content-Type': file.type || 'application/octet-stream' },
    });
  }

  removePhoto(url: string): Observable<void> {
    return this.http.delete<void>(url);
  }

  reportUrl(id: number): string {
    return `/api/field-audits/${id}/report.pdf`;
  }
}
