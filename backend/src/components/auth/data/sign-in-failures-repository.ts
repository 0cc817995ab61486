import type { DataSource } from 'typeorm';

export interface FailureCount {
  failures: number;
  lastFailureAt: Date;
  windowUntil: Date;
}

/**
 * Failed sign-ins kept in MariaDB (`sign_in_failure`), so every app instance sees the same counts. A bucket is an
 * account (`account:<e-mail>`) or an address with an account (`address:<ip>|<e-mail>`); its count starts again
 * after a window without failures.
 */
export class SignInFailuresRepository {
  constructor(private readonly db: DataSource) {}

  /** The live counts (window not over) of these buckets. */
  async read(buckets: string[], now: Date): Promise<Map<string, FailureCount>> {
    const rows: Array<{ bucket: string; failures: number; last_failure_at: Date; window_until: Date }> =
      await this.db.query(
        `SELECT bucket, failures, last_failure_at, window_until FROM sign_in_failure
         WHERE bucket IN (?) AND window_until > ?`,
        [buckets.map(clip), now],
      );
    return new Map(
      rows.map((r) => [
        r.bucket,
        {
          failures: Number(r.failures),
          lastFailureAt: new Date(r.last_failure_at),
          windowUntil: new Date(r.window_until),
        },
      ]),
    );
  }

  /** One more failure in each bucket; a bucket whose window has passed starts again at one. */
  async recordFailure(buckets: string[], now: Date, windowMs: number): Promise<void> {
    const until = new Date(now.getTime() + windowMs);
    // MariaDB applies the assignments left to right: `failures` reads the old window_until.
    await this.db.query(
      `INSERT INTO sign_in_failure (bucket, failures, last_failure_at, window_until) VALUES ?
       ON DUPLICATE KEY UPDATE failures = IF(window_until <= VALUES(last_failure_at), 1, failures + 1),
         last_failure_at = VALUES(last_failure_at), window_until = VALUES(window_until)`,
      [buckets.map((b) => [clip(b), 1, now, until])],
    );
  }

  async clear(bucket: string): Promise<void> {
    await this.db.query('DELETE FROM sign_in_failure WHERE bucket = ?', [clip(bucket)]);
  }

  /** Drops counts whose window is over, so the table stays small. */
  async prune(now: Date): Promise<void> {
    await this.db.query('DELETE FROM sign_in_failure WHERE window_until <= ?', [now]);
  }
}

function clip(bucket: string): string {
  return bucket.slice(0, 255);
}
