import type { RequestHandler, Response } from 'express';
import type { DatabaseWatch } from '../db/database-watch';
import { AppError } from './app-error';

const MESSAGE = 'The database is not answering right now; nothing was changed. Try again in a minute.';

function answerUnavailable(res: Response): void {
  if (res.headersSent) return;
  res
    .status(503)
    .set('Retry-After', '10')
    .json({ error: { code: 'database_unavailable', message: MESSAGE } });
}

/**
 * While MariaDB is known not to answer, API requests get a 503 at once instead of waiting on it. A read already
 * waiting when MariaDB stops answering is answered 503 at that moment too (its handler's late answer is dropped).
 * A write already under way is left to finish or time out: answering early could report as failed a change that
 * MariaDB then commits when it resumes.
 */
export function databaseGate(watch: DatabaseWatch): RequestHandler {
  return (req, res, next) => {
    if (watch.isDown) {
      res.set('Retry-After', '10');
      throw new AppError('database_unavailable', MESSAGE);
    }
    if (req.method === 'GET' || req.method === 'HEAD') {
      const off = watch.onDown(() => answerUnavailable(res));
      res.once('close', off);
    }
    next();
  };
}
