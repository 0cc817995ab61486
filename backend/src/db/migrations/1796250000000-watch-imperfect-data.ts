import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Watch runs in the background with progress (sites to check and done), an optional site list, and per-site
 * warnings (an overspend check skipped or budgeted on estimated or partial weather); weather-station alerts.
 */
export class WatchImperfectData1796250000000 implements MigrationInterface {
  name = 'WatchImperfectData1796250000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`watch_run\`
      ADD \`site_ids\` text NULL,
      ADD \`sites_total\` int UNSIGNED NOT NULL DEFAULT 0,
      ADD \`sites_done\` int UNSIGNED NOT NULL DEFAULT 0,
      ADD \`warnings\` mediumtext NULL`);
    await q.query(`ALTER TABLE \`alert\` MODIFY \`kind\`
      enum ('leak', 'runaway-zone', 'overspend', 'silent-meter', 'weather') NOT NULL`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query("DELETE FROM `alert` WHERE `kind` = 'weather'");
    await q.query(`ALTER TABLE \`alert\` MODIFY \`kind\`
      enum ('leak', 'runaway-zone', 'overspend', 'silent-meter') NOT NULL`);
    await q.query(
      'ALTER TABLE `watch_run` DROP COLUMN `warnings`, DROP COLUMN `sites_done`, DROP COLUMN `sites_total`, ' +
        'DROP COLUMN `site_ids`',
    );
  }
}
