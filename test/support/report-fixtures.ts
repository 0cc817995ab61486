import type { DataSource } from 'typeorm';
import { etoRainCsv, normals, stationForSite } from './budget-fixtures';
import type { Client } from './test-app';
import { refreshMonths } from '../../backend/src/components/readings/data/daily-use-repository';
import { PDFParse } from 'pdf-parse';

/** Invented daily ETo (mm) by calendar month: ~2.5 in January rising to ~6 in July. */
export const etoPerDay = (month: number): number =>
  Number((2 + 4 * Math.sin((Math.PI * (month - 0.5)) / 12)).toFixed(2));
/** Rain on every fifth day of the wet months, mm. */
export const rainOn = (date: string): number =>
  [1, 2, 3, 11, 12].includes(Number(date.slice(5, 7))) && Number(date.slice(8)) % 5 === 0 ? 4 : 0;

export const daysIn = (month: string): number =>
  new Date(Date.UTC(Number(month.slice(0, 4)), Number(month.slice(5)), 0)).getUTCDate();
export const monthEto = (month: string): number => etoPerDay(Number(month.slice(5))) * daysIn(month);

export function monthsBetween(from: string, to: string): string[] {
  const out: string[] = [];
  for (
    let [y, m] = from.split('-').map(Number) as [number, number];
    `${y}-${String(m).padStart(2, '0')}` <= to;
    m === 12 ? ((m = 1), y++) : m++
  )
    out.push(`${y}-${String(m).padStart(2, '0')}`);
  return out;
}

/** A station with the invented weather for [from, to] (dates), linked to the site. */
export async function weatherForSite(client: Client, siteId: number, from: string, to: string): Promise<number> {
  const stationId = await stationForSite(client, siteId);
  await client
    .put(`/api/weather-stations/${stationId}/normals`, { normals: normals({ etoMm: 120, rainMm: 10 }) })
    .expect(200);
  const days = (Date.parse(to) - Date.parse(from)) / 86_400_000 + 1;
  await client
    .postText(
      `/api/weather-stations/${stationId}/daily?format=eto-rain`,
      etoRainCsv(from, days, (d) => [etoPerDay(Number(d.slice(5, 7))), rainOn(d)]),
    )
    .expect(200);
  return stationId;
}

/** Writes a month's metered use straight into the daily rollup, spread evenly over `meteredDays` days. */
export async function insertMonthlyUse(
  db: DataSource,
  siteId: number,
  month: string,
  gallons: number,
  meteredDays = daysIn(month),
): Promise<void> {
  const values = Array.from({ length: meteredDays }, (_, i) => [
    siteId,
    `${month}-${String(i + 1).padStart(2, '0')}`,
    (gallons / meteredDays).toFixed(4),
    1440,
    96,
  ]);
  await db.query('DELETE FROM site_daily_use WHERE site_id = ? AND local_date BETWEEN ? AND ?', [
    siteId,
    `${month}-01`,
    `${month}-31`,
  ]);
  await db.query('INSERT INTO site_daily_use (site_id, local_date, gallons, covered_minutes, reading_count) VALUES ?', [
    values,
  ]);
  await refreshMonths(db, siteId, month, month);
}

/** Downloads a PDF and returns its text with whitespace collapsed. */
export async function pdfText(client: Client, path: string): Promise<string> {
  const collect = (res: NodeJS.ReadableStream, done: (err: Error | null, body: Buffer) => void) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  };
  const res = await client
    .get(path)
    .buffer(true)
    .parse(collect as never)
    .expect(200)
    .expect('content-type', 'application/pdf');
  const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
  try {
    return (await parser.getText()).text.replace(/\s+/g, ' ');
  } finally {
    await parser.destroy();
  }
}
