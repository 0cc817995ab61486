import session from 'express-session';
import MySQLStoreFactory from 'express-mysql-session';
import type { Pool } from 'mysql2/promise';
import type { RequestHandler } from 'express';
import type { Config } from '../../config';

export const SESSION_COOKIE = 'rillmark.sid';

/**
 * Sessions live in MariaDB (table `session`, created by the foundation migration), so they survive a
 * restart and are shared by every app instance behind a proxy.
 */
export function createSessionMiddleware(config: Config, pool: Pool): { middleware: RequestHandler; close: () => Promise<void> } {
  const MySQLStore = MySQLStoreFactory(session as never);
  const store = new MySQLStore(
    {
      createDatabaseTable: false,
      clearExpired: true,
      checkExpirationInterval: 15 * 60_000,
      expiration: config.session.maxAgeMs,
      endConnectionOnClose: false,
      schema: { tableName: 'session', columnNames: { session_id: 'session_id', expires: 'expires', data: 'data' } },
    },
    pool as never,
  );
  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.session.secret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.session.secureCookies,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.session.secureCookies,
      maxAge: config.session.maxAgeMs,
      path: '/',
    },
  });
  return { middleware, close: () => store.close() };
}
