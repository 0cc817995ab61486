import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Each role's month: a manager's review mark per site and month, board packets built in the background, and
 * savings projects that lock their baseline when marked installed (with a retrofit list and the installed cost).
 */
export class RoleMonths1796330000000 implements MigrationInterface {
  name = 'RoleMonths1796330000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`site_month_review\` (
      \`site_id\` int UNSIGNED NOT NULL,
      \`month\` char(7) NOT NULL,
      \`reviewed_by\` int UNSIGNED NULL,
      \`reviewed_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`note\` varchar(2000) NOT NULL DEFAULT '',
      PRIMARY KEY (\`site_id\`, \`month\`),
      INDEX \`ix_site_month_review_month\` (\`month\`),
      CONSTRAINT \`FK_site_month_review_site\` FOREIGN KEY (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_site_month_review_user\` FOREIGN KEY (\`reviewed_by\`) REFERENCES \`user\`(\`id\`)
        ON DELETE SET NULL
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`board_packet\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`organisation_id\` int UNSIGNED NOT NULL,
      \`month\` char(7) NOT NULL,
      \`title\` varchar(160) NOT NULL,
      \`site_ids\` longtext NOT NULL,
      \`status\` enum ('queued', 'running', 'done', 'failed') NOT NULL DEFAULT 'queued',
      \`done_sites\` smallint UNSIGNED NOT NULL DEFAULT 0,
      \`total_sites\` smallint UNSIGNED NOT NULL,
      \`storage_key\` varchar(100) NULL,
      \`size_bytes\` int UNSIGNED NULL,
      \`error\` varchar(500) NULL,
      \`created_by\` int UNSIGNED NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`finished_at\` datetime(3) NULL,
      PRIMARY KEY (\`id\`),
      INDEX \`ix_board_packet_org\` (\`organisation_id\`, \`created_at\`),
      CONSTRAINT \`FK_board_packet_org\` FOREIGN KEY (\`organisation_id\`) REFERENCES \`organisation\`(\`id\`)
        ON DELETE CASCADE,
      CONSTRAINT \`FK_board_packet_user\` FOREIGN KEY (\`created_by\`) REFERENCES \`user\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
    await q.query(`ALTER TABLE \`savings_project\`
      ADD \`status\` varchar(12) NOT NULL DEFAULT 'planned',
      ADD \`locked_at\` datetime(3) NULL,
      ADD \`locked_by\` int UNSIGNED NULL,
      ADD \`archived_at\` datetime(3) NULL,
      ADD \`archived_by\` int UNSIGNED NULL,
      ADD \`retrofits\` longtext NULL,
      ADD \`installed_cost\` decimal(12,2) NULL,
      ADD \`cost_currency\` char(3) NULL`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`savings_project\` DROP \`status\`,
      DROP \`locked_at\`, DROP \`locked_by\`, DROP \`archived_at\`, DROP \`archived_by\`, DROP \`retrofits\`,
      DROP \`installed_cost\`, DROP \`cost_currency\``);
    await q.query('DROP TABLE `board_packet`');
    await q.query('DROP TABLE `site_month_review`');
  }
}
