/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import type { Page } from 'playwright-core';
import { startServer, type RunningServer } from '../../backend/src/server';
import { DEMO_PASSWORD, DEMO_USERS } from '../../ops/seed/demo-scenario';
import { seedDemo } from '../../ops/seed/seed-demo';
import { addHours, addMeter, HOUR, waitForRun } from '../api/watch-fixtures';
import { DESKTOP, openBrowser, PHONE, screenshot, signIn } from '../support/browser';
import { Client, createSite, shareSite, suffix } from '../support/test-app';
import { e2eDatabase } from '../support/e2e-database';

/**
 * Watering-rule compliance (the agency's auditor enters a rule and reads the worklist) and a repair verified by the
 * meter (a manager resolves a leak as fixed; the watch confirms it), at desktop and phone width. Screenshots in
 * test-artifacts/e2e/.
 */
let server: RunningServer;
let db: DataSource;
let siteId: number;
let siteName: string;
let meterId: number;

const JUNE = Date.parse('2026-06-01T07:00:00Z'); // 2026-06-01 00:00 in Los Angeles
const day = (n: number) => JUNE + (n - 1) * 24 * HOUR;
const email = (organisation: string, role: string) =>
  DEMO_USERS.find((u) => u.organisation === organisation && u.role === role)!.email;

beforeAll(async () => {
  const opened = await e2eDatabase();
  db = opened.db;
  await seedDemo(db);
  const [cobalt] = (await db.query("SELECT id FROM organisation WHERE name = 'Cobalt Ridge Property Services'")) as {
    id: number;
  }[];
  const [agency] = (await db.query("SELECT id FROM organisation WHERE name LIKE 'Verdella Valley%'")) as {
    id: number;
  }[];
  siteName = `Marigold Court Commons ${suffix()}`;
  siteId = (await createSite(db, cobalt!.id, { name: siteName })).id;
  await shareSite(db, siteId, agency!.id, 'read');
  // Station A waters at 14:00 local on June 3 (outside 20:00–08:00) and, by hand, at 13:00 on June 5.
  const c: { insertId: number } = await db.query(
    "INSERT INTO controller (site_id, ref, name) VALUES (?, 'C1', 'Main')",
    [siteId],
  );
  const z: { insertId: number } = await db.query(
    "INSERT INTO zone (controller_id, station, name, design_gpm) VALUES (?, 'A', 'Front beds', 10)",
    [c.insertId],
  );
  await db.query('INSERT INTO runtime_event (zone_id, start_utc, minutes, cause, upload_id) VALUES ?', [
    [
      [z.insertId, new Date(day(3) + 14 * HOUR), 20, 'scheduled', 0],
      [z.insertId, new Date(day(5) + 13 * HOUR), 15, 'manual', 0],
    ],
  ]);
  // A leak: the meter never stops for 48 h from June 10, then is quiet again.
  meterId = await addMeter(db, siteId);
  await addHours(db, meterId, day(1), day(10), 0);
  await addHours(db, meterId, day(10), day(12), 12);
  server = await startServer(opened.config);
});
afterAll(async () => {
  await server?.stop();
  await db?.destroy();
});

/** The owner's administrator re-checks a range of June through the API, as the watch runs page would. */
async function recheck(from: number, to: number): Promise<void> {
  const admin = new Client(server.url);
  await admin.signIn(email('cobalt', 'admin'), DEMO_PASSWORD);
  for (let i = 0; i < 100; i++) {
    const res = await admin.post('/api/watch/runs', {
      from: new Date(from).toISOString(),
      to: new Date(to).toISOString(),
      siteIds: [siteId],
    });
    if (res.status === 202) {
      await waitForRun(admin, res.body.id);
      return;
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the watch never came free');
}

/** A whole-page screenshot: the shell scrolls inside its content pane, so the pane grows with its content here. */
async function shot(page: Page, name: string): Promise<void> {
  const style = await page.addStyleTag({
    content: '.mat-drawer-container, .mat-drawer-content { overflow: visible !important; height: auto !important; }',
  });
  await screenshot(page, name);
  await style.evaluate((e) => (e as HTMLElement).remove());
}

async function toPhone(page: Page): Promise<void> {
  await page.setViewportSize(PHONE);
  await page.waitForFunction(() => {
    const content = document.querySelector('.mat-drawer-content');
    return content instanceof HTMLElement && getComputedStyle(content).marginLeft === '0px';
  });
}

describe('field tools in the browser', () => {
  it(
    "when the agency's auditor enters a watering rule, then after the watch the worklist shows the site with its " +
      'runs outside the rules and the manual run apart',
    async () => {
      const browser = await openBrowser(DESKTOP);
      const { page } = browser;
      try {
        await signIn(page, { baseUrl: server.url, email: email('verdella', 'auditor') });
        await page.getByRole('link', { name: 'Watering rules' }).click();
        await page.getByRole('link', { name: 'Rules by stage' }).click();
        await page.getByRole('button', { name: 'New rule' }).click();
        await page.getByLabel('Rule name').fill(`Summer rule ${suffix()}`);
        await page.getByLabel('Stage', { exact: true }).fill('Stage 2');
        await page.getByLabel('In force from').fill('2026-05-01');
        await page.getByRole('combobox', { name: 'Watering days' }).click();
        await page.getByRole('option', { name: 'Any day' }).click();
        await page.getByRole('combobox', { name: 'Sites under this rule' }).click();
        await page.getByRole('option', { name: siteName }).click();
        await page.keyboard.press('Escape');
        await page.getByRole('button', { name: 'Save rule' }).click();
        const table = page.getByRole('table', { name: 'Watering rules' });
        await expect.poll(() => table.innerText()).toContain('Summer rule');
        expect(await table.innerText()).toContain('20:00–08:00');
        await shot(page, 'watering-rules-desktop');

        await recheck(day(1), day(12));
        await page.goto(`${server.url}/watering-rules`);
        await page.getByLabel('Month').fill('2026-06');
        const worklist = page.getByRole('table', { name: 'Sites watering outside the rules' });
        const row = worklist.getByRole('row').filter({ hasText: siteName });
        await expect.poll(() => row.innerText()).toContain('1 outside the hours');
        const cells = await row.getByRole('cell').allInnerTexts();
        expect(cells.slice(0, 4)).toEqual(['1', '20 min', '1 outside the hours; 1 over the station limit', '1']);
        await shot(page, 'watering-rules-worklist-desktop');
        await toPhone(page);
        await shot(page, 'watering-rules-worklist-phone');

        await row.getByRole('link', { name: 'Runs listed' }).click();
        await page.getByRole('heading', { name: 'Watering rules — Watering outside the rules' }).waitFor();
        expect(await page.getByText(/broke the watering rule in force/).innerText()).toContain(
          'Manual runs, shown apart',
        );
      } finally {
        await browser.close();
      }
    },
  );

  it(
    'when a manager resolves a leak as fixed on the day of the repair, then after three quiet nights the alert ' +
      'shows "verified by data" with the nights charted',
    async () => {
      const browser = await openBrowser(DESKTOP);
      const { page } = browser;
      try {
        const [leak] = (await db.query("SELECT id FROM alert WHERE site_id = ? AND sub_kind = 'continuous-flow'", [
          siteId,
        ])) as { id: number }[];
        expect(leak).toBeDefined();
        await signIn(page, { baseUrl: server.url, email: email('cobalt', 'manager') });
        await page.goto(`${server.url}/alerts/${leak!.id}`);
        await page.getByRole('combobox', { name: 'How was it resolved?' }).click();
        await page.getByRole('option', { name: 'Fixed (a repair was made)' }).click();
        await page.getByLabel('Day of the repair').fill('2026-06-11');
        await page.getByRole('button', { name: 'Mark resolved' }).click();
        await page.getByRole('heading', { name: /Repair check: Repair being checked/ }).waitFor();

        await addHours(db, meterId, day(12), day(16), 0);
        await recheck(day(12), day(16));
        await page.reload();
        const check = page.getByRole('region', { name: 'Repair check: Verified by data' });
        await check.waitFor();
        expect(await check.innerText()).toContain('confirms the repair');
        await check.getByRole('img').first().waitFor();
        await shot(page, 'repair-verified-desktop');
        await toPhone(page);
        await shot(page, 'repair-verified-phone');

        await page.goto(`${server.url}/alerts/repairs`);
        await page.getByLabel('Flagged from').fill('2026-06-01');
        const perSite = page.getByRole('table', { name: 'Per site' });
        await expect.poll(() => perSite.innerText()).toContain(siteName);
        await shot(page, 'repair-times-phone');
      } finally {
        await browser.close();
      }
    },
  );
});
