import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { DataSource } from 'typeorm';
import { createApp } from './app';
import type { Config } from './config';
import { connectWithRetry } from './db/connect';
import { createDataSource } from './db/data-source';
import { startScheduler } from './jobs/scheduler';
import { logger } from './platform/logger';
import { createSmtpMailer, type Mailer } from './platform/mail/mailer';

/**
 * The app expects MariaDB to run READ COMMITTED (ops/db/start.sh sets it): under REPEATABLE READ, gap locks
 * made concurrent uploads for different sites deadlock. Imports ask for it per transaction anyway; this says
 * so when a server of one's own is configured otherwise.
 */
async function warnUnlessReadCommitted(db: DataSource): Promise<void> {
  const [row]: { level: string }[] = await db.query('SELECT @@GLOBAL.tx_isolation AS level');
  if (row && row.level !== 'READ-COMMITTED')
    logger.warn(
      `MariaDB runs ${row.level}; set transaction_isolation = READ-COMMITTED ` +
        '(see README, Scaling) or concurrent writes may deadlock',
    );
}

/**
 * A committed upload must survive an operating-system crash: InnoDB has to flush its log at every commit
 * (ops/db/start.sh sets it; with 2 a crash can lose the last second of commits). Said at start when it is not so.
 */
async function warnUnlessDurable(db: DataSource): Promise<void> {
  const [row]: { flush: string; binlog: string; sync: string }[] = await db.query(
    'SELECT @@GLOBAL.innodb_flush_log_at_trx_commit AS flush, @@GLOBAL.log_bin AS binlog, @@GLOBAL.sync_binlog AS sync',
  );
  if (row && String(row.flush) !== '1')
    logger.warn(
      `MariaDB runs innodb_flush_log_at_trx_commit = ${row.flush}: committed uploads can be lost if the machine ` +
        'crashes; set it to 1 (see README, Reliability and security)',
    );
  if (row && String(row.binlog) === '1' && String(row.sync) !== '1')
    logger.warn(
      `MariaDB writes a binary log with sync_binlog = ${row.sync}; set it to 1 so a crash cannot lose commits from it`,
    );
}

/** A node-cron expression for "every n seconds" (every minute at second 0 for 60). */
function everySeconds(n: number): string {
  return n >= 60 ? '0 * * * * *' : `*/${n} * * * * *`;
}

export interface RunningServer {
  url: string;
  port: number;
  stop(): Promise<void>;
}

/** Starts the real app on `config.http.port` (0 = any free port, as the tests do). */
export async function startServer(
  config: Config,
  options: { mailer?: Mailer; dbAttempts?: number } = {},
): Promise<RunningServer> {
  const db = createDataSource(config.db);
  await connectWithRetry(db, { attempts: options.dbAttempts ?? 30 });
  await warnUnlessReadCommitted(db);
  await warnUnlessDurable(db);
  const mailer = options.mailer ?? createSmtpMailer(config.mail);
  const { app, close, mailQueue, watch } = createApp({ config, db, mailer });
  const scheduler = config.jobs.enabled
    ? startScheduler([
        { name: 'mail-delivery', cron: everySeconds(config.mail.pollSeconds), run: () => mailQueue.deliverDue() },
        watch.job,
      ])
    : null;
  if (config.jobs.enabled) mailQueue.kick();
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(config.http.port, config.http.host, () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://${config.http.host}:${port}`,
    port,
    async stop() {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await scheduler?.stop();
      await close();
      mailer.close();
      await db.destroy();
    },
  };
}
