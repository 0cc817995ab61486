import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { equipSite, uploadFile } from '../support/ingest-fixtures';
import {
  createSite,
  createTestApp,
  createWorld,
  shareSite,
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

describe('meters, controllers and import profiles', () => {
  it('when a meter ref is used twice on a site, then the second is refused', async () => {
    const site = await createSite(app.db, world.org.id);
    const body = { ref: 'LARK-07', unit: 'ccf', purpose: 'mixed', waterSource: 'potable' };
    const first = await manager.post(`/api/sites/${site.id}/meters`, body).expect(201);
    expect(first.body).toMatchObject({
      ref: 'LARK-07',
      registerMultiplier: 1,
      registerDigits: null,
      previousRegisters: [],
    });
    const again = await manager.post(`/api/sites/${site.id}/meters`, body).expect(409);
    expect(again.body.error.details).toEqual([{ field: 'ref', message: 'is already used on this site' }]);
  });

  it('when a meter has readings, then it cannot be deleted until its uploads are rolled back', async () => {
    const site = await createSite(app.db, world.org.id);
    await equipSite(manager, site.id);
    const upload = await uploadFile(manager, site.id, 'meters/interval-long-utf8-bom.csv').expect(201);
    const meter = (await manager.get(`/api/sites/${site.id}/meters`).expect(200)).body.find(
      (m: { ref: string }) => m.ref === 'HOA-NORTH-02',
    );
    await manager.delete(`/api/sites/${site.id}/meters/${meter.id}`).expect(409);
    await manager.post(`/api/uploads/${upload.body.upload.id}/rollback`).expect(200);
    await manager.delete(`/api/sites/${site.id}/meters/${meter.id}`).expect(204);
  });

  it('when an auditor reads equipment, then it is visible but cannot be changed', async () => {
    const site = await createSite(app.db, world.org.id);
    await equipSite(manager, site.id);
    const auditor = await signedIn(app, world.users.auditor.email);
    const controllers = (await auditor.get(`/api/sites/${site.id}/controllers`).expect(200)).body;
    expect(controllers.map((c: { ref: string }) => c.ref)).toEqual(['CTL-HOA-NORTH-A', 'CTL-OFFICE-A', 'CTL-SCHOOL-A']);
    await auditor
      .post(`/api/sites/${site.id}/controllers/${controllers[0].id}/zones`, { station: '9', name: 'Extra' })
      .expect(403);
  });

  it('when a mapping is saved as a profile, then the organisation can list it and upload with it by id', async () => {
    const name = `Utility hourly ${Date.now()}`;
    const mapping = {
      kind: 'interval-long',
      header: ['Meter #', 'Interval Start', 'Usage (Gal)'],
      columns: { meter: 0, timestamp: 1, value: 2 },
      unit: 'gal',
      intervalMinutes: 60,
    };
    const saved = await manager.post('/api/import-profiles', { name, mapping }).expect(201);
    await manager.post('/api/import-profiles', { name, mapping }).expect(409);
    const contractor = await signedIn(app, world.users.contractor.email);
    expect(
      (await contractor.get('/api/import-profiles').expect(200)).body.map((p: { name: string }) => p.name),
    ).toContain(name);
    const auditor = await signedIn(app, world.users.auditor.email);
    await auditor.post('/api/import-profiles', { name: `${name} 2`, mapping }).expect(403);

    const site = await createSite(app.db, world.org.id);
    await equipSite(manager, site.id);
    const res = await uploadFile(manager, site.id, 'meters/interval-long-hourly.csv', {
      profileId: String(saved.body.id),
    }).expect(201);
    expect(res.body.upload).toMatchObject({ accepted: 98, mapping: { columns: { meter: 0, timestamp: 1, value: 2 } } });
    await manager.delete(`/api/import-profiles/${saved.body.id}`).expect(204);
    await manager.delete(`/api/import-profiles/${saved.body.id}`).expect(404);
  });
});

async function siteWithController(): Promise<{
  siteId: number;
  controllerId: number;
  zones: { id: number; station: string }[];
}> {
  const site = await createSite(app.db, world.org.id);
  const res = await manager
    .post(`/api/sites/${site.id}/controllers`, {
      ref: 'CTL-FERN',
      name: 'Fern Court clock',
      zones: [
        { station: '1', name: 'Lawn' },
        { station: '2', name: 'Beds' },
      ],
    })
    .expect(201);
  return { siteId: site.id, controllerId: res.body.id, zones: res.body.zones };
}

/**
 * Editing one zone of a controller: PATCH /api/sites/:id/controllers/:controllerId/zones/:zoneId (invented equipment).
 */
describe('zone edits', () => {
  it(
    'when a manager renames a zone and gives its flows, then the ' +
      'controller comes back with the change and the audit log has it',
    async () => {
      const { siteId, controllerId, zones } = await siteWithController();
      const lawn = zones.find((z) => z.station === '1')!;
      const res = await manager
        .patch(`/api/sites/${siteId}/controllers/${controllerId}/zones/${lawn.id}`, {
          name: 'North lawn',
          designGpm: 14.5,
          emitterCount: null,
        })
        .expect(200);
      expect(res.body.zones).toEqual([
        {
          id: lawn.id,
          controllerId,
          station: '1',
          name: 'North lawn',
          hydrozoneId: null,
          designGpm: 14.5,
          emitterCount: null,
          emitterGph: null,
        },
        expect.objectContaining({ station: '2', name: 'Beds', designGpm: null }),
      ]);
      const stored = (await manager.get(`/api/sites/${siteId}/controllers`).expect(200)).body[0].zones[0];
      expect(stored).toMatchObject({ name: 'North lawn', designGpm: 14.5 });
      const [audit] = await app.db.query(
        `SELECT action, user_id AS userId FROM audit_entry WHERE entity = 'zone' AND entity_id = ?
        ORDER BY id DESC LIMIT 1`,
        [String(lawn.id)],
      );
      expect(audit).toEqual({ action: 'update', userId: world.users.manager.id });
    },
  );

  it(
    'when the new station is already used on the controller, then ' + 'the edit is refused and nothing changes',
    async () => {
      const { siteId, controllerId, zones } = await siteWithController();
      const beds = zones.find((z) => z.station === '2')!;
      const res = await manager
        .patch(`/api/sites/${siteId}/controllers/${controllerId}/zones/${beds.id}`, { station: '1' })
        .expect(409);
      expect(res.body.error.details).toEqual([{ field: 'station', message: 'is already used' }]);
      // Keeping its own station is not a clash.
      await manager
        .patch(`/api/sites/${siteId}/controllers/${controllerId}/zones/${beds.id}`, {
          station: '2',
          name: 'Shrub beds',
        })
        .expect(200);
    },
  );

  it('when the zone belongs to another controller or the body has unknown fields, then 404 and 400', async () => {
    const first = await siteWithController();
    const second = await siteWithController();
    await manager
      .patch(`/api/sites/${first.siteId}/controllers/${first.controllerId}/zones/${second.zones[0]!.id}`, {
        name: 'Stolen',
      })
      .expect(404);
    await manager
      .patch(`/api/sites/${second.siteId}/controllers/${first.controllerId}/zones/${first.zones[0]!.id}`, {
        name: 'Stolen',
      })
      .expect(404);
    const bad = await manager
      .patch(`/api/sites/${first.siteId}/controllers/${first.controllerId}/zones/${first.zones[0]!.id}`, {
        colour: 'green',
      })
      .expect(400);
    expect(bad.body.error.code).toBe('validation_failed');
    const unchanged = (await manager.get(`/api/sites/${second.siteId}/controllers`).expect(200)).body[0].zones[0];
    expect(unchanged.name).toBe('Lawn');
  });

  it(
    "when a zone is linked to another site's hydrozone, then it is " +
      "refused and nothing changes; its own site's is accepted",
    async () => {
      const { siteId, controllerId, zones } = await siteWithController();
      const other = await siteWithController();
      const hydrozone = (siteOf: number) =>
        manager
          .post(`/api/sites/${siteOf}/hydrozones`, {
            name: 'Bed',
            area: 500,
            areaUnit: 'ft2',
            plantFactor: 0.3,
            irrigationMethod: 'drip',
          })
          .expect(201)
          .then((r) => r.body.id as number);
      const own = await hydrozone(siteId);
      const foreign = await hydrozone(other.siteId);
      const url = `/api/sites/${siteId}/controllers/${controllerId}/zones`;
      const refused = await manager.patch(`${url}/${zones[0]!.id}`, { hydrozoneId: foreign }).expect(400);
      expect(refused.body.error.details).toEqual([
        { field: 'hydrozoneId', message: 'is not a hydrozone of this site' },
      ]);
      await manager.post(url, { station: '9', name: 'Borrowed', hydrozoneId: foreign }).expect(400);
      await manager
        .post(`/api/sites/${siteId}/controllers`, {
          ref: 'C-X',
          name: 'Second',
          zones: [{ station: '1', name: 'Z', hydrozoneId: foreign }],
        })
        .expect(400);
      const after = (await manager.get(`/api/sites/${siteId}/controllers`).expect(200)).body;
      expect(after).toHaveLength(1);
      expect(after[0].zones.map((z: { hydrozoneId: number | null }) => z.hydrozoneId)).toEqual([null, null]);
      const linked = await manager.patch(`${url}/${zones[0]!.id}`, { hydrozoneId: own }).expect(200);
      expect(linked.body.zones[0].hydrozoneId).toBe(own);
    },
  );

  it(
    'when a read-only organisation or an auditor tries, then the ' + 'site refuses and a stranger sees no site',
    async () => {
      const { siteId, controllerId, zones } = await siteWithController();
      const utility = await createWorld(app.db, 'utility');
      await shareSite(app.db, siteId, utility.org.id, 'read');
      const reader = await signedIn(app, utility.users.manager.email);
      const auditor = await signedIn(app, world.users.auditor.email);
      const stranger = await signedIn(app, (await createWorld(app.db)).users.manager.email);
      const url = `/api/sites/${siteId}/controllers/${controllerId}/zones/${zones[0]!.id}`;
      await reader.patch(url, { name: 'Nope' }).expect(403);
      await auditor.patch(url, { name: 'Nope' }).expect(403);
      await stranger.patch(url, { name: 'Nope' }).expect(404);
      expect((await manager.get(`/api/sites/${siteId}/controllers`).expect(200)).body[0].zones[0].name).toBe('Lawn');
    },
  );
});
