/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startServer, type RunningServer } from '../../backend/src/server';
import { DEMO_USERS } from '../../ops/seed/demo-scenario';
import { seedDemo } from '../../ops/seed/seed-demo';
import { DESKTOP, openBrowser, PHONE, screenshot, signIn } from '../support/browser';
import { suffix } from '../support/test-app';
import { demoSiteId, e2eDatabase } from '../support/e2e-database';

/**
 * Settings in the browser: an administrator switches units, makes an API key, sees its secret once with the upload
 * command, proves the key works and revokes it; a manager and an auditor get the read-only page.
 */
let server: RunningServer;
let siteId: number;
const SITE = 'Tannery Point Office Park';

beforeAll(async () => {
  const { config, db } = await e2eDatabase();
  await seedDemo(db);
  siteId = await demoSiteId(db, SITE);
  await db.destroy();
  server = await startServer(config);
});
afterAll(async () => server?.stop());

type DemoRole = 'admin' | 'manager' | 'auditor';

async function signInAs(page: Page, role: DemoRole): Promise<void> {
  const user = DEMO_USERS.find((u) => u.role === role && u.organisation !== 'harrowgate')!;
  await signIn(page, { baseUrl: server.url, email: user.email });
}

/** What a nightly script would see when it follows an upload with the key: 404 means "signed in, no such upload". */
async function keyStatus(secret: string): Promise<number> {
  const res = await fetch(`${server.url}/api/uploads/999999999`, { headers: { Authorization: `Bearer ${secret}` } });
  return res.status;
}

async function sectionTabs(page: Page): Promise<string[]> {
  // With a tab panel, Material's tab nav bar is a tablist of tabs (each still a link).
  return (
    await page.getByRole('tablist', { name: 'Settings' }).getByRole('tab').locator('.tab-label').allTextContents()
  ).map((t) => t.trim());
}

describe('settings page', () => {
  it(
    'when an administrator makes an API key, then the secret shows ' +
      'once with the upload command, works, and stops working once revoked',
    async () => {
      const browser = await openBrowser(DESKTOP);
      try {
        const { page } = browser;
        await signInAs(page, 'admin');
        await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Settings' }).click();
        await page.getByRole('heading', { name: 'Units', level: 1 }).waitFor();
        expect(await sectionTabs(page)).toEqual(['Units', 'Notifications', 'API keys', 'Users']);

        // Units: switch to metric, see it survive a reload, and switch back.
        const units = page.getByRole('radiogroup', { name: 'Unit system for the organisation' });
        await units.getByRole('radio', { name: /Metric/ }).check();
        await page.getByRole('button', { name: 'Save unit system' }).click();
        await page.getByText('Saved. Figures are now shown in Metric units.').waitFor();
        await page.reload();
        await expect(units.getByRole('radio', { name: /Metric/ }).isChecked()).resolves.toBe(true);
        await screenshot(page, 'settings-units-admin-desktop');
        await units.getByRole('radio', { name: /US customary/ }).check();
        await page.getByRole('button', { name: 'Save unit system' }).click();
        await page.getByText('Saved. Figures are now shown in US customary units.').waitFor();

        // API keys: create one for a single site.
        await page.getByRole('tablist', { name: 'Settings' }).getByRole('tab', { name: 'API keys' }).click();
        await page.getByRole('heading', { name: 'API keys', level: 1 }).waitFor();
        await page.getByRole('button', { name: 'New API key' }).click();
        const name = `Pump house logger ${suffix()}`;
        const dialog = page.getByRole('dialog');
        await dialog.getByLabel('Name').fill(name);
        await dialog.getByRole('combobox', { name: 'Sites' }).click();
        await page.getByRole('option', { name: SITE }).click();
        await page.keyboard.press('Tab');
        await dialog.getByRole('button', { name: 'Create key' }).click();

        await dialog.getByText('This is the only time Rillmark shows it').waitFor();
        const secret = await dialog.getByLabel('API key').inputValue();
        expect(secret).toMatch(/^rk_[0-9a-f]{8}_[A-Za-z0-9_-]{43}$/);
        const command = await dialog.getByLabel('Upload command').innerText();
        expect(command).toContain('-F file=@readings.csv');
        expect(command).toContain(`${server.url}/api/sites/${siteId}/uploads`);
        await page.waitForTimeout(400); // the dialog's opening animation
        await screenshot(page, 'settings-api-key-secret-desktop');
        // Escape does not throw the only copy away.
        await page.keyboard.press('Escape');
        await expect(dialog.isVisible()).resolves.toBe(true);
        expect(await keyStatus(secret)).toBe(404);

        await dialog.getByRole('button', { name: 'I have stored the key' }).click();
        await dialog.waitFor({ state: 'detached' });
        const row = page.getByRole('row').filter({ hasText: name });
        await row.getByText('Active').waitFor();
        expect(await row.innerText()).toContain(SITE);
        expect(await page.content()).not.toContain(secret);
        await screenshot(page, 'settings-api-keys-desktop');

        // Revoke, through the confirmation.
        await row.getByRole('button', { name: `Revoke ${name}` }).click();
        await page
          .getByRole('dialog')
          .getByRole('heading', { name: `Revoke “${name}”?` })
          .waitFor();
        await page.getByRole('dialog').getByRole('button', { name: 'Revoke key' }).click();
        await row.getByText(/^Revoked /).waitFor();
        expect(await row.getByRole('button', { name: /Revoke/ }).count()).toBe(0);
        expect(await keyStatus(secret)).toBe(401);

        // The people in the organisation, in the same frame.
        await page.getByRole('tablist', { name: 'Settings' }).getByRole('tab', { name: 'Users' }).click();
        await page.getByRole('table', { name: 'Users' }).locator('tbody tr').first().waitFor();
        await screenshot(page, 'settings-users-admin-desktop');
      } finally {
        await browser.close();
      }
    },
  );

  it('when an administrator opens settings on a phone, then the sections fit the screen', async () => {
    const browser = await openBrowser(PHONE);
    try {
      const { page } = browser;
      await signInAs(page, 'admin');
      await page.goto(`${server.url}/settings/api-keys`);
      await page.getByRole('heading', { name: 'API keys', level: 1 }).waitFor();
      await page.getByRole('table', { name: 'API keys' }).waitFor();
      const overflow = await page.evaluate(
        () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
      );
      expect(overflow).toBeLessThanOrEqual(0);
      await screenshot(page, 'settings-api-keys-admin-phone');
      await page.getByRole('button', { name: 'New API key' }).click();
      const dialog = page.getByRole('dialog');
      await dialog.getByLabel('Name').fill(`Phone-made key ${suffix()}`);
      await dialog.getByRole('combobox', { name: 'Sites' }).click();
      await page.getByRole('option', { name: SITE }).click();
      await page.keyboard.press('Tab');
      await page.waitForTimeout(400); // the dialog's opening animation
      await screenshot(page, 'settings-api-key-new-phone');
      await dialog.getByRole('button', { name: 'Create key' }).click();
      await dialog.getByRole('button', { name: 'Copy command' }).waitFor();
      // The secret, its copy button and the command stay inside the phone's width.
      const box = await dialog.boundingBox();
      expect(box!.x + box!.width).toBeLessThanOrEqual(390);
      expect((await dialog.getByRole('button', { name: 'Copy key' }).boundingBox())!.x).toBeGreaterThanOrEqual(0);
      await screenshot(page, 'settings-api-key-secret-phone');
      await dialog.getByRole('button', { name: 'I have stored the key' }).click();
      await dialog.waitFor({ state: 'detached' });
      await page.goto(`${server.url}/settings/units`);
      await page.getByRole('radiogroup', { name: 'Unit system for the organisation' }).waitFor();
      await screenshot(page, 'settings-units-admin-phone');
    } finally {
      await browser.close();
    }
  });

  it.each([
    ['manager', DESKTOP],
    ['auditor', PHONE],
  ] as const)(
    'when a %s opens settings, then units are read-only, alert e-mail is theirs, and API keys stay out of reach',
    async (role, viewport) => {
      const browser = await openBrowser(viewport);
      try {
        const { page } = browser;
        await signInAs(page, role);
        await page.goto(`${server.url}/settings`);
        await page.getByRole('heading', { name: 'Units', level: 1 }).waitFor();
        await page.getByText('Only administrators can change the unit system.').waitFor();
        expect(await page.getByRole('radiogroup').count()).toBe(0);
        expect(await page.getByText(/gallons \(gal\), inches \(in\), square feet \(ft²\)/).count()).toBe(1);
        expect(await sectionTabs(page)).toEqual(['Units', 'Notifications']);
        await screenshot(page, `settings-units-${role}-${viewport === PHONE ? 'phone' : 'desktop'}`);

        await page.getByRole('tablist', { name: 'Settings' }).getByRole('tab', { name: 'Notifications' }).click();
        await page.getByRole('heading', { name: 'Alert e-mail', level: 1 }).waitFor();
        await page.getByRole('radiogroup', { name: 'How often' }).waitFor();
        await screenshot(page, `settings-notifications-${role}`);

        await page.goto(`${server.url}/settings/api-keys`);
        await page.waitForLoadState('networkidle');
        expect(page.url()).not.toContain('/settings/api-keys');
        expect(await page.getByRole('heading', { name: 'API keys' }).count()).toBe(0);
      } finally {
        await browser.close();
      }
    },
  );
});
