import type { MigrationInterface, QueryRunner } from 'typeorm';

/** What-if plans: a copy of a site's hydrozones with changes (JSON), and the savings project it became. */
export class WhatIfPlans1796300001000 implements MigrationInterface {
  name = 'WhatIfPlans1796300001000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE \`what_if_plan\` (
      \`id\` int UNSIGNED NOT NULL AUTO_INCREMENT,
      \`site_id\` int UNSIGNED NOT NULL,
      \`title\` varchar(160) NOT NULL,
      \`notes\` text NOT NULL,
      \`weather_year\` smallint UNSIGNED NOT NULL,
      \`cost_of_work\` double NOT NULL DEFAULT 0,
      \`currency\` char(3) NOT NULL DEFAULT 'USD',
      \`smart_controller_percent\` double NULL,
      \`rain_sensor\` tinyint(1) NOT NULL DEFAULT 0,
      \`zone_changes\` text NOT NULL,
      \`status\` enum('draft','carried-out') NOT NULL DEFAULT 'draft',
      \`savings_project_id\` int UNSIGNED NULL,
      \`carried_out_on\` date NULL,
      \`created_by\` int UNSIGNED NULL,
      \`created_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      \`updated_at\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      PRIMARY KEY (\`id\`),
      INDEX \`IDX_what_if_plan_site\` (\`site_id\`),
      CONSTRAINT \`FK_what_if_plan_site\` FOREIGN KEY (\`site_id\`) REFERENCES \`site\`(\`id\`) ON DELETE CASCADE,
      CONSTRAINT \`FK_what_if_plan_project\` FOREIGN KEY (\`savings_project_id\`)
        REFERENCES \`savings_project\`(\`id\`) ON DELETE SET NULL,
      CONSTRAINT \`FK_what_if_plan_user\` FOREIGN KEY (\`created_by\`) REFERENCES \`user\`(\`id\`) ON DELETE SET NULL
    ) ENGINE=InnoDB`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `what_if_plan`');
  }
}
