import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Water budgets: hydrozones, weather stations with daily weather and monthly normals, the site → station link
 * and rate schedules. Written by hand (names match the entities' explicit index and foreign-key names).
 */
export class Budgets1796170000000 implements MigrationInterface {
  name = 'Budgets1796170000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`weather_station\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
        \`organisation_id\` int UNSIGNED NOT NULL, \`name\` varchar(120) NOT NULL, \`latitude\`
        double NOT NULL, \`longitude\` double NOT NULL, \`elevation_m\` double NOT NULL,
        \`wind_height_m\` double NOT NULL DEFAULT 2, \`exposure\` enum ('interior', 'coastal') NOT
        NULL DEFAULT 'interior', \`source_kind\` enum ('upload', 'feed') NOT NULL DEFAULT 'upload',
        \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6), \`updated_at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6) ON UPDATE CURRENT_TIMESTAMP(6), UNIQUE
        INDEX \`uq_weather_station_org_name\` (\`organisation_id\`, \`name\`), PRIMARY KEY
        (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`daily_weather\` (\`id\` bigint UNSIGNED NOT NULL AUTO_INCREMENT,
        \`station_id\` int UNSIGNED NOT NULL, \`date\` char(10) NOT NULL, \`eto_mm\` double NULL,
        \`rain_mm\` double NULL, \`method\` enum ('measured', 'penman-monteith',
        'penman-monteith-estimated-rs', 'hargreaves', 'normal-filled') NOT NULL, \`observations\`
        text NULL, \`source\` enum ('upload', 'feed') NOT NULL, \`updated_at\` datetime(3) NOT NULL
        DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`uq_daily_weather_station_date\`
        (\`station_id\`, \`date\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`monthly_weather_normal\` (\`station_id\` int UNSIGNED NOT NULL, \`month\`
        tinyint UNSIGNED NOT NULL, \`eto_mm\` double NOT NULL, \`rain_mm\` double NOT NULL, PRIMARY
        KEY (\`station_id\`, \`month\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`hydrozone\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`site_id\` int
        UNSIGNED NOT NULL, \`name\` varchar(120) NOT NULL, \`area_ft2\` double NOT NULL,
        \`plant_water_use\` enum ('very-low', 'low', 'moderate', 'high') NULL, \`plant_factor\`
        double NULL, \`irrigation_method\` enum ('drip', 'subsurface-drip', 'bubbler',
        'microspray', 'spray', 'rotor', 'rotary-nozzle') NOT NULL, \`efficiency_override\` double
        NULL, \`special_landscape_area\` tinyint NOT NULL DEFAULT 0, \`special_landscape_kind\`
        enum ('recycled-water', 'edible', 'recreation-turf') NULL, \`design_flow_gpm\` double NULL,
        \`emitter_count\` int UNSIGNED NULL, \`emitter_gph\` double NULL,
        \`soil_intake_in_per_hour\` double NULL, \`notes\` text NOT NULL, \`created_at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6), \`updated_at\` datetime(3) NOT NULL
        DEFAULT CURRENT_TIMESTAMP(6) ON UPDATE CURRENT_TIMESTAMP(6), UNIQUE INDEX
        \`uq_hydrozone_site_name\` (\`site_id\`, \`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`rate_schedule\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`site_id\` int
        UNSIGNED NOT NULL, \`name\` varchar(120) NOT NULL, \`unit\` enum ('ccf', 'kgal') NOT NULL,
        \`currency\` char(3) NOT NULL DEFAULT 'USD', \`fixed_charge_per_period\` double NOT NULL,
        \`structure\` text NOT NULL, \`effective_from\` char(10) NOT NULL, \`created_at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6), \`updated_at\` datetime(3) NOT NULL
        DEFAULT CURRENT_TIMESTAMP(6) ON UPDATE CURRENT_TIMESTAMP(6), UNIQUE INDEX
        \`uq_rate_schedule_site_from\` (\`site_id\`, \`effective_from\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(`ALTER TABLE \`site\` ADD \`weather_station_id\` int UNSIGNED NULL`);
    await q.query(
      `ALTER TABLE \`weather_station\` ADD CONSTRAINT \`fk_weather_station_org\` FOREIGN KEY
        (\`organisation_id\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`daily_weather\` ADD CONSTRAINT \`fk_daily_weather_station\` FOREIGN KEY
        (\`station_id\`) REFERENCES \`weather_station\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`monthly_weather_normal\` ADD CONSTRAINT \`fk_monthly_normal_station\` FOREIGN
        KEY (\`station_id\`) REFERENCES \`weather_station\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`hydrozone\` ADD CONSTRAINT \`fk_hydrozone_site\` FOREIGN KEY (\`site_id\`)
        REFERENCES \`site\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`rate_schedule\` ADD CONSTRAINT \`fk_rate_schedule_site\` FOREIGN KEY
        (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`site\` ADD CONSTRAINT \`fk_site_weather_station\` FOREIGN KEY
        (\`weather_station_id\`) REFERENCES \`weather_station\`(\`id\`) ON DELETE SET NULL ON
        UPDATE NO ACTION`,
    );
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`site\` DROP FOREIGN KEY \`fk_site_weather_station\``);
    await q.query(`ALTER TABLE \`site\` DROP COLUMN \`weather_station_id\``);
    await q.query(`DROP TABLE \`rate_schedule\``);
    await q.query(`DROP TABLE \`hydrozone\``);
    await q.query(`DROP TABLE \`monthly_weather_normal\``);
    await q.query(`DROP TABLE \`daily_weather\``);
    await q.query(`DROP TABLE \`weather_station\``);
  }
}
