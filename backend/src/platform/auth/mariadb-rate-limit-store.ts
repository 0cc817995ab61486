import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Pool, RowDataPacket } from 'mysql2/promise';

/**
 * express-rate-limit counters kept in MariaDB, so every app instance behind a proxy counts the same
 * sign-in attempts (an in-memory store would give each instance its own allowance).
 */
export class MariaDbRateLimitStore implements Store {
  private windowMs = 60_000;

  constructor(
    private readonly pool: Pool,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [rows] = await this.pool.query<RowDataPacket[]>(
      'SELECT hits, reset_at FROM rate_limit_hit WHERE bucket = ? AND reset_at > ?',
      [this.bucket(key), new Date()],
    );
    const row = rows[0];
    return row ? { totalHits: Number(row['hits']), resetTime: new Date(row['reset_at']) } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const now = new Date();
    const reset = new Date(now.getTime() + this.windowMs);
    const bucket = this.bucket(key);
    // MariaDB evaluates the assignments left to right; both IF()s read the old reset_at.
    await this.pool.query(
      `INSERT INTO rate_limit_hit (bucket, hits, reset_at) VALUES (?, 1, ?)
       ON DUPLICATE KEY UPDATE hits = IF(reset_at <= ?, 1, hits + 1), reset_at = IF(reset_at <= ?,
        VALUES(reset_at), reset_at)`,
      [bucket, reset, now, now],
    );
    const [rows] = await this.pool.query<RowDataPacket[]>(
      'SELECT hits, reset_at FROM rate_limit_hit WHERE bucket = ?',
      [bucket],
    );
    const row = rows[0]!;
    return { totalHits: Number(row['hits']), resetTime: new Date(row['reset_at']) };
  }

  async decrement(key: string): Promise<void> {
    await this.pool.query('UPDATE rate_limit_hit SET hits = GREATEST(hits - 1, 0) WHERE bucket = ?', [
      this.bucket(key),
    ]);
  }

  async resetKey(key: string): Promise<void> {
    await this.pool.query('DELETE FROM rate_limit_hit WHERE bucket = ?', [this.bucket(key)]);
  }

  /** Drops expired counters; called now and then so the table stays small. */
  async prune(): Promise<void> {
    await this.pool.query('DELETE FROM rate_limit_hit WHERE reset_at <= ?', [new Date()]);
  }

  private bucket(key: string): string {
    return `${this.prefix}:${key}`.slice(0, 255);
  }
}
