import type { MigrationInterface, QueryRunner } from 'typeorm';

const UNITS = `'gal', 'kgal', 'ccf', 'ft3', 'm3', 'l', 'acre-in', 'acre-ft'`;
const KINDS = `'interval-long', 'interval-wide', 'register', 'runtime', 'billing'`;
const OLD_KINDS = `'interval-long', 'interval-wide', 'register', 'runtime'`;

/**
 * What uploads decide or ask about real-world exports. Written by hand.
 * - Uploads for a whole organisation (rows routed by meter/controller to their sites): `upload.site_id` may be
 *   null, `upload.organisation_id` says whose it is, `upload_site` keeps the counts per site.
 * - Billing periods (`meter_billing_period`), spread over days into `meter_reading` with a flag.
 * - `meter_reading.flags` (1 estimated, 2 spread from a bill by ETo, 4 spread evenly); register reads keep the
 *   serial, multiplier, digits and estimated flag their file gave; rollups carry estimated and spread gallons.
 * - Conflicts left for later ("replace these N readings", in-file repeats to resolve): `upload_conflict`.
 * - Meter swaps recorded by an upload (`meter_register_period.upload_id`, undone with it).
 * - An organisation's usual day/month order.
 */
export class IngestDecisions1796350000000 implements MigrationInterface {
  name = 'IngestDecisions1796350000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`upload\` ADD \`organisation_id\` int UNSIGNED NULL AFTER \`site_id\`,
      ADD \`unknown_refs\` int UNSIGNED NOT NULL DEFAULT 0, MODIFY \`kind\` enum (${KINDS}) NULL`);
    await q.query('UPDATE upload u JOIN site s ON s.id = u.site_id SET u.organisation_id = s.organisation_id');
    // Nullable so rows written without it (fixtures, older scripts) still insert; the site then says whose it is.
    await q.query(`ALTER TABLE \`upload\` MODIFY \`site_id\` int UNSIGNED NULL,
      ADD INDEX \`ix_upload_org_sha\` (\`organisation_id\`, \`sha256\`),
      ADD CONSTRAINT \`fk_upload_org\` FOREIGN KEY (\`organisation_id\`) REFERENCES \`organisation\`(\`id\`)
      ON DELETE CASCADE ON UPDATE NO ACTION`);
    await q.query(`CREATE TABLE \`upload_site\` (\`upload_id\` int UNSIGNED NOT NULL, \`site_id\` int UNSIGNED
      NOT NULL, \`accepted\` int UNSIGNED NOT NULL DEFAULT 0, \`duplicate\` int UNSIGNED NOT NULL DEFAULT 0,
      \`conflicting\` int UNSIGNED NOT NULL DEFAULT 0, \`rejected\` int UNSIGNED NOT NULL DEFAULT 0,
      PRIMARY KEY (\`upload_id\`, \`site_id\`), INDEX \`ix_upload_site_site\` (\`site_id\`, \`upload_id\`),
      CONSTRAINT \`fk_upload_site_upload\` FOREIGN KEY (\`upload_id\`) REFERENCES \`upload\`(\`id\`) ON DELETE
      CASCADE, CONSTRAINT \`fk_upload_site_site\` FOREIGN KEY (\`site_id\`) REFERENCES \`site\`(\`id\`) ON
      DELETE CASCADE) ENGINE=InnoDB`);
    await q.query(`ALTER TABLE \`upload_rejection\` MODIFY \`kind\` enum ('rejected', 'conflict', 'notice',
      'unknown') NOT NULL, ADD \`ref\` varchar(64) NULL, ADD \`ref_field\` enum ('meter', 'controller') NULL,
      ADD \`ref_rows\` int UNSIGNED NULL`);
    await q.query(`ALTER TABLE \`import_profile\` MODIFY \`kind\` enum (${KINDS}) NOT NULL`);
    await q.query(
      "ALTER TABLE `organisation` ADD `date_order` enum ('month-first', 'day-first') NULL AFTER `unit_system`",
    );
    await q.query('ALTER TABLE `meter_reading` ADD `flags` tinyint UNSIGNED NOT NULL DEFAULT 0');
    await q.query(`ALTER TABLE \`meter_register_read\` ADD \`serial\` varchar(64) NULL, ADD \`multiplier\`
      double NULL, ADD \`digits\` tinyint UNSIGNED NULL, ADD \`estimated\` tinyint UNSIGNED NOT NULL DEFAULT 0`);
    await q.query(`ALTER TABLE \`meter_register_period\` ADD \`serial\` varchar(64) NULL, ADD \`upload_id\` int
      UNSIGNED NULL, ADD INDEX \`ix_meter_register_period_upload\` (\`upload_id\`)`);
    await q.query(`CREATE TABLE \`meter_billing_period\` (\`meter_id\` int UNSIGNED NOT NULL, \`start_date\` date
      NOT NULL, \`end_date\` date NOT NULL, \`volume_gal\` decimal(14,4) NOT NULL, \`original_value\`
      decimal(16,6) NOT NULL, \`original_unit\` enum (${UNITS}) NOT NULL, \`estimated\` tinyint UNSIGNED NOT NULL
      DEFAULT 0, \`spread\` enum ('eto', 'even') NULL, \`upload_id\` int UNSIGNED NOT NULL, PRIMARY KEY
      (\`meter_id\`, \`start_date\`), INDEX \`ix_meter_billing_period_upload\` (\`upload_id\`), CONSTRAINT
      \`fk_meter_billing_period_meter\` FOREIGN KEY (\`meter_id\`) REFERENCES \`meter\`(\`id\`) ON DELETE
      CASCADE) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`upload_conflict\` (\`id\` bigint UNSIGNED NOT NULL AUTO_INCREMENT, \`upload_id\`
      int UNSIGNED NOT NULL, \`kind\` enum ('stored', 'in-file') NOT NULL, \`meter_id\` int UNSIGNED NOT NULL,
      \`start_utc\` datetime NOT NULL, \`minutes\` mediumint UNSIGNED NOT NULL, \`volume_gal\` decimal(12,4) NOT
      NULL, \`original_value\` decimal(16,6) NOT NULL, \`original_unit\` enum (${UNITS}) NOT NULL, \`flags\`
      tinyint UNSIGNED NOT NULL DEFAULT 0, \`row_no\` int UNSIGNED NOT NULL, \`resolved\` tinyint UNSIGNED NOT
      NULL DEFAULT 0, PRIMARY KEY (\`id\`), INDEX \`ix_upload_conflict_upload\` (\`upload_id\`, \`kind\`,
      \`resolved\`), CONSTRAINT \`fk_upload_conflict_upload\` FOREIGN KEY (\`upload_id\`) REFERENCES
      \`upload\`(\`id\`) ON DELETE CASCADE) ENGINE=InnoDB`);
    for (const table of ['site_daily_use', 'site_monthly_use']) {
      await q.query(`ALTER TABLE \`${table}\` ADD \`estimated_gal\` decimal(16,4) NOT NULL DEFAULT 0, ADD
        \`spread_gal\` decimal(16,4) NOT NULL DEFAULT 0`);
    }
  }

  public async down(q: QueryRunner): Promise<void> {
    for (const table of ['site_daily_use', 'site_monthly_use']) {
      await q.query(`ALTER TABLE \`${table}\` DROP \`estimated_gal\`, DROP \`spread_gal\``);
    }
    await q.query('DROP TABLE `upload_conflict`');
    await q.query('DROP TABLE `meter_billing_period`');
    await q.query(`ALTER TABLE \`meter_register_period\` DROP INDEX \`ix_meter_register_period_upload\`, DROP
      \`upload_id\`, DROP \`serial\``);
    await q.query(`ALTER TABLE \`meter_register_read\` DROP \`serial\`, DROP \`multiplier\`, DROP \`digits\`,
      DROP \`estimated\``);
    await q.query('ALTER TABLE `meter_reading` DROP `flags`');
    await q.query('ALTER TABLE `organisation` DROP `date_order`');
    await q.query(`DELETE FROM \`import_profile\` WHERE \`kind\` = 'billing'`);
    await q.query(`ALTER TABLE \`import_profile\` MODIFY \`kind\` enum (${OLD_KINDS}) NOT NULL`);
    await q.query(`DELETE FROM \`upload_rejection\` WHERE \`kind\` = 'unknown'`);
    await q.query(`ALTER TABLE \`upload_rejection\` DROP \`ref\`, DROP \`ref_field\`, DROP \`ref_rows\`, MODIFY
      \`kind\` enum ('rejected', 'conflict', 'notice') NOT NULL`);
    await q.query('DROP TABLE `upload_site`');
    await q.query(`DELETE FROM \`upload\` WHERE \`site_id\` IS NULL OR \`kind\` = 'billing'`);
    await q.query(`ALTER TABLE \`upload\` DROP FOREIGN KEY \`fk_upload_org\`, DROP INDEX \`ix_upload_org_sha\`,
      DROP \`organisation_id\`, DROP \`unknown_refs\`, MODIFY \`site_id\` int UNSIGNED NOT NULL, MODIFY
      \`kind\` enum (${OLD_KINDS}) NULL`);
  }
}
