/// <reference lib="dom" />
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startServer, type RunningServer } from '../../backend/src/server';
import { DEMO_ORGANISATIONS, DEMO_PASSWORD, DEMO_USERS, type DemoUser } from '../../ops/seed/demo-scenario';
import { seedBudgets } from '../../ops/seed/seed-budgets';
import { seedDemo } from '../../ops/seed/seed-demo';
import { seedMeters } from '../../ops/seed/seed-meters';
import { ARTIFACTS, DESKTOP, openBrowser, PHONE, screenshot } from '../support/browser';
import { e2eDatabase } from '../support/e2e-database';

/**
 * Each demo role signs in to the production build, lands on the portfolio, opens a site's overview and
 * reads November 2026 (the demo readings run September to November) from its monthly table; the figure
 * must equal what the API says. Screenshots at desktop and phone width go to test-artifacts/e2e/.
 */
const MONTH = '2026-11';
let server: RunningServer;

beforeAll(async () => {
  const { config, db } = await e2eDatabase();
  await seedDemo(db);
  await seedBudgets(db);
  // Imports keep site_daily_use in step, so the seeded readings are on the dashboard without a rebuild.
  await seedMeters(db, config);
  await db.destroy();
  server = await startServer(config);
}, 300_000);
afterAll(async () => server?.stop());

async function signIn(page: Page, user: DemoUser): Promise<void> {
  await page.goto(`${server.url}/portfolio?`);
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('E-mail address').fill(user.email);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Portfolio', level: 1 }).waitFor();
}

async function openPortfolioMonth(page: Page): Promise<void> {
  // The page opens on the last complete month; step from there to November 2026 whatever today is.
  const today = new Date();
  const steps = (today.getUTCFullYear() - 2026) * 12 + today.getUTCMonth() + 1 - 1 - 11;
  for (let i = 0; i < Math.abs(steps); i++) {
    const before = (await page.locator('rm-period-picker .label').innerText()).trim();
    await page.getByRole('button', { name: steps > 0 ? 'Previous month' : 'Next month' }).click();
    await page.waitForFunction((b) => document.querySelector('rm-period-picker .label')?.textContent?.trim() !== b, before);
  }
  expect((await page.locator('rm-period-picker .label').innerText()).trim()).toBe('Nov 2026');
  await page.getByRole('table', { name: 'Sites in the portfolio' }).locator('tbody tr td.mat-column-siteName a').first().waitFor();
  await page.locator('rm-sites-table mat-progress-bar').waitFor({ state: 'detached' });
}

const roles = DEMO_USERS.filter((u) => DEMO_ORGANISATIONS.find((o) => o.key === u.organisation)!.key !== 'harrowgate');

describe('dashboard in the browser', () => {
  it.each(roles.map((u) => [`${u.role} (${u.organisation})`, u] as const))('%s opens the portfolio and a site overview whose monthly figure matches the API', async (name, user) => {
    const tag = name.replace(/[^a-z]+/gi, '-').replace(/-$/, '');
    for (const viewport of [DESKTOP, PHONE]) {
      const width = viewport === DESKTOP ? 'desktop' : 'phone';
      const browser = await openBrowser(viewport);
      const errors: string[] = [];
      browser.page.on('pageerror', (e) => errors.push(e.message));
      try {
        const { page } = browser;
        await signIn(page, user);
        await openPortfolioMonth(page);
        await expect(page.getByRole('list', { name: 'Headline figures' }).innerText()).resolves.toMatch(/gal/);
        await screenshot(page, `dashboard-${tag}-portfolio-${width}`);

        // The worst site of the month is on top (sorted by percent of budget, descending); open it.
        const link = page.getByRole('table', { name: 'Sites in the portfolio' }).locator('tbody tr td.mat-column-siteName a').first();
        const siteName = (await link.innerText()).trim();
        await link.click();
        await page.waitForURL(/\/sites\/\d+\/overview/);
        const siteId = Number(/\/sites\/(\d+)\/overview/.exec(page.url())![1]);
        await page.getByRole('heading', { name: siteName, level: 1 }).waitFor();
        const row = page.locator(`table[aria-label="Monthly use against budget"] tr[data-month="${MONTH}"]`);
        await row.waitFor();
        const shown = (await row.locator('td.mat-column-use').innerText()).trim();
        const api = await page.evaluate(async ([id, month]) => {
          const res = await fetch(`/api/sites/${id}/monthly?from=${month}&to=${month}`);
          return (await res.json()) as { months: { month: string; useGallons: number }[] };
        }, [siteId, MONTH] as const);
        expect(shown).toBe(Math.round(api.months[0]!.useGallons).toLocaleString('en-US'));
        expect(api.months[0]!.useGallons).toBeGreaterThan(0);
        await page.locator('rm-daily-chart canvas, rm-daily-chart + p, .panel .rm-state').first().waitFor();
        await page.waitForTimeout(300);
        await screenshot(page, `dashboard-${tag}-overview-${width}`);
        // The page scrolls inside the shell, so the lower panels get their own pictures.
        for (const [panel, label] of [['grid', 'Hour-by-day flow'], ['monthly', 'Monthly table']] as const) {
          const section = page.locator('section.panel', { has: page.getByRole('heading', { name: label }) });
          await section.scrollIntoViewIfNeeded();
          await page.waitForTimeout(200);
          await section.screenshot({ path: resolve(ARTIFACTS, `dashboard-${tag}-${panel}-${width}.png`) });
        }
        // The export link points at the CSV of the same table.
        const href = await page.getByRole('link', { name: 'Export CSV' }).getAttribute('href');
        expect(href).toMatch(new RegExp(`/api/sites/${siteId}/monthly\\?from=\\d{4}-\\d{2}&to=${MONTH}&format=csv`));
        expect(errors).toEqual([]);
      } finally {
        await browser.close();
      }
    }
  }, 120_000);
});
