import 'reflect-metadata';
import { DataSource } from 'typeorm';
import type { Config } from '../config';
import { ENTITIES } from './entities';
import { MIGRATIONS } from './migrations';

/** One DataSource per app instance. Schema changes go through migrations only (no `synchronize`). */
export function createDataSource(db: Config['db']): DataSource {
  return new DataSource({
    type: 'mariadb',
    host: db.host,
    port: db.port,
    username: db.user,
    password: db.password,
    database: db.database,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    migrationsTableName: 'schema_migration',
    migrationsTransactionMode: 'each',
    synchronize: false,
    timezone: 'Z',
    charset: 'utf8mb4_unicode_ci',
    poolSize: db.poolSize,
    extra: { connectTimeout: 5_000 },
    // Every statement has a deadline (mysql2's query timeout); one that passes it fails with PROTOCOL_SEQUENCE_TIMEOUT
    // (a 503), and is also logged as slow.
    enableQueryTimeout: true,
    maxQueryExecutionTime: db.queryTimeoutMs,
    logging: ['error'],
  });
}
