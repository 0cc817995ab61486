/** Fixtures for the watch tests: a meter and hourly readings written straight into the real tables. */
import type { DataSource } from 'typeorm';
import type { Client, TestApp } from '../support/test-app';

export const HOUR = 3_600_000;
/** The start of the current UTC hour: data "up to now" ends here. */
export const thisHour = () => Math.floor(Date.now() / HOUR) * HOUR;

export async function addMeter(db: DataSource, siteId: number): Promise<number> {
  const r: { insertId: number } = await db.query(
    `INSERT INTO meter (site_id, ref, unit, purpose, water_source) VALUES (?, ?, 'gal',
      'dedicated-irrigation', 'potable')`,
    [siteId, `M-${siteId}`],
  );
  return r.insertId;
}

/** Hourly readings of `gallons` each for the hours [fromMs, toMs); upload 0 marks them as test data. */
export async function addHours(
  db: DataSource,
  meterId: number,
  fromMs: number,
  toMs: number,
  gallons: number,
): Promise<void> {
  const rows: unknown[][] = [];
  for (let t = fromMs; t < toMs; t += HOUR) rows.push([meterId, new Date(t), 60, gallons, gallons, 'gal', 0]);
  if (rows.length)
    await db.query(
      `INSERT INTO meter_reading (meter_id, start_utc, minutes, volume_gal, original_value,
        original_unit, upload_id) VALUES ?`,
      [rows],
    );
}

/** A site whose meter has flowed every hour for `hours` hours, ending `endHoursAgo` hours before this hour. */
export async function leakingSite(db: DataSource, siteId: number, hours = 48, endHoursAgo = 0): Promise<number> {
  const meterId = await addMeter(db, siteId);
  const end = thisHour() - endHoursAgo * HOUR;
  await addHours(db, meterId, end - hours * HOUR, end, 12);
  return meterId;
}

export interface RunResult {
  id: number;
  status: string;
  sitesChecked: number;
  sitesSkipped: number;
  sitesTotal: number;
  sitesDone: number;
  alertsRaised: number;
  alertsUpdated: number;
  alertsReopened: number;
  mailsQueued: number;
  errors: { siteId: number; message: string }[];
  warnings: { siteId: number; message: string }[];
}

/**
 * Runs the watch for the admin's organisation (waiting out a run another test file may be holding), then follows
 * the background run on its page until it has finished.
 */
export async function runWatch(admin: Client, body: object = {}): Promise<RunResult> {
  for (let i = 0; i < 100; i++) {
    const res = await admin.post('/api/watch/runs', body);
    if (res.status === 202) return waitForRun(admin, res.body.id);
    if (res.status !== 409) throw new Error(`run failed: ${res.status} ${JSON.stringify(res.body)}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the watch lease never came free');
}

export async function waitForRun(admin: Client, id: number): Promise<RunResult> {
  for (let i = 0; i < 600; i++) {
    const run = (await admin.get(`/api/watch/runs/${id}`).expect(200)).body as RunResult;
    if (run.status !== 'running') return run;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`watch run ${id} never finished`);
}

export async function alertCount(app: TestApp, siteId: number): Promise<number> {
  const [{ n }] = (await app.db.query('SELECT COUNT(*) AS n FROM alert WHERE site_id = ?', [siteId])) as [
    { n: string },
  ];
  return Number(n);
}
