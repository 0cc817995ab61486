import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue, equipSite, siteReadings, uploadFile } from '../support/ingest-fixtures';
import {
  createSite,
  createTestApp,
  createWorld,
  signedIn,
  type Client,
  type TestApp,
  type World,
} from '../support/test-app';

let app: TestApp;
let world: World;
let manager: Client;

beforeAll(async () => {
  app = await createTestApp();
  world = await createWorld(app.db);
  manager = await signedIn(app, world.users.manager.email);
});
afterAll(async () => app?.stop());

/** A site that already holds data (the hourly sample), so each test can check nothing stored was touched. */
async function siteWithData(
  timeZone: string,
): Promise<{ siteId: number; before: Awaited<ReturnType<typeof siteReadings>> }> {
  const site = await createSite(app.db, world.org.id, { timeZone });
  await equipSite(manager, site.id);
  const first = await uploadFile(manager, site.id, 'meters/interval-long-hourly.csv');
  expect(first.status).toBe(201);
  return { siteId: site.id, before: await siteReadings(app.db, site.id) };
}

async function rejections(
  uploadId: number,
): Promise<Array<{ row: number; column: number | null; kind: string; message: string }>> {
  return (await manager.get(`/api/uploads/${uploadId}/rejections`).expect(200)).body.items;
}

describe('whole-file problems: refused with a message naming the file, nothing stored changes', () => {
  const cases: Array<[string, RegExp]> = [
    ['broken/empty.csv', /"empty\.csv": The file is empty\./],
    ['broken/zip-renamed.csv', /"zip-renamed\.csv": This is a zip file .* renamed \.csv/],
    ['broken/header-only.csv', /"header-only\.csv": The file has a header but no data rows\./],
    ['broken/unknown-columns.csv', /"unknown-columns\.csv": No known layout/],
    [
      'broken/missing-required-field.csv',
      /"missing-required-field\.csv": The column mapping is incomplete: Choose the run start column\./,
    ],
  ];
  it.each(cases)('when %s is sent, then it is refused with its own reason', async (path, message) => {
    const { siteId, before } = await siteWithData(catalogue.files[path]!.timeZone);
    const res = await uploadFile(manager, siteId, path);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(message);
    if (path.includes('missing-required'))
      expect(res.body.error.details).toContainEqual({
        field: 'mapping.start',
        message: 'Choose the run start column.',
      });
    expect(await siteReadings(app.db, siteId)).toEqual(before);
    const history = (await manager.get(`/api/sites/${siteId}/uploads`).expect(200)).body.items;
    expect(history[0]).toMatchObject({ status: 'failed', errorSummary: expect.stringMatching(message) });
  });
});

describe('row problems: the valid rows are kept, each bad row is listed with row, column and reason', () => {
  const rowCases = Object.entries(catalogue.files).filter(
    ([path, spec]) => path.startsWith('broken/') && spec.errorAt && !spec.checkKnownRefs,
  );
  it.each(rowCases)('%s', async (path, spec) => {
    const { siteId, before } = await siteWithData(spec.timeZone);
    const res = await uploadFile(manager, siteId, path);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.upload).toMatchObject({ status: 'done', accepted: spec.records, rejected: spec.errors });
    const listed = (await rejections(res.body.upload.id)).filter((r) => r.kind === 'rejected');
    expect(listed.map((r) => [r.row, r.column])).toEqual(spec.errorAt);
    for (const r of listed) expect(r.message.length).toBeGreaterThan(10);
    const after = await siteReadings(app.db, siteId);
    for (const reading of before) expect(after).toContainEqual(reading);
    expect(after.length).toBe(before.length + spec.records!);
  });

  it(
    'when a file names a meter the site does not have, then its rows are listed once, ' +
      'naming the meter, its row count and rows',
    async () => {
      const { siteId } = await siteWithData('America/Los_Angeles');
      const res = await uploadFile(manager, siteId, 'broken/unknown-meter.csv');
      expect(res.body.upload).toMatchObject({ accepted: 2, rejected: 2, unknownRefs: 1 });
      const listed = (await rejections(res.body.upload.id)).filter((r) => r.kind === 'unknown');
      expect(listed).toEqual([
        {
          row: 4,
          column: null,
          kind: 'unknown',
          message: expect.stringContaining('meter "HOA-SOUTH-99" is not set up on this site: 2 row(s) not imported'),
          ref: { field: 'meter', ref: 'HOA-SOUTH-99', rows: 2 },
        },
      ]);
    },
  );

  it(
    'when a register drops in a way no rollover explains, then the ' +
      'reads are kept but no volume is made from the drop',
    async () => {
      const { siteId, before } = await siteWithData('America/Los_Angeles');
      const res = await uploadFile(manager, siteId, 'broken/register-not-a-rollover.csv');
      expect(res.body.upload).toMatchObject({ status: 'done', accepted: 3, rejected: 1 });
      const listed = await rejections(res.body.upload.id);
      expect(listed.find((r) => r.kind === 'rejected')).toMatchObject({
        row: 3,
        message: expect.stringContaining('not a plausible rollover'),
      });
      expect((await siteReadings(app.db, siteId)).length).toBe(before.length + 1);
    },
  );

  it(
    'when the uploader chose to refuse the file on any row error, ' +
      'then nothing is stored and the rows are still listed',
    async () => {
      const { siteId, before } = await siteWithData('America/Los_Angeles');
      const res = await uploadFile(manager, siteId, 'broken/negative-volume.csv', { rowErrors: 'refuse-file' });
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/"negative-volume\.csv": 1 row\(s\) were rejected/);
      expect(res.body.error.details[0]).toMatchObject({ field: 'row 3, column 3' });
      expect(await siteReadings(app.db, siteId)).toEqual(before);
      const failed = (await manager.get(`/api/sites/${siteId}/uploads`).expect(200)).body.items[0];
      expect(failed.status).toBe('failed');
      expect((await rejections(failed.id)).map((r) => [r.row, r.column])).toEqual([[3, 3]]);
    },
  );

  it('when a reading is older than the meter, then that row is refused naming the install date', async () => {
    const { siteId } = await siteWithData('America/Los_Angeles');
    const csv =
      'Meter #,Interval Start,Usage (Gal)\nHOA-NORTH-01,2019-06-01 ' +
      '00:00,10\nHOA-NORTH-01,2026-11-20 00:00,11\nHOA-NORTH-01,2026-11-20 01:00,12\n';
    const res = await uploadFile(
      manager,
      siteId,
      Buffer.from(csv),
      { overrides: JSON.stringify({ intervalMinutes: 60 }) },
      'old.csv',
    );
    expect(res.body.upload, JSON.stringify(res.body)).toMatchObject({ accepted: 2, rejected: 1 });
    expect((await rejections(res.body.upload.id)).find((r) => r.kind === 'rejected')).toMatchObject({
      row: 2,
      column: 2,
      message: expect.stringContaining('before meter HOA-NORTH-01 was installed (2020-01-01)'),
    });
  });

  it(
    'when the rejected rows are downloaded as CSV, then each line ' + 'names the file, row, column and reason',
    async () => {
      const { siteId } = await siteWithData('America/Los_Angeles');
      const res = await uploadFile(manager, siteId, 'broken/unknown-meter.csv');
      const csv = await manager
        .get(`/api/uploads/${res.body.upload.id}/rejections?format=csv`)
        .expect(200)
        .expect('content-type', /text\/csv/);
      const lines = csv.text.trim().split('\r\n');
      expect(lines[0]).toBe('file,row,column,kind,reason');
      expect(lines).toContainEqual(expect.stringMatching(/^unknown-meter\.csv,4,,unknown,.*HOA-SOUTH-99/));
      expect(lines).toHaveLength(3); // the unit notice, and the unknown meter once
    },
  );
});
