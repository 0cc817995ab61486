import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { LocalFileStore } from './local-file-store';

function freshStore(): { store: LocalFileStore; root: string } {
  const root = mkdtempSync(join(tmpdir(), 'rillmark-store-'));
  return { store: new LocalFileStore(root), root };
}

const MB = Buffer.alloc(1024 * 1024, 'a,');

describe('LocalFileStore: a pending copy thrown away while bytes are still being written (finding 1)', () => {
  it('when discard() comes while a write is in flight, then no error escapes and no scratch file is left', async () => {
    const { store, root } = freshStore();
    for (let i = 0; i < 20; i++) {
      const pending = store.begin();
      await pending.write(Buffer.from('Meter,'));
      // The file is open now: these writes are in flight on the file descriptor when discard() comes.
      void pending.write(MB).catch(() => undefined);
      void pending.write(MB).catch(() => undefined);
      await pending.discard();
      await pending.discard();
    }
    // Let any late fs callback run: an 'error' without a listener would surface as an uncaught exception here.
    await new Promise((r) => setTimeout(r, 200));
    expect(readdirSync(join(root, 'tmp'))).toEqual([]);
  });

  it('when the bytes are kept, then they are filed under their hash and the scratch file is gone', async () => {
    const { store, root } = freshStore();
    const pending = store.begin();
    await pending.write(Buffer.from('hello\n'));
    const key = await pending.keep('ab'.repeat(32));
    expect(key).toBe(`ab/${'ab'.repeat(32)}`);
    expect(await store.exists(key)).toBe(true);
    expect(readdirSync(join(root, 'tmp'))).toEqual([]);
  });

  it('when a write fails (the folder vanished), then write and keep reject instead of throwing later', async () => {
    const { store, root } = freshStore();
    const pending = store.begin();
    rmSync(join(root, 'tmp'), { recursive: true, force: true });
    await expect(pending.write(MB)).rejects.toThrow();
    await expect(pending.keep('cd'.repeat(32))).rejects.toThrow();
    await pending.discard();
  });
});
