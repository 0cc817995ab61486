import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue, expectedTotals, meterBody, siteReadings, uploadFile } from '../support/ingest-fixtures';
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

// Issue 12: what the upload decides by itself from the whole file, and what it asks a person instead.
let app: TestApp;
let world: World;
let manager: Client;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  manager = await signedIn(app, world.users.manager.email);
});
afterAll(async () => app?.stop());

/** A fresh site with one gallon meter. */
async function siteWithMeter(ref: string): Promise<number> {
  const site = await createSite(app.db, world.org.id, { timeZone: 'America/Los_Angeles' });
  const res = await manager.post(`/api/sites/${site.id}/meters`, meterBody({ ref, unit: 'gal' }));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return site.id;
}

const csv = (...lines: string[]) => Buffer.from(['Meter,Interval Start,Usage (Gal)', ...lines].join('\n') + '\n');

async function rejections(client: Client, uploadId: number, kind?: string) {
  const query = kind ? `?kind=${kind}` : '';
  return (await client.get(`/api/uploads/${uploadId}/rejections${query}`).expect(200)).body.items as Array<{
    row: number;
    kind: string;
    message: string;
    ref?: { ref: string; rows: number };
  }>;
}

describe('day/month order', () => {
  it('when every date fits both orders, then the upload is refused by name and stored only once chosen', async () => {
    const siteId = await siteWithMeter('DMY-1');
    const file = csv('DMY-1,03/04/2026 01:00,10', 'DMY-1,03/04/2026 02:00,11', 'DMY-1,04/04/2026 01:00,12');
    const refused = await uploadFile(manager, siteId, file);
    expect(refused.status, JSON.stringify(refused.body)).toBe(422);
    expect(refused.body.error).toMatchObject({ code: 'date_order_ambiguous' });
    expect(await siteReadings(app.db, siteId)).toEqual([]);

    const res = await uploadFile(manager, siteId, file, { dateOrder: 'day-first' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.upload.mapping).toMatchObject({ dateOrder: 'day-first' });
    // 3 April 01:00 PDT is 08:00 UTC.
    expect((await siteReadings(app.db, siteId)).map((r) => r.start)[0]).toBe('2026-04-03T08:00:00.000Z');

    // The order kept in the mapping, as the upload page and a saved import profile send it.
    const profile = await manager.post('/api/import-profiles', { name: 'Day-first', mapping: res.body.upload.mapping });
    expect(profile.status, JSON.stringify(profile.body)).toBe(201);
    expect(profile.body.mapping).toMatchObject({ dateOrder: 'day-first' });
    const other = await siteWithMeter('DMY-1');
    const byMapping = await uploadFile(manager, other, file, { mapping: JSON.stringify(profile.body.mapping) });
    expect(byMapping.status, JSON.stringify(byMapping.body)).toBe(201);
    expect((await siteReadings(app.db, other)).map((r) => r.start)[0]).toBe('2026-04-03T08:00:00.000Z');
  });
});

describe('repeats inside one file', () => {
  it('when an interval comes twice with other values, then rows and values are named; kept as chosen', async () => {
    const siteId = await siteWithMeter('REP-1');
    const file = csv(
      'REP-1,2026-05-01 01:00,10',
      'REP-1,2026-05-01 02:00,20',
      'REP-1,2026-05-01 01:00,10',
      'REP-1,2026-05-01 02:00,25',
    );
    const res = await uploadFile(manager, siteId, file);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const upload = res.body.upload;
    expect(upload).toMatchObject({ accepted: 1, duplicate: 1, conflicting: 1 });
    const listed = await rejections(manager, upload.id);
    const conflict = listed.find((r) => r.kind === 'conflict')!;
    expect(conflict.message).toMatch(/row 3: 20(\.0+)? gal; row 5: 25(\.0+)? gal/);
    expect(listed.some((r) => r.kind === 'notice' && /rows 2 & 4/.test(r.message))).toBe(true);
    expect((await siteReadings(app.db, siteId)).length).toBe(1);

    const summary = (await manager.get(`/api/uploads/${upload.id}/conflicts`).expect(200)).body;
    expect(summary.open).toEqual({ stored: 0, inFile: 1 });
    await manager.post(`/api/uploads/${upload.id}/conflicts/repeats`, { choice: 'sum' }).expect(200);
    const stored = await siteReadings(app.db, siteId);
    expect(stored.map((r) => Number(r.gallons))).toEqual([10, 45]);
  });
});

describe('conflicts with stored readings', () => {
  it('when a later file disagrees, then the day is summarised and "replace these" stores the file values', async () => {
    const siteId = await siteWithMeter('CON-1');
    await uploadFile(manager, siteId, csv('CON-1,2026-05-02 01:00,10', 'CON-1,2026-05-02 02:00,20')).expect(201);
    const res = await uploadFile(manager, siteId, csv('CON-1,2026-05-02 01:00,12', 'CON-1,2026-05-02 02:00,20'));
    expect(res.body.upload).toMatchObject({ accepted: 0, duplicate: 1, conflicting: 1 });
    const id = res.body.upload.id;
    const summary = (await manager.get(`/api/uploads/${id}/conflicts`).expect(200)).body;
    expect(summary.days).toEqual([
      { date: '2026-05-02', siteId, kind: 'stored', readings: 1, storedGallons: 10, fileGallons: 12 },
    ]);
    const replaced = await manager.post(`/api/uploads/${id}/conflicts/replace`, { siteId, date: '2026-05-02' });
    expect(replaced.status, JSON.stringify(replaced.body)).toBe(200);
    expect(replaced.body.replaced).toBe(1);
    expect((await siteReadings(app.db, siteId)).map((r) => Number(r.gallons))).toEqual([12, 20]);
    expect((await manager.get(`/api/uploads/${id}/conflicts`).expect(200)).body.open).toEqual({ stored: 0, inFile: 0 });
  });
});

describe('one file for many sites', () => {
  it('when an organisation uploads a multi-site export, then each row lands on its meter’s site, once', async () => {
    // An organisation of its own, so its meter refs are unique to it; site names of its own too, so the demo's
    // sites (which the catalogue is named after) stay the only ones of their name in the shared test database.
    const org = await createWorld(app.db);
    const admin = await signedIn(app, org.users.manager.email);
    const siteOf = new Map<string, number>();
    for (const s of catalogue.sites) {
      const site = await createSite(app.db, org.org.id, { name: `${s.name} ${suffix()}`, timeZone: s.timeZone });
      for (const m of s.meters) {
        const res = await admin.post(`/api/sites/${site.id}/meters`, meterBody(m));
        expect(res.status, JSON.stringify(res.body)).toBe(201);
        siteOf.set(m.ref, site.id);
      }
    }
    const path = 'meters/multi-site-export.csv';
    const send = () => admin.multipart('/api/uploads').attach('file', `samples/${path}`);
    const res = await send();
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const upload = res.body.upload;
    const expected = expectedTotals[path]!;
    expect(upload).toMatchObject({ siteId: null, accepted: 18, unknownRefs: 1 });
    for (const [ref, want] of Object.entries(expected)) {
      const stored = (await siteReadings(app.db, siteOf.get(ref)!)).filter((r) => r.ref === ref);
      expect(stored.length, ref).toBe(want.records);
      expect(upload.sites).toContainEqual(
        expect.objectContaining({ siteId: siteOf.get(ref), accepted: want.records, conflicting: 0 }),
      );
    }
    const unknown = await rejections(admin, upload.id, 'unknown');
    expect(unknown.map((u) => u.ref)).toEqual([{ field: 'meter', ref: 'HOA-EAST-77', rows: 6 }]);

    // Once the missing meter exists, the same file again brings in just its rows; a third time, nothing.
    const east = await admin.post(
      `/api/sites/${siteOf.get('HOA-NORTH-01')}/meters`,
      meterBody({ ref: 'HOA-EAST-77', unit: 'gal' }),
    );
    expect(east.status, JSON.stringify(east.body)).toBe(201);
    const again = await send();
    expect(again.body.upload).toMatchObject({ accepted: 6, duplicate: 18, unknownRefs: 0 });
    const third = await send();
    expect(third.body).toMatchObject({ outcome: 'already-imported', upload: { id: again.body.upload.id } });
  });
});

describe('a meter swap entered on the meter form', () => {
  it('when a swap is recorded, then the old register becomes a previous register ending at the swap', async () => {
    const siteId = await siteWithMeter('SWAP-1');
    const meter = (await manager.get(`/api/sites/${siteId}/meters`).expect(200)).body[0];
    const res = await manager.post(`/api/sites/${siteId}/meters/${meter.id}/swaps`, {
      swappedAt: '2026-03-01T17:00:00.000Z',
      multiplier: 10,
      digits: 5,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({
      registerMultiplier: 10,
      registerDigits: 5,
      installedAt: '2026-03-01T17:00:00.000Z',
      previousRegisters: [expect.objectContaining({ removedAt: '2026-03-01T17:00:00.000Z' })],
    });
  });
});
