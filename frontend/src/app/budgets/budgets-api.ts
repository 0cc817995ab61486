import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { ComplianceDto, RainCreditKind, SiteBudgetDto } from '@shared/budgets/budget-dto';
import type { MweloProjectType } from '@shared/budgets/mwelo-allowance';
import { Observable } from 'rxjs';

export interface BudgetQuery {
  from: string;
  to: string;
  rain: RainCreditKind;
  /** Indoor allotment for a mixed meter; both or neither. */
  indoor?: { occupants: number; gallonsPerPersonPerDay: number } | null;
}

/** /api/sites/:id/budget and /compliance. */
@Injectable({ providedIn: 'root' })
export class BudgetsApi {
  private readonly http = inject(HttpClient);

  budget(siteId: number, query: BudgetQuery): Observable<SiteBudgetDto> {
    let params = new HttpParams().set('from', query.from).set('to', query.to).set('rain', query.rain);
    if (query.indoor)
      params = params
        .set('occupants', query.indoor.occupants)
        .set('gallonsPerPersonPerDay', query.indoor.gallonsPerPersonPerDay);
    return this.http.get<SiteBudgetDto>(`/api/sites/${siteId}/budget`, { params });
  }

  compliance(
    siteId: number,
    year: number,
    projectType: MweloProjectType | null,
    effectivePrecipitation: boolean,
  ): Observable<ComplianceDto> {
    let params = new HttpParams().set('year', year).set('effectivePrecipitation', effectivePrecipitation);
    if (projectType) params = params.set('projectType', projectType);
    return this.http.get<ComplianceDto>(`/api/sites/${siteId}/compliance`, { params });
  }
}
