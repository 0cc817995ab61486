import { randomBytes } from 'node:crypto';
import { createReadStream, createWriteStream, mkdirSync } from 'node:fs';
import { access, link, mkdir, rm } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import { join, resolve } from 'node:path';
import type { FileStore, PendingFile } from './file-store';

/**
 * Original files on local disk under `root`, keyed by SHA-256 (`ab/abcdef…`), so the same file sent twice, to
 * any site, is stored once. Writes go to `root/tmp` first and are linked into place when kept.
 */
export class LocalFileStore implements FileStore {
  private readonly root: string;

  constructor(root: string) {
    this.root = resolve(root);
    mkdirSync(join(this.root, 'tmp'), { recursive: true });
  }

  begin(): PendingFile {
    const tmp = join(this.root, 'tmp', `${Date.now()}-${randomBytes(6).toString('hex')}`);
    return new PendingLocalFile(tmp, (sha256) => this.fileUnder(tmp, sha256));
  }

  open(key: string): Readable {
    return createReadStream(this.path(key));
  }

  async exists(key: string): Promise<boolean> {
    return access(this.path(key)).then(
      () => true,
      () => false,
    );
  }

  async remove(key: string): Promise<void> {
    await rm(this.path(key), { force: true });
  }

  /** Links the scratch file into place (an existing copy of the same content is kept as it is). */
  private async fileUnder(tmp: string, sha256: string): Promise<string> {
    const key = `${sha256.slice(0, 2)}/${sha256}`;
    await mkdir(join(this.root, sha256.slice(0, 2)), { recursive: true });
    await link(tmp, this.path(key)).catch((err: NodeJS.ErrnoException) => {
      if (err.code !== 'EEXIST') throw err;
    });
    await rm(tmp, { force: true });
    return key;
  }

  private path(key: string): string {
    if (!/^[0-9a-f]{2}\/[0-9a-f]{64}$/.test(key)) throw new Error(`not a storage key: ${key}`);
    return join(this.root, key);
  }
}

/**
 * One scratch file and the write stream into it. Every error of the stream is caught here and handed to the next
 * `write`/`keep`; `discard` may come at any moment (even with a write in flight) and only returns once the
 * stream has closed and the file is gone, so nothing is written after it and no scratch file is left behind.
 */
class PendingLocalFile implements PendingFile {
  private readonly stream;
  private failure: Error | null = null;
  private discarded = false;
  private readonly closed: Promise<void>;

  constructor(
    private readonly tmp: string,
    private readonly file: (sha256: string) => Promise<string>,
  ) {
    this.stream = createWriteStream(tmp, { flags: 'wx' });
    this.stream.on('error', (err) => (this.failure ??= err));
    this.closed = new Promise((done) => this.stream.once('close', done));
  }

  write(chunk: Buffer): Promise<void> {
    const refused = this.refusal();
    if (refused) return Promise.reject(refused);
    if (this.stream.write(chunk)) return Promise.resolve();
    return new Promise((done, fail) => {
      const settle = () => {
        this.stream.off('drain', onDrain);
        this.stream.off('close', onClose);
      };
      const onDrain = () => (settle(), done());
      const onClose = () => (settle(), fail(this.refusal() ?? new Error('the copy of the upload was closed')));
      this.stream.on('drain', onDrain);
      this.stream.on('close', onClose);
    });
  }

  async keep(sha256: string): Promise<string> {
    const refused = this.refusal();
    if (refused) throw refused;
    this.stream.end();
    await this.closed;
    if (this.failure) {
      await rm(this.tmp, { force: true });
      throw this.failure;
    }
    return this.file(sha256);
  }

  async discard(): Promise<void> {
    this.discarded = true;
    this.stream.destroy();
    await this.closed;
    await rm(this.tmp, { force: true });
  }

  private refusal(): Error | null {
    if (this.discarded) return new Error('the copy of the upload was thrown away');
    return this.failure;
  }
}
