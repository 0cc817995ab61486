/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startServer, type RunningServer } from '../../backend/src/server';
import { DEMO_ORGANISATIONS, DEMO_SITES, DEMO_USERS, type DemoUser } from '../../ops/seed/demo-scenario';
import { seedDemo } from '../../ops/seed/seed-demo';
import { DESKTOP, openBrowser, PHONE, screenshot, signIn } from '../support/browser';
import { e2eDatabase } from '../support/e2e-database';

/**
 * Each demo role signs in through the real production build in Debian's Chromium and sees its own
 * sites and actions. Screenshots go to test-artifacts/e2e/ (git-ignored) to be looked at.
 */
let server: RunningServer;

beforeAll(async () => {
  const { config, db } = await e2eDatabase();
  await seedDemo(db);
  await db.destroy();
  server = await startServer(config);
});
afterAll(async () => server?.stop());

/**
 * What the list must show: every demo site the user's organisation owns or has been shared, and none of the
 * demo sites it may not see. (Other browser tests add sites of their own to the demo organisation, so the
 * list may hold more than the scenario's.)
 */
async function expectRightSites(page: Page, user: DemoUser): Promise<void> {
  const onScreen = await siteNamesOnScreen(page);
  expect(onScreen).toEqual(expect.arrayContaining(expectedSites(user)));
  const hidden = DEMO_SITES.map((s) => s.name).filter((name) => !expectedSites(user).includes(name));
  expect(onScreen.filter((name) => hidden.includes(name))).toEqual([]);
}

/** The demo sites a user's organisation owns or has been shared, from the scenario itself. */
function expectedSites(user: DemoUser): string[] {
  return DEMO_SITES.filter(
    (s) => s.organisation === user.organisation || s.shares.some((sh) => sh.organisation === user.organisation),
  )
    .map((s) => s.name)
    .sort();
}

/** Signs in (home is the portfolio) and opens the sites list, which this test is about. */
async function signInToSites(page: Page, user: DemoUser): Promise<void> {
  await signIn(page, { baseUrl: server.url, email: user.email });
  await page.goto(`${server.url}/sites`);
  await page.getByRole('heading', { name: 'Sites', level: 1 }).waitFor();
  await page.getByRole('table', { name: 'Sites' }).locator('tbody tr').first().waitFor();
}

async function siteNamesOnScreen(page: Page): Promise<string[]> {
  const cells = page.getByRole('table', { name: 'Sites' }).locator('tbody tr td.mat-column-name');
  return (await cells.allInnerTexts()).map((t) => t.trim()).sort();
}

const roles = DEMO_USERS.filter((u) => DEMO_ORGANISATIONS.find((o) => o.key === u.organisation)!.key !== 'harrowgate');

describe('each demo role in the browser', () => {
  it.each(roles.map((u) => [u.role, u] as const))(
    '%s signs in, sees exactly its sites and only its actions',
    async (role, user) => {
      const browser = await openBrowser(DESKTOP);
      const requests: string[] = [];
      const cspViolations: string[] = [];
      browser.page.on('request', (r) => requests.push(r.url()));
      browser.page.on('console', (m) => m.text().includes('Content Security Policy') && cspViolations.push(m.text()));
      try {
        const { page } = browser;
        await signInToSites(page, user);
        await expectRightSites(page, user);

        const canCreate = role === 'admin' || role === 'manager';
        expect(await page.getByRole('link', { name: 'New site' }).count()).toBe(canCreate ? 1 : 0);
        const nav = page.getByRole('navigation', { name: 'Main' });
        expect(await nav.getByRole('link', { name: 'Users' }).count()).toBe(role === 'admin' ? 1 : 0);
        expect(await nav.getByRole('link', { name: 'Uploads' }).count()).toBe(role === 'auditor' ? 0 : 1);
        await screenshot(page, `${role}-sites-desktop`);

        // Open the first site: editable for admin and manager, read-only for the others.
        const firstRow = page.getByRole('table', { name: 'Sites' }).locator('tbody tr').first();
        const firstName = (await firstRow.locator('td.mat-column-name').innerText()).trim();
        await firstRow.click();
        await page.waitForURL(/\/sites\/\d+$/);
        await page.getByRole('heading', { name: firstName, level: 1 }).waitFor();
        if (canCreate) await page.getByRole('button', { name: 'Save changes' }).waitFor();
        else await page.getByText('Your access:').waitFor();
        expect(await page.getByRole('button', { name: 'Save changes' }).count()).toBe(canCreate ? 1 : 0);
        expect(await page.getByRole('button', { name: /delete/i }).count()).toBe(role === 'admin' ? 1 : 0);
        await screenshot(page, `${role}-site-desktop`);

        // The shipped fonts are in use (a CSP-blocked stylesheet once left the icons as raw words).
        const fonts = await page.evaluate(async () => {
          await document.fonts.ready;
          return [...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.family.replace(/"/g, ''));
        });
        expect(fonts).toEqual(expect.arrayContaining(['Open Sans', 'Material Symbols Outlined']));
        expect(cspViolations).toEqual([]);
        // Nothing may leave for a font host or CDN: every request stays on the app's own origin.
        expect(requests.filter((u) => !u.startsWith(server.url) && !u.startsWith('data:'))).toEqual([]);
      } finally {
        await browser.close();
      }
    },
  );

  it.each(roles.map((u) => [u.role, u] as const))(
    '%s at phone width sees the list with a menu button',
    async (role, user) => {
      const browser = await openBrowser(PHONE);
      try {
        await signInToSites(browser.page, user);
        await expectRightSites(browser.page, user);
        await expect(browser.page.getByRole('button', { name: 'Navigation menu' }).isVisible()).resolves.toBe(true);
        await screenshot(browser.page, `${role}-sites-phone`);
      } finally {
        await browser.close();
      }
    },
  );

  it('an auditor who types an admin page address is turned away', async () => {
    const browser = await openBrowser(DESKTOP);
    try {
      await signInToSites(
        browser.page,
        DEMO_USERS.find((u) => u.role === 'auditor')!,
      );
      await browser.page.goto(`${server.url}/admin/users`);
      await browser.page.waitForLoadState('networkidle');
      expect(browser.page.url()).not.toContain('/admin/users');
    } finally {
      await browser.close();
    }
  });
});
