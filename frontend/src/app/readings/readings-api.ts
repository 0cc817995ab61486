import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { HourlyGridDto, SiteMonthlyDto, SiteOverviewDto } from '@shared/readings/readings-dto';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

/** A site's readings: /api/sites/:id/overview, /hourly-grid and /monthly (aggregates only). */
@Injectable({ providedIn: 'root' })
export class ReadingsApi {
  private readonly http = inject(HttpClient);

  overview(siteId: number, from: string, to: string): Observable<SiteOverviewDto> {
    return this.http.get<SiteOverviewDto>(`/api/sites/${siteId}/overview`, { params: queryParams({ from, to }) });
  }

  hourlyGrid(siteId: number, month: string): Observable<HourlyGridDto> {
    return this.http.get<HourlyGridDto>(`/api/sites/${siteId}/hourly-grid`, { params: queryParams({ month }) });
  }

  monthly(siteId: number, from: string, to: string): Observable<SiteMonthlyDto> {
    return this.http.get<SiteMonthlyDto>(`/api/sites/${siteId}/monthly`, { params: queryParams({ from, to }) });
  }

  /** A plain link downloads the file with the session cookie; GET needs no CSRF token. */
  monthlyCsvUrl(siteId: number, from: string, to: string): string {
    return `/api/sites/${siteId}/monthly?${queryParams({ from, to, format: 'csv' }).toString()}`;
  }
}
