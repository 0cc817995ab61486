import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Hardening (issue 11):
 * - `sign_in_failure`: failed sign-ins per account and per address+account (only wrong passwords are written), for
 *   growing delays per account and a window per address. Replaces express-rate-limit's `rate_limit_hit`.
 * - `mail_message.organisation_ids`: the organisations a message was sent for, so the development outbox shows an
 *   administrator only their own organisation's mail.
 */
export class Hardening1796320000000 implements MigrationInterface {
  name = 'Hardening1796320000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`sign_in_failure\` (
      \`bucket\` varchar(255) NOT NULL,
      \`failures\` int UNSIGNED NOT NULL,
      \`last_failure_at\` datetime(3) NOT NULL,
      \`window_until\` datetime(3) NOT NULL,
      INDEX \`ix_sign_in_failure_window\` (\`window_until\`),
      PRIMARY KEY (\`bucket\`)) ENGINE=InnoDB`);
    await q.query('DROP TABLE `rate_limit_hit`');
    await q.query('ALTER TABLE `mail_message` ADD `organisation_ids` varchar(255) NULL');
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `mail_message` DROP COLUMN `organisation_ids`');
    await q.query(
      `CREATE TABLE \`rate_limit_hit\` (\`bucket\` varchar(255) NOT NULL, \`hits\` int UNSIGNED NOT NULL,
        \`reset_at\` datetime(3) NOT NULL, INDEX \`ix_rate_limit_reset\` (\`reset_at\`), PRIMARY KEY (\`bucket\`))
        ENGINE=InnoDB`,
    );
    await q.query('DROP TABLE `sign_in_failure`');
  }
}
