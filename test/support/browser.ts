import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../ops/seed/demo-scenario';

export const ARTIFACTS = resolve(import.meta.dirname, '../../test-artifacts/e2e');

export const DESKTOP = { width: 1366, height: 860 };
export const PHONE = { width: 390, height: 844 };

/**
 * Debian's Chromium driven by playwright-core (no browser download). A fresh profile per context; the
 * flags keep Chromium from reaching for the network, which this machine does not have.
 */
export async function openBrowser(
  viewport = DESKTOP,
): Promise<{ context: BrowserContext; page: Page; close: () => Promise<void> }> {
  const profile = mkdtempSync(join(tmpdir(), 'rillmark-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport,
    locale: 'en-US',
    timezoneId: 'America/Los_Angeles',
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(ARTIFACTS, { recursive: true });
  const path = join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/**
 * Signs in through the sign-in page the way a person does, and waits for the home page (the portfolio).
 * `path` is where the browser starts; signed out, the app sends it to the sign-in page first.
 */
export async function signIn(
  page: Page,
  user: { baseUrl: string; email: string; password?: string; path?: string },
): Promise<void> {
  await page.goto(`${user.baseUrl}${user.path ?? '/'}`);
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('E-mail address').fill(user.email);
  await page.getByLabel('Password', { exact: true }).fill(user.password ?? DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Portfolio', level: 1 }).waitFor();
}
