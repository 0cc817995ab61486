import { loadConfig } from '../../backend/src/config';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
import { logger } from '../../backend/src/platform/logger';
import { seedDemo } from './seed-demo';

/** `npm run seed`: writes the demo scenario into the configured database (idempotent). */
const db = createDataSource(loadConfig().db);
await connectWithRetry(db, { attempts: 10 });
const counts = await seedDemo(db);
logger.info(`demo scenario seeded: ${counts.organisations} organisations, ${counts.users} users, ${counts.sites} sites`);
await db.destroy();
