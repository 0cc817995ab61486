import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  createOrganisation,
  createSite,
  createTestApp,
  createUser,
  createWorld,
  shareSite,
  signedIn,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';
import { leakingSite, runWatch } from './watch-fixtures';

let app: TestApp;
let world: World;
let admin: Client;
let siteId: number;
let alertId: number;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  admin = await signedIn(app, world.users.admin.email);
  siteId = (await createSite(app.db, world.org.id)).id;
  await leakingSite(app.db, siteId);
  await runWatch(admin);
  alertId = (
    (await app.db.query("SELECT id FROM alert WHERE site_id = ? AND sub_kind = 'continuous-flow'", [siteId])) as {
      id: number;
    }[]
  )[0]!.id;
});
afterAll(async () => app?.stop());

describe('who may see and act on alerts', () => {
  it('when an auditor opens an alert, then they read its evidence and events but may not act (403)', async () => {
    const auditor = await signedIn(app, world.users.auditor.email);
    const detail = (await auditor.get(`/api/alerts/${alertId}`).expect(200)).body;
    expect(detail).toMatchObject({ kind: 'leak', subKind: 'continuous-flow', status: 'open', canAct: false, siteId });
    expect(detail.evidence.series[0].points.length).toBeGreaterThan(24);
    expect(detail.waterLostGal).toBeGreaterThan(0);
    expect(detail.events).toEqual([expect.objectContaining({ action: 'opened', userName: 'Nightly watch' })]);
    await auditor.post(`/api/alerts/${alertId}/acknowledge`, {}).expect(403);
    await auditor.post(`/api/alerts/${alertId}/resolve`, {}).expect(403);
    await auditor.post(`/api/alerts/${alertId}/notes`, { note: 'seen' }).expect(403);
  });

  it(
    'when another organisation asks for the alert, then it does not ' + 'exist for them (404) and their inbox omits it',
    async () => {
      const other = await createWorld(app.db);
      const stranger = await signedIn(app, other.users.admin.email);
      await stranger.get(`/api/alerts/${alertId}`).expect(404);
      await stranger.post(`/api/alerts/${alertId}/acknowledge`, {}).expect(404);
      const inbox = (await stranger.get('/api/alerts').expect(200)).body;
      expect(inbox.items.map((a: { id: number }) => a.id)).not.toContain(alertId);
    },
  );

  it('when a contractor has a contributing share, then they may act; a read share may only look', async () => {
    const contractorOrg = await createOrganisation(app.db, 'contractor', 'Crew');
    const readerOrg = await createOrganisation(app.db, 'contractor', 'Reader');
    await shareSite(app.db, siteId, contractorOrg.id, 'contribute');
    await shareSite(app.db, siteId, readerOrg.id, 'read');
    const crew = await signedIn(app, (await createUser(app.db, contractorOrg.id, 'contractor')).email);
    const reader = await signedIn(app, (await createUser(app.db, readerOrg.id, 'contractor')).email);
    await reader.post(`/api/alerts/${alertId}/notes`, { note: 'looks bad' }).expect(403);
    const noted = (await crew.post(`/api/alerts/${alertId}/notes`, { note: 'Crew on site Tuesday.' }).expect(201)).body;
    expect(noted.events.at(-1)).toMatchObject({ action: 'note', note: 'Crew on site Tuesday.' });
  });

  it('when a manager acknowledges then resolves with a note, then the status and history follow', async () => {
    const manager = await signedIn(app, world.users.manager.email);
    await manager.post(`/api/alerts/${alertId}/notes`, {}).expect(400);
    const acked = (await manager.post(`/api/alerts/${alertId}/acknowledge`, { note: 'Looking into it' }).expect(200))
      .body;
    expect(acked.status).toBe('acknowledged');
    await manager.post(`/api/alerts/${alertId}/acknowledge`, {}).expect(409);
    const resolved = (await manager.post(`/api/alerts/${alertId}/resolve`, { note: 'Valve replaced.' }).expect(200))
      .body;
    expect(resolved.status).toBe('resolved');
    expect(resolved.events.map((e: { action: string }) => e.action)).toEqual([
      'opened',
      'note',
      'acknowledged',
      'resolved',
    ]);
    const inbox = (await manager.get(`/api/alerts?status=resolved&siteId=${siteId}`).expect(200)).body;
    expect(inbox.items.map((a: { id: number }) => a.id)).toContain(alertId);
    expect(
      (await manager.get(`/api/alerts?status=open&siteId=${siteId}&kind=leak`).expect(200)).body.items.map(
        (a: { id: number }) => a.id,
      ),
    ).not.toContain(alertId);
  });

  it('when settings are read and changed, then explanations come along and only editors may change them', async () => {
    const contractor = await signedIn(app, world.users.contractor.email);
    const settings = (await contractor.get(`/api/sites/${siteId}/watch-settings`).expect(200)).body;
    expect(settings.canEdit).toBe(false);
    expect(settings.thresholds.find((t: { name: string }) => t.name === 'continuousFlowHours')).toMatchObject({
      value: 24,
      unit: 'h',
      overridden: false,
      explanation: expect.stringContaining('leak'),
    });
    await contractor
      .put(`/api/sites/${siteId}/watch-settings`, { thresholds: { continuousFlowHours: 36 } })
      .expect(403);
    const manager = await signedIn(app, world.users.manager.email);
    await manager.put(`/api/sites/${siteId}/watch-settings`, { thresholds: { nightStartHour: 30 } }).expect(400);
    const saved = (
      await manager
        .put(`/api/sites/${siteId}/watch-settings`, {
          thresholds: { continuousFlowHours: 36 },
          irrigationWindow: { startHour: 22, endHour: 6 },
        })
        .expect(200)
    ).body;
    expect(saved.thresholds.find((t: { name: string }) => t.name === 'continuousFlowHours')).toMatchObject({
      value: 36,
      overridden: true,
    });
    expect(saved.irrigationWindow).toEqual({ startHour: 22, endHour: 6 });
  });
});
