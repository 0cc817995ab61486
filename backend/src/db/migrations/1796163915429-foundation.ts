import { MigrationInterface, QueryRunner } from 'typeorm';

export class Foundation1796163915429 implements MigrationInterface {
  name = 'Foundation1796163915429';

  public async up(queryRunner: QueryRunner): Promise<void> {
    // Sessions (express-mysql-session's layout) and sign-in rate-limit counters live in MariaDB so that
    // several app instances behind a proxy share them.
    await queryRunner.query(
      `CREATE TABLE \`session\` (\`session_id\` varchar(128) COLLATE utf8mb4_bin NOT NULL,
        \`expires\` int UNSIGNED NOT NULL, \`data\` mediumtext COLLATE utf8mb4_bin, INDEX
        \`ix_session_expires\` (\`expires\`), PRIMARY KEY (\`session_id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`rate_limit_hit\` (\`bucket\` varchar(255) NOT NULL, \`hits\` int UNSIGNED NOT
        NULL, \`reset_at\` datetime(3) NOT NULL, INDEX \`ix_rate_limit_reset\` (\`reset_at\`),
        PRIMARY KEY (\`bucket\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`audit_entry\` (\`id\` bigint UNSIGNED NOT NULL AUTO_INCREMENT, \`at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6), \`user_id\` int UNSIGNED NULL,
        \`organisation_id\` int UNSIGNED NULL, \`entity\` varchar(40) NOT NULL, \`entity_id\`
        varchar(40) NOT NULL, \`action\` varchar(40) NOT NULL, \`changes\` longtext NULL, INDEX
        \`ix_audit_org_at\` (\`organisation_id\`, \`at\`), INDEX \`ix_audit_entity\` (\`entity\`,
        \`entity_id\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`organisation\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`name\`
        varchar(160) NOT NULL, \`kind\` enum ('property-manager', 'contractor', 'utility') NOT
        NULL, \`unit_system\` enum ('us', 'metric') NOT NULL DEFAULT 'us', \`created_at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6), UNIQUE INDEX
        \`IDX_d9428f9c8e3052d6617e3aab0e\` (\`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`site_tag\` (\`site_id\` int UNSIGNED NOT NULL, \`tag\` varchar(40) NOT NULL,
        INDEX \`ix_site_tag_tag\` (\`tag\`), PRIMARY KEY (\`site_id\`, \`tag\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`site\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`organisation_id\` int
        UNSIGNED NOT NULL, \`name\` varchar(120) NOT NULL, \`kind\` enum ('hoa-common-area',
        'office-park', 'school-ground', 'streetscape', 'park', 'other') NOT NULL, \`address\`
        varchar(300) NOT NULL, \`time_zone\` varchar(64) NOT NULL, \`notes\` text NOT NULL,
        \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6), \`updated_at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6) ON UPDATE CURRENT_TIMESTAMP(6), UNIQUE
        INDEX \`uq_site_org_name\` (\`organisation_id\`, \`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`site_share\` (\`site_id\` int UNSIGNED NOT NULL, \`organisation_id\` int
        UNSIGNED NOT NULL, \`access\` enum ('contribute', 'read') NOT NULL, \`created_at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6), INDEX \`ix_site_share_org\`
        (\`organisation_id\`), PRIMARY KEY (\`site_id\`, \`organisation_id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`user\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`email\` varchar(254)
        NOT NULL, \`display_name\` varchar(120) NOT NULL, \`password_hash\` varchar(255) NULL,
        \`status\` enum ('active', 'invited', 'disabled') NOT NULL DEFAULT 'invited',
        \`last_sign_in_at\` datetime(3) NULL, \`created_at\` datetime(3) NOT NULL DEFAULT
        CURRENT_TIMESTAMP(6), \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6) ON
        UPDATE CURRENT_TIMESTAMP(6), UNIQUE INDEX \`IDX_e12875dfb3b1d92d7d7c5377e2\` (\`email\`),
        PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`membership\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`user_id\` int
        UNSIGNED NOT NULL, \`organisation_id\` int UNSIGNED NOT NULL, \`role\` enum ('admin',
        'manager', 'contractor', 'auditor') NOT NULL, \`created_at\` datetime(3) NOT NULL DEFAULT
        CURRENT_TIMESTAMP(6), UNIQUE INDEX \`uq_membership_user_org\` (\`user_id\`,
        \`organisation_id\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `CREATE TABLE \`user_token\` (\`id\` int UNSIGNED NOT NULL AUTO_INCREMENT, \`user_id\` int
        UNSIGNED NOT NULL, \`purpose\` enum ('invite', 'reset') NOT NULL, \`token_hash\` char(64)
        NOT NULL, \`expires_at\` datetime(3) NOT NULL, \`used_at\` datetime(3) NULL, \`created_at\`
        datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(6), UNIQUE INDEX
        \`IDX_108995b1a4145b5b06dbf34104\` (\`token_hash\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await queryRunner.query(
      `ALTER TABLE \`site_tag\` ADD CONSTRAINT \`FK_9d7b2ba69a5cdbf3e12f9f4ada5\` FOREIGN KEY
        (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`site\` ADD CONSTRAINT \`FK_9677adb539f4db320b0dce3087c\` FOREIGN KEY
        (\`organisation_id\`) REFERENCES \`organisation\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`site_share\` ADD CONSTRAINT \`FK_e37611ef684faf5bc544698f91a\` FOREIGN KEY
        (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`site_share\` ADD CONSTRAINT \`FK_6507a232f4f517702d3e32e8c2c\` FOREIGN KEY
        (\`organisation_id\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`membership\` ADD CONSTRAINT \`FK_e9c72e8d29784031c96f5c6af8d\` FOREIGN KEY
        (\`user_id\`) REFERENCES \`user\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`membership\` ADD CONSTRAINT \`FK_be659e88cd5ed71eef6d4122aac\` FOREIGN KEY
        (\`organisation_id\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE \`user_token\` ADD CONSTRAINT \`FK_79ac751931054ef450a2ee47778\` FOREIGN KEY
        (\`user_id\`) REFERENCES \`user\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE \`rate_limit_hit\``);
    await queryRunner.query(`DROP TABLE \`session\``);
    await queryRunner.query(`ALTER TABLE \`user_token\` DROP FOREIGN KEY \`FK_79ac751931054ef450a2ee47778\``);
    await queryRunner.query(`ALTER TABLE \`membership\` DROP FOREIGN KEY \`FK_be659e88cd5ed71eef6d4122aac\``);
    await queryRunner.query(`ALTER TABLE \`membership\` DROP FOREIGN KEY \`FK_e9c72e8d29784031c96f5c6af8d\``);
    await queryRunner.query(`ALTER TABLE \`site_share\` DROP FOREIGN KEY \`FK_6507a232f4f517702d3e32e8c2c\``);
    await queryRunner.query(`ALTER TABLE \`site_share\` DROP FOREIGN KEY \`FK_e37611ef684faf5bc544698f91a\``);
    await queryRunner.query(`ALTER TABLE \`site\` DROP FOREIGN KEY \`FK_9677adb539f4db320b0dce3087c\``);
    await queryRunner.query(`ALTER TABLE \`site_tag\` DROP FOREIGN KEY \`FK_9d7b2ba69a5cdbf3e12f9f4ada5\``);
    await queryRunner.query(`DROP INDEX \`IDX_108995b1a4145b5b06dbf34104\` ON \`user_token\``);
    await queryRunner.query(`DROP TABLE \`user_token\``);
    await queryRunner.query(`DROP INDEX \`uq_membership_user_org\` ON \`membership\``);
    await queryRunner.query(`DROP TABLE \`membership\``);
    await queryRunner.query(`DROP INDEX \`IDX_e12875dfb3b1d92d7d7c5377e2\` ON \`user\``);
    await queryRunner.query(`DROP TABLE \`user\``);
    await queryRunner.query(`DROP INDEX \`ix_site_share_org\` ON \`site_share\``);
    await queryRunner.query(`DROP TABLE \`site_share\``);
    await queryRunner.query(`DROP INDEX \`uq_site_org_name\` ON \`site\``);
    await queryRunner.query(`DROP TABLE \`site\``);
    await queryRunner.query(`DROP INDEX \`ix_site_tag_tag\` ON \`site_tag\``);
    await queryRunner.query(`DROP TABLE \`site_tag\``);
    await queryRunner.query(`DROP INDEX \`IDX_d9428f9c8e3052d6617e3aab0e\` ON \`organisation\``);
    await queryRunner.query(`DROP TABLE \`organisation\``);
    await queryRunner.query(`DROP INDEX \`ix_audit_entity\` ON \`audit_entry\``);
    await queryRunner.query(`DROP INDEX \`ix_audit_org_at\` ON \`audit_entry\``);
    await queryRunner.query(`DROP TABLE \`audit_entry\``);
  }
}
