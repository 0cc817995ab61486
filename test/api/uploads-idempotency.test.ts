import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { equipSite, siteReadings, siteRuns, uploadFile } from '../support/ingest-fixtures';
import {
  createSite,
  createTestApp,
  createWorld,
  signedIn,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';

let app: TestApp;
let world: World;
let manager: Client;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  manager = await signedIn(app, world.users.manager.email);
});
afterAll(async () => app?.stop());

async function equippedSite(timeZone = 'America/Los_Angeles'): Promise<number> {
  const site = await createSite(app.db, world.org.id, { timeZone });
  await equipSite(manager, site.id);
  return site.id;
}

const header = 'Meter #,Interval Start,Usage (Gal)\n';
const hours = (from: number, to: number, value: (h: number) => number) =>
  Array.from(
    { length: to - from },
    (_, i) => `SCHOOL-01,2026-11-20 ${String(from + i).padStart(2, '0')}:00,${value(from + i).toFixed(2)}\n`,
  ).join('');

/** `yyyy-mm-dd hh:mm` of hour `i` after 2026-01-01 00:00 UTC. */
const hourAfterNewYear = (i: number) =>
  new Date(Date.UTC(2026, 0, 1) + i * 3_600_000).toISOString().slice(0, 16).replace('T', ' ');

describe('re-uploads', () => {
  it('when the same file is sent again, then it says which upload already has it and nothing changes', async () => {
    const siteId = await equippedSite();
    const first = await uploadFile(manager, siteId, 'meters/interval-long-hourly.csv').expect(201);
    const before = await siteReadings(app.db, siteId);
    const again = await uploadFile(manager, siteId, 'meters/interval-long-hourly.csv').expect(200);
    expect(again.body).toMatchObject({ outcome: 'already-imported', upload: { id: first.body.upload.id } });
    expect(again.body.message).toMatch(
      new RegExp(`already imported as upload #${first.body.upload.id}.*nothing was changed`),
    );
    expect(await siteReadings(app.db, siteId)).toEqual(before);
    const history = (await manager.get(`/api/sites/${siteId}/uploads`).expect(200)).body;
    expect(history.total).toBe(1);
  });

  it(
    'when a file overlaps stored readings, then only the new ones ' + 'are inserted and the rest count as duplicates',
    async () => {
      const siteId = await equippedSite();
      await uploadFile(manager, siteId, Buffer.from(header + hours(0, 12, (h) => h + 0.5)), {}, 'morning.csv').expect(
        201,
      );
      const res = await uploadFile(
        manager,
        siteId,
        Buffer.from(header + hours(6, 18, (h) => h + 0.5)),
        {},
        'midday.csv',
      ).expect(201);
      expect(res.body.upload).toMatchObject({ accepted: 6, duplicate: 6, conflicting: 0, rejected: 0 });
      expect((await siteReadings(app.db, siteId)).length).toBe(18);
    },
  );

  it(
    'when a file disagrees with stored readings, then the conflicts ' + 'are reported and the stored values kept',
    async () => {
      const siteId = await equippedSite();
      await uploadFile(manager, siteId, Buffer.from(header + hours(0, 6, (h) => h + 0.5)), {}, 'first.csv').expect(201);
      const before = await siteReadings(app.db, siteId);
      const res = await uploadFile(
        manager,
        siteId,
        Buffer.from(header + hours(0, 8, (h) => (h === 2 ? 99 : h + 0.5))),
        {},
        'second.csv',
      ).expect(201);
      expect(res.body.upload).toMatchObject({ accepted: 2, duplicate: 5, conflicting: 1, replaced: 0 });
      const items = (await manager.get(`/api/uploads/${res.body.upload.id}/rejections`).expect(200)).body.items;
      expect(items).toContainEqual({
        row: 4,
        column: null,
        kind: 'conflict',
        message: expect.stringMatching(/SCHOOL-01.*stored 2\.5 gal .*this file 99 gal; the stored value was kept/),
      });
      const after = await siteReadings(app.db, siteId);
      for (const r of before) expect(after).toContainEqual(r);
    },
  );

  it(
    'when replacing conflicts is chosen, then the stored value is ' + 'replaced, and rolling back puts it back',
    async () => {
      const siteId = await equippedSite();
      await uploadFile(manager, siteId, Buffer.from(header + hours(0, 6, (h) => h + 0.5)), {}, 'first.csv').expect(201);
      const before = await siteReadings(app.db, siteId);
      const res = await uploadFile(
        manager,
        siteId,
        Buffer.from(header + hours(0, 8, (h) => (h === 2 ? 99 : h + 0.5))),
        { replaceConflicts: 'true' },
        'fix.csv',
      ).expect(201);
      expect(res.body.upload).toMatchObject({ accepted: 2, duplicate: 5, conflicting: 1, replaced: 1 });
      const replaced = (await siteReadings(app.db, siteId)).find((r) => r.start === '2026-11-20T10:00:00.000Z');
      expect(replaced).toMatchObject({ gallons: '99.0000', uploadId: res.body.upload.id });

      const undo = await manager.post(`/api/uploads/${res.body.upload.id}/rollback`).expect(200);
      expect(undo.body).toMatchObject({ removed: 3, upload: { status: 'rolled-back' } });
      expect(await siteReadings(app.db, siteId)).toEqual(before);
    },
  );

  it("when an upload is rolled back, then exactly its rows go and another upload's stay", async () => {
    const siteId = await equippedSite();
    const a = await uploadFile(manager, siteId, 'meters/interval-long-hourly.csv').expect(201);
    const b = await uploadFile(manager, siteId, 'meters/interval-long-date-time-columns.csv', {
      dateOrder: 'month-first',
    }).expect(201);
    const runs = await uploadFile(manager, siteId, 'runtime/runtime-start-duration.csv').expect(201);
    await manager.post(`/api/uploads/${a.body.upload.id}/rollback`).expect(200);
    const left = await siteReadings(app.db, siteId);
    expect(left.length).toBe(8);
    expect(new Set(left.map((r) => r.uploadId))).toEqual(new Set([b.body.upload.id]));
    expect(await siteRuns(app.db, siteId)).toBe(12);
    await manager.post(`/api/uploads/${runs.body.upload.id}/rollback`).expect(200);
    expect(await siteRuns(app.db, siteId)).toBe(0);
    // Rolled back twice: refused, nothing else moves.
    const again = await manager.post(`/api/uploads/${a.body.upload.id}/rollback`).expect(409);
    expect(again.body.error.message).toMatch(/rolled-back/);
    // A rolled-back file may be sent again.
    const back = await uploadFile(manager, siteId, 'meters/interval-long-hourly.csv').expect(201);
    expect(back.body.upload.accepted).toBe(98);
  });

  it(
    'when a 15-minute file overlaps stored hourly readings of the ' +
      'same meter, then the overlapping ones are not stored',
    async () => {
      const siteId = await equippedSite();
      await uploadFile(manager, siteId, Buffer.from(header + hours(0, 6, (h) => h + 0.5)), {}, 'hourly.csv').expect(
        201,
      );
      const quarter = (hour: number) =>
        [0, 15, 30, 45]
          .map((m) => `SCHOOL-01,2026-11-20 ${String(hour).padStart(2, '0')}:${String(m).padStart(2, '0')},0.25`)
          .join('\n');
      const res = await uploadFile(
        manager,
        siteId,
        Buffer.from(`${header}${quarter(1)}\n${quarter(8)}\n`),
        {},
        'logger.csv',
      ).expect(201);
      expect(res.body.upload).toMatchObject({ accepted: 4, conflicting: 4, duplicate: 0 });
      const items = (await manager.get(`/api/uploads/${res.body.upload.id}/rejections`).expect(200)).body.items;
      expect(items.filter((r: { kind: string }) => r.kind === 'conflict')).toHaveLength(4);
      expect(items[0].message).toMatch(
        /overlaps a stored 60-minute reading .* not stored, so no water is counted twice/,
      );
      const stored = await siteReadings(app.db, siteId);
      expect(stored.filter((r) => r.minutes === 15).map((r) => r.start.slice(11, 16))).toEqual([
        '16:00',
        '16:15',
        '16:30',
        '16:45',
      ]);
      expect(stored.filter((r) => r.minutes === 60)).toHaveLength(6);
    },
  );

  it('when monthly register files arrive one after another, then each continues from the stored reads', async () => {
    const siteId = await equippedSite();
    const reads = (rows: string[]) => Buffer.from(`Meter Serial,Read Date,Register Reading,Unit\n${rows.join('\n')}\n`);
    await uploadFile(
      manager,
      siteId,
      reads(['HOA-NORTH-02,2026-09-01,031250,CCF', 'HOA-NORTH-02,2026-10-01,031702,CCF']),
      {},
      'sept.csv',
    ).expect(201);
    const next = await uploadFile(manager, siteId, reads(['HOA-NORTH-02,2026-11-01,032190,CCF']), {}, 'oct.csv').expect(
      201,
    );
    expect(next.body.upload).toMatchObject({ accepted: 1 });
    const volumes = await siteReadings(app.db, siteId);
    expect(volumes.map((v) => [v.start, v.gallons])).toEqual([
      ['2026-09-01T07:00:00.000Z', (452 * 748.051948).toFixed(4)],
      ['2026-10-01T07:00:00.000Z', (488 * 748.051948).toFixed(4)],
    ]);
  });
});

describe('DST files through the API', () => {
  it(
    'when the fall-back day is uploaded, then the repeated 01:00 ' + 'hour is two readings an hour apart in UTC',
    async () => {
      const siteId = await equippedSite();
      await uploadFile(manager, siteId, 'meters/interval-long-hourly.csv').expect(201);
      const nov1 = (await siteReadings(app.db, siteId)).filter(
        (r) => r.ref === 'HOA-NORTH-01' && r.start >= '2026-11-01T07:00' && r.start < '2026-11-01T11:00',
      );
      expect(nov1.map((r) => r.start.slice(11, 16))).toEqual(['07:00', '08:00', '09:00', '10:00']);
    },
  );

  it(
    'when a one-row-per-day file holds the fall-back day, then the ' + 'doubled hour is one 120-minute reading',
    async () => {
      const siteId = await equippedSite();
      await uploadFile(manager, siteId, 'meters/interval-wide-24.csv').expect(201);
      const long = (await siteReadings(app.db, siteId)).filter((r) => r.minutes === 120);
      expect(long).toEqual([
        expect.objectContaining({ ref: 'OFFICE-PARK-01', start: '2026-11-01T08:00:00.000Z', gallons: '181.0000' }),
      ]);
    },
  );

  it('when the spring-forward day is uploaded, then 01:00 PST and 03:00 PDT are one hour apart', async () => {
    const siteId = await equippedSite();
    await uploadFile(manager, siteId, 'meters/interval-long-spring-forward.csv').expect(201);
    const starts = (await siteReadings(app.db, siteId)).map((r) => r.start.slice(11, 16));
    expect(starts).toEqual(['08:00', '09:00', '10:00', '11:00', '12:00']);
  });
});

describe('interrupted uploads', () => {
  it(
    'when the connection drops halfway through a file, then the upload ' + 'is marked failed and nothing is stored',
    async () => {
      const siteId = await equippedSite();
      const { request } = await import('node:http');
      // A machine upload (API key), so the raw request needs no session or CSRF token.
      const admin = await signedIn(app, world.users.admin.email);
      const key = (await admin.post('/api/api-keys', { name: `Cut ${siteId}`, siteIds: [siteId] }).expect(201)).body
        .secret as string;
      const boundary = 'rillmark-test-boundary';
      const rows = Array.from({ length: 8000 }, (_, i) => `SCHOOL-01,${hourAfterNewYear(i)},1.00\n`).join('');
      const body = Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; ` +
          `filename="cut.csv"\r\nContent-Type: text/csv\r\n\r\n${header}${rows}`,
      );
      await new Promise<void>((done) => {
        const req = request(`${app.server.url}/api/sites/${siteId}/uploads`, {
          method: 'POST',
          headers: {
            Authorization: `Bearer ${key}`,
            'Content-Type': `multipart/form-data; boundary=${boundary}`,
            'Content-Length': body.length * 2,
          },
        });
        req.on('error', () => done());
        req.write(body.subarray(0, body.length / 2), () => setTimeout(() => (req.destroy(), done()), 300));
      });
      // The server notices the cut, rolls back and records why.
      let upload: { status: string; errorSummary: string | null } | undefined;
      for (let i = 0; i < 50 && upload?.status !== 'failed'; i++) {
        await new Promise((r) => setTimeout(r, 100));
        upload = (await manager.get(`/api/sites/${siteId}/uploads`).expect(200)).body.items[0];
      }
      expect(upload).toMatchObject({
        status: 'failed',
        errorSummary: expect.stringMatching(/interrupted|could not finish/),
      });
      expect(await siteReadings(app.db, siteId)).toEqual([]);
      const after = await uploadFile(manager, siteId, 'meters/interval-long-hourly.csv');
      expect(after.status, JSON.stringify(after.body)).toBe(201);
    },
  );
});

describe('daily use rollup follows the readings', () => {
  const dailyUse = async (siteId: number) =>
    (await app.db.query(
      `SELECT DATE_FORMAT(local_date, "%Y-%m-%d") AS d, gallons, reading_count AS n FROM
        site_daily_use WHERE site_id = ? ORDER BY local_date`,
      [siteId],
    )) as {
      d: string;
      gallons: string;
      n: number;
    }[];

  it(
    'when readings are imported, replaced and rolled back, then site_daily_use ' +
      'holds the sums of the local days each time',
    async () => {
      const siteId = await equippedSite();
      // 2026-11-20 00:00–11:00 local (Los Angeles): 12 hours of h + 0.5 gal = 72 gal on one local day.
      await uploadFile(manager, siteId, Buffer.from(header + hours(0, 12, (h) => h + 0.5)), {}, 'morning.csv').expect(
        201,
      );
      expect(await dailyUse(siteId)).toEqual([{ d: '2026-11-20', gallons: '72.0000', n: 12 }]);
      const fix = await uploadFile(
        manager,
        siteId,
        Buffer.from(header + hours(0, 2, (h) => (h === 0 ? 10.5 : h + 0.5))),
        { replaceConflicts: 'true' },
        'fix.csv',
      ).expect(201);
      expect(await dailyUse(siteId)).toEqual([{ d: '2026-11-20', gallons: '82.0000', n: 12 }]);
      await manager.post(`/api/uploads/${fix.body.upload.id}/rollback`).expect(200);
      expect(await dailyUse(siteId)).toEqual([{ d: '2026-11-20', gallons: '72.0000', n: 12 }]);
      const all = (await manager.get(`/api/sites/${siteId}/uploads`).expect(200)).body.items as {
        id: number;
        status: string;
      }[];
      await manager.post(`/api/uploads/${all.find((u) => u.status === 'done')!.id}/rollback`).expect(200);
      expect(await dailyUse(siteId)).toEqual([]);
    },
  );
});

describe('uploads at the same moment', () => {
  it(
    'when several sites send overlapping days at once (nightly scripts ' +
      'on one schedule), then every upload lands and each site counts only its own water',
    async () => {
      const sites = await Promise.all(Array.from({ length: 6 }, () => equippedSite()));
      // Same days at every site, different volumes, so a mixed-up daily rollup would show.
      const file = (k: number) => header + hours(0, 24, (h) => (h < 4 ? 10 + k : 0.5));
      const results = await Promise.all(
        sites.map((siteId, k) => uploadFile(manager, siteId, Buffer.from(file(k)), {}, `night-${k}.csv`)),
      );
      expect(results.map((r) => r.status)).toEqual(sites.map(() => 201));
      for (const [k, siteId] of sites.entries()) {
        const [day] = await app.db.query(
          'SELECT gallons, reading_count AS n FROM site_daily_use WHERE site_id = ? AND local_date = ?',
          [siteId, '2026-11-20'],
        );
        expect({ gallons: Number(day.gallons), n: Number(day.n) }).toEqual({ gallons: 4 * (10 + k) + 20 * 0.5, n: 24 });
      }
    },
  );
});
