import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { OrganisationSettingsDto, UnitSystem } from '@shared/budgets/budget-dto';
import { Observable } from 'rxjs';

/** /api/organisation: the organisation's own settings. */
@Injectable({ providedIn: 'root' })
export class OrganisationApi {
  private readonly http = inject(HttpClient);

  settings(): Observable<OrganisationSettingsDto> {
    return this.http.get<OrganisationSettingsDto>('/api/organisation/settings');
  }

  /** The day/month order the organisation's exports usually use (null: none; ambiguous files are asked about). */
  setDateOrder(dateOrder: 'month-first' | 'day-first' | null): Observable<OrganisationSettingsDto> {
    return this.http.patch<OrganisationSettingsDto>('/api/organisation/settings', { dateOrder });
  }

  setUnitSystem(unitSystem: UnitSystem): Observable<OrganisationSettingsDto> {
    return this.http.patch<OrganisationSettingsDto>('/api/organisation/settings', { unitSystem });
  }
}
