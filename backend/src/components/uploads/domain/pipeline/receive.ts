import { createHash } from 'node:crypto';
import { finished, Transform, type Readable } from 'node:stream';
import type { FileStore } from '../../../../platform/storage/file-store';
import { TooLarge } from '../upload-errors';

/** The bytes of one upload as they pass: hashed, counted and copied to the store; the parser reads `bytes`. */
export interface Received {
  /** The same bytes, for the parser. Fails with `TooLarge` past the limit. */
  bytes: Readable;
  /** Bytes seen so far. */
  size(): number;
  /** The SHA-256 of the whole file (call once the parser has read to the end). */
  sha256(): string;
  /** Files the kept copy under its hash; returns the storage key. */
  keep(sha256: string): Promise<string>;
  /** The storage key once `keep` filed the copy, else null. */
  keptKey(): string | null;
  /** Throws the copy away unless it was kept (a refused or failed upload). Safe to call twice. */
  discard(): Promise<void>;
  /** Lets the rest of the request flow (whatever happened), so the multipart parser can finish. */
  release(): void;
}

/**
 * Receive: taps an upload's byte stream — SHA-256, size limit, and a copy of the original kept as the bytes pass —
 * without holding the file in memory.
 */
/**
 * Pipes the upload into the tap. A source that fails or closes before its end (the client went away, even before
 * this was called) fails the tap with that error, so the parser reading the tap stops instead of waiting forever.
 * The tap's own errors reach the parser through its read side; the listener here only keeps them from being
 * unhandled once nobody reads.
 */
function feedTap(file: Readable, tap: Transform): void {
  tap.on('error', () => undefined);
  finished(file, (err) => {
    if (err) tap.destroy(err);
  });
  file.pipe(tap);
}

export function receiveBytes(file: Readable, store: FileStore, maxBytes: number): Received {
  // The store owns the copy's stream: a failed write rejects `write`, which fails the upload.
  const pending = store.begin();
  const hash = createHash('sha256');
  let size = 0;
  const tap = new Transform({
    transform(chunk: Buffer, _enc, done) {
      size += chunk.length;
      if (size > maxBytes) return done(new TooLarge());
      hash.update(chunk);
      pending.write(chunk).then(() => done(null, chunk), done);
    },
  });
  feedTap(file, tap);
  let keptKey: string | null = null;
  return {
    bytes: tap,
    size: () => size,
    sha256: () => hash.digest('hex'),
    keep: async (sha256) => {
      keptKey = await pending.keep(sha256);
      return keptKey;
    },
    keptKey: () => keptKey,
    discard: async () => {
      file.unpipe(tap);
      if (!keptKey) await pending.discard();
    },
    release: () => {
      file.unpipe(tap);
      file.resume();
      tap.destroy();
    },
  };
}
