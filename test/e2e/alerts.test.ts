/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { OrganisationEntity } from '../../backend/src/components/organisations/data/organisation.entity';
import { startServer, type RunningServer } from '../../backend/src/server';
import { DEMO_USERS } from '../../ops/seed/demo-scenario';
import { seedDemo } from '../../ops/seed/seed-demo';
import { leakingSite } from '../api/watch-fixtures';
import { DESKTOP, openBrowser, screenshot, signIn } from '../support/browser';
import { createSite, shareSite, suffix } from '../support/test-app';
import { e2eDatabase } from '../support/e2e-database';

/**
 * An administrator runs the watch, finds the leak in the inbox, reads its evidence and acknowledges it; an auditor only
 * reads.
 */
let server: RunningServer;
let db: DataSource;
let siteName: string;

beforeAll(async () => {
  const opened = await e2eDatabase();
  const { config } = opened;
  db = opened.db;
  await seedDemo(db);
  const org = await db.getRepository(OrganisationEntity).findOneByOrFail({ name: 'Cobalt Ridge Property Services' });
  const utility = await db
    .getRepository(OrganisationEntity)
    .findOneByOrFail({ name: 'Verdella Valley Water Agency — Conservation Office' });
  siteName = `Larkspur Terrace Greens ${suffix()}`;
  const site = await createSite(db, org.id, { name: siteName });
  await shareSite(db, site.id, utility.id, 'read');
  await leakingSite(db, site.id, 40);
  server = await startServer(config);
});
afterAll(async () => {
  await server?.stop();
  await db?.destroy();
});

async function signInAs(page: import('playwright-core').Page, role: 'admin' | 'auditor'): Promise<void> {
  const user = DEMO_USERS.find((u) => u.role === role && (role === 'auditor' || u.organisation === 'cobalt'))!;
  await signIn(page, { baseUrl: server.url, email: user.email });
}

describe('alerts pages', () => {
  it(
    'when an administrator runs the watch, then the leak shows in ' + 'the inbox and its detail can be acknowledged',
    async () => {
      const browser = await openBrowser(DESKTOP);
      try {
        const { page } = browser;
        await signInAs(page, 'admin');
        await page.getByRole('link', { name: 'Alerts' }).click();
        await page.getByRole('heading', { name: 'Alerts', level: 1 }).waitFor();
        await page.getByRole('link', { name: 'Watch runs' }).click();
        const started = page.waitForResponse(
          (r) => r.url().endsWith('/api/watch/runs') && r.request().method() === 'POST',
        );
        await page.getByRole('button', { name: 'Run now' }).click();
        const runId = ((await (await started).json()) as { id: number }).id;
        // The run goes on in the background; the page follows it, and so does the test, until it is done.
        await expect
          .poll(
            async () =>
              ((await (await page.request.get(`${server.url}/api/watch/runs/${runId}`)).json()) as { status: string })
                .status,
            {
              timeout: 60_000,
            },
          )
          .toBe('done');
        await page.getByRole('row').filter({ hasText: 'running' }).first().waitFor({ state: 'detached' });
        await screenshot(page, 'alerts-runs');
        await page.goto(`${server.url}/alerts`);
        const row = page.getByRole('row').filter({ hasText: siteName }).filter({ hasText: 'Water never stops' });
        await row.waitFor();
        expect(await row.textContent()).toMatch(/gal/);
        await screenshot(page, 'alerts-inbox');
        await row.getByRole('link').click();
        await page.getByRole('heading', { name: 'Leak suspected — Water never stops' }).waitFor();
        await page.getByRole('img').first().waitFor();
        await page.waitForTimeout(1200);
        await screenshot(page, 'alerts-detail');
        await page.getByLabel('Note (what was found or done)').fill('Crew checking the lateral line on Thursday.');
        await page.getByRole('button', { name: 'Acknowledge' }).click();
        await page.getByText('“Crew checking the lateral line on Thursday.”').waitFor();
        expect(await page.getByText('status: acknowledged').count()).toBe(1);
      } finally {
        await browser.close();
      }
    },
  );

  it('when an auditor opens the alert, then they see the evidence but no way to act', async () => {
    const browser = await openBrowser(DESKTOP);
    try {
      const { page } = browser;
      await signInAs(page, 'auditor');
      await page.goto(`${server.url}/alerts?`);
      await page.getByRole('heading', { name: 'Alerts', level: 1 }).waitFor();
      // The inbox opens on open alerts; the admin acknowledged this one, so look at every status.
      await page.getByLabel('Status').click();
      await page.getByRole('option', { name: 'Any status' }).click();
      const row = page.getByRole('row').filter({ hasText: siteName }).filter({ hasText: 'Water never stops' });
      await row.getByRole('link').click();
      await page.getByRole('heading', { name: 'Evidence' }).waitFor();
      expect(await page.getByRole('button', { name: 'Acknowledge' }).count()).toBe(0);
      expect(await page.getByRole('button', { name: 'Mark resolved' }).count()).toBe(0);
      await screenshot(page, 'alerts-detail-auditor');
    } finally {
      await browser.close();
    }
  });
});
