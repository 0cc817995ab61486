import type { MigrationInterface, QueryRunner } from 'typeorm';

const KINDS_BEFORE = `'leak', 'runaway-zone', 'overspend', 'silent-meter', 'weather'`;
const ACTIONS_BEFORE = `'opened', 'acknowledged', 'resolved', 'reopened', 'note', 'updated'`;

/**
 * Issue 18 part 2. Watering rules an agency enters by stage (days, hours, minutes per station, dates in force) and
 * the sites under each; the watch's "watering outside the rules" alerts; and repairs verified by the meter: how an
 * alert was resolved ("fixed" with the repair's date), and whether the data since confirmed it.
 */
export class WateringRulesAndRepairs1796340000000 implements MigrationInterface {
  name = 'WateringRulesAndRepairs1796340000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`watering_rule\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`organisation_id\` int UNSIGNED NOT NULL,
      \`name\` varchar(120) NOT NULL,
      \`stage\` varchar(60) NOT NULL,
      \`day_mode\` enum ('any', 'weekdays', 'odd-even', 'assigned') NOT NULL,
      \`weekdays\` varchar(20) NOT NULL DEFAULT '',
      \`start_hour\` tinyint UNSIGNED NOT NULL,
      \`end_hour\` tinyint UNSIGNED NOT NULL,
      \`max_station_minutes\` smallint UNSIGNED NULL,
      \`in_force_from\` date NOT NULL,
      \`in_force_to\` date NULL,
      \`updated_by\` int UNSIGNED NULL,
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`id\`),
      INDEX \`ix_watering_rule_org\` (\`organisation_id\`, \`in_force_from\`),
      CONSTRAINT \`FK_watering_rule_org\` FOREIGN KEY (\`organisation_id\`)
        REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_watering_rule_user\` FOREIGN KEY (\`updated_by\`) REFERENCES \`user\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`watering_rule_site\` (
      \`rule_id\` int UNSIGNED NOT NULL,
      \`site_id\` int UNSIGNED NOT NULL,
      \`address_number\` int UNSIGNED NULL,
      \`assigned_weekdays\` varchar(20) NOT NULL DEFAULT '',
      PRIMARY KEY (\`rule_id\`, \`site_id\`),
      INDEX \`ix_watering_rule_site_site\` (\`site_id\`),
      CONSTRAINT \`FK_watering_rule_site_rule\` FOREIGN KEY (\`rule_id\`)
        REFERENCES \`watering_rule\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_watering_rule_site_site\` FOREIGN KEY (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE
    ) ENGINE=InnoDB`);
    await q.query(`ALTER TABLE \`alert\` MODIFY \`kind\` enum (${KINDS_BEFORE}, 'watering-rules') NOT NULL`);
    await q.query(`ALTER TABLE \`alert\`
      ADD \`resolution\` enum ('fixed', 'not-a-problem', 'other') NULL,
      ADD \`repaired_at\` datetime NULL,
      ADD \`resolved_by\` int UNSIGNED NULL,
      ADD \`resolver_organisation_id\` int UNSIGNED NULL,
      ADD \`verification\` enum ('watching', 'verified', 'not-verified') NULL,
      ADD \`verified_at\` datetime(3) NULL,
      ADD \`verification_evidence\` mediumtext NULL,
      ADD INDEX \`ix_alert_verification\` (\`verification\`, \`site_id\`)`);
    await q.query(
      `ALTER TABLE \`alert_event\` MODIFY \`action\` enum (${ACTIONS_BEFORE}, 'verified', 'not-verified') NOT NULL`,
    );
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query("DELETE FROM `alert_event` WHERE `action` IN ('verified', 'not-verified')");
    await q.query(`ALTER TABLE \`alert_event\` MODIFY \`action\` enum (${ACTIONS_BEFORE}) NOT NULL`);
    await q.query(`ALTER TABLE \`alert\` DROP INDEX \`ix_alert_verification\`, DROP \`resolution\`,
      DROP \`repaired_at\`, DROP \`resolved_by\`, DROP \`resolver_organisation_id\`, DROP \`verification\`,
      DROP \`verified_at\`, DROP \`verification_evidence\``);
    await q.query("DELETE FROM `alert` WHERE `kind` = 'watering-rules'");
    await q.query(`ALTER TABLE \`alert\` MODIFY \`kind\` enum (${KINDS_BEFORE}) NOT NULL`);
    await q.query('DROP TABLE `watering_rule_site`');
    await q.query('DROP TABLE `watering_rule`');
  }
}
