import { PassThrough, Readable } from 'node:stream';
import type { QueryRunner } from 'typeorm';
import type { IngestTarget } from './ingest-targets';

const STAGE = 'ingest_stage';
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

export interface ConflictRow {
  rowNo: number;
  key: Record<string, unknown>;
  stored: Record<string, unknown>;
  incoming: Record<string, unknown>;
  storedUploadId: number;
}

export interface MergeOutcome {
  accepted: number;
  duplicate: number;
  conflicting: number;
  replaced: number;
  conflicts: ConflictRow[];
}

/**
 * Stages an upload's rows on one connection with `LOAD DATA LOCAL INFILE` from a generated stream (the file
 * is never materialised), then classifies and merges them with set-based SQL inside the caller's transaction.
 * The stage is a temporary table with the target's key, loaded with IGNORE: a row repeating a key already in
 * the same file is skipped (the first is kept) and counted by the caller.
 */
export class IngestWriter {
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
    private readonly target: IngestTarget,
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
    let into: string;
    if (directUploadId !== undefined) {
      const names = [...t.stageColumns.map(([n]) => `\`${n}\``), '@row_no'].join(', ');
      into =
        `\`${t.table}\` CHARACTER SET utf8mb4 FIELDS TERMINATED BY '\\t' ` +
        `ESCAPED BY '\\\\' LINES TERMINATED BY '\\n' (${names}) SET upload_id ` +
        `= ${Number(directUploadId)}`;
    } else {
      await this.qr.query(`DROP TEMPORARY TABLE IF EXISTS ${STAGE}`);
      const columns = t.stageColumns.map(([name, type]) => `\`${name}\` ${type}`).join(', ');
      await this.qr.query(
        `CREATE TEMPORARY TABLE ${STAGE} (${columns}, row_no int unsigned ` +
          `NOT NULL, PRIMARY KEY (${t.key.join(', ')})) ENGINE=InnoDB`,
      );
      const names = [...t.stageColumns.map(([n]) => `\`${n}\``), 'row_no'].join(', ');
      into =
        `${STAGE} CHARACTER SET utf8mb4 FIELDS TERMINATED BY '\\t' ESCAPED ` +
        `BY '\\\\' LINES TERMINATED BY '\\n' (${names})`;
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

  /** Row numbers of staged rows, by key, for messages about them. */
  async stagedRows(where: string, values: unknown[]): Promise<Array<Record<string, unknown>>> {
    return this.qr.query(`SELECT * FROM ${STAGE} WHERE ${where}`, values);
  }

  /** True when some stored row of a staged meter/zone lies within the staged time span of that meter/zone. */
  private async overlapsStored(): Promise<boolean> {
    const [owner, time] = this.target.key as [string, string];
    const spans: Array<{ id: number; first: Date; last: Date }> = await this.qr.query(
      `SELECT \`${owner}\` AS id, MIN(\`${time}\`) AS first, MAX(\`${time}\`) AS last FROM ${STAGE}
        GROUP BY \`${owner}\``,
    );
    for (const span of spans) {
      const [hit] = await this.qr.query(
        `SELECT 1 AS hit FROM \`${this.target.table}\` WHERE \`${owner}\` = ? AND \`${time}\` BETWEEN ? AND ? LIMIT 1`,
        [span.id, span.first, span.last],
      );
      if (hit) return true;
    }
    return false;
  }

  /**
   * Classifies staged rows against stored ones and writes: new rows are inserted; rows equal to stored ones are
   * duplicates; rows differing are conflicts — listed (first `listLimit`), and replaced only when asked, with the
   * stored row kept in `upload_replacement` so roll-back can restore it. Runs in the caller's transaction.
   */
  async merge(uploadId: number, replaceConflicts: boolean, listLimit = 1000): Promise<MergeOutcome> {
    const t = this.target;
    const on = t.key.map((k) => `t.\`${k}\` = s.\`${k}\``).join(' AND ');
    const same = t.compared.map((c) => `t.\`${c}\` <=> s.\`${c}\``).join(' AND ');
    let matched = 0;
    let duplicate = 0;
    // Most uploads bring only new data: when no stored row falls in the file's span for any of its meters/zones,
    // the row-by-row classification below cannot match anything and is skipped.
    if (await this.overlapsStored()) {
      const [counts] = await this.qr.query(
        `SELECT COUNT(*) AS matched, COALESCE(SUM(${same}), 0) AS same FROM ${STAGE} s JOIN \`${t.table}\` t ON ${on}`,
      );
      matched = Number(counts.matched);
      duplicate = Number(counts.same);
    }
    const conflicting = matched - duplicate;
    let conflicts: ConflictRow[] = [];
    let replaced = 0;
    if (conflicting > 0) {
      const select = [
        's.row_no AS row_no',
        't.upload_id AS stored_upload_id',
        ...t.key.map((k) => `s.\`${k}\` AS \`k_${k}\``),
        ...t.compared.map((c) => `t.\`${c}\` AS \`t_${c}\`, s.\`${c}\` AS \`s_${c}\``),
      ].join(', ');
      const rows: Array<Record<string, unknown>> = await this.qr.query(
        `SELECT ${select} FROM ${STAGE} s JOIN \`${t.table}\` t ON ${on} WHERE NOT (${same}) ORDER
          BY s.row_no LIMIT ${Number(listLimit)}`,
      );
      conflicts = rows.map((r) => ({
        rowNo: Number(r['row_no']),
        storedUploadId: Number(r['stored_upload_id']),
        key: Object.fromEntries(t.key.map((k) => [k, r[`k_${k}`]])),
        stored: Object.fromEntries(t.compared.map((c) => [c, r[`t_${c}`]])),
        incoming: Object.fromEntries(t.compared.map((c) => [c, r[`s_${c}`]])),
      }));
      if (replaceConflicts) {
        const all = [...t.key, ...t.copied, 'upload_id'];
        const json = all.map((c) => `'${c}', t.\`${c}\``).join(', ');
        await this.qr.query(
          `INSERT INTO upload_replacement (upload_id, target_table, previous_row) SELECT ?,
            '${t.table}', JSON_OBJECT(${json}) FROM ${STAGE} s JOIN \`${t.table}\` t ON ${on} WHERE
            NOT (${same})`,
          [uploadId],
        );
        const set = [...t.copied.map((c) => `t.\`${c}\` = s.\`${c}\``), 't.upload_id = ?'].join(', ');
        const result = await this.qr.query(
          `UPDATE \`${t.table}\` t JOIN ${STAGE} s ON ${on} SET ${set} WHERE NOT (${same})`,
          [uploadId],
        );
        replaced = affected(result);
      }
    }
    const columns = [...t.key, ...t.copied].map((c) => `\`${c}\``).join(', ');
    // IGNORE skips the keys classified above; the stage's types equal the target's, so nothing else is ignored.
    const inserted = await this.qr.query(
      `INSERT IGNORE INTO \`${t.table}\` (${columns}, upload_id) SELECT ${columns}, ? FROM ${STAGE}`,
      [uploadId],
    );
    return { accepted: affected(inserted), duplicate, conflicting, replaced, conflicts };
  }
}

/** TypeORM's mysql driver returns the OkPacket for writes (an array [rows, packet] in some versions). */
export function affected(result: unknown): number {
  const r = result as { affectedRows?: number } | [unknown, { affectedRows?: number }];
  if (Array.isArray(r)) return Number((r[1] as { affectedRows?: number })?.affectedRows ?? 0);
  return Number(r?.affectedRows ?? 0);
}
