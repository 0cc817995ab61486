import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue, equipSite, expectedTotals, siteReadings, siteRuns, uploadFile } from '../support/ingest-fixtures';
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

/** A fresh site in the file's zone with every demo meter and controller, so each file is judged alone. */
async function equippedSite(timeZone: string): Promise<number> {
  const site = await createSite(app.db, world.org.id, { timeZone });
  await equipSite(manager, site.id);
  return site.id;
}

const good = Object.entries(catalogue.files).filter(
  ([path, spec]) => !path.startsWith('broken/') && spec.records !== undefined && !spec.organisation,
);

/** Per meter, the readings stored and their US gallons, beside what make-samples.py summed from the file. */
async function expectTotals(siteId: number, path: string, kind: string): Promise<void> {
  const expected = expectedTotals[path];
  if (!expected) return;
  const stored = await siteReadings(app.db, siteId);
  for (const [ref, want] of Object.entries(expected)) {
    const mine = stored.filter((r) => r.ref === ref);
    const gallons = mine.reduce((sum, r) => sum + Number(r.gallons), 0);
    // Each reading is stored to 1/10,000 gallon, so the sum may differ by half of that per reading.
    expect(Math.abs(gallons - want.gallons), `${ref}: ${gallons} vs ${want.gallons}`).toBeLessThanOrEqual(
      mine.length * 0.00005 + 0.0001,
    );
    if (kind === 'billing') expect(await billingPeriods(siteId, ref)).toBe(want.records);
    else expect(mine.length, ref).toBe(want.records);
  }
}

async function billingPeriods(siteId: number, ref: string): Promise<number> {
  const [row] = await app.db.query(
    `SELECT COUNT(*) AS n FROM meter_billing_period b JOIN meter m ON m.id = b.meter_id
     WHERE m.site_id = ? AND m.ref = ?`,
    [siteId, ref],
  );
  return Number(row.n);
}

describe('every sample file imports with the counts samples/catalogue.json gives', () => {
  it.each(good)('%s', async (path, spec) => {
    const siteId = await equippedSite(spec.timeZone);
    const fields: Record<string, string> = spec.mappingOverrides
      ? { overrides: JSON.stringify(spec.mappingOverrides) }
      : {};
    if (spec.dateOrder) fields['dateOrder'] = spec.dateOrder;
    const res = await uploadFile(manager, siteId, path, fields);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const upload = res.body.upload;
    expect(upload).toMatchObject({
      status: 'done',
      kind: spec.kind,
      accepted: spec.records,
      rejected: spec.errors,
      duplicate: 0,
      conflicting: 0,
    });
    expect(upload.sha256).toMatch(/^[0-9a-f]{64}$/);
    await expectTotals(siteId, path, spec.kind!);
    if (spec.kind === 'runtime') {
      expect(await siteRuns(app.db, siteId)).toBe(spec.records);
    } else if (spec.kind === 'register') {
      expect((await siteReadings(app.db, siteId)).length).toBe(spec.differenced!.volumes);
      const rejections = (await manager.get(`/api/uploads/${upload.id}/rejections`).expect(200)).body.items as Array<{
        kind: string;
        message: string;
      }>;
      expect(rejections.filter((r) => r.kind === 'notice' && /replacement register/.test(r.message)).length).toBe(
        spec.differenced!.problems.includes('meter-swap') ? 1 : 0,
      );
    } else if (spec.kind !== 'billing') {
      const stored = await siteReadings(app.db, siteId);
      expect(stored.length).toBe(spec.records);
      expect(new Set(stored.map((r) => r.uploadId))).toEqual(new Set([upload.id]));
    }
  });
});

describe('a mapping confirmed in the browser', () => {
  it('when the page sends the whole mapping it showed, then the file is read with it', async () => {
    const siteId = await equippedSite('America/Los_Angeles');
    // The hourly sample's columns, with the volume read as kgal instead of the header's gallons.
    const mapping = {
      kind: 'interval-long',
      header: ['Meter #', 'Interval Start', 'Usage (Gal)'],
      columns: { meter: 0, timestamp: 1, value: 2 },
      unit: 'kgal',
      intervalMinutes: 60,
    };
    const res = await uploadFile(manager, siteId, 'meters/interval-long-hourly.csv', {
      mapping: JSON.stringify(mapping),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.upload).toMatchObject({ accepted: 98, mapping: { unit: 'kgal' } });
    const first = (await siteReadings(app.db, siteId))[0]!;
    expect(first.gallons).toBe('93750.0000');
  });

  it('when the mapping names a column the file does not have, then it is refused naming the field', async () => {
    const siteId = await equippedSite('America/Los_Angeles');
    const mapping = {
      kind: 'interval-long',
      header: [],
      columns: { meter: 0, timestamp: 1, value: 7 },
      unit: 'gal',
      intervalMinutes: 60,
    };
    const res = await uploadFile(manager, siteId, 'meters/interval-long-hourly.csv', {
      mapping: JSON.stringify(mapping),
    }).expect(400);
    expect(res.body.error.details).toContainEqual({
      field: 'mapping.value',
      message: expect.stringContaining('is not in the header'),
    });
  });
});
