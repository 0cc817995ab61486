import type { MigrationInterface, QueryRunner } from 'typeorm';

const UNITS = `'gal', 'kgal', 'ccf', 'ft3', 'm3', 'l', 'acre-in', 'acre-ft'`;
const KINDS = `'interval-long', 'interval-wide', 'register', 'runtime'`;

/**
 * Meters, readings, controllers, zones, runtime events, uploads, import profiles and API keys. Written by hand.
 *
 * Scale notes: `meter_reading` and `runtime_event` are clustered on (meter|zone, start), with no surrogate id,
 * so a meter's period is one range scan and a row is ~30 bytes. Their only foreign key is to the meter/zone
 * (cascade on delete); when the table grows to where RANGE partitioning by `start_utc` pays off, that key must
 * go (MariaDB has no foreign keys on partitioned InnoDB tables) — the primary key already contains `start_utc`,
 * as partitioning requires. `upload_id` is indexed (roll-back deletes by it) but has no foreign key, to keep
 * bulk loads cheap; uploads are never deleted, only marked rolled back.
 */
export class Ingest1796180000000 implements MigrationInterface {
  name = 'Ingest1796180000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`meter\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`site_id\` int
        UNSIGNED NOT NULL, \`ref\` varchar(64) NOT NULL, \`unit\` enum (${UNITS}) NOT NULL,
        \`register_multiplier\` double NOT NULL DEFAULT 1, \`register_digits\` tinyint UNSIGNED
        NULL, \`purpose\` enum ('dedicated-irrigation', 'mixed') NOT NULL, \`water_source\` enum
        ('potable', 'recycled') NOT NULL, \`installed_at\` datetime NULL, \`removed_at\` datetime
        NULL, \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updated_at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), UNIQUE
        INDEX \`uq_meter_site_ref\` (\`site_id\`, \`ref\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`meter_register_period\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
        \`meter_id\` int UNSIGNED NOT NULL, \`installed_at\` datetime NOT NULL, \`removed_at\`
        datetime NOT NULL, \`multiplier\` double NOT NULL, \`digits\` tinyint UNSIGNED NULL, INDEX
        \`ix_meter_register_period_meter\` (\`meter_id\`, \`installed_at\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`meter_reading\` (\`meter_id\` int UNSIGNED NOT NULL, \`start_utc\` datetime
        NOT NULL, \`minutes\` mediumint UNSIGNED NOT NULL, \`volume_gal\` decimal(12,4) NOT NULL,
        \`original_value\` decimal(16,6) NOT NULL, \`original_unit\` enum (${UNITS}) NOT NULL,
        \`upload_id\` int UNSIGNED NOT NULL, INDEX \`ix_meter_reading_upload\` (\`upload_id\`),
        PRIMARY KEY (\`meter_id\`, \`start_utc\`, \`minutes\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`meter_register_read\` (\`meter_id\` int UNSIGNED NOT NULL, \`read_at\`
        datetime NOT NULL, \`position\` tinyint UNSIGNED NOT NULL, \`register_value\` decimal(16,4)
        NOT NULL, \`unit\` enum (${UNITS}) NOT NULL, \`upload_id\` int UNSIGNED NOT NULL, INDEX
        \`ix_meter_register_read_upload\` (\`upload_id\`), PRIMARY KEY (\`meter_id\`, \`read_at\`,
        \`position\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`controller\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`site_id\` int
        UNSIGNED NOT NULL, \`ref\` varchar(64) NOT NULL, \`name\` varchar(120) NOT NULL, UNIQUE
        INDEX \`uq_controller_site_ref\` (\`site_id\`, \`ref\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`zone\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`controller_id\` int
        UNSIGNED NOT NULL, \`station\` varchar(16) NOT NULL, \`name\` varchar(120) NOT NULL,
        \`hydrozone_id\` int UNSIGNED NULL, \`design_gpm\` double NULL, \`emitter_count\` int
        UNSIGNED NULL, \`emitter_gph\` double NULL, UNIQUE INDEX \`uq_zone_controller_station\`
        (\`controller_id\`, \`station\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`runtime_event\` (\`zone_id\` int UNSIGNED NOT NULL, \`start_utc\` datetime
        NOT NULL, \`minutes\` smallint UNSIGNED NOT NULL, \`cause\` enum ('scheduled', 'manual',
        'skipped-rain', 'skipped-wind') NULL, \`measured_gallons\` decimal(12,2) NULL,
        \`upload_id\` int UNSIGNED NOT NULL, INDEX \`ix_runtime_event_upload\` (\`upload_id\`),
        PRIMARY KEY (\`zone_id\`, \`start_utc\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`upload\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`site_id\` int
        UNSIGNED NOT NULL, \`uploaded_by\` int UNSIGNED NULL, \`api_key_id\` int UNSIGNED NULL,
        \`kind\` enum (${KINDS}) NULL, \`file_name\` varchar(255) NOT NULL, \`size_bytes\` bigint
        UNSIGNED NOT NULL DEFAULT 0, \`storage_key\` varchar(100) NULL, \`sha256\` char(64) NULL,
        \`mapping\` text NULL, \`options\` varchar(500) NULL, \`client_ref\` varchar(40) NULL,
        \`status\` enum ('processing', 'done', 'failed', 'rolled-back') NOT NULL, \`rows_read\` int
        UNSIGNED NOT NULL DEFAULT 0, \`accepted\` int UNSIGNED NOT NULL DEFAULT 0, \`duplicate\`
        int UNSIGNED NOT NULL DEFAULT 0, \`conflicting\` int UNSIGNED NOT NULL DEFAULT 0,
        \`replaced\` int UNSIGNED NOT NULL DEFAULT 0, \`rejected\` int UNSIGNED NOT NULL DEFAULT 0,
        \`error_summary\` text NULL, \`created_at\` datetime(3) NOT NULL DEFAULT
        CURRENT_TIMESTAMP(3), \`finished_at\` datetime(3) NULL, INDEX \`ix_upload_site_created\`
        (\`site_id\`, \`created_at\`), INDEX \`ix_upload_site_sha\` (\`site_id\`, \`sha256\`),
        PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`upload_rejection\` (\`id\` bigint UNSIGNED NOT NULL AUTO_INCREMENT,
        \`upload_id\` int UNSIGNED NOT NULL, \`row_no\` int UNSIGNED NOT NULL, \`column_no\`
        smallint UNSIGNED NULL, \`kind\` enum ('rejected', 'conflict', 'notice') NOT NULL,
        \`message\` varchar(500) NOT NULL, INDEX \`ix_upload_rejection_upload\` (\`upload_id\`,
        \`row_no\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`upload_replacement\` (\`id\` bigint UNSIGNED NOT NULL AUTO_INCREMENT,
        \`upload_id\` int UNSIGNED NOT NULL, \`target_table\` varchar(40) NOT NULL,
        \`previous_row\` text NOT NULL, INDEX \`ix_upload_replacement_upload\` (\`upload_id\`),
        PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`import_profile\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
        \`organisation_id\` int UNSIGNED NOT NULL, \`name\` varchar(120) NOT NULL, \`kind\` enum
        (${KINDS}) NOT NULL, \`mapping\` text NOT NULL, \`created_by\` int UNSIGNED NULL,
        \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX
        \`uq_import_profile_org_name\` (\`organisation_id\`, \`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`api_key\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`organisation_id\`
        int UNSIGNED NOT NULL, \`name\` varchar(120) NOT NULL, \`prefix\` char(11) NOT NULL,
        \`secret_hash\` char(64) NOT NULL, \`created_by\` int UNSIGNED NULL, \`created_at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`last_used_at\` datetime(3) NULL,
        \`revoked_at\` datetime(3) NULL, UNIQUE INDEX \`uq_api_key_prefix\` (\`prefix\`), PRIMARY
        KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`api_key_site\` (\`api_key_id\` int UNSIGNED NOT NULL, \`site_id\` int
        UNSIGNED NOT NULL, PRIMARY KEY (\`api_key_id\`, \`site_id\`)) ENGINE=InnoDB`,
    );

    const fk = (table: string, name: string, column: string, ref: string, onDelete = 'CASCADE') =>
      q.query(
        `ALTER TABLE \`${table}\` ADD CONSTRAINT \`${name}\` FOREIGN KEY (\`${column}\`) REFERENCES
          \`${ref}\`(\`id\`) ON DELETE ${onDelete} ON UPDATE NO ACTION`,
      );
    await fk('meter', 'fk_meter_site', 'site_id', 'site');
    await fk('meter_register_period', 'fk_meter_register_period_meter', 'meter_id', 'meter');
    await fk('meter_reading', 'fk_meter_reading_meter', 'meter_id', 'meter');
    await fk('meter_register_read', 'fk_meter_register_read_meter', 'meter_id', 'meter');
    await fk('controller', 'fk_controller_site', 'site_id', 'site');
    await fk('zone', 'fk_zone_controller', 'controller_id', 'controller');
    await fk('runtime_event', 'fk_runtime_event_zone', 'zone_id', 'zone');
    await fk('upload', 'fk_upload_site', 'site_id', 'site');
    await fk('upload_rejection', 'fk_upload_rejection_upload', 'upload_id', 'upload');
    await fk('upload_replacement', 'fk_upload_replacement_upload', 'upload_id', 'upload');
    await fk('import_profile', 'fk_import_profile_org', 'organisation_id', 'organisation');
    await fk('api_key', 'fk_api_key_org', 'organisation_id', 'organisation');
    await fk('api_key_site', 'fk_api_key_site_key', 'api_key_id', 'api_key');
    await fk('api_key_site', 'fk_api_key_site_site', 'site_id', 'site');
  }

  public async down(q: QueryRunner): Promise<void> {
    for (const table of [
      'api_key_site',
      'api_key',
      'import_profile',
      'upload_replacement',
      'upload_rejection',
      'upload',
      'runtime_event',
      'zone',
      'controller',
      'meter_register_read',
      'meter_reading',
      'meter_register_period',
      'meter',
    ]) {
      await q.query(`DROP TABLE \`${table}\``);
    }
  }
}
