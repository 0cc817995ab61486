import { Router } from 'express';
import type { Config } from '../../config';
import { outboxRouter } from './api/outbox-router';

export interface Outbox {
  /** /dev/outbox, or nothing when the development outbox is off */
  router: Router;
}

/** Wires the development outbox: what the local fake SMTP server received. */
export function createOutbox(deps: { config: Config }): Outbox {
  const router = Router();
  if (deps.config.mail.devOutbox) router.use('/dev/outbox', outboxRouter(deps.config));
  return { router };
}
