import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { healthRouter } from './api/health-router';

export interface Health {
  /** /health (answers before the session is read) */
  router: Router;
}

/** Wires the health check. */
export function createHealth(deps: { db: DataSource; version: string }): Health {
  return { router: Router().use('/health', healthRouter(deps.db, deps.version)) };
}
