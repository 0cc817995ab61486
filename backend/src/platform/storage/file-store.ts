import type { Readable, Writable } from 'node:stream';

/** A file being written: bytes go to `stream`; `keep` files it under its content hash, `discard` throws it away. */
export interface PendingFile {
  stream: Writable;
  /** Files the bytes under `sha256` and returns the storage key (the same content is kept once). */
  keep(sha256: string): Promise<string>;
  discard(): Promise<void>;
}

/** Where original uploads are kept. Local disk today; an object store later implements the same three calls. */
export interface FileStore {
  begin(): PendingFile;
  /** Reads a kept file back (e.g. to read an upload a second time). */
  open(key: string): Readable;
  exists(key: string): Promise<boolean>;
}
