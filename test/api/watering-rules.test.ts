import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import {
  createSite,
  createWorld,
  shareSite,
  signedIn,
  type Client,
  type TestApp,
  type World,
  createTestApp,
} from '../support/test-app';
import { runWatch } from './watch-fixtures';

let app: TestApp;
let owner: World;
let agency: World;
let ownerAdmin: Client;
let officer: Client;

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  agency = await createWorld(app.db, 'utility');
  ownerAdmin = await signedIn(app, owner.users.admin.email);
  officer = await signedIn(app, agency.users.auditor.email);
});
afterAll(async () => app?.stop());

/** A controller with stations A–C (10 gpm) on the site; returns the zone ids by station. */
async function addZones(db: DataSource, siteId: number): Promise<Record<string, number>> {
  const c: { insertId: number } = await db.query(
    "INSERT INTO controller (site_id, ref, name) VALUES (?, 'C1', 'Main')",
    [siteId],
  );
  const ids: Record<string, number> = {};
  for (const station of ['A', 'B', 'C']) {
    const z: { insertId: number } = await db.query(
      'INSERT INTO zone (controller_id, station, name, design_gpm) VALUES (?, ?, ?, 10)',
      [c.insertId, station, `Beds ${station}`],
    );
    ids[station] = z.insertId;
  }
  return ids;
}

/** Runs at local Los Angeles times in June 2026 (PDT, UTC−7); upload 0 marks test data. */
async function addRuns(db: DataSource, runs: [number, string, number, string][]): Promise<void> {
  const rows = runs.map(([zoneId, local, minutes, cause]) => [
    zoneId,
    new Date(Date.parse(`${local}:00Z`) + 7 * 3_600_000),
    minutes,
    cause,
    0,
  ]);
  await db.query('INSERT INTO runtime_event (zone_id, start_utc, minutes, cause, upload_id) VALUES ?', [rows]);
}

const stage2 = (siteId: number) => ({
  name: 'Summer watering rule',
  stage: 'Stage 2',
  dayMode: 'odd-even',
  allowedHours: { startHour: 20, endHour: 8 },
  maxStationMinutes: 30,
  inForceFrom: '2026-05-01',
  inForceTo: '2026-09-30',
  sites: [{ siteId, addressNumber: 7 }],
});

describe('watering rules and the officer worklist', () => {
  it(
    'when scheduled runs break the rule in force, then the watch files one alert for the month with the runs listed, ' +
      'manual runs apart, and the officer sees it on the worklist',
    async () => {
      const site = await createSite(app.db, owner.org.id);
      await shareSite(app.db, site.id, agency.org.id, 'read');
      const z = await addZones(app.db, site.id);
      await addRuns(app.db, [
        [z['A']!, '2026-06-02T22:00', 10, 'scheduled'], // even date, odd address
        [z['A']!, '2026-06-03T14:00', 10, 'scheduled'], // afternoon
        [z['B']!, '2026-06-05T21:00', 45, 'scheduled'], // over 30 min
        [z['B']!, '2026-06-05T13:00', 15, 'manual'],
        [z['A']!, '2026-06-07T21:00', 10, 'scheduled'], // within the rule
        [z['C']!, '2026-06-09T07:30', 40, 'scheduled'], // past 08:00 and over 30 min
      ]);
      const created = await officer.post('/api/watering-rules', stage2(site.id)).expect(201);
      expect(created.body).toMatchObject({ stage: 'Stage 2', sites: [{ siteId: site.id, addressNumber: 7 }] });

      const run = await runWatch(ownerAdmin, {
        from: '2026-06-01T07:00:00Z',
        to: '2026-07-01T07:00:00Z',
        siteIds: [site.id],
      });
      expect(run.errors).toEqual([]);
      const alerts = (await ownerAdmin.get(`/api/alerts?siteId=${site.id}&kind=watering-rules`).expect(200)).body;
      expect(alerts.total).toBe(1);
      const alert = (await ownerAdmin.get(`/api/alerts/${alerts.items[0].id}`).expect(200)).body;
      expect(alert).toMatchObject({ kind: 'watering-rules', subKind: 'outside-rules', severity: 'act-soon' });
      expect(alert.evidence.numbers).toMatchObject({
        runsOutsideRules: 4,
        manualRunsOutsideRules: 1,
        notAWateringDay: 1,
        outsideAllowedHours: 2,
        overStationLimit: 2,
        minutesOutsideRules: 105,
      });
      expect(alert.explanation).toContain('2026-06-02 22:00 Station A');
      expect(alert.explanation).toContain('Manual runs, shown apart (1)');
      expect(alert.explanation).toContain('set by the local water agency');
      expect(alert.evidence.series.map((s: { label: string }) => s.label)).toEqual([
        'Runs outside the rules, minutes',
        'Manual runs outside the rules (shown apart), minutes',
      ]);

      const list = (await officer.get('/api/watering-rules/worklist?month=2026-06').expect(200)).body;
      expect(list).toMatchObject({ month: '2026-06', sitesUnderRules: 1, total: 1 });
      expect(list.items[0]).toMatchObject({
        siteId: site.id,
        alertId: alert.id,
        runsOutsideRules: 4,
        manualRunsOutsideRules: 1,
      });
      expect((await officer.get('/api/watering-rules/worklist?month=2026-07').expect(200)).body.total).toBe(0);

      // A second re-check of the same month files the same finding: still one alert.
      await runWatch(ownerAdmin, { from: '2026-06-01T07:00:00Z', to: '2026-07-01T07:00:00Z', siteIds: [site.id] });
      expect((await ownerAdmin.get(`/api/alerts?siteId=${site.id}&kind=watering-rules`).expect(200)).body.total).toBe(
        1,
      );
    },
  );

  it('when only manual runs break the rule, or the site is under no rule, then no alert is raised', async () => {
    const manualOnly = await createSite(app.db, owner.org.id);
    const free = await createSite(app.db, owner.org.id);
    const a = await addZones(app.db, manualOnly.id);
    const b = await addZones(app.db, free.id);
    await addRuns(app.db, [
      [a['A']!, '2026-06-03T14:00', 10, 'manual'],
      [b['A']!, '2026-06-03T14:00', 10, 'scheduled'],
    ]);
    await ownerAdmin.post('/api/watering-rules', { ...stage2(manualOnly.id), name: 'Manual only' }).expect(201);
    await runWatch(ownerAdmin, {
      from: '2026-06-01T07:00:00Z',
      to: '2026-07-01T07:00:00Z',
      siteIds: [manualOnly.id, free.id],
    });
    for (const s of [manualOnly, free])
      expect((await ownerAdmin.get(`/api/alerts?siteId=${s.id}&kind=watering-rules`).expect(200)).body.total).toBe(0);
  });

  it(
    'when a rule is invalid, names a site the organisation cannot see, or the role is wrong, ' + 'then it is refused',
    async () => {
      const site = await createSite(app.db, owner.org.id);
      const unseen = await createSite(app.db, owner.org.id);
      await shareSite(app.db, site.id, agency.org.id, 'read');
      const bad = await officer
        .post('/api/watering-rules', { ...stage2(site.id), inForceTo: '2026-04-01' })
        .expect(400);
      expect(bad.body.error.details).toContainEqual(expect.objectContaining({ field: 'inForceTo' }));
      await officer.post('/api/watering-rules', { ...stage2(site.id), dayMode: 'weekdays', weekdays: [] }).expect(400);
      await officer.post('/api/watering-rules', stage2(unseen.id)).expect(404);
      const contractor = await signedIn(app, agency.users.contractor.email);
      await contractor.get('/api/watering-rules').expect(403);
      await contractor.post('/api/watering-rules', stage2(site.id)).expect(403);

      const rule = (await officer.post('/api/watering-rules', stage2(site.id)).expect(201)).body;
      await ownerAdmin.get(`/api/watering-rules/${rule.id}`).expect(404);
      await ownerAdmin.put(`/api/watering-rules/${rule.id}`, stage2(site.id)).expect(404);
      const changed = await officer
        .put(`/api/watering-rules/${rule.id}`, { ...stage2(site.id), stage: 'Stage 3', maxStationMinutes: 15 })
        .expect(200);
      expect(changed.body).toMatchObject({ stage: 'Stage 3', maxStationMinutes: 15 });
      const page = (await officer.get('/api/watering-rules?q=Stage%203').expect(200)).body;
      expect(page.items.map((r: { id: number }) => r.id)).toContain(rule.id);
      await officer.delete(`/api/watering-rules/${rule.id}`).expect(204);
      await officer.get(`/api/watering-rules/${rule.id}`).expect(404);
    },
  );
});
