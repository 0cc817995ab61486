import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { equipSite, uploadFile } from '../support/ingest-fixtures';
import { createSite, createTestApp, createWorld, signedIn, type Client, type TestApp, type World } from '../support/test-app';

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
    expect(first.body).toMatchObject({ ref: 'LARK-07', registerMultiplier: 1, registerDigits: null, previousRegisters: [] });
    const again = await manager.post(`/api/sites/${site.id}/meters`, body).expect(409);
    expect(again.body.error.details).toEqual([{ field: 'ref', message: 'is already used on this site' }]);
  });

  it('when a meter has readings, then it cannot be deleted until its uploads are rolled back', async () => {
    const site = await createSite(app.db, world.org.id);
    await equipSite(manager, site.id);
    const upload = await uploadFile(manager, site.id, 'meters/interval-long-utf8-bom.csv').expect(201);
    const meter = (await manager.get(`/api/sites/${site.id}/meters`).expect(200)).body.find((m: { ref: string }) => m.ref === 'HOA-NORTH-02');
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
    await auditor.post(`/api/sites/${site.id}/controllers/${controllers[0].id}/zones`, { station: '9', name: 'Extra' }).expect(403);
  });

  it('when a mapping is saved as a profile, then the organisation can list it and upload with it by id', async () => {
    const name = `Utility hourly ${Date.now()}`;
    const mapping = { kind: 'interval-long', header: ['Meter #', 'Interval Start', 'Usage (Gal)'], columns: { meter: 0, timestamp: 1, value: 2 }, unit: 'gal', intervalMinutes: 60 };
    const saved = await manager.post('/api/import-profiles', { name, mapping }).expect(201);
    await manager.post('/api/import-profiles', { name, mapping }).expect(409);
    const contractor = await signedIn(app, world.users.contractor.email);
    expect((await contractor.get('/api/import-profiles').expect(200)).body.map((p: { name: string }) => p.name)).toContain(name);
    const auditor = await signedIn(app, world.users.auditor.email);
    await auditor.post('/api/import-profiles', { name: `${name} 2`, mapping }).expect(403);

    const site = await createSite(app.db, world.org.id);
    await equipSite(manager, site.id);
    const res = await uploadFile(manager, site.id, 'meters/interval-long-hourly.csv', { profileId: String(saved.body.id) }).expect(201);
    expect(res.body.upload).toMatchObject({ accepted: 98, mapping: { columns: { meter: 0, timestamp: 1, value: 2 } } });
    await manager.delete(`/api/import-profiles/${saved.body.id}`).expect(204);
    await manager.delete(`/api/import-profiles/${saved.body.id}`).expect(404);
  });
});
