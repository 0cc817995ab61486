import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Outgoing mail queue and the lease rows that keep scheduled jobs on one instance. */
export class MailAndJobs1796190000000 implements MigrationInterface {
  name = 'MailAndJobs1796190000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`mail_message\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`dedupe_key\` varchar(191) NOT NULL,
      \`to_address\` varchar(254) NOT NULL,
      \`subject\` varchar(300) NOT NULL,
      \`body_text\` longtext NOT NULL,
      \`body_html\` longtext NULL,
      \`status\` enum ('queued', 'sending', 'sent', 'failed') NOT NULL DEFAULT 'queued',
      \`attempts\` smallint UNSIGNED NOT NULL DEFAULT 0,
      \`next_attempt_at\` datetime(3) NOT NULL,
      \`claimed_by\` varchar(64) NULL,
      \`claimed_until\` datetime(3) NULL,
      \`last_error\` varchar(500) NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`sent_at\` datetime(3) NULL,
      UNIQUE INDEX \`uq_mail_message_dedupe\` (\`dedupe_key\`),
      INDEX \`ix_mail_message_due\` (\`status\`, \`next_attempt_at\`),
      PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`job_lease\` (
      \`name\` varchar(64) NOT NULL,
      \`holder\` varchar(64) NOT NULL,
      \`leased_until\` datetime(3) NOT NULL,
      PRIMARY KEY (\`name\`)) ENGINE=InnoDB`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `job_lease`');
    await q.query('DROP TABLE `mail_message`');
  }
}
