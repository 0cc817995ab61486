/// <reference lib="dom" />
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { ControllerEntity } from '../../backend/src/components/meters/data/controller.entity';
import { MeterEntity } from '../../backend/src/components/meters/data/meter.entity';
import { ZoneEntity } from '../../backend/src/components/meters/data/zone.entity';
import { OrganisationEntity } from '../../backend/src/components/organisations/data/organisation.entity';
import { startServer, type RunningServer } from '../../backend/src/server';
import { DEMO_USERS } from '../../ops/seed/demo-scenario';
import { seedDemo } from '../../ops/seed/seed-demo';
import { DESKTOP, openBrowser, screenshot, signIn } from '../support/browser';
import { SAMPLES } from '../support/ingest-fixtures';
import { createSite, suffix } from '../support/test-app';
import { e2eDatabase } from '../support/e2e-database';

/** A manager sends a sample file through the upload page of the production build, sends it again, rolls it back. */
let server: RunningServer;
let db: DataSource;
let siteName: string;

beforeAll(async () => {
  const opened = await e2eDatabase();
  const { config } = opened;
  db = opened.db;
  await seedDemo(db);
  // A fresh site each run, so the first upload is always new.
  const org = await db.getRepository(OrganisationEntity).findOneByOrFail({ name: 'Cobalt Ridge Property Services' });
  siteName = `Aster Lane Fields ${suffix()}`;
  const site = await createSite(db, org.id, { name: siteName, kind: 'school-ground' });
  await db.getRepository(MeterEntity).insert({
    siteId: site.id,
    ref: 'SCHOOL-01',
    unit: 'gal',
    registerMultiplier: 1,
    registerDigits: 6,
    purpose: 'dedicated-irrigation',
    waterSource: 'recycled',
    installedAt: new Date('2020-01-01T00:00:00Z'),
    removedAt: null,
  });
  const controller = Number(
    (await db.getRepository(ControllerEntity).insert({ siteId: site.id, ref: 'CTL-SCHOOL-A', name: 'Controller A' }))
      .identifiers[0]!['id'],
  );
  await db.getRepository(ZoneEntity).insert(
    ['A1', 'A2', 'A3', 'B1'].map((station) => ({
      controllerId: controller,
      station,
      name: `Station ${station}`,
      hydrozoneId: null,
      designGpm: 10,
      emitterCount: null,
      emitterGph: null,
    })),
  );
  server = await startServer(config);
});
afterAll(async () => {
  await server?.stop();
  await db?.destroy();
});

describe('upload page', () => {
  it(
    'when a manager drops a sample file, then the preview, the result, ' +
      'the no-op re-upload and the roll-back all show',
    async () => {
      const manager = DEMO_USERS.find((u) => u.role === 'manager')!;
      const browser = await openBrowser(DESKTOP);
      try {
        const { page } = browser;
        await signIn(page, { baseUrl: server.url, email: manager.email });

        await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Uploads' }).click();
        await page.getByRole('heading', { name: 'Data uploads' }).waitFor();
        await page.getByRole('combobox', { name: 'Site' }).click();
        await page.getByRole('option', { name: siteName }).click();
        await page.getByText('America/Los_Angeles').waitFor();

        const file = resolve(SAMPLES, 'meters/interval-long-us-ampm.csv');
        await page.getByLabel('CSV file', { exact: true }).setInputFiles(file);
        await page.getByRole('heading', { name: 'How the file will be read' }).waitFor();
        // 12:00 AM, 1:00 AM (PDT), 1:00 AM again (PST): read in the site's zone.
        const sample = page.locator('ul.sample li');
        expect(await sample.count()).toBe(6);
        expect(await sample.first().innerText()).toMatch(/^SCHOOL-01 · 2026-11-01 00:00:00 · 60 min · 83\.25/);
        // Every date fits both orders (no day above 12): the page asks rather than guessing.
        await page.getByText(/fit both day-first and month-first/).waitFor();
        await page.getByRole('radio', { name: /month first/ }).check();
        await page.getByText(/Dates read month first \(m\/d\/yyyy\): as chosen/).waitFor();
        await screenshot(page, 'uploads-preview');

        await page.getByRole('button', { name: 'Upload', exact: true }).click();
        await page.getByRole('heading', { name: /Upload #\d+ imported/ }).waitFor();
        const counts = page.locator('dl.counts');
        expect(await counts.locator('div', { hasText: 'New' }).locator('dd').innerText()).toBe('6');
        await screenshot(page, 'uploads-result');

        await page.getByRole('button', { name: 'Upload', exact: true }).click();
        await page.getByRole('heading', { name: 'Nothing to do' }).waitFor();
        expect(await page.getByText(/already imported as upload #\d+/).count()).toBe(1);

        const history = page.getByRole('table', { name: 'Upload history' });
        expect(await history.locator('tbody tr').count()).toBe(1);
        await history.getByRole('button', { name: 'Roll back' }).click();
        await page.getByRole('dialog').getByRole('button', { name: 'Roll back' }).click();
        await history.getByText('Rolled back').waitFor();
        const [left] = await db.query(
          `SELECT COUNT(*) AS n FROM meter_reading r JOIN meter m ON m.id = r.meter_id JOIN site s ON
          s.id = m.site_id WHERE s.name = ?`,
          [siteName],
        );
        expect(Number(left.n)).toBe(0);
        await screenshot(page, 'uploads-rolled-back');
      } catch (err) {
        await screenshot(browser.page, 'uploads-failure');
        throw err;
      } finally {
        await browser.close();
      }
    },
  );
});
