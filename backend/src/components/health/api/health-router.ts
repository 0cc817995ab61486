import { Router } from 'express';
import type { DataSource } from 'typeorm';

/** GET /api/health: the app is up, and whether MariaDB answers (503 when it does not). */
export function healthRouter(db: DataSource, version: string): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const started = performance.now();
    let database: { status: 'up' | 'down'; latencyMs?: number; error?: string };
    try {
      if (!db.isInitialized) throw new Error('not connected yet');
      await db.query('SELECT 1');
      database = { status: 'up', latencyMs: Math.round((performance.now() - started) * 10) / 10 };
    } catch (err) {
      database = { status: 'down', error: (err as Error).message };
    }
    const ok = database.status === 'up';
    res
      .status(ok ? 200 : 503)
      .json({ status: ok ? 'ok' : 'degraded', version, time: new Date().toISOString(), database });
  });
  return router;
}
