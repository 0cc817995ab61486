/// <reference lib="dom" />
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { DataSource } from 'typeorm';
import { startServer, type RunningServer } from '../../backend/src/server';
import { DEMO_USERS, type DemoUser } from '../../ops/seed/demo-scenario';
import { seedAlerts } from '../../ops/seed/seed-alerts';
import { seedBudgets } from '../../ops/seed/seed-budgets';
import { seedDemo } from '../../ops/seed/seed-demo';
import { seedMeters } from '../../ops/seed/seed-meters';
import { seedSavings } from '../../ops/seed/seed-savings';
import { DESKTOP, openBrowser, PHONE, screenshot, signIn } from '../support/browser';
import { e2eDatabase } from '../support/e2e-database';

/**
 * Each role's month end to end on the demo, at desktop and phone width, with screenshots in test-artifacts/e2e/:
 * the manager closes November 2026 (review marks, a board packet), the contractor opens the savings book and prints
 * a handout, the auditor works the budget worklist and sends a notice. The generated PDFs are read back as text.
 */
const MONTH = '2026-11';
/** Each walk runs twice (desktop, phone) and builds PDFs: more than the default minute on a shared machine. */
const WALK_TIMEOUT_MS = 240_000;
let server: RunningServer;
let db: DataSource;

beforeAll(async () => {
  const opened = await e2eDatabase();
  db = opened.db;
  await seedDemo(db);
  await seedBudgets(db);
  await seedMeters(db, opened.config);
  await seedSavings(db);
  await seedAlerts(db, opened.config);
  // A notice is sent once per site and month: start from none, so the auditor's walk can send one.
  await db.query('DELETE FROM compliance_notice WHERE month = ?', [MONTH]);
  server = await startServer(opened.config);
}, 300_000);
afterAll(async () => {
  await server?.stop();
  await db?.destroy();
});

const user = (email: string): DemoUser => DEMO_USERS.find((u) => u.email === email)!;
const manager = user('morgan.manager@cobaltridge.example');
const contractor = user('casey.contractor@thistlewood.example');
const auditor = user('alex.auditor@verdellawater.example');

/** Downloads a link's target with the page's session and returns the PDF's text. */
async function pdfBehind(page: Page, href: string): Promise<{ text: string; pages: number }> {
  const res = await page.request.get(new URL(href, page.url()).href);
  expect(res.headers()['content-type']).toBe('application/pdf');
  const parser = new PDFParse({ data: new Uint8Array(await res.body()) });
  try {
    const parsed = await parser.getText();
    return { text: parsed.text.replace(/\s+/g, ' '), pages: parsed.total };
  } finally {
    await parser.destroy();
  }
}

async function expectNoSidewaysScroll(page: Page): Promise<void> {
  const widths = await page.evaluate(() => {
    const scroller = document.querySelector('mat-sidenav-content') ?? document.documentElement;
    return { scroll: scroller.scrollWidth, client: scroller.clientWidth, doc: document.documentElement.scrollWidth };
  });
  expect(widths.scroll).toBeLessThanOrEqual(widths.client + 1);
  expect(widths.doc).toBeLessThanOrEqual(PHONE.width + 1);
}

/** Runs `walk` at desktop and then phone width, each in a fresh browser; a page error fails it. */
async function atEachWidth(name: string, walk: (page: Page, width: 'desktop' | 'phone') => Promise<void>) {
  for (const viewport of [DESKTOP, PHONE]) {
    const width = viewport === DESKTOP ? 'desktop' : 'phone';
    const browser = await openBrowser(viewport);
    const errors: string[] = [];
    browser.page.on('pageerror', (e) => errors.push(e.message));
    try {
      await walk(browser.page, width);
      expect(errors).toEqual([]);
    } catch (err) {
      await screenshot(browser.page, `${name}-failure-${width}`);
      throw err;
    } finally {
      await browser.close();
    }
  }
}

/** Steps the month stepper from where it starts (the last complete month on today's UTC clock) back to `month`. */
async function stepTo(page: Page, month: string): Promise<void> {
  const label = new Intl.DateTimeFormat('en-US', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(`${month}-01T00:00:00Z`),
  );
  const now = new Date();
  const latest = now.getUTCFullYear() * 12 + now.getUTCMonth() - 1;
  const steps = latest - (Number(month.slice(0, 4)) * 12 + Number(month.slice(5)) - 1);
  const stepper = page.locator('rm-month-stepper .label');
  await stepper.waitFor();
  for (let i = 0; i < steps; i++) {
    const before = (await stepper.innerText()).trim();
    await page.getByRole('button', { name: 'Previous month' }).click();
    await page.waitForFunction(
      (b) => document.querySelector('rm-month-stepper .label')?.textContent?.trim() !== b,
      before,
    );
  }
  expect((await stepper.innerText()).trim()).toBe(label);
}

/** A screenshot to look at; at phone width the page must not scroll sideways. */
async function look(page: Page, name: string, width: 'desktop' | 'phone'): Promise<void> {
  await screenshot(page, `${name}-${width}`);
  if (width === 'phone') await expectNoSidewaysScroll(page);
}

describe("each role's month in the browser", () => {
  it(
    'a manager closes November: reviews a site, builds a board packet and reads its PDF',
    async () => {
      await atEachWidth('month-manager', async (page, width) => {
        await signIn(page, { baseUrl: server.url, email: manager.email });
        await page.goto(`${server.url}/month-close`);
        await page.getByRole('heading', { name: 'Month close', level: 1 }).waitFor();
        await stepTo(page, MONTH);
        const table = page.getByRole('table', { name: 'Sites in the month close' });
        const north = table.locator('tr', { hasText: 'Willowmere HOA — North Commons' });
        await north.waitFor();
        await page.locator('rm-month-close-page mat-progress-bar').waitFor({ state: 'detached' });
        await expect(table.innerText()).resolves.not.toMatch(/hoa-common-area|weatherStation:|hydrozones:/);
        await look(page, 'month-manager-close', width);

        const note = `Valve 4 rebuilt on the 18th (${width}).`;
        await north.getByRole('button', { name: /reviewed|Edit review/ }).click();
        await page.getByLabel('Note (what was done, what to watch)').fill(note);
        await page.getByRole('button', { name: 'Mark reviewed' }).click();
        await north.getByText(note).waitFor();
        await expect(north.innerText()).resolves.toContain('Reviewed by Morgan Okafor');

        // Unique per run: the test database keeps earlier runs' packets.
        const title = `Willowmere HOA board packet (${width}, ${Date.now().toString(36)})`;
        await page.getByRole('button', { name: 'New board packet' }).click();
        await page.getByLabel('Title on the cover').fill(title);
        await page.getByRole('button', { name: 'north-valley' }).click();
        await page.getByRole('button', { name: /Build packet \(\d+ sites?\)/ }).click();
        const packet = page.getByRole('listitem').filter({ hasText: title });
        const download = packet.getByRole('link', { name: /Download PDF/ });
        await download.waitFor({ timeout: 45_000 });
        await download.scrollIntoViewIfNeeded();
        await look(page, 'month-manager-packet', width);
        const { text, pages } = await pdfBehind(page, (await download.getAttribute('href'))!);
        expect(text).toContain(title);
        expect(text).toContain('November 2026');
        expect(text).toContain('Willowmere HOA — North Commons');
        expect(text).toContain('Daily use against the daily budget');
        expect(text).toContain('Alerts this month');
        expect(text).toContain(note);
        expect(text).not.toMatch(/hoa-common-area|weatherStation:|from memory/);
        expect(pages).toBeGreaterThanOrEqual(2);

        // The watch settings speak plainly and name the site.
        const siteHref = (await north
          .getByRole('link', { name: 'Willowmere HOA — North Commons' })
          .getAttribute('href'))!;
        const siteId = /\/sites\/(\d+)/.exec(siteHref)![1];
        await page.goto(`${server.url}/alerts/sites/${siteId}/settings`);
        await page.getByRole('heading', { name: 'Watch settings · Willowmere HOA — North Commons' }).waitFor();
        await page.getByRole('heading', { name: 'Leak suspected', level: 2 }).waitFor();
        const settings = await page.locator('rm-watch-settings').innerText();
        expect(settings).not.toMatch(/nightFlowMadK|common practice|no source|scaled mad/i);
        expect(settings).toContain('gal per hour');
        await look(page, 'month-manager-watch-settings', width);
      });
    },
    WALK_TIMEOUT_MS,
  );

  it(
    'a contractor opens the savings book and prints the client handout',
    async () => {
      await atEachWidth('month-contractor', async (page, width) => {
        await signIn(page, { baseUrl: server.url, email: contractor.email });
        await page.goto(`${server.url}/reports/savings`);
        await page.getByRole('heading', { name: 'Savings book', level: 1 }).waitFor();
        const row = page.getByRole('row').filter({ hasText: 'Greenbelt path: spray to drip' });
        await row.waitFor();
        await page.locator('rm-savings-book mat-progress-bar').waitFor({ state: 'detached' });
        await expect(row.innerText()).resolves.toMatch(/Installed \(baseline locked\)/);
        await expect(row.innerText()).resolves.toMatch(/Savings proven|Not proven yet|No savings/);
        await expect(row.innerText()).resolves.toMatch(/\d gal/);
        await look(page, 'month-contractor-book', width);

        const handout = row.getByRole('link', { name: /Handout/ });
        const { text, pages } = await pdfBehind(page, (await handout.getAttribute('href'))!);
        expect(pages).toBe(1);
        expect(text).toContain('Greenbelt path: spray to drip');
        expect(text).toContain('212 spray heads capped');
        expect(text).toContain('Simple payback');
        expect(text).toContain('ASHRAE Guideline 14-2002 §5.2.11');
        expect(text).toContain('Rillmark savings criteria, version 1');
        expect(text).toContain('Rain is not part of this model.');
        expect(text).not.toMatch(/from memory|quoted|and rain into/i);

        // The project's own page: what the contractor may still do once the baseline is locked.
        await row.getByRole('link', { name: 'Greenbelt path: spray to drip' }).click();
        await page.getByRole('heading', { name: 'Greenbelt path: spray to drip', level: 1 }).waitFor();
        await page.getByRole('heading', { name: 'History' }).waitFor();
        await expect(page.locator('rm-savings-report').innerText()).resolves.not.toMatch(/from memory/i);
        await page.getByRole('link', { name: 'Willowmere HOA — South Greenbelt' }).click();
        const project = page.locator('article', { hasText: 'Greenbelt path: spray to drip' });
        await project.getByText(/Baseline and model locked since/).waitFor();
        expect(await project.getByRole('button', { name: 'Delete' }).count()).toBe(0);
        expect(await project.getByRole('button', { name: 'Archive' }).count()).toBe(0);
        await look(page, 'month-contractor-project', width);
      });
    },
    WALK_TIMEOUT_MS,
  );

  it(
    'an auditor works the budget worklist, sends a notice and reads the notice history',
    async () => {
      await atEachWidth('month-auditor', async (page, width) => {
        await signIn(page, { baseUrl: server.url, email: auditor.email });
        await page.goto(`${server.url}/reports`);
        await page.getByRole('heading', { name: 'Budget worklist' }).waitFor();
        await page.getByLabel('Year').fill('2026');
        await page.getByLabel('Period').click();
        await page.getByRole('option', { name: `${MONTH} (against the month's budget)` }).click();
        await page.getByRole('listbox').waitFor({ state: 'detached' });
        const table = page.getByRole('table', { name: 'Sites needing a look first' });
        await table.locator('tbody tr').first().waitFor();
        await page.locator('rm-compliance-page mat-progress-bar').waitFor({ state: 'detached' });
        const shown = await table.innerText();
        expect(shown).not.toMatch(/hoa-common-area|office-park|weatherStation:|hydrozones:|no-data|over-budget/);
        expect(shown).toMatch(/Over budget|Within budget|Incomplete data|Open alerts|No data|No budget/);
        await look(page, 'month-auditor-worklist', width);

        // A site over budget gets a notice (at desktop width; the phone walk finds it sent).
        if (width === 'desktop') {
          const row = table
            .locator('tbody tr')
            .filter({ has: page.getByRole('button', { name: 'Send' }) })
            .first();
          const siteName = (await row.locator('td.mat-column-name a').innerText()).trim();
          await row.getByRole('button', { name: 'Send' }).click();
          await page.getByLabel('Note to add (optional)').fill('Please check the controller after the heat wave.');
          await page.getByRole('button', { name: 'Send notice' }).click();
          await page.getByText(/Notice sent to \d+ managers? of/).waitFor();
          await page.getByRole('button', { name: `Notices about ${siteName}` }).click();
        } else {
          const sentRow = table.locator('tbody tr', { hasText: /sent \d{4}-\d{2}-\d{2}/ }).first();
          await sentRow.getByRole('button', { name: /Notices about/ }).click();
        }
        const dialog = page.getByRole('dialog');
        await dialog.getByText('November 2026').waitFor();
        await expect(dialog.innerText()).resolves.toContain('Alex Moreau-Tanaka');
        await expect(dialog.innerText()).resolves.toContain('Please check the controller after the heat wave.');
        await look(page, 'month-auditor-notices', width);
        await dialog.getByRole('button', { name: 'Close' }).click();

        // Exports carry labels, never codes or the API's field names.
        const csvHref = (await page.getByRole('link', { name: /CSV/ }).getAttribute('href'))!;
        const csv = await (await page.request.get(new URL(csvHref, page.url()).href)).text();
        expect(csv).toContain('Needs a look');
        expect(csv).not.toMatch(/hoa-common-area|office-park|weatherStation:|hydrozones:/);

        // Through the share, the site's details say who shared it.
        await page.goto(`${server.url}/sites`);
        await page.getByRole('table', { name: 'Sites' }).locator('tbody tr').first().click();
        await page.getByRole('heading', { name: 'Shared with you' }).waitFor();
        await expect(page.locator('.shared-with-you').innerText()).resolves.toMatch(
          /^(Cobalt Ridge Property Services|Harrowgate Estates Management) shared this site with your organisation/,
        );
        await look(page, 'month-auditor-site-details', width);
      });
    },
    WALK_TIMEOUT_MS,
  );
});
