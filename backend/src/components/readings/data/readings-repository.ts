import type { DataSource } from 'typeorm';

/** Aggregate reads for one site's readings pages (the caller has checked access). */
export class ReadingsRepository {
  constructor(private readonly db: DataSource) {}

  /** Daily ETo and rain from the site's linked weather station, as stored (no gap filling). */
  async weather(
    siteId: number,
    from: string,
    to: string,
  ): Promise<Map<string, { etoMm: number | null; rainMm: number | null }>> {
    const rows: { date: string; etoMm: number | null; rainMm: number | null }[] = await this.db.query(
      `SELECT dw.date, dw.eto_mm AS etoMm, dw.rain_mm AS rainMm FROM daily_weather dw JOIN site s
        ON s.weather_station_id = dw.station_id
       WHERE s.id = ? AND dw.date BETWEEN ? AND ?`,
      [siteId, from, to],
    );
    return new Map(
      rows.map((r) => [
        r.date,
        { etoMm: r.etoMm === null ? null : Number(r.etoMm), rainMm: r.rainMm === null ? null : Number(r.rainMm) },
      ]),
    );
  }

  async uploads(
    siteId: number,
    timeZone: string,
    from: string,
    to: string,
  ): Promise<{ id: number; date: string; fileName: string; status: string; accepted: number }[]> {
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT id, DATE_FORMAT(CONVERT_TZ(created_at, '+00:00', ?), '%Y-%m-%d') AS date, file_name
        AS fileName, status, accepted
       FROM upload WHERE site_id = ? AND created_at BETWEEN ? - INTERVAL 1 DAY AND ? + INTERVAL 2
        DAY HAVING date BETWEEN ? AND ? ORDER BY created_at LIMIT 500`,
      [timeZone, siteId, from, to, from, to],
    );
    return rows.map((r) => ({
      id: Number(r['id']),
      date: String(r['date']),
      fileName: String(r['fileName']),
      status: String(r['status']),
      accepted: Number(r['accepted']),
    }));
  }

  async lastDataAt(siteId: number): Promise<Date | null> {
    const [row]: { last: string | null }[] = await this.db.query(
      `SELECT MAX((SELECT r.start_utc + INTERVAL r.minutes MINUTE FROM meter_reading r WHERE
        r.meter_id = m.id ORDER BY r.start_utc DESC LIMIT 1)) AS last
       FROM meter m WHERE m.site_id = ?`,
      [siteId],
    );
    return row?.last ? new Date(row.last) : null;
  }

  /**
   * Gallons per local day and local hour of one month. Readings are grouped by the local hour they start in;
   * the UTC window is a day wider on each side and HAVING keeps the month's local days.
   */
  async hourly(
    siteId: number,
    timeZone: string,
    month: string,
    lastDay: string,
  ): Promise<{ date: string; hour: number; gallons: number }[]> {
    const first = `${month}-01`;
    const rows: Record<string, unknown>[] = await this.db.query(
      `SELECT DATE_FORMAT(CONVERT_TZ(r.start_utc, '+00:00', ?), '%Y-%m-%d') AS d,
        HOUR(CONVERT_TZ(r.start_utc, '+00:00', ?)) AS h, SUM(r.volume_gal) AS gal
       FROM meter_reading r JOIN meter m ON m.id = r.meter_id
       WHERE m.site_id = ? AND r.start_utc >= ? - INTERVAL 1 DAY AND r.start_utc < ? + INTERVAL 2 DAY
       GROUP BY d, h HAVING d BETWEEN ? AND ? ORDER BY d, h`,
      [timeZone, timeZone, siteId, first, lastDay, first, lastDay],
    );
    return rows.map((r) => ({ date: String(r['d']), hour: Number(r['h']), gallons: Number(r['gal']) }));
  }
}
