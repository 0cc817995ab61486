import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The ETAF a site's ordinance allows (absent: MWELO's value for the site's kind). */
export class SiteEtafSettings1796300002000 implements MigrationInterface {
  name = 'SiteEtafSettings1796300002000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`site_etaf_setting\` (
      \`site_id\` int UNSIGNED NOT NULL,
      \`allowed_etaf\` double NOT NULL,
      \`basis\` varchar(20) NOT NULL,
      \`updated_by\` int UNSIGNED NULL,
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`site_id\`),
      CONSTRAINT \`FK_site_etaf_setting_site\` FOREIGN KEY (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_site_etaf_setting_user\` FOREIGN KEY (\`updated_by\`)
        REFERENCES \`user\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `site_etaf_setting`');
  }
}
