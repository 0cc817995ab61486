import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  createOrganisation,
  createSite,
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
import { insertMonthlyUse, pdfText, weatherForSite } from '../support/report-fixtures';
import { alertInMonth, budgetedSite } from '../support/month-fixtures';

let app: TestApp;
let owner: World;
let manager: Client;
let utility: { id: number; name: string };
let auditor: Client;
const sites: { id: number; name: string }[] = [];

// Three owner sites with the same hydrozone and weather but different use, shared with a utility; one unshared.
const USE_JUNE = [90_000, 140_000, 40_000, 200_000];

async function mailsTo(address: string): Promise<{ subject: string; text: string }[]> {
  const res = await fetch(`http://${app.config.mail.host}:${app.config.mail.fakeServerHttpPort}/messages`);
  return ((await res.json()) as { messages: { to: string; subject: string; text: string }[] }).messages.filter((m) =>
    m.to.includes(address),
  );
}

beforeAll(async () => {
  app = await createTestApp();
  owner = await createWorld(app.db);
  manager = await signedIn(app, owner.users.manager.email);
  utility = await createOrganisation(app.db, 'utility', 'Utility');
  auditor = await signedIn(app, (await createUser(app.db, utility.id, 'auditor')).email);
  const names = ['Alder Court', 'Birch Commons', '=HYPERLINK("x")', 'Unshared Yard'];
  for (const [i, name] of names.entries()) {
    const site = await createSite(app.db, owner.org.id, {
      name: `${name}`,
      kind: i === 1 ? 'office-park' : 'hoa-common-area',
    });
    sites.push(site);
    await manager
      .post(`/api/sites/${site.id}/hydrozones`, {
        name: 'Shrubs',
        area: 20_000,
        areaUnit: 'ft2',
        plantFactor: 0.5,
        irrigationMethod: 'drip',
      })
      .expect(201);
    await weatherForSite(manager, site.id, '2024-06-01', '2025-06-30');
    await insertMonthlyUse(app.db, site.id, '2025-06', USE_JUNE[i]!, i === 2 ? 15 : 30);
    await insertMonthlyUse(app.db, site.id, '2024-06', 100_000);
    if (i < 3) await shareSite(app.db, site.id, utility.id, 'read');
  }
  await manager.patch(`/api/sites/${sites[1]!.id}`, { tags: ['north'] }).expect(200);
});
afterAll(async () => app?.stop());

describe('compliance ranking', () => {
  it("when the manager ranks June, then the order and percentages match each site's budget page", async () => {
    const r = (await manager.get('/api/reports/compliance?year=2025&month=2025-06&pageSize=200').expect(200)).body;
    const mine = r.items.filter((row: { siteId: number }) => sites.some((s) => s.id === row.siteId));
    expect(mine).toHaveLength(4);
    const expected: { siteId: number; percent: number }[] = [];
    for (const [i, s] of sites.entries()) {
      const budget = (await manager.get(`/api/sites/${s.id}/budget?from=2025-06&to=2025-06`).expect(200)).body.months[0]
        .gallons;
      expected.push({ siteId: s.id, percent: (100 * USE_JUNE[i]!) / budget });
    }
    // The worklist: over budget first (most over on top), then the half-metered site, then the rest by percent.
    const over = expected.filter((e) => e.percent > 100).sort((a, b) => b.percent - a.percent);
    const gappyId = sites[2]!.id;
    const rest = expected.filter((e) => e.percent <= 100 && e.siteId !== gappyId).sort((a, b) => b.percent - a.percent);
    const gappyExpected = expected.filter((e) => e.percent <= 100 && e.siteId === gappyId);
    const order = [...over, ...gappyExpected, ...rest];
    expect(mine.map((row: { siteId: number }) => row.siteId)).toEqual(order.map((e) => e.siteId));
    expect(mine.map((row: { group: string }) => row.group)).toEqual([
      ...over.map(() => 'over-budget'),
      ...gappyExpected.map(() => 'incomplete-data'),
      ...rest.map(() => 'within-budget'),
    ]);
    mine.forEach((row: { percentOfBudget: number }, i: number) =>
      expect(row.percentOfBudget).toBeCloseTo(order[i]!.percent, 3),
    );
    const gappy = mine.find((row: { siteId: number }) => row.siteId === sites[2]!.id);
    expect(gappy.completeness).toBeCloseTo(0.5, 6);
    const alder = mine.find((row: { siteId: number }) => row.siteId === sites[0]!.id);
    expect(alder.trendPercent).toBeCloseTo(-10, 3);
    // Daily rows hold 4 decimals, so the month sums to within 0.001 gal of the figure written.
    // Annual view: percent of the year's MAWA from the compliance endpoint.
    const annual = (await manager.get(`/api/sites/${sites[0]!.id}/compliance?year=2025`).expect(200)).body;
    expect(alder.annualMawaGal).toBeCloseTo(annual.mawaGallons, 6);
  });

  it('when filtered by area or customer type, then only matching sites remain', async () => {
    const byTag = (await manager.get('/api/reports/compliance?year=2025&month=2025-06&tag=north').expect(200)).body;
    expect(byTag.items.map((r: { siteName: string }) => r.siteName)).toEqual(['Birch Commons']);
    const byKind = (await manager.get('/api/reports/compliance?year=2025&month=2025-06&kind=office-park').expect(200))
      .body;
    expect(byKind.items.every((r: { siteKind: string }) => r.siteKind === 'office-park')).toBe(true);
    const sorted = (
      await manager.get('/api/reports/compliance?year=2025&month=2025-06&sort=name&dir=asc&pageSize=2').expect(200)
    ).body;
    expect(sorted.items).toHaveLength(2);
    expect(sorted.total).toBe(4);
  });

  it('when a utility auditor asks, then only shared sites are ranked, and a contractor is refused', async () => {
    const r = (await auditor.get('/api/reports/compliance?year=2025&month=2025-06').expect(200)).body;
    expect(r.items.map((row: { siteId: number }) => row.siteId).sort()).toEqual(
      sites
        .slice(0, 3)
        .map((s) => s.id)
        .sort(),
    );
    const contractor = await signedIn(app, owner.users.contractor.email);
    await contractor.get('/api/reports/compliance?year=2025').expect(403);
    await auditor.post(`/api/reports/compliance/${sites[3]!.id}/notice`, {}).expect(404);
  });

  it('when exported, then the CSV neutralises formula names and the PDF lists the sites', async () => {
    const csv = await auditor.get('/api/reports/compliance?year=2025&month=2025-06&format=csv').expect(200);
    expect(csv.text).toContain(`"'=HYPERLINK(""x"")"`);
    expect(csv.text).not.toMatch(/(^|,)=HYPERLINK/m);
    const text = await pdfText(auditor, '/api/reports/compliance.pdf?year=2025&month=2025-06');
    expect(text).toContain('Birch Commons');
    expect(text).toContain('Sites needing a look come first');
  });

  it('when an auditor sends a notice twice, then the manager gets one e-mail and the site logs it once', async () => {
    const site = sites[1]!;
    const sent = await auditor
      .post(`/api/reports/compliance/${site.id}/notice`, {
        month: '2025-06',
        message: 'Please check the north valves.',
      })
      .expect(201);
    expect(sent.body.recipients).toBe(2); // the owner's admin and manager
    const again = await auditor.post(`/api/reports/compliance/${site.id}/notice`, { month: '2025-06' }).expect(409);
    expect(again.body.error.message).toMatch(/already sent/);
    let mails: { subject: string; text: string }[] = [];
    // Delivery is asynchronous; on a loaded 2-core machine it has taken over 4 s.
    for (let i = 0; i < 200 && mails.length === 0; i++) {
      await new Promise((r) => setTimeout(r, 100));
      mails = (await mailsTo(owner.users.manager.email)).filter((m) => m.subject.includes(site.name));
    }
    await new Promise((r) => setTimeout(r, 500));
    mails = (await mailsTo(owner.users.manager.email)).filter((m) => m.subject.includes(site.name));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toMatch(/used 140,000 gal in 2025-06, \d+ % of its water budget of [\d,]+ gal/);
    expect(mails[0]!.text).toContain('Please check the north valves.');
    const log = await app.db.query(
      `SELECT user_id AS userId, organisation_id AS org FROM audit_entry WHERE entity = 'site' AND
        entity_id = ? AND action = 'compliance-notice'`,
      [String(site.id)],
    );
    expect(log).toHaveLength(1);
    expect(Number(log[0].org)).toBe(owner.org.id);
    const ranked = (await manager.get('/api/reports/compliance?year=2025&month=2025-06&tag=north').expect(200)).body;
    expect(ranked.items[0].noticeSentAt).not.toBeNull();
    const contractor = await signedIn(app, owner.users.contractor.email);
    await contractor.post(`/api/reports/compliance/${sites[0]!.id}/notice`, {}).expect(403);
  });
});

describe("auditor's worklist", () => {
  it(
    'when a shared site has no readings, another has open alerts and a third no weather station, then each is in ' +
      'its own group, none ranked as compliant or as 0 %, and exports carry labels, not codes',
    async () => {
      const other = await createWorld(app.db);
      const otherManager = await signedIn(app, other.users.manager.email);
      const quiet = await budgetedSite(app.db, otherManager, other.org.id, {
        name: `Quiet Acres ${suffix()}`,
        month: '2025-06',
        useGallons: null,
      });
      const alerted = await budgetedSite(app.db, otherManager, other.org.id, {
        name: `Ridge Lane ${suffix()}`,
        month: '2025-06',
        useGallons: 1_000,
      });
      await alertInMonth(app.db, alerted, '2025-06');
      const unlinked = await createSite(app.db, other.org.id, { name: `Station-less Park ${suffix()}` });
      await insertMonthlyUse(app.db, unlinked.id, '2025-06', 5_000);
      for (const id of [quiet, alerted, unlinked.id]) await shareSite(app.db, id, utility.id, 'read');

      const r = (await auditor.get(`/api/reports/compliance?year=2025&month=2025-06&owner=${other.org.id}`).expect(200))
        .body;
      expect(r.owners.map((o: { id: number }) => o.id)).toEqual(expect.arrayContaining([owner.org.id, other.org.id]));
      expect(r.items.map((row: { siteId: number; group: string }) => [row.siteId, row.group])).toEqual([
        [alerted, 'open-alerts'],
        [quiet, 'no-data'],
        [unlinked.id, 'no-budget'],
      ]);
      const quietRow = r.items.find((row: { siteId: number }) => row.siteId === quiet);
      expect(quietRow.percentOfBudget).toBeNull();
      expect(quietRow.budgetGal).toBeGreaterThan(0);
      expect(r.items.find((row: { siteId: number }) => row.siteId === unlinked.id).problem).toMatch(
        /^This site has no hydrozones yet/,
      );
      expect(r.groups.find((g: { group: string }) => g.group === 'no-data').count).toBe(1);

      const csv = (
        await auditor
          .get(`/api/reports/compliance?year=2025&month=2025-06&owner=${other.org.id}&format=csv`)
          .expect(200)
      ).text;
      expect(csv).toContain(',Park,');
      expect(csv).not.toMatch(/,park,|hydrozones:|weatherStation:|no-data|open-alerts|no-budget/);
      expect(csv).toContain('No data');
      expect(csv).toContain('Open alerts');
      expect(csv).toContain('This site has no hydrozones yet');
    },
  );

  it('when the year is still running, the allowance is the MAWA prorated by ETo to date, labelled so', async () => {
    const year = new Date().getUTCFullYear();
    const r = (await manager.get(`/api/reports/compliance?year=${year}&pageSize=200`).expect(200)).body;
    expect(r.basis).toMatch(/MAWA to date/);
    expect(r.allowanceLabel).toMatch(/prorated by the share of its ETo to date/);
    const row = r.items.find((x: { siteId: number }) => x.siteId === sites[0]!.id);
    expect(row.fullBudgetGal).toBeCloseTo(row.annualMawaGal, 6);
    if (row.allowanceShare !== null) {
      // Not on the year's last day: part of the year's ETo is still to come.
      expect(row.allowanceShare).toBeGreaterThan(0);
      expect(row.allowanceShare).toBeLessThan(1);
      expect(row.budgetGal).toBeCloseTo(row.annualMawaGal * row.allowanceShare, 3);
      expect(row.annualAllowanceGal).toBeCloseTo(row.budgetGal, 6);
    }
    // A year that is over is compared with its whole MAWA.
    const past = (await manager.get('/api/reports/compliance?year=2025&pageSize=200').expect(200)).body;
    const pastRow = past.items.find((x: { siteId: number }) => x.siteId === sites[0]!.id);
    expect(pastRow.allowanceShare).toBeNull();
    expect(pastRow.budgetGal).toBeCloseTo(pastRow.annualMawaGal, 6);
  });

  it("when a notice was sent, then the site's notice history says when, by whom, from where, and what", async () => {
    const site = sites[0]!;
    await auditor
      .post(`/api/reports/compliance/${site.id}/notice`, { month: '2025-05', message: 'May looked high.' })
      .expect(201);
    const history = (await auditor.get(`/api/reports/compliance/${site.id}/notices`).expect(200)).body;
    expect(history.items[0]).toMatchObject({
      month: '2025-05',
      sentBy: 'Test auditor',
      senderOrganisation: utility.name,
      recipients: 2,
      message: 'May looked high.',
    });
    expect((await manager.get(`/api/reports/compliance/${site.id}/notices`).expect(200)).body.total).toBe(1);
    const contractor = await signedIn(app, owner.users.contractor.email);
    await contractor.get(`/api/reports/compliance/${site.id}/notices`).expect(403);
    await auditor.get(`/api/reports/compliance/${sites[3]!.id}/notices`).expect(404);
  });
});
