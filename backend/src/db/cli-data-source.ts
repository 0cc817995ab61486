import { loadConfig } from '../config';
import { createDataSource } from './data-source';

/**
 * For the TypeORM CLI only (`npm run migration:generate -- backend/src/db/migrations/<Name>`). Kept out of
 * data-source.ts: reading the configuration when that module loads made a refused configuration an uncaught
 * exception at import (exit 1, restarted forever) instead of the server's plain refusal (exit 78).
 */
export const cliDataSource = createDataSource(loadConfig().db);
