import { readdirSync, readFileSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { equipSite, SAMPLES, siteReadings, uploadFile } from '../support/ingest-fixtures';
import {
  createSite,
  createTestApp,
  createWorld,
  signedIn,
  suffix,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';

let app: TestApp;
let world: World;
let manager: Client;

beforeAll(async () => {
  // Its own upload folder, so the scratch files seen are this file's alone.
  app = await createTestApp({
    RILLMARK_UPLOAD_MAX_MB: '8',
    RILLMARK_UPLOAD_DIR: `.data/test-uploads/streams-${suffix()}`,
  });
  world = await createWorld(app.db);
  manager = await signedIn(app, world.users.manager.email);
});
afterAll(async () => app?.stop());

async function equippedSite(): Promise<number> {
  const site = await createSite(app.db, world.org.id);
  await equipSite(manager, site.id);
  return site.id;
}

/** Files left in the upload store's scratch folder (a refused or failed upload must leave none behind). */
function scratchFiles(): string[] {
  return readdirSync(resolve(app.config.uploads.dir, 'tmp'));
}

async function healthy(): Promise<void> {
  const res = await fetch(`${app.server.url}/api/health`);
  expect(res.status).toBe(200);
}

/** The manager's cookie and CSRF token, for uploads sent over a raw HTTP connection. */
async function credentials(): Promise<{ cookie: string; csrf: string }> {
  const cookie = (await manager.get('/api/health').expect(200)).request.cookies as string;
  const csrf = decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(cookie)?.[1] ?? '');
  return { cookie, csrf };
}

/** A multipart upload whose body is written in one go. */
function sendAtOnce(siteId: number, fileName: string, file: Buffer): Promise<{ status: number; body: string }> {
  return sendRaw(siteId, fileName, file, Infinity);
}

/** A multipart upload sent the way curl and browsers send it: the body in 64 KB writes as the socket takes them. */
function sendInChunks(siteId: number, fileName: string, file: Buffer): Promise<{ status: number; body: string }> {
  return sendRaw(siteId, fileName, file, 64 * 1024);
}

async function sendRaw(
  siteId: number,
  fileName: string,
  file: Buffer,
  chunkBytes: number,
): Promise<{ status: number; body: string }> {
  const { cookie, csrf } = await credentials();
  const boundary = 'rillmarkchunks';
  const body = Buffer.concat([
    Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${fileName}"\r\n` +
        'Content-Type: text/csv\r\n\r\n',
    ),
    file,
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
  return new Promise((resolveAnswer, reject) => {
    const req = httpRequest(`${app.server.url}/api/sites/${siteId}/uploads`, {
      method: 'POST',
      headers: {
        cookie,
        'x-xsrf-token': csrf,
        'content-type': `multipart/form-data; boundary=${boundary}`,
        'content-length': String(body.length),
      },
    });
    req.on('error', reject);
    req.on('response', (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolveAnswer({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString() }));
    });
    let at = 0;
    const next = (): void => {
      if (at >= body.length) return void req.end();
      const chunk = body.subarray(at, at + chunkBytes);
      at += chunk.length;
      req.write(chunk, () => setImmediate(next));
    };
    next();
  });
}

describe('an upload the parser refuses early never takes the server down (finding 1)', () => {
  it(
    'when the first line is "a," a million times, ' +
      'then the file is refused plainly, nothing is kept and the server still answers',
    async () => {
      const siteId = await equippedSite();
      // The crash depended on timing (a write to the kept copy still in flight when it was thrown away): try often.
      const wide = Buffer.from('a,'.repeat(1_000_000) + '\n');
      for (let i = 0; i < 4; i++) {
        const res = i % 2 ? await sendInChunks(siteId, 'wide.csv', wide) : await sendAtOnce(siteId, 'wide.csv', wide);
        expect(res.status).toBe(400);
        expect(JSON.parse(res.body).error.message).toMatch(/^"wide\.csv": /);
        await healthy();
      }
      expect(await siteReadings(app.db, siteId)).toEqual([]);
      const uploads = (await manager.get(`/api/sites/${siteId}/uploads`).expect(200)).body.items;
      expect(uploads.map((u: { status: string }) => u.status)).toEqual(Array(4).fill('failed'));
      expect(scratchFiles()).toEqual([]);
    },
  );

  it(
    'when the same refusal happens to many uploads at once, ' + 'then every one is answered and the server survives',
    async () => {
      const siteId = await equippedSite();
      const body = Buffer.from('a,'.repeat(300_000) + '\n' + '1,2\n'.repeat(50_000));
      const answers = await Promise.all(
        Array.from({ length: 6 }, (_, i) => uploadFile(manager, siteId, body, {}, `wide-${i}.csv`)),
      );
      expect(answers.map((r) => r.status)).toEqual([400, 400, 400, 400, 400, 400]);
      await healthy();
      expect(scratchFiles()).toEqual([]);
    },
  );
});

describe('a file whose quoting breaks before MariaDB has asked for the rows', () => {
  it(
    'when a quote opens and never closes, ' +
      'then the answer is a prompt 400 naming the line, nothing is stored and the connection is free',
    async () => {
      const siteId = await equippedSite();
      const sample = readFileSync(resolve(SAMPLES, 'meters/interval-long-hourly.csv'), 'utf8');
      const broken = sample.split('\n').slice(0, 30).join('\n') + '\nHOA-NORTH-01,2026-10-30 00:00,"1.5\n';
      // Before: the load into MariaDB waited a minute for a stream that had already failed, then answered 500.
      const res = await uploadFile(manager, siteId, Buffer.from(broken), {}, 'quote.csv');
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/^"quote\.csv" is not well-formed CSV: Quote Not Closed.* line 31/);
      expect(await siteReadings(app.db, siteId)).toEqual([]);
      await uploadFile(manager, siteId, 'meters/interval-long-hourly.csv').expect(201);
    },
  );
});

describe('a client that goes away mid-upload', () => {
  it(
    'when the connection drops halfway through the file, ' +
      'then nothing is stored, no copy is kept and the server answers others',
    async () => {
      const siteId = await equippedSite();
      const { cookie, csrf } = await credentials();
      const boundary = 'rillmarkboundary';
      const head = Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="half.csv"\r\n` +
          'Content-Type: text/csv\r\n\r\nMeter #,Interval Start,Usage (Gal)\n',
      );
      const rows = Buffer.from('HOA-NORTH-01,2026-10-31 00:00,1.5\n'.repeat(40_000));
      await new Promise<void>((done) => {
        const req = httpRequest(`${app.server.url}/api/sites/${siteId}/uploads`, {
          method: 'POST',
          headers: {
            cookie,
            'x-xsrf-token': csrf,
            'content-type': `multipart/form-data; boundary=${boundary}`,
            'content-length': String(head.length + rows.length * 2),
          },
        });
        req.on('error', () => done());
        req.on('response', (r) => (r.resume(), done()));
        req.write(head);
        req.write(rows, () => setTimeout(() => (req.destroy(), done()), 200));
      });
      // The server finishes the failed upload in the background; wait until it has written its outcome.
      let status = 'processing';
      for (let i = 0; i < 100 && status === 'processing'; i++) {
        await new Promise((r) => setTimeout(r, 100));
        status = (await manager.get(`/api/sites/${siteId}/uploads`).expect(200)).body.items[0]?.status ?? 'processing';
      }
      expect(status).toBe('failed');
      await healthy();
      expect(await siteReadings(app.db, siteId)).toEqual([]);
      expect(scratchFiles()).toEqual([]);
    },
  );
});
