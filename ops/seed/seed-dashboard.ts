import type { DataSource } from 'typeorm';
import { DailyUseRepository } from '../../backend/src/components/readings/data/daily-use-repository';

/**
 * The dashboard reads the `site_daily_use` rollup. Seeded readings arrive through the upload path, which
 * may not refresh the rollup yet, so every site with readings but no rollup rows is rebuilt here. Idempotent.
 */
export async function seedDashboard(db: DataSource): Promise<{ rebuilt: number }> {
  const sites: { id: number }[] = await db.query(
    `SELECT DISTINCT m.site_id AS id FROM meter m
     WHERE EXISTS (SELECT 1 FROM meter_reading r WHERE r.meter_id = m.id)
       AND NOT EXISTS (SELECT 1 FROM site_daily_use d WHERE d.site_id = m.site_id)`,
  );
  const rollup = new DailyUseRepository(db);
  for (const site of sites) await db.transaction((em) => rollup.rebuildSite(em, Number(site.id)));
  return { rebuilt: sites.length };
}
