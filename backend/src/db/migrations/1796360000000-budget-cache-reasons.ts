import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The budget cache keeps, for a site that cannot be budgeted, the reason in words. Earlier versions stored it with
 * the API's field code in front ("hydrozones: This site has no hydrozones yet…"), which the month close, the
 * monthly table and the board packet then showed to people. The cache is rebuilt on demand, so the rows that carry
 * a reason are simply dropped and recomputed with the plain wording on the next read.
 */
export class BudgetCacheReasons1796360000000 implements MigrationInterface {
  name = 'BudgetCacheReasons1796360000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('DELETE FROM `site_monthly_budget` WHERE `problem` IS NOT NULL');
  }

  public async down(): Promise<void> {
    // Nothing to restore: the rows are a cache and come back on the next read.
  }
}
