import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A cache of each site's monthly water budget (and its cost, ETo and rain). The budget engine reads
 * hydrozones, weather and rates per site; the portfolio sorts 1,000 sites by percent of budget, so it
 * reads these rows instead and refills missing or stale ones through BudgetsService.
 */
export class SiteMonthlyBudget1796210000000 implements MigrationInterface {
  name = 'SiteMonthlyBudget1796210000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`site_monthly_budget\` (
      \`site_id\` int UNSIGNED NOT NULL,
      \`month\` char(7) NOT NULL,
      \`gallons\` double NULL,
      \`cost\` double NULL,
      \`currency\` char(3) NULL,
      \`eto_mm\` double NULL,
      \`rain_mm\` double NULL,
      \`filled_days\` smallint UNSIGNED NOT NULL DEFAULT 0,
      \`problem\` varchar(300) NULL,
      \`computed_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`site_id\`, \`month\`)) ENGINE=InnoDB`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `site_monthly_budget`');
  }
}
