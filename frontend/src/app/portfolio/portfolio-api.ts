import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { SortDirection } from '@shared/api/page';
import type { PortfolioCondition, PortfolioDto, PortfolioPeriod, PortfolioSort } from '@shared/portfolio/portfolio-dto';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

export interface PortfolioQuery {
  period: PortfolioPeriod;
  from: string;
  to: string;
  page: number;
  pageSize: number;
  sort: PortfolioSort;
  dir: SortDirection;
  q: string;
  tag: string;
  condition: PortfolioCondition | '';
}

/** The /api/portfolio endpoint (aggregates only). */
@Injectable({ providedIn: 'root' })
export class PortfolioApi {
  private readonly http = inject(HttpClient);

  portfolio(query: PortfolioQuery): Observable<PortfolioDto> {
    // A month or water year is named by its first day; only a custom range sends `to`.
    return this.http.get<PortfolioDto>('/api/portfolio', {
      params: queryParams({ ...query, to: query.period === 'custom' ? query.to : '' }),
    });
  }

  tags(): Observable<string[]> {
    return this.http.get<string[]>('/api/sites/tags');
  }
}
