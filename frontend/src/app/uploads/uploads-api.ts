import { HttpClient, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type { ColumnMapping } from '@shared/ingest/upload-kind';
import type { ImportProfileDto, RejectionDto, UploadDto, UploadResult } from '@shared/uploads/upload';
import type { Observable } from 'rxjs';

/** The /api upload, import-profile, meter and controller endpoints. */
@Injectable({ providedIn: 'root' })
export class UploadsApi {
  private readonly http = inject(HttpClient);

  /**
   * Sends the file as multipart, reporting upload progress; the fields go before the file, as the server reads them.
   */
  upload(siteId: number, file: File, fields: Record<string, string>): Observable<HttpEvent<UploadResult>> {
    const form = new FormData();
    for (const [name, value] of Object.entries(fields)) form.append(name, value);
    form.append('file', file, file.name);
    return this.http.post<UploadResult>(`/api/sites/${siteId}/uploads`, form, {
      reportProgress: true,
      observe: 'events',
    });
  }

  list(siteId: number, page = 0, clientRef?: string): Observable<Page<UploadDto>> {
    const params: Record<string, string | number> = { page, pageSize: 20 };
    if (clientRef) params['clientRef'] = clientRef;
    return this.http.get<Page<UploadDto>>(`/api/sites/${siteId}/uploads`, { params });
  }

  rejections(uploadId: number, limit = 200): Observable<{ items: RejectionDto[]; total: number }> {
    return this.http.get<{ items: RejectionDto[]; total: number }>(`/api/uploads/${uploadId}/rejections`, {
      params: { limit },
    });
  }

  rejectionsCsvUrl(uploadId: number): string {
    return `/api/uploads/${uploadId}/rejections?format=csv`;
  }

  rollBack(uploadId: number): Observable<{ upload: UploadDto; removed: number }> {
    return this.http.post<{ upload: UploadDto; removed: number }>(`/api/uploads/${uploadId}/rollback`, {});
  }

  profiles(): Observable<ImportProfileDto[]> {
    return this.http.get<ImportProfileDto[]>('/api/import-profiles');
  }

  saveProfile(name: string, mapping: ColumnMapping): Observable<ImportProfileDto> {
    return this.http.post<ImportProfileDto>('/api/import-profiles', { name, mapping });
  }
}
