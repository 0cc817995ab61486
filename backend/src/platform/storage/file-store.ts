import type { Readable } from 'node:stream';

/**
 * A file being written. The store owns the stream behind it (its errors are caught and reported through these
 * calls), so a caller can never leave an 'error' event without a listener.
 */
export interface PendingFile {
  /** Appends bytes; resolves when more may be written (back-pressure), rejects if the copy failed or was discarded. */
  write(chunk: Buffer): Promise<void>;
  /** Files the bytes under `sha256` and returns the storage key (the same content is kept once). */
  keep(sha256: string): Promise<string>;
  /** Throws the bytes away: waits for the stream to close, then removes the scratch file. Safe to call twice. */
  discard(): Promise<void>;
}

/** Where original uploads are kept. Local disk today; an object store later implements the same calls. */
export interface FileStore {
  begin(): PendingFile;
  /** Reads a kept file back (e.g. to read an upload a second time). */
  open(key: string): Readable;
  exists(key: string): Promise<boolean>;
  /** Removes a kept file that a failed upload had just filed (and nothing else refers to). */
  remove(key: string): Promise<void>;
}
