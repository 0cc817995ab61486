import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type { RunTimeAdviceDto } from '@shared/budgets/budget-dto';
import type { HydrozoneDto, HydrozoneInput } from '@shared/hydrozones/hydrozone-dto';
import { Observable } from 'rxjs';

/** /api/sites/:id/hydrozones and each zone's run-time advice. */
@Injectable({ providedIn: 'root' })
export class HydrozonesApi {
  private readonly http = inject(HttpClient);

  list(siteId: number): Observable<Page<HydrozoneDto>> {
    // A site has tens of zones at most; one page of 200 holds them all.
    return this.http.get<Page<HydrozoneDto>>(`/api/sites/${siteId}/hydrozones`, {
      params: new HttpParams().set('pageSize', 200),
    });
  }

  create(siteId: number, input: HydrozoneInput): Observable<HydrozoneDto> {
    return this.http.post<HydrozoneDto>(`/api/sites/${siteId}/hydrozones`, input);
  }

  update(siteId: number, zoneId: number, input: Partial<HydrozoneInput>): Observable<HydrozoneDto> {
    return this.http.patch<HydrozoneDto>(`/api/sites/${siteId}/hydrozones/${zoneId}`, input);
  }

  remove(siteId: number, zoneId: number): Observable<void> {
    return this.http.delete<void>(`/api/sites/${siteId}/hydrozones/${zoneId}`);
  }

  advice(siteId: number, zoneId: number, month: string, daysPerWeek: number): Observable<RunTimeAdviceDto> {
    const params = new HttpParams().set('month', month).set('daysPerWeek', daysPerWeek);
    return this.http.get<RunTimeAdviceDto>(`/api/sites/${siteId}/hydrozones/${zoneId}/advice`, { params });
  }
}
