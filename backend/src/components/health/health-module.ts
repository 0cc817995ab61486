import { Router } from 'express';
import type { DatabaseWatch } from '../../db/database-watch';
import { healthRouter } from './api/health-router';

export interface Health {
  /** /health, /health/live, /health/ready (answer before the session is read) */
  router: Router;
}

/** Wires the health checks over the database watch. */
export function createHealth(deps: { watch: DatabaseWatch; version: string }): Health {
  return { router: Router().use('/health', healthRouter(deps.watch, deps.version)) };
}
