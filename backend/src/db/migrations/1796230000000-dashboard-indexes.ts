import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The portfolio sums every visible site's daily use over a date range and reads one month of cached budgets
 * for all of them. Both tables are keyed by site first; these covering indexes let those range reads skip
 * the other dates instead of scanning every row.
 */
export class DashboardIndexes1796230000000 implements MigrationInterface {
  name = 'DashboardIndexes1796230000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('CREATE INDEX `ix_site_daily_use_date` ON `site_daily_use` (`local_date`, `site_id`, `gallons`)');
    await q.query(
      'CREATE INDEX `ix_site_monthly_budget_month` ON `site_monthly_budget` (`month`, `site_id`, `gallons`)',
    );
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP INDEX `ix_site_monthly_budget_month` ON `site_monthly_budget`');
    await q.query('DROP INDEX `ix_site_daily_use_date` ON `site_daily_use`');
  }
}
