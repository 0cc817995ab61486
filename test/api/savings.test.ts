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
import { insertMonthlyUse, pdfText, monthEto, monthsBetween, weatherForSite } from '../support/report-fixtures';

let app: TestApp;
let owner: World;
let manager: Client;

// A hand-built site whose truth is known: baseline use = 3,000 gal + 800 gal/mm × monthly ETo (± a few %),
// reporting use = 70 % of that, so the true savings are 30 %.
const BASELINE = monthsBetween('2024-01', '2024-12');
const REPORTING = monthsBetween('2025-02', '2025-09');
const trueUse = (month: string) => 3000 + 800 * monthEto(month);
const smallNoise = [0.02, -0.015, 0.01, -0.02, 0.005, 0.015, -0.01, -0.005, 0.02, -0.02, 0.01, -0.01];
const bigNoise = [0.35, -0.3, 0.25, -0.4, 0.3, -0.35, 0.4, -0.25, 0.3, -0.3, 0.35, -0.35];
const project = {
  title: 'Greenbelt drip retrofit',
  changeKind: 'spray-to-drip',
  changeDescription: 'Spray heads on the slope replaced by inline drip.',
  installedOn: '2025-01-15',
  baselineFrom: '2024-01',
  baselineTo: '2024-12',
  reportingFrom: '2025-02',
  reportingTo: '2025-09',
  modelForm: 'eto',
};

async function siteWithUse(name: string, noise: number[]): Promise<number> {
  const site = await createSite(app.db, owner.org.id, { name });
  await weatherForSite(manager, site.id, '2024-01-01', '2025-09-30');
  for (const [i, m] of BASELINE.entries()) await insertMonthlyUse(app.db, site.id, m, trueUse(m) * (1 + noise[i]!));
  for (const m of REPORTING) await insertMonthlyUse(app.db, site.id, m, 0.7 * trueUse(m));
  await manager
    .post(`/api/sites/${site.id}/rate-schedules`, {
      name: 'Landscape rate',
      unit: 'kgal',
      fixedChargePerPeriod: 10,
      volumeCharge: { kind: 'uniform', pricePerUnit: 4 },
      effectiveFrom: '2024-01-01',
    })
    .expect(201);
  return site.id;
}

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  manager = await signedIn(app, owner.users.manager.email);
});
afterAll(async () => app?.stop());

describe('savings projects', () => {
  it(
    'when contractors and managers write and auditors read, then ' +
      'access follows the site levels and other organisations get 404',
    async () => {
      const site = await createSite(app.db, owner.org.id);
      const created = await manager.post(`/api/sites/${site.id}/savings-projects`, project).expect(201);
      expect(created.body).toMatchObject({
        siteId: site.id,
        title: project.title,
        installedOn: '2025-01-15',
        createdBy: owner.users.manager.id,
      });

      // A contractor may not change (or delete) a project the owner's manager wrote; the manager may.
      const contractor = await signedIn(app, owner.users.contractor.email);
      await contractor.patch(`/api/savings-projects/${created.body.id}`, { title: 'Contractor rename' }).expect(403);
      await contractor.delete(`/api/savings-projects/${created.body.id}`).expect(403);
      await manager.patch(`/api/savings-projects/${created.body.id}`, { title: 'Slope drip retrofit' }).expect(200);
      const auditor = await signedIn(app, owner.users.auditor.email);
      expect(
        (await auditor.get(`/api/sites/${site.id}/savings-projects`).expect(200)).body.map(
          (p: { title: string }) => p.title,
        ),
      ).toEqual(['Slope drip retrofit']);
      await auditor.post(`/api/sites/${site.id}/savings-projects`, project).expect(403);

      // A contractor firm with a contribute share may create; one with a read share may only look.
      const firm = await createOrganisation(app.db, 'contractor');
      const firmContractor = await signedIn(app, (await createUser(app.db, firm.id, 'contractor')).email);
      await firmContractor.get(`/api/savings-projects/${created.body.id}`).expect(404);
      await firmContractor.post(`/api/sites/${site.id}/savings-projects`, project).expect(404);
      await shareSite(app.db, site.id, firm.id, 'read');
      await firmContractor.get(`/api/savings-projects/${created.body.id}`).expect(200);
      await firmContractor.post(`/api/sites/${site.id}/savings-projects`, project).expect(403);
      await app.db.query('UPDATE site_share SET access = ? WHERE site_id = ? AND organisation_id = ?', [
        'contribute',
        site.id,
        firm.id,
      ]);
      await firmContractor.post(`/api/sites/${site.id}/savings-projects`, project).expect(201);

      const stranger = await signedIn(app, (await createWorld(app.db)).users.admin.email);
      await stranger.get(`/api/savings-projects/${created.body.id}/report`).expect(404);
      await stranger.delete(`/api/savings-projects/${created.body.id}`).expect(404);
    },
  );

  it('when the baseline ends after installation, then 400 names the field', async () => {
    const site = await createSite(app.db, owner.org.id);
    const res = await manager
      .post(`/api/sites/${site.id}/savings-projects`, { ...project, baselineTo: '2025-01' })
      .expect(400);
    expect(res.body.error.details[0].field).toBe('baselineTo');
  });

  it(
    'when reporting use is 70 % of a clean weather-driven baseline, ' +
      'then the report finds ≈ 30 % savings and Guideline 14 accepts the model',
    async () => {
      const siteId = await siteWithUse('Known-savings park', smallNoise);
      const id = (await manager.post(`/api/sites/${siteId}/savings-projects`, project).expect(201)).body.id;
      const r = (await manager.get(`/api/savings-projects/${id}/report`).expect(200)).body;
      expect(r.model.coefficients[1].value).toBeCloseTo(800, -1.5);
      expect(r.model.statistics.rSquared).toBeGreaterThan(0.95);
      expect(r.savings.savedPercent).toBeGreaterThan(28);
      expect(r.savings.savedPercent).toBeLessThan(32);
      const trueSaved = REPORTING.reduce((s, m) => s + 0.3 * trueUse(m), 0);
      expect(Math.abs(r.savings.savedGal - trueSaved) / trueSaved).toBeLessThan(0.05);
      // $4 per kgal: the fixed charge cancels out, so money saved ≈ 4 × saved kgal.
      expect(r.savings.currency).toBe('USD');
      expect(r.savings.savedMoney).toBeCloseTo((4 * r.savings.savedGal) / 1000, 0);
      expect(r.verdict.canClaimSavings).toBe(true);
      expect(r.verdict.checks.find((c: { id: string }) => c.id === 'cv-rmse').passed).toBe(true);
      expect(r.reportingMonths).toHaveLength(8);
    },
  );

  it(
    'when the baseline scatters ±30–40 % around the weather line, ' +
      'then the verdict says the model is not good enough to claim savings',
    async () => {
      const siteId = await siteWithUse('Noisy park', bigNoise);
      const id = (await manager.post(`/api/sites/${siteId}/savings-projects`, project).expect(201)).body.id;
      const r = (await manager.get(`/api/savings-projects/${id}/report`).expect(200)).body;
      expect(r.verdict.canClaimSavings).toBe(false);
      expect(r.verdict.summary).toMatch(/not good enough to claim savings because its CV\(RMSE\) is/);
      expect(r.verdict.checks.find((c: { id: string }) => c.id === 'cv-rmse').passed).toBe(false);
    },
  );

  it('when a month is barely metered, then it is left out with a warning rather than counted as savings', async () => {
    const siteId = await siteWithUse('Gappy park', smallNoise);
    await insertMonthlyUse(app.db, siteId, '2025-05', 1000, 10);
    const id = (await manager.post(`/api/sites/${siteId}/savings-projects`, project).expect(201)).body.id;
    const r = (await manager.get(`/api/savings-projects/${id}/report`).expect(200)).body;
    expect(r.savings.periods.map((p: { label: string }) => p.label)).not.toContain('2025-05');
    expect(r.warnings.join(' ')).toMatch(/Reporting months left out .*2025-05/);
  });

  it(
    'when exported, then the CSV neutralises a formula site name ' +
      'and the PDF states the site, the savings and the method',
    async () => {
      const siteId = await siteWithUse('=HYPERLINK("x")', smallNoise);
      const id = (await manager.post(`/api/sites/${siteId}/savings-projects`, project).expect(201)).body.id;
      const csv = await manager
        .get(`/api/savings-projects/${id}/report?format=csv`)
        .expect(200)
        .expect('content-type', /text\/csv/);
      expect(csv.text).toContain(`"'=HYPERLINK(""x"")"`);
      expect(csv.text).not.toMatch(/(^|,)=HYPERLINK/m);
      expect(csv.text.split('\r\n')[0]).toContain('Metered use (gal)');

      const r = (await manager.get(`/api/savings-projects/${id}/report`).expect(200)).body;
      const text = await pdfText(manager, `/api/savings-projects/${id}/report.pdf`);
      expect(text).toContain('=HYPERLINK("x")');
      expect(text).toContain(
        `${Math.round(r.savings.savedGal).toLocaleString('en-US')} gal (${r.savings.savedPercent.toFixed(1)} %)`,
      );
      expect(text).toContain('to predict what the site would have used without the change');
      expect(text).toContain('ASHRAE Guideline 14');
      // The Guideline 14 threshold, spelled out because the shipped font subset has no ≤ sign.
      expect(text).toContain('at most 20 %');
    },
  );
});
