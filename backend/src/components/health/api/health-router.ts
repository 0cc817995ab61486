import { Router, type Request, type Response } from 'express';
import type { DatabaseWatch } from '../../../db/database-watch';

/**
 * Health for load balancers and supervisors:
 * - GET /api/health/live: the process answers HTTP (never touches MariaDB; a failing liveness check means restart).
 * - GET /api/health/ready (and /api/health): whether this instance can serve, i.e. MariaDB answers a `SELECT 1`.
 *   Always answers within about two seconds: 200 with the database `up`, or 503 with it `down` (take the instance
 *   out of rotation, don't restart it).
 */
export function healthRouter(watch: DatabaseWatch, version: string): Router {
  const router = Router();
  router.get('/live', (_req, res) => {
    res.json({ status: 'ok', version, time: new Date().toISOString() });
  });
  const ready = async (_req: Request, res: Response) => {
    const database = await watch.check();
    const ok = database.status === 'up';
    res
      .status(ok ? 200 : 503)
      .json({ status: ok ? 'ok' : 'degraded', version, time: new Date().toISOString(), database });
  };
  router.get('/ready', ready);
  router.get('/', ready);
  return router;
}
