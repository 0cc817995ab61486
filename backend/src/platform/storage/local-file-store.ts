import { randomBytes } from 'node:crypto';
import { createReadStream, createWriteStream, mkdirSync } from 'node:fs';
import { access, mkdir, rename, rm } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import { finished } from 'node:stream/promises';
import { join, resolve } from 'node:path';
import type { FileStore, PendingFile } from './file-store';

/**
 * Original files on local disk under `root`, keyed by SHA-256 (`ab/abcdef…`), so the same file sent twice, to
 * any site, is stored once. Writes go to `root/tmp` first and are renamed into place when kept.
 */
export class LocalFileStore implements FileStore {
  private readonly root: string;

  constructor(root: string) {
    this.root = resolve(root);
    mkdirSync(join(this.root, 'tmp'), { recursive: true });
  }

  begin(): PendingFile {
    const tmp = join(this.root, 'tmp', `${Date.now()}-${randomBytes(6).toString('hex')}`);
    const stream = createWriteStream(tmp);
    const closed = async () => {
      if (!stream.writableFinished && !stream.destroyed) stream.end();
      await finished(stream).catch(() => undefined);
    };
    return {
      stream,
      keep: async (sha256) => {
        await closed();
        const key = `${sha256.slice(0, 2)}/${sha256}`;
        await mkdir(join(this.root, sha256.slice(0, 2)), { recursive: true });
        await rename(tmp, join(this.root, key));
        return key;
      },
      discard: async () => {
        stream.destroy();
        await rm(tmp, { force: true });
      },
    };
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

  private path(key: string): string {
    if (!/^[0-9a-f]{2}\/[0-9a-f]{64}$/.test(key)) throw new Error(`not a storage key: ${key}`);
    return join(this.root, key);
  }
}
