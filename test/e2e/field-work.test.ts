/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startServer, type RunningServer } from '../../backend/src/server';
import { demoPhotoPng } from '../../ops/seed/demo-photo';
import { DEMO_USERS } from '../../ops/seed/demo-scenario';
import { seedBudgets } from '../../ops/seed/seed-budgets';
import { seedDemo } from '../../ops/seed/seed-demo';
import { seedFieldWork } from '../../ops/seed/seed-field-work';
import { seedSavings } from '../../ops/seed/seed-savings';
import { suffix } from '../support/test-app';
import { DESKTOP, openBrowser, PHONE, screenshot, signIn } from '../support/browser';
import { demoSiteId, e2eDatabase } from '../support/e2e-database';

/**
 * Field audits (contractor), the what-if planner (manager) and the achieved-ETAF index (auditor) in Chromium, at
 * desktop and phone width; screenshots in test-artifacts/e2e/ to be looked at.
 */
let server: RunningServer;
const siteIds: Record<string, number> = {};

beforeAll(async () => {
  const { config, db } = await e2eDatabase();
  await seedDemo(db);
  await seedBudgets(db);
  await seedSavings(db);
  await seedFieldWork(db, config);
  for (const name of ['Willowmere HOA — South Greenbelt', 'Willowmere HOA — North Commons']) {
    siteIds[name] = await demoSiteId(db, name);
  }
  await db.destroy();
  server = await startServer(config);
});
afterAll(async () => server?.stop());

const GREENBELT = () => siteIds['Willowmere HOA — South Greenbelt']!;
const COMMONS = () => siteIds['Willowmere HOA — North Commons']!;

function emailOf(organisation: string, role: string): string {
  return DEMO_USERS.find((u) => u.organisation === organisation && u.role === role)!.email;
}

/**
 * How far the page can be scrolled sideways, in the document or in the shell's scrolling content; when it can,
 * the elements sticking out are named in the failure.
 */
async function sidewaysScroll(page: Page): Promise<number> {
  const { overflow, culprits } = await page.evaluate(() => {
    const scrollers = [document.documentElement, document.querySelector('.mat-drawer-content')].filter(
      (e): e is HTMLElement => e instanceof HTMLElement,
    );
    const width = document.documentElement.clientWidth;
    // Only what can be seen: an element inside a box that clips or scrolls its overflow does not widen the page.
    const clipped = (e: Element) => {
      for (let a = e.parentElement; a && a.tagName !== 'MAIN'; a = a.parentElement)
        if (getComputedStyle(a).overflowX !== 'visible') return true;
      return false;
    };
    const culprits = [...document.querySelectorAll('main *')]
      .filter((e) => e.getBoundingClientRect().right > width + 1 && !clipped(e))
      .slice(0, 5)
      .map((e) => `${e.outerHTML.slice(0, 100)} → ${Math.round(e.getBoundingClientRect().right)}`);
    return { overflow: Math.max(...scrollers.map((e) => e.scrollWidth - e.clientWidth)), culprits };
  });
  expect(culprits, `elements wider than the screen`).toEqual(overflow > 0 ? [] : culprits);
  return overflow;
}

/**
 * A screenshot of the whole page: the shell scrolls inside its content pane, so for the picture the pane is let
 * grow with its content and the document scrolls instead.
 */
async function shot(page: Page, name: string): Promise<void> {
  const style = await page.addStyleTag({
    content: '.mat-drawer-container, .mat-drawer-content { overflow: visible !important; height: auto !important; }',
  });
  await screenshot(page, name);
  await style.evaluate((e) => (e as HTMLElement).remove());
}

/** Narrows the window to a phone's and waits for the menu to leave its column (it animates). */
async function toPhone(page: Page): Promise<void> {
  await page.setViewportSize(PHONE);
  await page.waitForFunction(() => {
    const content = document.querySelector('.mat-drawer-content');
    return content instanceof HTMLElement && getComputedStyle(content).marginLeft === '0px';
  });
}

describe('field work in the browser', () => {
  it(
    'when a contractor audits on a phone, ' +
      'then the catch-can figures, faults and a photo show, and nothing scrolls sideways',
    async () => {
      const browser = await openBrowser(PHONE);
      const { page } = browser;
      try {
        await signIn(page, { baseUrl: server.url, email: emailOf('thistlewood', 'contractor') });
        await page.goto(`${server.url}/sites/${GREENBELT()}/audits`);
        await page.getByRole('link', { name: 'Winter audit before the path retrofit' }).click();
        const seeded = page.getByRole('article', { name: 'Zone test: Greenbelt path spray' });
        await seeded.waitFor();
        expect(await seeded.innerText()).toContain('48 % (poor)');
        expect(await sidewaysScroll(page)).toBeLessThanOrEqual(0);
        await shot(page, 'field-audit-demo-phone');

        await page.getByRole('link', { name: 'All audits' }).click();
        await page.getByRole('button', { name: 'New audit' }).click();
        const title = `Phone audit ${suffix()}`;
        await page.getByLabel('Title').fill(title);
        await page.getByRole('button', { name: 'Start audit' }).click();
        await page.getByRole('heading', { name: title, level: 2 }).waitFor();
        await page.getByRole('button', { name: 'Add zone test' }).click();
        await page.getByRole('combobox', { name: 'Hydrozone' }).click();
        await page.getByRole('option', { name: 'Slope groundcover' }).click();
        await page.getByLabel('Can throat diameter').fill('3');
        await page.getByLabel('Number of cans').fill('8');
        const catches = [9, 10, 8, 11, 9, 6, 9, 10];
        for (const [i, c] of catches.entries()) await page.getByLabel(`Can ${i + 1}`, { exact: true }).fill(String(c));
        await expect.poll(() => page.getByRole('status').first().innerText()).toContain('DU_lq 78 %');
        expect(await sidewaysScroll(page)).toBeLessThanOrEqual(0);
        await shot(page, 'field-audit-catch-cans-phone');
        await page.getByRole('button', { name: 'Save test' }).click();
        await page.getByRole('article', { name: 'Zone test: Slope groundcover' }).waitFor();

        await page.getByRole('button', { name: 'Add fault' }).click();
        await page.getByLabel('Where').fill('Head 3 by the steps');
        await page.getByRole('button', { name: 'Save fault' }).click();
        await page
          .getByLabel('Add a photo of Tilted head, Head 3 by the steps')
          .setInputFiles({ name: 'head-3.png', mimeType: 'image/png', buffer: demoPhotoPng(9) });
        await page.getByRole('img', { name: 'Photo of Tilted head, Head 3 by the steps' }).waitFor();
        expect(await sidewaysScroll(page)).toBeLessThanOrEqual(0);
        await shot(page, 'field-audit-new-phone');
        await page.setViewportSize(DESKTOP);
        await shot(page, 'field-audit-new-desktop');
      } finally {
        await browser.close();
      }
    },
  );

  it(
    'when a manager plans turf to drip, ' + 'then the comparison updates, and carrying it out makes a savings project',
    async () => {
      const browser = await openBrowser(DESKTOP);
      const { page } = browser;
      try {
        await signIn(page, { baseUrl: server.url, email: emailOf('cobalt', 'manager') });
        await page.goto(`${server.url}/sites/${COMMONS()}/planner`);
        await page.getByRole('link', { name: 'Turf bowl: half to low-water meadow' }).waitFor();
        await page.getByRole('button', { name: 'New plan' }).click();
        const title = `Drip the turf bowl ${suffix()}`;
        await page.getByLabel('Title').fill(title);
        await page.getByLabel('Cost of the work (USD)').fill('25000');
        await page.getByRole('button', { name: 'Create plan' }).click();
        await page.getByRole('heading', { name: title, level: 2 }).waitFor();
        await page.getByRole('table', { name: 'Today and with the plan' }).waitFor();
        const turf = page.getByRole('group', { name: 'Turf bowl (rotors)' });
        await turf.getByRole('button', { name: 'To drip' }).click();
        await turf.getByLabel('Plant factor').fill('0.3');
        await page.getByRole('button', { name: 'Save and compare' }).click();
        const saved = page.getByRole('group', { name: 'What the plan saves' });
        await expect
          .poll(async () => Number((await saved.innerText()).match(/([\d,]+) gal/)![1]!.replace(/,/g, '')))
          .toBeGreaterThan(100_000);
        expect(await saved.innerText()).toMatch(/\d+\.\d years/);
        await shot(page, 'planner-desktop');
        await toPhone(page);
        expect(await sidewaysScroll(page)).toBeLessThanOrEqual(0);
        await shot(page, 'planner-phone');

        await page.getByRole('button', { name: 'Mark as carried out' }).click();
        await page.getByRole('dialog').getByRole('button', { name: 'Create savings project' }).click();
        await page.getByRole('link', { name: 'Open its savings report' }).click();
        // The project exists with its plan's title; the months after the work have no readings yet.
        await page.waitForURL(/\/reports\/savings\/\d+$/);
        await page
          .getByRole('alert')
          .or(page.getByRole('heading', { name: title, level: 1 }))
          .first()
          .waitFor();
        await shot(page, 'planner-carried-out-report');
      } finally {
        await browser.close();
      }
    },
  );

  it(
    'when an auditor opens the ETAF index, ' +
      'then sites are ranked with their distribution and a site shows its peers, at both widths',
    async () => {
      const browser = await openBrowser(PHONE);
      const { page } = browser;
      try {
        await signIn(page, { baseUrl: server.url, email: emailOf('verdella', 'auditor') });
        await page.goto(`${server.url}/etaf`);
        await page.getByRole('heading', { name: 'Achieved ETAF', level: 1 }).waitFor();
        const ranking = page.getByRole('table', { name: 'Sites by achieved ETAF' });
        await ranking.getByRole('link', { name: 'Willowmere HOA — South Greenbelt' }).waitFor();
        await shot(page, 'etaf-ranking-phone');
        expect(await sidewaysScroll(page)).toBeLessThanOrEqual(0);
        await page.setViewportSize(DESKTOP);
        await shot(page, 'etaf-ranking-desktop');
        await ranking.getByRole('link', { name: 'Willowmere HOA — South Greenbelt' }).click();
        await page.getByRole('heading', { name: 'Among comparable sites' }).waitFor();
        expect(await page.getByRole('listitem').filter({ hasText: 'Achieved ETAF' }).innerText()).toMatch(/\d\.\d\d/);
        await toPhone(page);
        await shot(page, 'etaf-site-phone');
        expect(await sidewaysScroll(page)).toBeLessThanOrEqual(0);
        // Auditors see audits but not the planner.
        await page.goto(`${server.url}/sites/${GREENBELT()}/audits`);
        await page.getByRole('heading', { name: 'Field audits', level: 2 }).waitFor();
        expect(await page.getByRole('navigation', { name: 'Site pages' }).getByText('Planner').count()).toBe(0);
      } finally {
        await browser.close();
      }
    },
  );
});
