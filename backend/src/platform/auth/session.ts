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
export function createSessionMiddleware(
  config: Config,
  pool: Pool,
): { middleware: RequestHandler; close: () => Promise<void> } {
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
  throttleTouch(store);
  withQueryTimeout(store, pool, config.db.queryTimeoutMs);
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

/** How often one instance writes a session's new expiry: at most once a minute, not on every request. */
export const TOUCH_INTERVAL_MS = 60_000;

/**
 * With `rolling`, express-session touches the store on every request: an UPDATE and a commit per page load
 * or API call. The cookie still rolls every response; the stored expiry is refreshed at most once a
 * minute per session, so a session can end at most that much earlier than its cookie says.
 */
export function throttleTouch(store: {
  touch: (sid: string, session: unknown, cb?: (err?: unknown) => void) => unknown;
}): void {
  const touch = store.touch.bind(store);
  const last = new Map<string, number>();
  store.touch = (sid, session, cb) => {
    const now = Date.now();
    if (now - (last.get(sid) ?? 0) < TOUCH_INTERVAL_MS) {
      cb?.();
      return;
    }
    if (last.size > 50_000) last.clear(); // bounded: forgetting only means one extra write
    last.set(sid, now);
    return touch(sid, session, cb);
  };
}

/** The session store's queries get the same deadline as every other statement (it would wait forever otherwise). */
function withQueryTimeout(store: { query: (sql: string, params?: unknown) => unknown }, pool: Pool, ms: number): void {
  store.query = (sql, params) => pool.query({ sql, timeout: ms }, params as never[]);
}
