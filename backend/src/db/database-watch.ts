import { createConnection, type Connection } from 'mysql2/promise';
import type { Config } from '../config';
import { logger } from '../platform/logger';

/** How often MariaDB is pinged, and how long a ping may take before it counts as "not answering". */
export const WATCH_INTERVAL_MS = 1_000;
export const PING_TIMEOUT_MS = 1_500;
/** Failed pings in a row before requests are turned away: one slow answer on a busy machine is not an outage. */
export const FAILURES_BEFORE_DOWN = 2;

export interface PingResult {
  status: 'up' | 'down';
  latencyMs?: number;
  error?: string;
}

/**
 * Pings MariaDB every second on a connection of its own (not the app's pools, which a stalled server fills with
 * waiting queries) and knows, within about three seconds (two failed pings in a row), when it stops answering.
 * Requests then get a 503 at once (see databaseGate) instead of waiting on a paused or dead server; the readiness
 * check says `down` as soon as its own ping fails.
 * A failed ping drops its connection; the next one connects afresh, so a restarted MariaDB is found by itself.
 */
export class DatabaseWatch {
  private connection: Promise<Connection> | null = null;
  private timer: NodeJS.Timeout | null = null;
  private downSince: number | null = null;
  private failuresInARow = 0;
  private lastError = '';
  private readonly listeners = new Set<() => void>();

  constructor(private readonly db: Config['db']) {}

  /** True once a ping has failed and none has succeeded since. */
  get isDown(): boolean {
    return this.downSince !== null;
  }

  get reason(): string {
    return this.lastError;
  }

  start(): void {
    const tick = async () => {
      await this.check();
      if (this.timer) this.timer = setTimeout(() => void tick(), WATCH_INTERVAL_MS).unref();
    };
    this.timer = setTimeout(() => void tick(), WATCH_INTERVAL_MS).unref();
  }

  async stop(): Promise<void> {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    this.drop();
  }

  /** Calls `listener` when MariaDB is found not answering; returns the function that unsubscribes it. */
  onDown(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** A ping whose outcome also updates what the watch knows (the readiness check uses it). */
  async check(): Promise<PingResult> {
    const result = await this.ping();
    this.record(result);
    return result;
  }

  /** One `SELECT 1` with a deadline: answers within PING_TIMEOUT_MS whatever MariaDB does. */
  private async ping(): Promise<PingResult> {
    const started = performance.now();
    let deadline: NodeJS.Timeout | undefined;
    // The deadline gives way to an answer already received: when the event loop was busy (a large file being
    // parsed), the timer and MariaDB's answer are due at once, and timers run before network input is read.
    const timeout = new Promise<never>((_, reject) => {
      const expire = () => reject(new Error(`no answer within ${PING_TIMEOUT_MS} ms`));
      deadline = setTimeout(() => setImmediate(expire), PING_TIMEOUT_MS);
    });
    try {
      await Promise.race([this.selectOne(), timeout]);
      return { status: 'up', latencyMs: Math.round((performance.now() - started) * 10) / 10 };
    } catch (err) {
      this.drop();
      return { status: 'down', error: (err as { code?: string }).code ?? (err as Error).message };
    } finally {
      clearTimeout(deadline);
    }
  }

  private async selectOne(): Promise<void> {
    // Concurrent pings (readiness checks) share one connection attempt.
    this.connection ??= this.connect();
    const connection = await this.connection;
    // No query timeout of mysql2's own: its timer would fire before a late-read answer too (the deadline in ping()
    // covers a silent server, and a failed ping drops the connection).
    await connection.query('SELECT 1');
  }

  private async connect(): Promise<Connection> {
    const connection = await createConnection({
      host: this.db.host,
      port: this.db.port,
      user: this.db.user,
      password: this.db.password,
      database: this.db.database,
      connectTimeout: PING_TIMEOUT_MS,
    });
    // An idle connection whose server died emits 'error'; the next ping notices and reconnects.
    connection.on('error', () => this.drop());
    return connection;
  }

  private drop(): void {
    const connection = this.connection;
    this.connection = null;
    connection?.then(
      (c) => c.destroy(),
      () => undefined,
    );
  }

  private record(result: PingResult): void {
    if (result.status === 'down') {
      this.lastError = result.error ?? 'no answer';
      this.failuresInARow++;
      if (this.downSince !== null || this.failuresInARow < FAILURES_BEFORE_DOWN) return;
      this.downSince = Date.now();
      logger.warn(`MariaDB is not answering (${this.lastError}); requests get 503 until it does`);
      for (const listener of this.listeners) listener();
      return;
    }
    this.failuresInARow = 0;
    if (this.downSince !== null) {
      logger.info(`MariaDB answers again after ${Math.round((Date.now() - this.downSince) / 1000)} s`);
      this.downSince = null;
      this.lastError = '';
    }
  }
}
