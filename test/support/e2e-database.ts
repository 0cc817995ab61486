import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type { DataSource } from 'typeorm';
import type { Config } from '../../backend/src/config';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
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
