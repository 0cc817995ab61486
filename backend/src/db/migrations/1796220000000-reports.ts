import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Savings projects (a retrofit on a site with its baseline and reporting months) and compliance notices
 * (one per site and month, so an auditor's second click cannot mail a manager twice).
 */
export class Reports1796220000000 implements MigrationInterface {
  name = 'Reports1796220000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`savings_project\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`site_id\` int UNSIGNED NOT NULL,
      \`title\` varchar(160) NOT NULL,
      \`change_kind\` varchar(40) NOT NULL,
      \`change_description\` varchar(2000) NOT NULL DEFAULT '',
      \`installed_on\` date NOT NULL,
      \`baseline_from\` char(7) NOT NULL,
      \`baseline_to\` char(7) NOT NULL,
      \`reporting_from\` char(7) NOT NULL,
      \`reporting_to\` char(7) NOT NULL,
      \`model_form\` varchar(20) NOT NULL,
      \`created_by\` int UNSIGNED NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`id\`),
      INDEX \`IDX_savings_project_site\` (\`site_id\`),
      CONSTRAINT \`FK_savings_project_site\` FOREIGN KEY (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_savings_project_user\` FOREIGN KEY (\`created_by\`) REFERENCES \`user\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`compliance_notice\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`site_id\` int UNSIGNED NOT NULL,
      \`month\` char(7) NOT NULL,
      \`sent_by\` int UNSIGNED NULL,
      \`sender_organisation_id\` int UNSIGNED NOT NULL,
      \`recipients\` smallint UNSIGNED NOT NULL,
      \`percent_of_budget\` double NULL,
      \`message\` varchar(2000) NOT NULL DEFAULT '',
      \`sent_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`id\`),
      UNIQUE INDEX \`UQ_compliance_notice_site_month\` (\`site_id\`, \`month\`),
      CONSTRAINT \`FK_compliance_notice_site\` FOREIGN KEY (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_compliance_notice_user\` FOREIGN KEY (\`sent_by\`) REFERENCES \`user\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `compliance_notice`');
    await q.query('DROP TABLE `savings_project`');
  }
}
