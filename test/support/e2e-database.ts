import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type { DataSource } from 'typeorm';
import type { Config } from '../../backend/src/config';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
import { DEMO_ORGANISATIONS, DEMO_SITES } from '../../ops/seed/demo-scenario';
import { testConfig } from './test-env';

// RILLMARK_E2E_WEB_DIR lets parallel work trees test their own build (ng build --output-path dist/<name>).
const webDir = process.env['RILLMARK_E2E_WEB_DIR'] ?? resolve(import.meta.dirname, '../../dist/web/browser');

/**
 * What every browser test starts from: the production build (checked, with a plain message when missing),
 * a test config serving it, and a connection to the test database for seeding.
 */
export async function e2eDatabase(): Promise<{ config: Config; db: DataSource }> {
  if (!existsSync(resolve(webDir, 'index.html')))
    throw new Error('No production build in dist/web; run: bash ops/build.sh');
  const config = testConfig({ RILLMARK_WEB_DIR: webDir });
  const db = createDataSource(config.db);
  await connectWithRetry(db, { attempts: 5 });
  return { config, db };
}

/**
 * The id of a seeded demo site, looked up within its own demo organisation: other tests share the test database
 * and may create sites of the same name in organisations of their own.
 */
export async function demoSiteId(db: DataSource, name: string): Promise<number> {
  const site = DEMO_SITES.find((s) => s.name === name);
  const organisation = DEMO_ORGANISATIONS.find((o) => o.key === site?.organisation);
  if (!site || !organisation) throw new Error(`"${name}" is not a demo site`);
  const [row]: { id: number }[] = await db.query(
    'SELECT s.id FROM site s JOIN organisation o ON o.id = s.organisation_id WHERE o.name = ? AND s.name = ?',
    [organisation.name, name],
  );
  if (!row) throw new Error(`demo site "${name}" is not seeded`);
  return Number(row.id);
}
