/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type RunningServer } from '../../backend/src/server';
import { seedBudgets } from '../../ops/seed/seed-budgets';
import { seedDemo } from '../../ops/seed/seed-demo';
import { DESKTOP, openBrowser, screenshot, signIn } from '../support/browser';
import { e2eDatabase } from '../support/e2e-database';

/**
 * The "done": a demo site shows monthly budgets from its hydrozones and its station's weather, and the
 * "how computed" view carries numbers a person can redo by hand (MWELO App. B form, 144/231 gal per inch per ft²).
 */
let server: RunningServer;

beforeAll(async () => {
  const { config, db } = await e2eDatabase();
  await seedDemo(db);
  await seedBudgets(db);
  await db.destroy();
  server = await startServer(config);
});
afterAll(async () => server?.stop());

const number = (text: string) => Number(text.replace(/[^0-9.-]/g, ''));

describe('demo site budget in the browser', () => {
  it(
    "when the manager opens a month's working, then each hydrozone's " + 'budget equals ETo × PF × area × 144/231 ÷ IE',
    async () => {
      const browser = await openBrowser(DESKTOP);
      const { page } = browser;
      try {
        await signIn(page, { baseUrl: server.url, email: 'morgan.manager@cobaltridge.example' });
        // Home is the portfolio; this test starts from the sites list.
        await page.goto(`${server.url}/sites`);
        await page.getByRole('link', { name: 'Willowmere HOA — North Commons' }).click();
        // The site's pages are tabs of its workspace.
        await page.getByRole('tab', { name: 'Water budget', exact: true }).click();
        const table = page.getByRole('table', { name: 'Monthly budget' });
        await table.locator('tbody tr').first().waitFor();
        expect(await table.locator('tbody tr.mat-mdc-row:not(.detail-row)').count()).toBe(12);

        await page.getByRole('button', { name: 'How computed' }).first().click();
        const working = page.getByRole('table', { name: /^How the budget of .+ was computed$/ });
        await working.first().waitFor();
        expect(await working.count()).toBe(3);
        let zonesTotal = 0;
        for (const zone of await working.all()) {
          const value = async (label: string) =>
            number(
              await zone
                .locator('tr', { has: page.getByRole('rowheader', { name: label, exact: true }) })
                .locator('td')
                .last()
                .innerText(),
            );
          const etoIn = await value('Reference ET for the month');
          const pf = await value('Plant factor (PF)');
          const ie = await value('Irrigation efficiency (IE)');
          const area = await value('Area');
          const budget = await value('Budget');
          // The screen rounds ETo to 0.001 in, so allow that much relative difference.
          expect(budget).toBeGreaterThan(0);
          expect(Math.abs(budget - (etoIn * pf * area * (144 / 231)) / ie) / budget).toBeLessThan(
            0.0005 / etoIn + 1e-6,
          );
          zonesTotal += budget;
        }
        const monthBudget = number(
          await table.locator('tbody tr.mat-mdc-row').first().locator('td.mat-column-budget').innerText(),
        );
        expect(Math.abs(monthBudget - zonesTotal)).toBeLessThanOrEqual(1);
        await screenshot(page, 'budget-how-computed');
      } finally {
        await browser.close();
      }
    },
  );
});
