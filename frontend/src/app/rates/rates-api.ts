import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { RateScheduleDto, RateScheduleInput } from '@shared/rates/rate-schedule-dto';
import { Observable } from 'rxjs';

/** /api/sites/:id/rate-schedules */
@Injectable({ providedIn: 'root' })
export class RatesApi {
  private readonly http = inject(HttpClient);

  list(siteId: number): Observable<RateScheduleDto[]> {
    return this.http.get<RateScheduleDto[]>(`/api/sites/${siteId}/rate-schedules`);
  }

  create(siteId: number, input: RateScheduleInput): Observable<RateScheduleDto> {
    return this.http.post<RateScheduleDto>(`/api/sites/${siteId}/rate-schedules`, input);
  }

  update(siteId: number, id: number, input: Partial<RateScheduleInput>): Observable<RateScheduleDto> {
    return this.http.patch<RateScheduleDto>(`/api/sites/${siteId}/rate-schedules/${id}`, input);
  }

  remove(siteId: number, id: number): Observable<void> {
    return this.http.delete<void>(`/api/sites/${siteId}/rate-schedules/${id}`);
  }
}
