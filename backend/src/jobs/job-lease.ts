import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';

/** This process's name in lease rows: host, pid and a random part (two apps on one host differ). */
export const INSTANCE_ID = `${hostname().slice(0, 30)}:${process.pid}:${randomBytes(3).toString('hex')}`;

/**
 * A lease row in MariaDB that lets exactly one app instance run a job at a time, whatever the number
 * of instances behind the proxy. A lease expires by itself, so a crashed holder blocks nobody for long.
 */
export class JobLease {
  constructor(
    private readonly db: DataSource,
    readonly name: string,
    private readonly holder: string = INSTANCE_ID,
  ) {}

  /** True when this instance holds the lease for the next `ttlMs` (taken fresh, or renewed). */
  async tryAcquire(ttlMs: number): Promise<boolean> {
    const now = new Date();
    const until = new Date(now.getTime() + ttlMs);
    // MariaDB applies the assignments left to right: the second IF already sees the new holder.
    await this.db.query(
      `INSERT INTO job_lease (name, holder, leased_until) VALUES (?, ?, ?)
       ON DUPLICATE KEY UPDATE holder = IF(leased_until <= ? OR holder = VALUES(holder), VALUES(holder), holder),
                               leased_until = IF(holder = VALUES(holder), VALUES(leased_until), leased_until)`,
      [this.name, this.holder, until, now],
    );
    const rows: { holder: string }[] = await this.db.query('SELECT holder FROM job_lease WHERE name = ?', [this.name]);
    return rows[0]?.holder === this.holder;
  }

  async release(): Promise<void> {
    await this.db.query('UPDATE job_lease SET leased_until = ? WHERE name = ? AND holder = ?', [
      new Date(0),
      this.name,
      this.holder,
    ]);
  }

  /** Runs `work` only if the lease can be taken; renews it while the work runs. Null when another instance holds it. */
  async runExclusive<T>(ttlMs: number, work: () => Promise<T>): Promise<T | null> {
    const started = await this.startExclusive(ttlMs, work);
    return started ? started.done : null;
  }

  /**
   * Takes the lease now and runs `work` in the background, renewing the lease until it settles; null when another
   * instance holds it. For work a request starts and does not wait for.
   */
  async startExclusive<T>(ttlMs: number, work: () => Promise<T>): Promise<{ done: Promise<T> } | null> {
    if (!(await this.tryAcquire(ttlMs))) return null;
    const renew = setInterval(() => void this.tryAcquire(ttlMs).catch(() => undefined), Math.max(1_000, ttlMs / 3));
    renew.unref();
    const done = (async () => {
      try {
        return await work();
      } finally {
        clearInterval(renew);
        await this.release();
      }
    })();
    return { done };
  }
}
