import { loadConfig } from '../config';
import { logger } from '../platform/logger';
import { createDataSource } from './data-source';
import { connectWithRetry } from './connect';

/** `npm run migrate`: applies pending migrations to the configured database and exits. */
const config = loadConfig();
const dataSource = createDataSource(config.db);
await connectWithRetry(dataSource, { attempts: 20 });
const applied = await dataSource.runMigrations({ transaction: 'each' });
logger.info(
  applied.length
    ? `applied ${applied.length} migration(s): ${applied.map((m) => m.name).join(', ')}`
    : 'schema is up to date',
);
await dataSource.destroy();
