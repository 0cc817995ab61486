import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SavingsBookRowDto, SavingsHistoryEntryDto } from '@shared/savings/savings-project-dto';
import { SAVINGS_PROJECT, siteWithSavings } from '../support/month-fixtures';
import {
  createOrganisation,
  createTestApp,
  createUser,
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
let firmContractor: Client;
let siteId: number;

async function pdfOf(client: Client, path: string): Promise<{ text: string; pages: number }> {
  const res = await client
    .get(path)
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    })
    .expect(200)
    .expect('content-type', 'application/pdf');
  const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
  try {
    const parsed = await parser.getText();
    return { text: parsed.text.replace(/\s+/g, ' '), pages: parsed.total };
  } finally {
    await parser.destroy();
  }
}

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  manager = await signedIn(app, owner.users.manager.email);
  siteId = await siteWithSavings(app.db, manager, owner.org.id, `Hillcrest slope ${suffix()}`);
  const firm = await createOrganisation(app.db, 'contractor', 'Firm');
  await shareSite(app.db, siteId, firm.id, 'contribute');
  firmContractor = await signedIn(app, (await createUser(app.db, firm.id, 'contractor')).email);
});
afterAll(async () => app?.stop());

describe("the contractor's savings book", () => {
  it(
    'when a contractor opens the book, then it lists the projects their firm wrote across sites with the water ' +
      "and money saved to date and the verdict, and not the owner's own projects unless asked for all",
    async () => {
      const mine = (
        await firmContractor.post(`/api/sites/${siteId}/savings-projects`, { ...SAVINGS_PROJECT }).expect(201)
      ).body;
      expect(mine).toMatchObject({ status: 'planned', retrofits: SAVINGS_PROJECT.retrofits, installedCost: 1200 });
      expect(mine.can).toMatchObject({ edit: true, markInstalled: true, archive: false });
      const ownersOwn = (
        await manager
          .post(`/api/sites/${siteId}/savings-projects`, { ...SAVINGS_PROJECT, title: 'Owner meter audit' })
          .expect(201)
      ).body;

      const book = (await firmContractor.get('/api/savings-projects?pageSize=50').expect(200)).body;
      const ids = book.items.map((r: SavingsBookRowDto) => r.project.id);
      expect(ids).toContain(mine.id);
      expect(ids).not.toContain(ownersOwn.id);
      const row: SavingsBookRowDto = book.items.find((r: SavingsBookRowDto) => r.project.id === mine.id);
      expect(row.standing).toBe('proven');
      expect(row.savedPercent).toBeGreaterThan(28);
      expect(row.savedPercent).toBeLessThan(32);
      expect(row.savedMoney).toBeCloseTo((4 * row.savedGal!) / 1000, 0);
      expect(row.reportedMonths).toBe(8);

      const all = (await firmContractor.get('/api/savings-projects?scope=all&pageSize=50').expect(200)).body;
      expect(all.items.map((r: SavingsBookRowDto) => r.project.id)).toEqual(
        expect.arrayContaining([mine.id, ownersOwn.id]),
      );
      await firmContractor.patch(`/api/savings-projects/${ownersOwn.id}`, { title: 'Taken over' }).expect(403);
      await firmContractor.delete(`/api/savings-projects/${ownersOwn.id}`).expect(403);
      const stranger = await signedIn(app, (await createWorld(app.db)).users.admin.email);
      expect((await stranger.get('/api/savings-projects?scope=all').expect(200)).body.items).toEqual([]);
    },
  );

  it(
    'when a project is marked installed, then its baseline and model lock: the contractor cannot change them, ' +
      "the owner's manager can with a reason, and every change is in the project's audit trail",
    async () => {
      const p = (
        await firmContractor
          .post(`/api/sites/${siteId}/savings-projects`, { ...SAVINGS_PROJECT, title: 'Lock test' })
          .expect(201)
      ).body;
      const installed = (await firmContractor.post(`/api/savings-projects/${p.id}/installed`).expect(200)).body;
      expect(installed).toMatchObject({ status: 'installed' });
      expect(installed.lockedAt).not.toBeNull();
      expect(installed.can).toMatchObject({ edit: true, changeBaseline: false, remove: false });
      await firmContractor.post(`/api/savings-projects/${p.id}/installed`).expect(409);

      await firmContractor.patch(`/api/savings-projects/${p.id}`, { baselineFrom: '2024-02' }).expect(403);
      await firmContractor.patch(`/api/savings-projects/${p.id}`, { modelForm: 'eto-rain' }).expect(403);
      await firmContractor.patch(`/api/savings-projects/${p.id}`, { reportingTo: '2025-08' }).expect(200);
      await firmContractor.delete(`/api/savings-projects/${p.id}`).expect(409);

      const noReason = await manager.patch(`/api/savings-projects/${p.id}`, { baselineFrom: '2024-02' }).expect(400);
      expect(noReason.body.error.details[0].field).toBe('reason');
      await manager
        .patch(`/api/savings-projects/${p.id}`, {
          baselineFrom: '2024-02',
          reason: 'January 2024 was read from a meter later found faulty.',
        })
        .expect(200);

      const history: SavingsHistoryEntryDto[] = (
        await firmContractor.get(`/api/savings-projects/${p.id}/history`).expect(200)
      ).body.items;
      expect(history.map((h) => h.action)).toEqual([
        'Changed the locked baseline',
        'Changed the project',
        'Marked installed: baseline and model locked',
        'Created the project',
      ]);
      expect(history[0]).toMatchObject({
        userName: 'Test manager',
        lines: ['Baseline from: 2024-01 → 2024-02'],
        reason: 'January 2024 was read from a meter later found faulty.',
      });
      expect(history[1]!.lines).toEqual(['Reporting to: 2025-09 → 2025-08']);

      const stranger = await signedIn(app, (await createWorld(app.db)).users.admin.email);
      await stranger.get(`/api/savings-projects/${p.id}/history`).expect(404);
      await stranger.post(`/api/savings-projects/${p.id}/archive`).expect(404);
    },
  );

  it("when the owner's manager archives a project, then nobody edits it until it is restored", async () => {
    const p = (
      await firmContractor
        .post(`/api/sites/${siteId}/savings-projects`, { ...SAVINGS_PROJECT, title: 'Archive test' })
        .expect(201)
    ).body;
    await firmContractor.post(`/api/savings-projects/${p.id}/archive`).expect(403);
    expect((await manager.post(`/api/savings-projects/${p.id}/archive`).expect(200)).body.status).toBe('archived');
    await firmContractor.patch(`/api/savings-projects/${p.id}`, { title: 'Renamed' }).expect(403);
    expect((await manager.post(`/api/savings-projects/${p.id}/restore`).expect(200)).body.status).toBe('planned');
    await firmContractor.patch(`/api/savings-projects/${p.id}`, { title: 'Renamed' }).expect(200);
  });

  it(
    'when a contractor prints the handout, then it is one page for the client with the retrofit list, cost, ' +
      'payback, chart, checks citing the standard and the criteria version, and the method of the model fitted',
    async () => {
      const eto = (
        await firmContractor
          .post(`/api/sites/${siteId}/savings-projects`, { ...SAVINGS_PROJECT, title: 'Handout ETo' })
          .expect(201)
      ).body;
      const report = (await firmContractor.get(`/api/savings-projects/${eto.id}/report`).expect(200)).body;
      expect(report.savings.paybackYears).toBeCloseTo(1200 / report.savings.annualMoney, 6);
      expect(report.verdict.checks[0]).not.toHaveProperty('fromMemory');

      const { text, pages } = await pdfOf(firmContractor, `/api/savings-projects/${eto.id}/handout.pdf`);
      expect(pages).toBe(1);
      expect(text).toContain('Handout ETo');
      expect(text).toContain('Zones 3–5: 84 spray heads capped, inline drip under mulch');
      expect(text).toContain('Installed cost');
      expect(text).toContain('$1,200.00');
      expect(text).toContain(`${report.savings.paybackYears.toFixed(1)} years`);
      expect(text).toContain('ASHRAE Guideline 14-2002 §5.2.11');
      expect(text).toContain('Rillmark savings criteria, version 1');
      expect(text).toContain('Rain is not part of this model.');
      expect(text).not.toMatch(/and rain|from memory|quoted/i);

      const rain = (
        await firmContractor
          .post(`/api/sites/${siteId}/savings-projects`, {
            ...SAVINGS_PROJECT,
            title: 'Handout rain',
            modelForm: 'eto-rain',
            changeDescription: 'Long description. '.repeat(100),
            // The longest list allowed still fits the one page (the rest is on the project).
            retrofits: Array.from(
              { length: 20 },
              (_, i) => `Zone ${i + 1}: ${'spray heads capped, drip laid '.repeat(6)}`,
            ),
          })
          .expect(201)
      ).body;
      const rainPdf = await pdfOf(firmContractor, `/api/savings-projects/${rain.id}/handout.pdf`);
      expect(rainPdf.pages).toBe(1);
      const rainText = rainPdf.text;
      expect(rainText).toMatch(/and \d+ more items, listed on the project/);
      expect(rainText).toContain('reference evapotranspiration (ETo) and rain');
      expect(rainText).not.toContain('Rain is not part of this model.');

      const stranger = await signedIn(app, (await createWorld(app.db)).users.admin.email);
      await stranger.get(`/api/savings-projects/${eto.id}/handout.pdf`).expect(404);
    },
  );
});
