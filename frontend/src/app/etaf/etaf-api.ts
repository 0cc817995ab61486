import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  EtafReportDto,
  EtafSettingDto,
  EtafSettingInput,
  EtafSort,
  SiteEtafStandingDto,
} from '@shared/etaf/etaf-dto';
import type { SiteKind } from '@shared/sites/site';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

export interface EtafQuery {
  from: string;
  to: string;
  kind: SiteKind | null;
  page: number;
  pageSize: number;
  sort: EtafSort;
  dir: 'asc' | 'desc';
}

/** The achieved-ETAF ranking, a site's standing among comparable sites, and its allowed ETAF. */
@Injectable({ providedIn: 'root' })
export class EtafApi {
  private readonly http = inject(HttpClient);

  report(q: EtafQuery): Observable<EtafReportDto> {
    return this.http.get<EtafReportDto>('/api/etaf', { params: queryParams({ ...q }) });
  }

  standing(siteId: number, from: string, to: string): Observable<SiteEtafStandingDto> {
    return this.http.get<SiteEtafStandingDto>(`/api/sites/${siteId}/etaf`, { params: queryParams({ from, to }) });
  }

  saveSetting(siteId: number, input: EtafSettingInput): Observable<EtafSettingDto> {
    return this.http.put<EtafSettingDto>(`/api/sites/${siteId}/etaf-setting`, input);
  }
}
