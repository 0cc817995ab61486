import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page } from '@shared/api/page';
import type {
  MonthlyNormalDto,
  WeatherImportReport,
  WeatherSeriesDto,
  WeatherStationDto,
  WeatherStationInput,
  WeatherUploadFormat,
} from '@shared/weather/weather-station-dto';
import { Observable } from 'rxjs';

/** /api/weather-stations and a site's station link. */
@Injectable({ providedIn: 'root' })
export class WeatherApi {
  private readonly http = inject(HttpClient);

  list(q = ''): Observable<Page<WeatherStationDto>> {
    let params = new HttpParams().set('pageSize', 200);
    if (q) params = params.set('q', q);
    return this.http.get<Page<WeatherStationDto>>('/api/weather-stations', { params });
  }

  get(id: number): Observable<WeatherStationDto> {
    return this.http.get<WeatherStationDto>(`/api/weather-stations/${id}`);
  }

  create(input: WeatherStationInput): Observable<WeatherStationDto> {
    return this.http.post<WeatherStationDto>('/api/weather-stations', input);
  }

  update(id: number, input: Partial<WeatherStationInput>): Observable<WeatherStationDto> {
    return this.http.patch<WeatherStationDto>(`/api/weather-stations/${id}`, input);
  }

  daily(id: number, from: string, to: string): Observable<WeatherSeriesDto> {
    return this.http.get<WeatherSeriesDto>(`/api/weather-stations/${id}/daily`, {
      params: new HttpParams().set('from', from).set('to', to),
    });
  }

  upload(id: number, format: WeatherUploadFormat, file: Blob): Observable<WeatherImportReport> {
    return this.http.post<WeatherImportReport>(`/api/weather-stations/${id}/daily`, file, {
      params: new HttpParams().set('format', format),
      headers: { 'content-type': 'text/csv' },
    });
  }

  fetchFromFeed(id: number, from: string, to: string): Observable<WeatherImportReport> {
    return this.http.post<WeatherImportReport>(`/api/weather-stations/${id}/fetch`, { from, to });
  }

  normals(id: number): Observable<MonthlyNormalDto[]> {
    return this.http.get<MonthlyNormalDto[]>(`/api/weather-stations/${id}/normals`);
  }

  saveNormals(id: number, normals: MonthlyNormalDto[]): Observable<MonthlyNormalDto[]> {
    return this.http.put<MonthlyNormalDto[]>(`/api/weather-stations/${id}/normals`, { normals });
  }

  stationOfSite(siteId: number): Observable<{ station: WeatherStationDto | null }> {
    return this.http.get<{ station: WeatherStationDto | null }>(`/api/sites/${siteId}/weather-station`);
  }

  linkSite(siteId: number, stationId: number | null): Observable<{ station: WeatherStationDto | null }> {
    return this.http.put<{ station: WeatherStationDto | null }>(`/api/sites/${siteId}/weather-station`, { stationId });
  }
}
