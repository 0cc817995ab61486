import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { lowQuarterUniformity } from '../../shared/field-audits/catch-can';
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
import { pdfText, weatherForSite } from '../support/report-fixtures';

/** A 1 × 1 PNG (valid, so the audit PDF can embed it). */
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==',
  'base64',
);
// Invented catches (inches read off graduated cans), 16 cans, 15-minute run.
const catches = [0.3, 0.28, 0.35, 0.22, 0.31, 0.27, 0.33, 0.18, 0.29, 0.3, 0.26, 0.34, 0.2, 0.32, 0.28, 0.25];

let app: TestApp;
let owner: World;
let firm: World;
let utility: World;
let stranger: World;
let siteId: number;
let zoneId: number;
let otherSiteZoneId: number;
let manager: Client;
let contractor: Client;
let auditor: Client;
let outsider: Client;

async function hydrozone(client: Client, site: number, name: string): Promise<number> {
  const res = await client
    .post(`/api/sites/${site}/hydrozones`, {
      name,
      area: 4_000,
      areaUnit: 'ft2',
      plantFactor: 0.7,
      irrigationMethod: 'spray',
    })
    .expect(201);
  return res.body.id;
}

beforeAll(async () => {
  app = await createTestApp();
  [owner, firm, utility, stranger] = await Promise.all([
    createWorld(app.db),
    createWorld(app.db, 'contractor'),
    createWorld(app.db, 'utility'),
    createWorld(app.db),
  ]);
  const site = await createSite(app.db, owner.org.id, { name: 'Invented Commons' });
  siteId = site.id;
  await shareSite(app.db, siteId, firm.org.id, 'contribute');
  await shareSite(app.db, siteId, utility.org.id, 'read');
  manager = await signedIn(app, owner.users.manager.email);
  contractor = await signedIn(app, firm.users.contractor.email);
  auditor = await signedIn(app, utility.users.auditor.email);
  outsider = await signedIn(app, stranger.users.manager.email);
  await weatherForSite(manager, siteId, '2025-07-01', '2025-07-31');
  zoneId = await hydrozone(manager, siteId, 'Front turf');
  const other = await createSite(app.db, owner.org.id);
  otherSiteZoneId = await hydrozone(manager, other.id, 'Elsewhere');
});
afterAll(async () => app?.stop());

const auditBody = { title: 'Summer audit', auditedOn: '2025-07-14', scheduleMonth: '2025-07', daysPerWeek: 3 };
const testBody = () => ({
  hydrozoneId: zoneId,
  headType: 'spray',
  runMinutes: 15,
  catchUnit: 'in',
  catches,
  pressures: [{ location: 'valve outlet', psi: 42 }],
  soilIntakeInPerHour: 0.4,
  slopePercent: 6,
});

describe('field audits', () => {
  it(
    'when a contractor records a catch-can test, ' +
      'then DU_lq, rate, multiplier and run times come back, and the PDF says so',
    async () => {
      const audit = (await contractor.post(`/api/sites/${siteId}/field-audits`, auditBody).expect(201)).body;
      expect(audit).toMatchObject({ canEdit: true, canApply: true, status: 'draft' });
      const withTest = (await contractor.post(`/api/field-audits/${audit.id}/zone-tests`, testBody()).expect(201)).body;
      const test = withTest.zoneTests[0];
      const du = lowQuarterUniformity(catches).du;
      expect(test.results.du).toBeCloseTo(du, 10);
      expect(test.results.prInPerHour).toBeCloseTo((catches.reduce((s, c) => s + c, 0) / 16) * 4, 10);
      expect(test.results.schedulingMultiplier).toBeCloseTo(1 / (0.4 + 0.6 * du), 10);
      expect(test.schedule.minutesPerWeek).toBeGreaterThan(0);
      expect(test.schedule.slopeLabel).toBe('5–8 %');
      expect(test.schedule.cycleSoak.cycles).toBeGreaterThanOrEqual(1);

      const withFault = (
        await contractor
          .post(`/api/field-audits/${audit.id}/faults`, {
            kind: 'tilted-head',
            location: 'head 4 by the path',
            zoneTestId: test.id,
          })
          .expect(201)
      ).body;
      const faultId = withFault.faults[0].id;
      const photo = await contractor
        .multipart(`/api/field-audits/${audit.id}/faults/${faultId}/photos`)
        .set('content-type', 'image/png')
        .send(PNG)
        .expect(201);
      const url = photo.body.faults[0].photos[0].url;
      const served = await manager.get(url).expect(200);
      expect(served.headers['content-type']).toBe('image/png');
      expect(Buffer.compare(served.body as Buffer, PNG)).toBe(0);

      const text = await pdfText(manager, `/api/field-audits/${audit.id}/report.pdf`);
      expect(text).toContain('Irrigation audit report');
      expect(text).toContain('Tilted head');
      expect(text).toContain(`${Math.round(100 * du)} %`);
      expect(text).toMatch(/backflow/i);
    },
  );

  it('when photos are not images or too large, then they are refused', async () => {
    const audit = (await contractor.post(`/api/sites/${siteId}/field-audits`, auditBody).expect(201)).body;
    const fault = (
      await contractor.post(`/api/field-audits/${audit.id}/faults`, { kind: 'other', location: 'gate' }).expect(201)
    ).body.faults[0];
    const path = `/api/field-audits/${audit.id}/faults/${fault.id}/photos`;
    const svg = await contractor.multipart(path).set('content-type', 'image/png').send(Buffer.from('<svg/>'));
    expect(svg.status).toBe(400);
    expect(svg.body.error.message).toMatch(/not a JPEG, PNG or WebP/);
    const big = await contractor
      .multipart(path)
      .set('content-type', 'image/jpeg')
      .send(Buffer.concat([Buffer.from([0xff, 0xd8, 0xff]), Buffer.alloc(8 * 1024 * 1024)]));
    expect(big.status).toBe(413);
    await contractor.multipart(path).set('content-type', 'image/jpeg').send(PNG).expect(400);
  });

  it(
    'when an auditor records an audit, ' +
      'then only their organisation may change it; results go into a hydrozone only with contribute',
    async () => {
      const mine = (await auditor.post(`/api/sites/${siteId}/field-audits`, auditBody).expect(201)).body;
      await auditor.post(`/api/field-audits/${mine.id}/zone-tests`, testBody()).expect(201);
      const theirs = (await contractor.post(`/api/sites/${siteId}/field-audits`, auditBody).expect(201)).body;
      await auditor.patch(`/api/field-audits/${theirs.id}`, { status: 'complete' }).expect(403);
      await contractor.patch(`/api/field-audits/${mine.id}`, { status: 'complete' }).expect(403);
      await manager.get(`/api/field-audits/${mine.id}`).expect(200);

      const read = (await auditor.get(`/api/field-audits/${mine.id}`).expect(200)).body;
      expect(read.canApply).toBe(false);
      const testId = read.zoneTests[0].id;
      const choice = { efficiency: true, flow: true, soilIntake: false };
      await auditor.post(`/api/field-audits/${mine.id}/zone-tests/${testId}/apply`, choice).expect(403);
      // The contractor (contribute) confirms the auditor's results into the hydrozone.
      const applied = (
        await contractor.post(`/api/field-audits/${mine.id}/zone-tests/${testId}/apply`, choice).expect(200)
      ).body;
      expect(applied.zoneTests[0].appliedAt).not.toBeNull();
      const zone = (await manager.get(`/api/sites/${siteId}/hydrozones/${zoneId}`).expect(200)).body;
      expect(zone.efficiencyOverride).toBeCloseTo(read.zoneTests[0].results.auditedEfficiency, 3);
      expect(zone.designFlowGpm).toBeCloseTo(read.zoneTests[0].results.equivalentFlowGpm, 3);
    },
  );

  it(
    'when another organisation asks, ' + "then audits, photos and the site's list answer 404 and nothing is written",
    async () => {
      const audit = (await contractor.post(`/api/sites/${siteId}/field-audits`, auditBody).expect(201)).body;
      const withFault = (
        await contractor
          .post(`/api/field-audits/${audit.id}/faults`, { kind: 'sunken-head', location: 'bed' })
          .expect(201)
      ).body;
      const fault = withFault.faults[0];
      const photo = (
        await contractor
          .multipart(`/api/field-audits/${audit.id}/faults/${fault.id}/photos`)
          .set('content-type', 'image/png')
          .send(PNG)
          .expect(201)
      ).body.faults[0].photos[0];
      await outsider.get(`/api/sites/${siteId}/field-audits`).expect(404);
      await outsider.post(`/api/sites/${siteId}/field-audits`, auditBody).expect(404);
      await outsider.get(`/api/field-audits/${audit.id}`).expect(404);
      await outsider.patch(`/api/field-audits/${audit.id}`, { title: 'Mine now' }).expect(404);
      await outsider.post(`/api/field-audits/${audit.id}/zone-tests`, testBody()).expect(404);
      await outsider.delete(`/api/field-audits/${audit.id}/faults/${fault.id}`).expect(404);
      await outsider.get(photo.url).expect(404);
      await outsider.delete(photo.url).expect(404);
      await outsider.get(`/api/field-audits/${audit.id}/report.pdf`).expect(404);
      const after = (await manager.get(`/api/field-audits/${audit.id}`).expect(200)).body;
      expect(after.title).toBe(auditBody.title);
      expect(after.faults[0].photos).toHaveLength(1);
      // A test may only use the audited site's own hydrozones.
      const bad = await contractor
        .post(`/api/field-audits/${audit.id}/zone-tests`, { ...testBody(), hydrozoneId: otherSiteZoneId })
        .expect(400);
      expect(bad.body.error.details[0].field).toBe('hydrozoneId');
    },
  );

  it('lists audits as a page', async () => {
    const page = (await manager.get(`/api/sites/${siteId}/field-audits?pageSize=2&sort=auditedOn&dir=desc`).expect(200))
      .body;
    expect(page.items).toHaveLength(2);
    expect(page.total).toBeGreaterThanOrEqual(4);
    expect(page.items[0]).toHaveProperty('meanDu');
  });
});
