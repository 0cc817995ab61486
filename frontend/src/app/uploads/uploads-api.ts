import { HttpClient, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type { ColumnMapping } from '@shared/ingest/upload-kind';
import type {
  ConflictSummaryDto,
  ImportProfileDto,
  RejectionDto,
  RepeatChoice,
  UploadDto,
  UploadResult,
} from '@shared/uploads/upload';
import type { Observable } from 'rxjs';

/** The /api upload, import-profile, meter and controller endpoints. */
@Injectable({ providedIn: 'root' })
export class UploadsApi {
  private readonly http = inject(HttpClient);

  /**
   * Sends the file as multipart, reporting upload progress; the fields go before the file, as the server reads them.
   */
  upload(siteId: number | null, file: File, fields: Record<string, string>): Observable<HttpEvent<UploadResult>> {
    const form = new FormData();
    for (const [name, value] of Object.entries(fields)) form.append(name, value);
    form.append('file', file, file.name);
    // No site: the organisation's upload, each row routed to the site its meter or controller belongs to.
    const url = siteId === null ? '/api/uploads' : `/api/sites/${siteId}/uploads`;
    return this.http.post<UploadResult>(url, form, {
      reportProgress: true,
      observe: 'events',
    });
  }

  /** A site's uploads, or (no site) the organisation's own multi-site uploads and every upload it may see. */
  list(siteId: number | null, page = 0, clientRef?: string): Observable<Page<UploadDto>> {
    const params: Record<string, string | number> = { page, pageSize: 20 };
    if (clientRef) params['clientRef'] = clientRef;
    const url = siteId === null ? '/api/uploads' : `/api/sites/${siteId}/uploads`;
    return this.http.get<Page<UploadDto>>(url, { params });
  }

  get(uploadId: number): Observable<UploadDto> {
    return this.http.get<UploadDto>(`/api/uploads/${uploadId}`);
  }

  rejections(uploadId: number, page = 0, pageSize = 50): Observable<{ items: RejectionDto[]; total: number }> {
    return this.http.get<{ items: RejectionDto[]; total: number }>(`/api/uploads/${uploadId}/rejections`, {
      params: { page, pageSize },
    });
  }

  conflicts(uploadId: number): Observable<ConflictSummaryDto> {
    return this.http.get<ConflictSummaryDto>(`/api/uploads/${uploadId}/conflicts`);
  }

  /** Stores the file's values over the stored ones: one site's day, or (no day) every open conflict. */
  replaceConflicts(
    uploadId: number,
    day?: { siteId: number; date: string },
  ): Observable<{ replaced: number; upload: UploadDto }> {
    return this.http.post<{ replaced: number; upload: UploadDto }>(
      `/api/uploads/${uploadId}/conflicts/replace`,
      day ?? {},
    );
  }

  resolveRepeats(uploadId: number, choice: RepeatChoice): Observable<{ stored: number; upload: UploadDto }> {
    return this.http.post<{ stored: number; upload: UploadDto }>(`/api/uploads/${uploadId}/conflicts/repeats`, {
      choice,
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
