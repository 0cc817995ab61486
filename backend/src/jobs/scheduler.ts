import { schedule, type ScheduledTask } from 'node-cron';
import { logger } from '../platform/logger';

export interface ScheduledJob {
  name: string;
  /** Cron expression (minute hour day month weekday). */
  cron: string;
  /** IANA zone the expression is read in (default: the server's). */
  timezone?: string;
  run: () => Promise<unknown>;
}

/**
 * Runs jobs on their cron schedules inside this app instance. A job that must run on one instance only
 * guards itself with a `JobLease`; the scheduler just never overlaps a job with its own previous run.
 */
export function startScheduler(jobs: ScheduledJob[]): { stop: () => Promise<void> } {
  const tasks: ScheduledTask[] = jobs.map((job) =>
    schedule(
      job.cron,
      async () => {
        try {
          await job.run();
        } catch (err) {
          logger.error(`scheduled job ${job.name} failed`, { error: (err as Error).message });
        }
      },
      { name: job.name, timezone: job.timezone, noOverlap: true, unref: true },
    ),
  );
  return {
    async stop() {
      for (const t of tasks) await t.stop();
    },
  };
}
