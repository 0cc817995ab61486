import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { afterAll, describe, expect, it } from 'vitest';
import { LocalFileStore } from '../../../../platform/storage/local-file-store';
import { TooLarge } from '../upload-errors';
import { receiveBytes } from './receive';

const root = mkdtempSync(join(tmpdir(), 'rillmark-receive-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

async function drain(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

describe('receiveBytes', () => {
  it('when a file passes, then the parser gets every byte, hash and size right, keep files a copy', async () => {
    const text = 'Meter,Timestamp,Usage (Gal)\n' + 'M-1,2026-06-01 00:00,1.5\n'.repeat(5000);
    const store = new LocalFileStore(root);
    const received = receiveBytes(Readable.from([Buffer.from(text)]), store, 1_000_000);
    expect((await drain(received.bytes)).toString()).toBe(text);
    const sha = received.sha256();
    expect(sha).toBe(createHash('sha256').update(text).digest('hex'));
    expect(received.size()).toBe(Buffer.byteLength(text));
    const key = await received.keep(sha);
    expect(readFileSync(join(root, key), 'utf8')).toBe(text);
    await received.discard(); // a kept copy stays
    expect(readFileSync(join(root, key), 'utf8')).toBe(text);
  });

  it('when the file passes the limit, then the parser fails with TooLarge and discard leaves nothing', async () => {
    const store = new LocalFileStore(root);
    const received = receiveBytes(Readable.from([Buffer.alloc(600, 65), Buffer.alloc(600, 65)]), store, 1000);
    await expect(drain(received.bytes)).rejects.toBeInstanceOf(TooLarge);
    await received.discard();
    expect(readdirSync(join(root, 'tmp'))).toEqual([]);
  });
});
