import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { ControllerDto, MeterDto, MeterInput, ZoneInput } from '@shared/meters/meter';
import type { Observable } from 'rxjs';

/** /api/sites/:id/meters and /api/sites/:id/controllers: a site's equipment. */
@Injectable({ providedIn: 'root' })
export class MetersApi {
  private readonly http = inject(HttpClient);

  meters(siteId: number): Observable<MeterDto[]> {
    return this.http.get<MeterDto[]>(`/api/sites/${siteId}/meters`);
  }

  createMeter(siteId: number, input: MeterInput): Observable<MeterDto> {
    return this.http.post<MeterDto>(`/api/sites/${siteId}/meters`, input);
  }

  updateMeter(siteId: number, meterId: number, changes: Partial<MeterInput>): Observable<MeterDto> {
    return this.http.patch<MeterDto>(`/api/sites/${siteId}/meters/${meterId}`, changes);
  }

  /** The meter's register was replaced at `swappedAt`: the old one becomes a previous register period. */
  recordSwap(
    siteId: number,
    meterId: number,
    swap: { swappedAt: string; multiplier: number; digits: number | null },
  ): Observable<MeterDto> {
    return this.http.post<MeterDto>(`/api/sites/${siteId}/meters/${meterId}/swaps`, swap);
  }

  deleteMeter(siteId: number, meterId: number): Observable<void> {
    return this.http.delete<void>(`/api/sites/${siteId}/meters/${meterId}`);
  }

  controllers(siteId: number): Observable<ControllerDto[]> {
    return this.http.get<ControllerDto[]>(`/api/sites/${siteId}/controllers`);
  }

  createController(siteId: number, input: { ref: string; name: string }): Observable<ControllerDto> {
    return this.http.post<ControllerDto>(`/api/sites/${siteId}/controllers`, input);
  }

  addZone(siteId: number, controllerId: number, input: ZoneInput): Observable<ControllerDto> {
    return this.http.post<ControllerDto>(`/api/sites/${siteId}/controllers/${controllerId}/zones`, input);
  }

  updateZone(
    siteId: number,
    controllerId: number,
    zoneId: number,
    changes: Partial<ZoneInput>,
  ): Observable<ControllerDto> {
    return this.http.patch<ControllerDto>(`/api/sites/${siteId}/controllers/${controllerId}/zones/${zoneId}`, changes);
  }
}
