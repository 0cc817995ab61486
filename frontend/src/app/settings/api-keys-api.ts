import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { ApiKeyDto, NewApiKeyDto } from '@shared/uploads/upload';
import { Observable } from 'rxjs';

/** /api/api-keys: machine-upload keys of the administrator's organisation. */
@Injectable({ providedIn: 'root' })
export class ApiKeysApi {
  private readonly http = inject(HttpClient);

  list(): Observable<ApiKeyDto[]> {
    return this.http.get<ApiKeyDto[]>('/api/api-keys');
  }

  /** The answer is the only place the secret ever appears. */
  create(name: string, siteIds: number[]): Observable<NewApiKeyDto> {
    return this.http.post<NewApiKeyDto>('/api/api-keys', { name, siteIds });
  }

  revoke(id: number): Observable<void> {
    return this.http.delete<void>(`/api/api-keys/${id}`);
  }
}
