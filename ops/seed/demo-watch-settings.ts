import type { DataSource } from 'typeorm';
import { DEMO_ORGANISATIONS } from './demo-scenario';

/**
 * The demo sites' meters carry a small steady background draw (a few gal/h at every hour, see demo-readings.ts).
 * On a real site that would be worth a look; in the demo it would bury the planted leak under months-long
 * "continuous flow" alerts, so these sites tell the watch to count an hour as flowing only above 6 gal/h — the
 * per-site setting a manager would use for a meter that also feeds, say, a drinking fountain.
 */
const DEMO_SETTINGS: Record<string, Record<string, number>> = {
  'Willowmere HOA — North Commons': { continuousFlowMinGph: 6 },
  'Tannery Point Office Park': { continuousFlowMinGph: 6 },
  'Juniper Hollow Elementary Fields': { continuousFlowMinGph: 6 },
};

export async function seedWatchSettings(db: DataSource): Promise<number> {
  const org = DEMO_ORGANISATIONS.find((o) => o.key === 'cobalt')!.name;
  let n = 0;
  for (const [siteName, thresholds] of Object.entries(DEMO_SETTINGS)) {
    const [site] = (await db.query(
      'SELECT s.id FROM site s JOIN organisation o ON o.id = s.organisation_id WHERE o.name = ? AND s.name = ?',
      [org, siteName],
    )) as { id: number }[];
    if (!site) continue;
    await db.query(
      `INSERT INTO site_watch_settings (site_id, thresholds, irrigation_start_hour,
        irrigation_end_hour) VALUES (?, ?, 21, 7)
       ON DUPLICATE KEY UPDATE thresholds = VALUES(thresholds)`,
      [site.id, JSON.stringify(thresholds)],
    );
    n++;
  }
  return n;
}
