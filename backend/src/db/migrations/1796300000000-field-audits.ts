import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Irrigation field audits: an audit of a site by one organisation, its catch-can tests per hydrozone (catches and
 * pressures as JSON), the faults found and their photos (kept through platform/storage, by SHA-256).
 */
export class FieldAudits1796300000000 implements MigrationInterface {
  name = 'FieldAudits1796300000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`field_audit\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`site_id\` int UNSIGNED NOT NULL,
      \`organisation_id\` int UNSIGNED NOT NULL,
      \`title\` varchar(160) NOT NULL,
      \`audited_on\` date NOT NULL,
      \`schedule_month\` char(7) NOT NULL,
      \`days_per_week\` tinyint UNSIGNED NOT NULL DEFAULT 3,
      \`static_pressure_psi\` double NULL,
      \`notes\` text NOT NULL,
      \`status\` enum('draft','complete') NOT NULL DEFAULT 'draft',
      \`created_by\` int UNSIGNED NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`id\`),
      INDEX \`IDX_field_audit_site\` (\`site_id\`, \`audited_on\`),
      CONSTRAINT \`FK_field_audit_site\` FOREIGN KEY (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_field_audit_org\` FOREIGN KEY (\`organisation_id\`)
        REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_field_audit_user\` FOREIGN KEY (\`created_by\`) REFERENCES \`user\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`field_audit_zone_test\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`audit_id\` int UNSIGNED NOT NULL,
      \`hydrozone_id\` int UNSIGNED NULL,
      \`hydrozone_name\` varchar(120) NOT NULL,
      \`hydrozone_area_ft2\` double NOT NULL,
      \`head_type\` varchar(20) NOT NULL,
      \`run_minutes\` double NOT NULL,
      \`catch_unit\` varchar(4) NOT NULL,
      \`throat_diameter\` double NULL,
      \`throat_unit\` varchar(4) NULL,
      \`catches\` text NOT NULL,
      \`pressures\` text NOT NULL,
      \`soil_intake_in_per_hour\` double NULL,
      \`slope_percent\` double NULL,
      \`notes\` text NOT NULL,
      \`applied_at\` datetime(3) NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`id\`),
      INDEX \`IDX_field_audit_zone_test_audit\` (\`audit_id\`),
      CONSTRAINT \`FK_field_audit_zone_test_audit\` FOREIGN KEY (\`audit_id\`)
        REFERENCES \`field_audit\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_field_audit_zone_test_zone\` FOREIGN KEY (\`hydrozone_id\`)
        REFERENCES \`hydrozone\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`field_audit_fault\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`audit_id\` int UNSIGNED NOT NULL,
      \`zone_test_id\` int UNSIGNED NULL,
      \`kind\` varchar(30) NOT NULL,
      \`location\` varchar(120) NOT NULL,
      \`description\` text NOT NULL,
      \`status\` enum('open','fixed') NOT NULL DEFAULT 'open',
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`id\`),
      INDEX \`IDX_field_audit_fault_audit\` (\`audit_id\`),
      CONSTRAINT \`FK_field_audit_fault_audit\` FOREIGN KEY (\`audit_id\`)
        REFERENCES \`field_audit\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_field_audit_fault_test\` FOREIGN KEY (\`zone_test_id\`)
        REFERENCES \`field_audit_zone_test\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
    await q.query(`CREATE TABLE \`field_audit_photo\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`fault_id\` int UNSIGNED NOT NULL,
      \`storage_key\` varchar(80) NOT NULL,
      \`content_type\` varchar(20) NOT NULL,
      \`size_bytes\` int UNSIGNED NOT NULL,
      \`created_by\` int UNSIGNED NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`id\`),
      INDEX \`IDX_field_audit_photo_fault\` (\`fault_id\`),
      CONSTRAINT \`FK_field_audit_photo_fault\` FOREIGN KEY (\`fault_id\`)
        REFERENCES \`field_audit_fault\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_field_audit_photo_user\` FOREIGN KEY (\`created_by\`)
        REFERENCES \`user\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `field_audit_photo`');
    await q.query('DROP TABLE `field_audit_fault`');
    await q.query('DROP TABLE `field_audit_zone_test`');
    await q.query('DROP TABLE `field_audit`');
  }
}
