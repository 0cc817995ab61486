import type { MigrationInterface, QueryRunner } from 'typeorm';

const KINDS = `'leak', 'runaway-zone', 'overspend', 'silent-meter'`;

/**
 * The nightly watch: alerts and their history, run records, per-site settings and state, and who gets which
 * e-mail. Written by hand. `alert.finding_key` is unique per site (the idempotency key of a finding);
 * `condition_key` finds the earlier alert when a resolved condition comes back.
 */
export class Watch1796215000000 implements MigrationInterface {
  name = 'Watch1796215000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`alert\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`site_id\` int UNSIGNED NOT NULL,
      \`kind\` enum (${KINDS}) NOT NULL,
      \`sub_kind\` varchar(40) NOT NULL,
      \`zone_id\` int UNSIGNED NULL,
      \`finding_key\` varchar(200) NOT NULL,
      \`condition_key\` varchar(160) NOT NULL,
      \`period_start_utc\` datetime NOT NULL,
      \`period_end_utc\` datetime NOT NULL,
      \`severity\` enum ('watch', 'act-soon', 'act-now') NOT NULL,
      \`status\` enum ('open', 'acknowledged', 'resolved') NOT NULL DEFAULT 'open',
      \`ongoing\` tinyint(1) NOT NULL DEFAULT 0,
      \`evidence\` mediumtext NOT NULL,
      \`water_lost_gal\` double NULL,
      \`money_lost\` double NULL,
      \`currency\` char(3) NULL,
      \`explanation\` text NOT NULL,
      \`first_detected_at\` datetime(3) NOT NULL,
      \`last_seen_at\` datetime(3) NOT NULL,
      \`resolved_at\` datetime(3) NULL,
      \`reopen_count\` int UNSIGNED NOT NULL DEFAULT 0,
      UNIQUE INDEX \`uq_alert_site_finding\` (\`site_id\`, \`finding_key\`),
      INDEX \`ix_alert_condition\` (\`site_id\`, \`condition_key\`, \`period_start_utc\`),
      INDEX \`ix_alert_status_site\` (\`status\`, \`site_id\`),
      PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`alert_event\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`alert_id\` int UNSIGNED NOT NULL,
      \`user_id\` int UNSIGNED NULL,
      \`action\` enum ('opened', 'acknowledged', 'resolved', 'reopened', 'note', 'updated') NOT NULL,
      \`note\` varchar(2000) NULL,
      \`at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      INDEX \`ix_alert_event_alert\` (\`alert_id\`, \`at\`),
      PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`watch_run\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`organisation_id\` int UNSIGNED NULL,
      \`requested_by\` int UNSIGNED NULL,
      \`trigger\` enum ('scheduled', 'manual', 'recheck') NOT NULL,
      \`status\` enum ('running', 'done', 'failed') NOT NULL,
      \`range_from_utc\` datetime NULL,
      \`range_to_utc\` datetime NOT NULL,
      \`started_at\` datetime(3) NOT NULL,
      \`finished_at\` datetime(3) NULL,
      \`sites_checked\` int UNSIGNED NOT NULL DEFAULT 0,
      \`sites_skipped\` int UNSIGNED NOT NULL DEFAULT 0,
      \`findings\` int UNSIGNED NOT NULL DEFAULT 0,
      \`alerts_raised\` int UNSIGNED NOT NULL DEFAULT 0,
      \`alerts_updated\` int UNSIGNED NOT NULL DEFAULT 0,
      \`alerts_reopened\` int UNSIGNED NOT NULL DEFAULT 0,
      \`mails_queued\` int UNSIGNED NOT NULL DEFAULT 0,
      \`errors\` mediumtext NULL,
      INDEX \`ix_watch_run_started\` (\`started_at\`),
      PRIMARY KEY (\`id\`)) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`watch_site_state\` (
      \`site_id\` int UNSIGNED NOT NULL,
      \`last_data_utc\` datetime NULL,
      \`last_checked_as_of_utc\` datetime NULL,
      \`last_night\` date NULL,
      PRIMARY KEY (\`site_id\`)) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`site_watch_settings\` (
      \`site_id\` int UNSIGNED NOT NULL,
      \`thresholds\` text NOT NULL,
      \`irrigation_start_hour\` tinyint UNSIGNED NOT NULL,
      \`irrigation_end_hour\` tinyint UNSIGNED NOT NULL,
      \`updated_by\` int UNSIGNED NULL,
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`site_id\`)) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`user_notification\` (
      \`user_id\` int UNSIGNED NOT NULL,
      \`frequency\` enum ('each', 'daily', 'none') NOT NULL DEFAULT 'daily',
      \`site_ids\` text NULL,
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`user_id\`)) ENGINE=InnoDB`);

    const fk = (table: string, name: string, column: string, ref: string) =>
      q.query(
        `ALTER TABLE \`${table}\` ADD CONSTRAINT \`${name}\` FOREIGN KEY (\`${column}\`) REFERENCES
          \`${ref}\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
      );
    await fk('alert', 'fk_alert_site', 'site_id', 'site');
    await fk('alert_event', 'fk_alert_event_alert', 'alert_id', 'alert');
    await fk('watch_site_state', 'fk_watch_site_state_site', 'site_id', 'site');
    await fk('site_watch_settings', 'fk_site_watch_settings_site', 'site_id', 'site');
    await fk('user_notification', 'fk_user_notification_user', 'user_id', 'user');
  }

  public async down(q: QueryRunner): Promise<void> {
    for (const table of [
      'user_notification',
      'site_watch_settings',
      'watch_site_state',
      'watch_run',
      'alert_event',
      'alert',
    ]) {
      await q.query(`DROP TABLE \`${table}\``);
    }
  }
}
