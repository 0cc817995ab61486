import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Daily metered use per site and local day, maintained with every import and roll back. */
export class DailyUse1796200000000 implements MigrationInterface {
  name = 'DailyUse1796200000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`site_daily_use\` (
      \`site_id\` int UNSIGNED NOT NULL,
      \`local_date\` date NOT NULL,
      \`gallons\` decimal(14,4) NOT NULL,
      \`covered_minutes\` int UNSIGNED NOT NULL,
      \`reading_count\` int UNSIGNED NOT NULL,
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`site_id\`, \`local_date\`)) ENGINE=InnoDB`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `site_daily_use`');
  }
}
