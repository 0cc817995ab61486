import type { Client } from './test-app';
import { suffix } from './test-app';

/** Invented station coordinates (a valley floor that exists only in the test suite). */
export const TEST_STATION = { latitude: 36.42, longitude: -119.87, elevationM: 95 };

/** Creates a station as `client` and links `siteId` to it; returns the station id. */
export async function stationForSite(
  client: Client,
  siteId: number,
  fields: Partial<typeof TEST_STATION> = {},
): Promise<number> {
  const station = await client
    .post('/api/weather-stations', { name: `Station ${suffix()}`, ...TEST_STATION, ...fields })
    .expect(201);
  await client.put(`/api/sites/${siteId}/weather-station`, { stationId: station.body.id }).expect(200);
  return station.body.id;
}

/** Twelve monthly normals, `overrides` by month number. */
export function normals(
  base: { etoMm: number; rainMm: number },
  overrides: Record<number, { etoMm: number; rainMm: number }> = {},
) {
  return Array.from({ length: 12 }, (_, i) => ({ month: i + 1, ...(overrides[i + 1] ?? base) }));
}

/** A daily ETo + rain CSV for each date from `from` for `days` days, skipping `skip`. */
export function etoRainCsv(
  from: string,
  days: number,
  value: (date: string) => [number, number],
  skip: string[] = [],
): string {
  const lines = ['date,eto_mm,rain_mm'];
  for (let i = 0; i < days; i++) {
    const date = new Date(Date.parse(from) + i * 86_400_000).toISOString().slice(0, 10);
    if (skip.includes(date)) continue;
    const [eto, rain] = value(date);
    lines.push(`${date},${eto},${rain}`);
  }
  return lines.join('\n') + '\n';
}
