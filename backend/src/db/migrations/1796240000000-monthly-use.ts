import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Monthly metered use per site (from `site_daily_use`, kept in step with it in the same transaction). The
 * portfolio's year to date, its 12-month trend lines and a site's monthly table read a dozen rows per site
 * here instead of a year of daily rows.
 */
export class MonthlyUse1796240000000 implements MigrationInterface {
  name = 'MonthlyUse1796240000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`site_monthly_use\` (
      \`site_id\` int UNSIGNED NOT NULL,
      \`month\` char(7) NOT NULL,
      \`gallons\` decimal(16,4) NOT NULL,
      \`covered_minutes\` int UNSIGNED NOT NULL,
      \`days\` smallint UNSIGNED NOT NULL,
      PRIMARY KEY (\`site_id\`, \`month\`),
      INDEX \`ix_site_monthly_use_month\` (\`month\`, \`site_id\`, \`gallons\`)) ENGINE=InnoDB`);
    await q.query(`INSERT INTO site_monthly_use (site_id, month, gallons, covered_minutes, days)
      SELECT site_id, DATE_FORMAT(local_date, '%Y-%m'), SUM(gallons), SUM(covered_minutes), COUNT(*) FROM site_daily_use
      GROUP BY site_id, DATE_FORMAT(local_date, '%Y-%m')`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `site_monthly_use`');
  }
}
