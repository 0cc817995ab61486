/// <reference lib="dom" />
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startServer, type RunningServer } from '../../backend/src/server';
import { DEMO_ORGANISATIONS, DEMO_USERS, type DemoUser } from '../../ops/seed/demo-scenario';
import { seedAlerts } from '../../ops/seed/seed-alerts';
import { seedBudgets } from '../../ops/seed/seed-budgets';
import { seedDemo } from '../../ops/seed/seed-demo';
import { seedMeters } from '../../ops/seed/seed-meters';
import { ARTIFACTS, DESKTOP, openBrowser, PHONE, screenshot, signIn } from '../support/browser';
import { e2eDatabase } from '../support/e2e-database';

/**
 * Each demo role signs in to the production build, lands on the portfolio, opens a site's overview and
 * reads November 2026 (the demo readings run September to November) from its monthly table; the figure
 * must equal what the API says. A manager then walks through every tab of a site's workspace.
 * Screenshots at desktop and phone width go to test-artifacts/e2e/.
 */
const MONTH = '2026-11';
let server: RunningServer;

beforeAll(async () => {
  const { config, db } = await e2eDatabase();
  await seedDemo(db);
  await seedBudgets(db);
  // Imports keep site_daily_use in step, so the seeded readings are on the dashboard without a rebuild.
  await seedMeters(db, config);
  // The nightly watch over the seeded data, so sites carry the alerts their workspace lists.
  await seedAlerts(db, config);
  await db.destroy();
  server = await startServer(config);
}, 300_000);
afterAll(async () => server?.stop());

async function signInAs(page: Page, user: DemoUser): Promise<void> {
  await signIn(page, { baseUrl: server.url, email: user.email, path: '/portfolio?' });
}

async function openPortfolioMonth(page: Page): Promise<void> {
  // The page opens on the last complete month; step from there to November 2026 whatever today is.
  const today = new Date();
  const steps = (today.getUTCFullYear() - 2026) * 12 + today.getUTCMonth() + 1 - 1 - 11;
  for (let i = 0; i < Math.abs(steps); i++) {
    const before = (await page.locator('rm-period-picker .label').innerText()).trim();
    await page.getByRole('button', { name: steps > 0 ? 'Previous month' : 'Next month' }).click();
    await page.waitForFunction(
      (b) => document.querySelector('rm-period-picker .label')?.textContent?.trim() !== b,
      before,
    );
  }
  expect((await page.locator('rm-period-picker .label').innerText()).trim()).toBe('Nov 2026');
  await page
    .getByRole('table', { name: 'Sites in the portfolio' })
    .locator('tbody tr td.mat-column-siteName a')
    .first()
    .waitFor();
  await page.locator('rm-sites-table mat-progress-bar').waitFor({ state: 'detached' });
}

/** The worst site of the month is on top (sorted by percent of budget, descending); opens its workspace. */
async function openWorstSite(page: Page): Promise<{ siteName: string; siteId: number }> {
  const link = page
    .getByRole('table', { name: 'Sites in the portfolio' })
    .locator('tbody tr td.mat-column-siteName a')
    .first();
  const siteName = (await link.innerText()).trim();
  await link.click();
  await page.waitForURL(/\/sites\/\d+\/overview/);
  const siteId = Number(/\/sites\/(\d+)\/overview/.exec(page.url())![1]);
  await page.getByRole('heading', { name: siteName, level: 1 }).waitFor();
  return { siteName, siteId };
}

/** Runs `walk` at desktop and then phone width, each in a fresh browser; an error on the page fails it. */
async function atEachWidth(
  failureShot: string,
  walk: (page: Page, width: 'desktop' | 'phone') => Promise<void>,
): Promise<void> {
  for (const viewport of [DESKTOP, PHONE]) {
    const width = viewport === DESKTOP ? 'desktop' : 'phone';
    const browser = await openBrowser(viewport);
    const errors: string[] = [];
    browser.page.on('pageerror', (e) => errors.push(e.message));
    try {
      await walk(browser.page, width);
      expect(errors).toEqual([]);
    } catch (err) {
      await screenshot(browser.page, `${failureShot}-${width}`);
      throw err;
    } finally {
      await browser.close();
    }
  }
}

const roles = DEMO_USERS.filter((u) => DEMO_ORGANISATIONS.find((o) => o.key === u.organisation)!.key !== 'harrowgate');

describe('dashboard in the browser', () => {
  it.each(roles.map((u) => [`${u.role} (${u.organisation})`, u] as const))(
    '%s opens the portfolio and a site overview whose monthly figure matches the API',
    async (name, user) => {
      const tag = name.replace(/[^a-z]+/gi, '-').replace(/-$/, '');
      await atEachWidth(`dashboard-${tag}-failure`, async (page, width) => {
        await signInAs(page, user);
        await openPortfolioMonth(page);
        await expect(page.getByRole('list', { name: 'Headline figures' }).innerText()).resolves.toMatch(/gal/);
        await screenshot(page, `dashboard-${tag}-portfolio-${width}`);

        const { siteId } = await openWorstSite(page);
        await page.locator('rm-daily-chart canvas, rm-daily-chart + p, .panel .rm-state').first().waitFor();
        await page.waitForTimeout(300);
        await screenshot(page, `dashboard-${tag}-overview-${width}`);
        // The page scrolls inside the shell, so the flow grid gets its own picture.
        const grid = page.locator('section.panel', { has: page.getByRole('heading', { name: 'Hour-by-day flow' }) });
        await grid.scrollIntoViewIfNeeded();
        await page.waitForTimeout(200);
        await grid.screenshot({ path: resolve(ARTIFACTS, `dashboard-${tag}-grid-${width}.png`) });

        // The monthly table is the site's next tab; it ends at the chosen month.
        await page.getByRole('tab', { name: 'Monthly table', exact: true }).click();
        await page.waitForURL(new RegExp(`/sites/${siteId}/monthly$`));
        await page.getByLabel('Last month shown').fill(MONTH);
        const row = page.locator(`table[aria-label="Monthly use against budget"] tr[data-month="${MONTH}"]`);
        await row.waitFor();
        const shown = (await row.locator('td.mat-column-use').innerText()).trim();
        const api = await page.evaluate(
          async ([id, month]) => {
            const res = await fetch(`/api/sites/${id}/monthly?from=${month}&to=${month}`);
            return (await res.json()) as { months: { month: string; useGallons: number }[] };
          },
          [siteId, MONTH] as const,
        );
        expect(shown).toBe(Math.round(api.months[0]!.useGallons).toLocaleString('en-US'));
        expect(api.months[0]!.useGallons).toBeGreaterThan(0);
        await page.locator('rm-site-monthly mat-progress-bar').waitFor({ state: 'detached' });
        await screenshot(page, `dashboard-${tag}-monthly-${width}`);
        // The export link points at the CSV of the same table.
        const href = await page.getByRole('link', { name: 'Export CSV' }).getAttribute('href');
        expect(href).toMatch(new RegExp(`/api/sites/${siteId}/monthly\\?from=\\d{4}-\\d{2}&to=${MONTH}&format=csv`));

        // Why: the site's open alerts, then one alert's evidence (from the inbox when this site has none open).
        const alertsTab = page.getByRole('tab', { name: 'Alerts', exact: true });
        await alertsTab.focus(); // at phone width the tab bar scrolls a focused tab into view; Enter then opens it
        await page.keyboard.press('Enter');
        await page.waitForURL(new RegExp(`/sites/${siteId}/alerts$`));
        await page.locator('table[aria-label="Alerts at this site"]').waitFor();
        await page.locator('rm-site-alerts mat-progress-bar').waitFor({ state: 'detached' });
        let alertLink = page.locator('table[aria-label="Alerts at this site"] tbody a[href^="/alerts/"]').first();
        if (!(await alertLink.count())) {
          await page.goto(new URL('/alerts', page.url()).href);
          alertLink = page.locator('tbody a[href^="/alerts/"]').first();
          await alertLink.waitFor();
        }
        await alertLink.click();
        await page.getByRole('heading', { name: 'Evidence' }).waitFor();
        await page.waitForTimeout(600);
        await screenshot(page, `dashboard-${tag}-alert-${width}`);
      });
    },
    150_000,
  );

  it('a manager opens a site from the portfolio and goes through every tab of its workspace', async () => {
    const manager = DEMO_USERS.find((u) => u.role === 'manager')!;
    await atEachWidth('site-workspace-failure', async (page, width) => {
      await signInAs(page, manager);
      await openPortfolioMonth(page);
      // The month's worst site has readings, equipment and uploads from the demo seed.
      const { siteName, siteId } = await openWorstSite(page);

      // The header's month-to-date figures carry their units and agree with the API for the same days.
      const figures = page.getByRole('list', { name: /^This month so far/ });
      await figures.waitFor();
      const header = await figures.innerText();
      expect(header).toMatch(/Use, 1(–\d+)? \w{3} \d{4}\s+[\d,]+ gal/);
      expect(header).toMatch(/Of budget\s+(\d[\d,]* %|—)/);
      const openAlerts = Number(/Open alerts\s+(\d+)/.exec(header)![1]);
      const apiOpen = await page.evaluate(
        async (id) =>
          ((await (await fetch(`/api/alerts?status=open&siteId=${id}&pageSize=1`)).json()) as { total: number }).total,
        siteId,
      );
      expect(openAlerts).toBe(apiOpen);
      expect(await page.getByText('America/Los_Angeles').first().isVisible()).toBe(true);

      // The tab bar is a tablist (with a tab panel), so its links are tabs.
      const tabs = page.locator('rm-site-workspace nav[mat-tab-nav-bar]');
      const visit = async (label: string, path: string, heading: string, ready: string) => {
        const tab = tabs.getByRole('tab', { name: label, exact: true });
        if (width === 'desktop') await tab.click();
        else {
          // At phone width the tab bar scrolls sideways, and a tab half under the arrow slides into view as it takes
          // focus
          // (Material), which moves it away from an emulated mouse before the button comes up. Keyboard users go this
          // way too.
          await tab.focus();
          await tab.press('Enter');
        }
        await page.waitForURL(new RegExp(`/sites/${siteId}${path}$`));
        await page.getByRole('heading', { name: heading, level: 2, exact: true }).waitFor();
        await page.locator(ready).first().waitFor();
        await page.locator('mat-tab-nav-panel mat-progress-bar').waitFor({ state: 'detached' });
        expect(await tab.getAttribute('aria-selected')).toBe('true');
        await page.waitForTimeout(200);
        await screenshot(page, `site-${label.toLowerCase().replace(/[^a-z]+/g, '-')}-${width}`);
      };

      await visit('Meters & zones', '/equipment', 'Meters & zones', 'table[aria-label^="Zones of"] tbody tr');
      const meters = page.getByRole('table', { name: 'Meters' });
      expect(await meters.locator('tbody tr').count()).toBeGreaterThan(0);
      expect(await meters.locator('tbody tr').first().innerText()).toMatch(/gal|CCF|kgal|ft³|m³|L|acre/);
      expect(await page.getByRole('note').filter({ hasText: 'mains power' }).innerText()).toMatch(
        /licensed professionals/,
      );
      // A manager may change equipment.
      await page.getByRole('button', { name: 'Add meter' }).waitFor();

      await visit('Alerts', '/alerts', 'Alerts', 'table[aria-label="Alerts at this site"]');
      const alertsTable = page.getByRole('table', { name: 'Alerts at this site' });
      const alertRows = alertsTable.locator('tbody tr', { has: page.locator('a[href^="/alerts/"]') });
      expect(await alertRows.count()).toBe(Math.min(apiOpen, 25));
      // Every status: as many rows as the API has alerts for the site, each linking to the alert's own page.
      const apiAll = await page.evaluate(
        async (id) => ((await (await fetch(`/api/alerts?siteId=${id}&pageSize=25`)).json()) as { total: number }).total,
        siteId,
      );
      await page.getByRole('radio', { name: 'All' }).click();
      await page.waitForFunction(
        ([n]) =>
          document.querySelectorAll('table[aria-label="Alerts at this site"] tbody tr a[href^="/alerts/"]').length ===
          n,
        [Math.min(apiAll, 25)] as const,
      );
      await screenshot(page, `site-alerts-all-${width}`);
      if (apiAll > 0) {
        await alertRows.first().getByRole('link').click();
        await page.waitForURL(/\/alerts\/\d+$/);
        await page.getByRole('heading', { level: 1 }).waitFor();
        await page.goBack();
        await page.waitForURL(new RegExp(`/sites/${siteId}/alerts$`));
      }

      await visit('Uploads', '/uploads', 'Uploads', 'table[aria-label="Upload history"] tbody tr');
      const uploadLink = page.getByRole('link', { name: 'Upload a file for this site' });
      expect(await uploadLink.getAttribute('href')).toBe(`/uploads?site=${siteId}`);

      await visit('Hydrozones', '/hydrozones', 'Hydrozones', 'table[aria-label="Hydrozones"]');
      await visit('Water budget', '/budget', 'Water budget', 'table[aria-label="Monthly budget"]');
      await visit('Rates', '/rates', 'Water rates', 'table[aria-label="Rate schedules"]');
      await visit('Details', '', 'Details', 'form.site-form, rm-site-summary');
      await visit('Overview', '/overview', 'Overview', 'rm-daily-chart canvas, .panel .rm-state');

      // The upload link opens the upload page on this site.
      await tabs.getByRole('tab', { name: 'Uploads', exact: true }).focus();
      await tabs.getByRole('tab', { name: 'Uploads', exact: true }).press('Enter');
      await uploadLink.click();
      await page.getByRole('heading', { name: 'Data uploads' }).waitFor();
      await page.getByRole('combobox', { name: 'Site' }).filter({ hasText: siteName }).waitFor();
    });
  }, 180_000);
});
