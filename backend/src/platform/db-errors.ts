/**
 * Errors that mean MariaDB could not be reached or stopped answering (as opposed to a bad query): the request
 * gets a 503 that says so, and an upload says it was stored whole or not at all.
 */
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'DB_UNAVAILABLE',
]);

interface DriverErrorLike {
  code?: string;
  fatal?: boolean;
  driverError?: { code?: string; fatal?: boolean };
}

export function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as DriverErrorLike | null | undefined;
  const inner = e?.driverError ?? e;
  if (!inner) return false;
  if (inner.code && UNAVAILABLE_CODES.has(inner.code)) return true;
  // mysql2 marks errors that closed the connection as fatal ("Can't add new command when connection is in
  // closed state").
  return inner.fatal === true && inner.code === undefined;
}

/** Thrown when this instance already knows MariaDB is not answering (see DatabaseWatch). */
export class DatabaseUnavailable extends Error {
  readonly code = 'DB_UNAVAILABLE';
}
