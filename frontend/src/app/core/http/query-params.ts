import { HttpParams } from '@angular/common/http';

/** Query parameters for a list request; empty filters are left out rather than sent blank. */
export function queryParams(values: Record<string, string | number | null | undefined>): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(values)) {
    if (value !== '' && value !== null && value !== undefined) params = params.set(key, value);
  }
  return params;
}
