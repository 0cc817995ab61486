import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import type { AuditRepository } from '../audit/data/audit-repository';
import type { MailQueue } from '../mail/domain/mail-queue';
import { usersRouter } from './api/users-router';
import { UsersRepository } from './data/users-repository';
import { UsersService } from './domain/users-service';

export interface Users {
  service: UsersService;
  /** Read by the auth component until it has a users service call of its own. */
  repository: UsersRepository;
  /** /users */
  router: Router;
}

/** Wires users and their organisation memberships. */
export function createUsers(deps: {
  db: DataSource;
  audit: AuditRepository;
  mailQueue: MailQueue;
  config: Config;
}): Users {
  const repository = new UsersRepository(deps.db);
  const service = new UsersService(deps.db, repository, deps.audit, deps.mailQueue, deps.config);
  return { service, repository, router: Router().use('/users', usersRouter(service)) };
}
