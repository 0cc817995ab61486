import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BoardPacketDto, MonthCloseDto, MonthCloseRowDto } from '@shared/month-close/month-close-dto';
import { alertInMonth, budgetedSite } from '../support/month-fixtures';
import { pdfText } from '../support/report-fixtures';
import {
  createOrganisation,
  createSite,
  createTestApp,
  createWorld,
  shareSite,
  signedIn,
  suffix,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';

let app: TestApp;
let owner: World;
let manager: Client;
const MONTH = '2025-06';
const tag = `close-${suffix()}`;
let metered: number;
let silent: number;

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  manager = await signedIn(app, owner.users.manager.email);
  metered = await budgetedSite(app.db, manager, owner.org.id, {
    name: `${tag} Larch Court`,
    month: MONTH,
    useGallons: 60_000,
    meteredDays: 25,
  });
  silent = (await createSite(app.db, owner.org.id, { name: `${tag} Empty Lot` })).id;
  await alertInMonth(app.db, metered, MONTH);
});
afterAll(async () => app?.stop());

async function closeTable(client: Client): Promise<MonthCloseDto> {
  return (await client.get(`/api/month-close?month=${MONTH}&q=${tag}&pageSize=50`).expect(200)).body;
}

const rowOf = (table: MonthCloseDto, siteId: number): MonthCloseRowDto => table.items.find((r) => r.siteId === siteId)!;

async function waitForPacket(client: Client, id: number): Promise<BoardPacketDto> {
  // The packet builds in the background; poll its stored progress (up to ~60 s on a loaded machine).
  for (let i = 0; i < 120; i++) {
    const packet: BoardPacketDto = (await client.get(`/api/month-close/packets/${id}`).expect(200)).body;
    if (packet.status === 'done' || packet.status === 'failed') return packet;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`packet ${id} did not finish`);
}

describe('month close', () => {
  it(
    'when a manager opens a month, then each owned site shows use, budget, variance, cost, alerts and metered ' +
      'days, a site without readings shows no use rather than zero, and a site shared by others stays out',
    async () => {
      const other = await createOrganisation(app.db);
      const sharedIn = await createSite(app.db, other.id, { name: `${tag} Neighbour Park` });
      await shareSite(app.db, sharedIn.id, owner.org.id, 'contribute');

      const table = await closeTable(manager);
      expect(table.items.map((r) => r.siteId).sort()).toEqual([metered, silent].sort());
      const m = rowOf(table, metered);
      expect(m.useGallons).toBeCloseTo(60_000, 0);
      expect(m.budgetGallons).toBeGreaterThan(0);
      expect(m.varianceGallons).toBeCloseTo(60_000 - m.budgetGallons!, 3);
      expect(m.cost).toBeGreaterThan(0);
      expect(m.currency).toBe('USD');
      expect({ metered: m.meteredDays, expected: m.expectedDays }).toEqual({ metered: 25, expected: 30 });
      expect(m.completeness).toBeCloseTo(25 / 30, 6);
      expect({ inMonth: m.alertsInMonth, open: m.openAlerts }).toEqual({ inMonth: 1, open: 1 });

      const s = rowOf(table, silent);
      expect(s.useGallons).toBeNull();
      expect(s.percentOfBudget).toBeNull();
      // In plain words, without the API's field code in front.
      expect(s.budgetProblem).toMatch(/^This site has no hydrozones yet/);
      expect(table.summary).toMatchObject({
        sites: 2,
        reviewed: 0,
        budgetGallons: null,
        openAlerts: 1,
        comparedSites: 1,
      });
    },
  );

  it('when a manager marks a site reviewed with a note, then it is stored, shown and audited', async () => {
    const res = await manager
      .put(`/api/sites/${metered}/month-reviews/${MONTH}`, { note: 'Leak on the north lateral fixed on the 12th.' })
      .expect(200);
    expect(res.body).toMatchObject({ siteId: metered, month: MONTH, reviewedBy: 'Test manager' });
    expect(rowOf(await closeTable(manager), metered).review?.note).toBe('Leak on the north lateral fixed on the 12th.');
    const audit: { action: string; changes: string }[] = await app.db.query(
      "SELECT action, changes FROM audit_entry WHERE entity = 'site' AND entity_id = ? ORDER BY id",
      [String(metered)],
    );
    expect(audit.map((a) => a.action)).toContain('month-review');

    await manager.delete(`/api/sites/${silent}/month-reviews/${MONTH}`).expect(404);
  });

  it('when another role or organisation tries the month close, then it is refused (others get 404)', async () => {
    const contractor = await signedIn(app, owner.users.contractor.email);
    const auditor = await signedIn(app, owner.users.auditor.email);
    await contractor.get(`/api/month-close?month=${MONTH}`).expect(403);
    await auditor.get(`/api/month-close?month=${MONTH}`).expect(403);
    await contractor.put(`/api/sites/${metered}/month-reviews/${MONTH}`, { note: 'x' }).expect(403);

    const stranger = await signedIn(app, (await createWorld(app.db)).users.manager.email);
    await stranger.put(`/api/sites/${metered}/month-reviews/${MONTH}`, { note: 'x' }).expect(404);
    await stranger.delete(`/api/sites/${metered}/month-reviews/${MONTH}`).expect(404);
    expect((await closeTable(stranger)).items).toEqual([]);
    await stranger
      .post('/api/month-close/packets', { month: MONTH, title: 'Not mine', siteIds: [metered] })
      .expect(400);
    await manager.put(`/api/sites/${metered}/month-reviews/2025-13`, { note: '' }).expect(400);
  });

  it(
    'when a manager asks for a board packet, then it is built in the background with progress, stored, and ' +
      'its PDF has the portfolio page and a page per site with the daily chart, the alerts and what was done',
    async () => {
      const alertId = (
        await manager.get(`/api/alerts?siteId=${metered}&pageSize=10&sort=detected&dir=desc`).expect(200)
      ).body.items[0].id;
      await manager.post(`/api/alerts/${alertId}/acknowledge`, { note: 'Crew sent to the north lateral.' }).expect(200);

      const started = await manager
        .post('/api/month-close/packets', { month: MONTH, title: `Larch Court HOA ${tag}`, siteIds: [metered, silent] })
        .expect(202);
      expect(started.body).toMatchObject({ totalSites: 2, title: `Larch Court HOA ${tag}` });
      expect(['queued', 'running', 'done']).toContain(started.body.status);

      const done = await waitForPacket(manager, started.body.id);
      expect(done).toMatchObject({ status: 'done', doneSites: 2, progress: 1 });
      expect(done.sizeBytes).toBeGreaterThan(1000);
      const listed = (await manager.get(`/api/month-close/packets?month=${MONTH}`).expect(200)).body;
      expect(listed.items.map((p: BoardPacketDto) => p.id)).toContain(done.id);

      const text = await pdfText(manager, `/api/month-close/packets/${done.id}/file`);
      expect(text).toContain(`Larch Court HOA ${tag}`);
      expect(text).toContain('June 2025');
      expect(text).toContain(`${tag} Larch Court`);
      expect(text).toContain(`${tag} Empty Lot`);
      expect(text).toContain('Daily use against the daily budget');
      expect(text).toContain('Leak suspected — Water never stops');
      expect(text).toContain('Crew sent to the north lateral.');
      expect(text).toContain('Leak on the north lateral fixed on the 12th.');
      expect(text).toMatch(/1,500 gal/);
      expect(text).not.toMatch(/hydrozones:|weatherStation:/);

      const contractor = await signedIn(app, owner.users.contractor.email);
      await contractor.get(`/api/month-close/packets/${done.id}/file`).expect(403);
      const stranger = await signedIn(app, (await createWorld(app.db)).users.manager.email);
      await stranger.get(`/api/month-close/packets/${done.id}`).expect(404);
      await stranger.get(`/api/month-close/packets/${done.id}/file`).expect(404);
    },
  );
});
