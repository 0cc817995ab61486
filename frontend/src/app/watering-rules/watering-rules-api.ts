import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type { RuleWorklistDto } from '@shared/watering-rules/rules-dto';
import type { WateringRuleDto, WateringRuleInput } from '@shared/watering-rules/watering-rule';
import { Observable } from 'rxjs';

/** /api/watering-rules: an agency's rules by stage and the worklist of sites watering outside them. */
@Injectable({ providedIn: 'root' })
export class WateringRulesApi {
  private readonly http = inject(HttpClient);

  list(): Observable<Page<WateringRuleDto>> {
    return this.http.get<Page<WateringRuleDto>>('/api/watering-rules', { params: { pageSize: 200 } });
  }

  create(input: WateringRuleInput): Observable<WateringRuleDto> {
    return this.http.post<WateringRuleDto>('/api/watering-rules', input);
  }

  update(id: number, input: WateringRuleInput): Observable<WateringRuleDto> {
    return this.http.put<WateringRuleDto>(`/api/watering-rules/${id}`, input);
  }

  remove(id: number): Observable<void> {
    return this.http.delete<void>(`/api/watering-rules/${id}`);
  }

  worklist(month: string): Observable<RuleWorklistDto> {
    return this.http.get<RuleWorklistDto>('/api/watering-rules/worklist', { params: { month, pageSize: 200 } });
  }
}
