import { PassThrough, Readable } from 'node:stream';
import type { QueryRunner } from 'typeorm';
import { affected } from './affected';
import type { IngestTarget } from './ingest-targets';

export const STAGE = 'ingest_stage';
/** Stage lines are sent in chunks of about this size; the socket's own buffer is capped at SOCKET_HIGH. */
const CHUNK_CHARS = 64 * 1024;
const SOCKET_HIGH = 4 * 1024 * 1024;

interface RawConnection {
  query(
    options: { sql: string; values?: unknown[]; infileStreamFactory?: () => NodeJS.ReadableStream },
    cb: (err: Error | null, result: unknown) => void,
  ): void;
  stream: NodeJS.WritableStream & { writableLength: number };
}

/**
 * Waits for 'drain'; fails on 'error' or on 'close' (a MariaDB killed mid-load closes its socket, sometimes without
 * an error event, and a plain `once(socket, 'drain')` would then wait forever).
 */
function drained(stream: NodeJS.WritableStream): Promise<void> {
  return new Promise((resolve, reject) => {
    const settle = (err?: Error) => {
      stream.off('drain', onDrain);
      stream.off('error', onError);
      stream.off('close', onClose);
      if (err) reject(err);
      else resolve();
    };
    const onDrain = () => settle();
    const onError = (err: Error) => settle(err);
    const onClose = () =>
      settle(
        Object.assign(new Error('the connection to MariaDB closed during the load'), {
          code: 'PROTOCOL_CONNECTION_LOST',
          fatal: true,
        }),
      );
    stream.on('drain', onDrain);
    stream.on('error', onError);
    stream.on('close', onClose);
  });
}

/**
 * Loads an upload's rows on one connection with `LOAD DATA LOCAL INFILE` from a generated stream (the file is
 * never materialised): into a temporary stage table keyed by the target's key and the file row, so a reading the
 * file gives twice is staged twice and the decide step can see it; or (direct) straight into the target table.
 */
export class StageTable {
  private stream: PassThrough | null = null;
  private load: Promise<unknown> | null = null;
  /** MariaDB has asked for the file (mysql2 called the stream factory). */
  private requested = false;
  private aborted: Error | null = null;
  private chunk = '';
  private direct = false;
  linesSent = 0;

  constructor(
    private readonly qr: QueryRunner,
    readonly target: IngestTarget,
  ) {}

  private get raw(): RawConnection {
    return (this.qr as unknown as { databaseConnection: RawConnection }).databaseConnection;
  }

  private rawQuery<T>(sql: string, values: unknown[] = [], infile?: () => NodeJS.ReadableStream): Promise<T> {
    return new Promise((resolve, reject) => {
      this.raw.query({ sql, values, ...(infile ? { infileStreamFactory: infile } : {}) }, (err, result) =>
        err ? reject(err) : resolve(result as T),
      );
    });
  }

  /**
   * The stream MariaDB reads the lines from, handed over when it asks for the file. An upload that failed before
   * MariaDB asked gets a stream that fails as soon as it is read: a stream destroyed before mysql2 listens to it
   * never says so, and MariaDB then waited for the file until its own read timeout (a minute) while holding the
   * connection and the transaction.
   */
  private infile(stream: PassThrough): () => NodeJS.ReadableStream {
    return () => {
      this.requested = true;
      const failure = this.aborted;
      if (!failure) return stream;
      return new Readable({
        read() {
          this.destroy(failure);
        },
      });
    };
  }

  /**
   * Starts the load. With `directUploadId` the lines go straight into the target table (IGNORE skips keys already
   * stored), inside the caller's open transaction: the fast path for files of new readings only. The caller
   * checks `finish()`'s count against `linesSent`, and rolls back and stages when any line was skipped.
   */
  async open(directUploadId?: number): Promise<void> {
    const t = this.target;
    this.stream = new PassThrough({ highWaterMark: 1024 * 1024 });
    this.direct = directUploadId !== undefined;
    const format = `CHARACTER SET utf8mb4 FIELDS TERMINATED BY '\\t' ESCAPED BY '\\\\' LINES TERMINATED BY '\\n'`;
    let into: string;
    if (directUploadId !== undefined) {
      const names = [...t.stageColumns.map(([n]) => `\`${n}\``), '@row_no'].join(', ');
      into = `\`${t.table}\` ${format} (${names}) SET upload_id = ${Number(directUploadId)}`;
    } else {
      await this.qr.query(`DROP TEMPORARY TABLE IF EXISTS ${STAGE}`);
      const columns = t.stageColumns.map(([name, type]) => `\`${name}\` ${type}`).join(', ');
      await this.qr.query(
        `CREATE TEMPORARY TABLE ${STAGE} (${columns}, row_no int unsigned ` +
          `NOT NULL, PRIMARY KEY (${[...t.key, 'row_no'].join(', ')})) ENGINE=InnoDB`,
      );
      const names = [...t.stageColumns.map(([n]) => `\`${n}\``), 'row_no'].join(', ');
      into = `${STAGE} ${format} (${names})`;
    }
    const stream = this.stream;
    // The writer owns this stream: its errors come back through `flush`/`finish` (or the load's own rejection).
    stream.on('error', () => undefined);
    this.requested = false;
    this.aborted = null;
    this.load = this.rawQuery(
      `LOAD DATA LOCAL INFILE 'rillmark-upload' IGNORE INTO TABLE ${into}`,
      [],
      this.infile(stream),
    );
    // Surface a failed load at once instead of when the stream ends.
    this.load.catch((err) => stream.destroy(err as Error));
  }

  /** One tab-separated line per record: the stage columns in order, then the file row; `\N` is NULL. */
  add(line: string): void {
    this.chunk += line;
    this.linesSent++;
  }

  /** True when enough lines wait for `flush()`. */
  get full(): boolean {
    return this.chunk.length >= CHUNK_CHARS;
  }

  /** Sends the waiting lines, waiting while the connection's buffers are full. */
  async flush(): Promise<void> {
    const stream = this.stream!;
    const text = this.chunk;
    this.chunk = '';
    if (stream.destroyed) throw stream.errored ?? new Error('the load into MariaDB was stopped');
    if (!stream.write(text)) await drained(stream);
    // mysql2 copies the stream into the socket without waiting; wait here so memory stays bounded.
    const socket = this.raw.stream;
    while (socket.writableLength > SOCKET_HIGH) await drained(socket);
  }

  /** Ends the stream and waits for the load; returns how many rows it stored (in the stage, or directly). */
  async finish(): Promise<number> {
    if (this.chunk) await this.flush();
    this.stream!.end();
    const result = await this.load;
    if (this.direct) return affected(result);
    const [row] = await this.qr.query(`SELECT COUNT(*) AS n FROM ${STAGE}`);
    return Number(row.n);
  }

  abort(err: Error): void {
    this.aborted ??= err;
    // Before MariaDB asked for the file, the factory hands it a failing stream instead (see infile).
    if (this.requested) this.stream?.destroy(err);
  }

  async drop(): Promise<void> {
    await this.qr.query(`DROP TEMPORARY TABLE IF EXISTS ${STAGE}`).catch(() => undefined);
  }

  /** Distinct values of one stage column (e.g. the meters a register file touched). */
  async distinct(column: string): Promise<number[]> {
    const rows: Array<{ v: number }> = await this.qr.query(`SELECT DISTINCT \`${column}\` AS v FROM ${STAGE}`);
    return rows.map((r) => Number(r.v));
  }

  /** Staged rows per owner (meter or zone), after repeats were resolved. */
  async countByOwner(): Promise<Map<number, number>> {
    const owner = this.target.owner;
    const rows: Array<{ id: number; n: number }> = await this.qr.query(
      `SELECT \`${owner}\` AS id, COUNT(*) AS n FROM ${STAGE} GROUP BY \`${owner}\``,
    );
    return new Map(rows.map((r) => [Number(r.id), Number(r.n)]));
  }

  /** Staged rows matching a condition, for messages about them. */
  async stagedRows(where: string, values: unknown[]): Promise<Array<Record<string, unknown>>> {
    return this.qr.query(`SELECT * FROM ${STAGE} WHERE ${where}`, values);
  }
}
