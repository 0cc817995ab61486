import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type { CarryOutInput, PlanComparisonDto, PlanDto, PlanInput } from '@shared/planner/plan-dto';
import type { SavingsProjectDto } from '@shared/savings/savings-project-dto';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

/** What-if plans of a site, their comparison and carrying one out; the board PDF is a plain link. */
@Injectable({ providedIn: 'root' })
export class PlannerApi {
  private readonly http = inject(HttpClient);

  list(siteId: number): Observable<Page<PlanDto>> {
    return this.http.get<Page<PlanDto>>(`/api/sites/${siteId}/plans`, {
      params: queryParams({ pageSize: 100, sort: 'updatedAt', dir: 'desc' }),
    });
  }

  get(id: number): Observable<PlanDto> {
    return this.http.get<PlanDto>(`/api/plans/${id}`);
  }

  create(siteId: number, input: PlanInput): Observable<PlanDto> {
    return this.http.post<PlanDto>(`/api/sites/${siteId}/plans`, input);
  }

  update(id: number, patch: Partial<PlanInput>): Observable<PlanDto> {
    return this.http.patch<PlanDto>(`/api/plans/${id}`, patch);
  }

  remove(id: number): Observable<void> {
    return this.http.delete<void>(`/api/plans/${id}`);
  }

  comparison(id: number): Observable<PlanComparisonDto> {
    return this.http.get<PlanComparisonDto>(`/api/plans/${id}/comparison`);
  }

  carryOut(id: number, input: CarryOutInput): Observable<{ plan: PlanDto; project: SavingsProjectDto }> {
    return this.http.post<{ plan: PlanDto; project: SavingsProjectDto }>(`/api/plans/${id}/carry-out`, input);
  }

  pdfUrl(id: number): string {
    return `/api/plans/${id}/comparison.pdf`;
  }
}
