import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { SiteLevel } from '@shared/auth/roles';
import type { SiteDto } from '@shared/sites/site';
import type { ApiKeyDto } from '@shared/uploads/upload';
import { ApiKeyList } from './api-key-list';

// Invented sites and keys only.
function site(id: number, name: string, access: SiteLevel): SiteDto {
  return {
    id,
    name,
    kind: 'park',
    address: '',
    timeZone: 'America/Boise',
    notes: '',
    tags: [],
    organisationId: 3,
    organisationName: 'Bluestem Grounds Co.',
    access,
    shares: [],
    sharedWithYou: null,
    createdAt: '2026-01-01T00:00:00Z',
    updatedAt: '2026-01-01T00:00:00Z',
  };
}
const SITES = [
  site(11, 'Cattail Commons', 'own'),
  site(12, 'Juniper Row', 'own'),
  site(13, 'Mesa Verdant (shared, read only)', 'read'),
];
function key(id: number, name: string, siteIds: number[], extra: Partial<ApiKeyDto> = {}): ApiKeyDto {
  return {
    id,
    name,
    prefix: `rk_0000000${id}`,
    siteIds,
    createdBy: 'Ada Brightwater',
    createdAt: '2026-03-04T10:00:00Z',
    lastUsedAt: null,
    revokedAt: null,
    ...extra,
  };
}
const SECRET = 'rk_00000009_' + 'A'.repeat(43);

describe('ApiKeyList', () => {
  let http: HttpTestingController;
  const next = (method: string, url: string): Promise<TestRequest> =>
    vi.waitFor(() => http.expectOne((req) => req.method === method && req.url === url));

  async function open(keys: ApiKeyDto[]) {
    TestBed.configureTestingModule({
      imports: [ApiKeyList],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ApiKeyList);
    TestBed.tick();
    (await next('GET', '/api/sites')).flush({ items: SITES, total: SITES.length, page: 0, pageSize: 200 });
    (await next('GET', '/api/api-keys')).flush(keys);
    await fixture.whenStable();
    const text = () => (document.body.textContent ?? '').replace(/\s+/g, ' ');
    return {
      fixture,
      loader: TestbedHarnessEnvironment.loader(fixture),
      root: TestbedHarnessEnvironment.documentRootLoader(fixture),
      text,
    };
  }

  afterEach(() => http.verify());

  it(
    'when keys exist, then each shows its sites by name, creation, ' +
      'last use and status, and only active keys can be revoked',
    async () => {
      const { loader } = await open([
        key(1, 'Pump house logger', [11, 12], { lastUsedAt: '2026-03-05T03:10:00Z' }),
        key(2, 'Old gateway', [12], { revokedAt: '2026-02-01T08:00:00Z' }),
      ]);
      const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
      expect(cells['name']!.text[0]).toContain('Pump house logger');
      expect(cells['name']!.text[0]).toContain('rk_00000001…');
      expect(cells['sites']!.text).toEqual(['Cattail Commons, Juniper Row', 'Juniper Row']);
      expect(cells['createdAt']!.text[0]).toContain('Mar 4, 2026');
      expect(cells['createdAt']!.text[0]).toContain('by Ada Brightwater');
      expect(cells['lastUsedAt']!.text[0]).toMatch(/Mar 5, 2026/);
      expect(cells['lastUsedAt']!.text[1]).toBe('Never');
      expect(cells['status']!.text).toEqual(['Active', 'Revoked Feb 1, 2026']);
      expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Revoke' }))).toHaveLength(1);
    },
  );

  it('when there are no keys, then the table says so and invites making one', async () => {
    const { text } = await open([]);
    expect(text()).toContain('No API keys yet.');
  });

  it(
    'when an admin makes a key, then only sites taking uploads are ' +
      'offered, the secret shows once with a curl upload, and closing forgets it',
    async () => {
      const { fixture, loader, root, text } = await open([]);
      await (await loader.getHarness(MatButtonHarness.with({ text: /New API key/ }))).click();
      const dialog = await root.getHarness(MatDialogHarness);
      expect(await dialog.getTitleText()).toBe('New API key');

      // Nothing is sent without a name and a site.
      await (await dialog.getHarness(MatButtonHarness.with({ text: 'Create key' }))).click();
      http.expectNone({ method: 'POST', url: '/api/api-keys' });
      expect(
        await (await dialog.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Sites' }))).getTextErrors(),
      ).toEqual(['Choose at least one site.']);

      await (
        await dialog.getHarness(MatInputHarness.with({ placeholder: /Pump house/ }))
      ).setValue('Pump house logger');
      const sites = await dialog.getHarness(MatSelectHarness);
      await sites.open();
      expect(await Promise.all((await sites.getOptions()).map((o) => o.getText()))).toEqual([
        'Cattail Commons',
        'Juniper Row',
      ]);
      await sites.clickOptions({ text: 'Juniper Row' });
      await sites.clickOptions({ text: 'Cattail Commons' });
      // Closing by clicking outside: Escape would close the dialog as well.
      (document.querySelector('.cdk-overlay-transparent-backdrop') as HTMLElement).click();
      await vi.waitFor(async () => expect(await sites.isOpen()).toBe(false));
      expect(await sites.getValueText()).toBe('Cattail Commons, Juniper Row');
      // A native click: the harness would wait for the request this click starts, which only the test answers.
      (document.querySelector('mat-dialog-container button[type="submit"]') as HTMLButtonElement).click();
      const post = await next('POST', '/api/api-keys');
      expect(post.request.body).toEqual({ name: 'Pump house logger', siteIds: [11, 12] });
      post.flush({ ...key(9, 'Pump house logger', [11, 12]), secret: SECRET });

      await vi.waitFor(() => expect(text()).toContain('This is the only time Rillmark shows it'));
      expect((document.getElementById('api-key-secret') as HTMLInputElement).value).toBe(SECRET);
      const command = document.querySelector('pre.command')!.textContent!;
      expect(command).toContain('-H "Authorization: Bearer $RILLMARK_API_KEY"');
      expect(command).toContain('-F file=@readings.csv');
      expect(command).toContain(`${location.origin}/api/sites/11/uploads`);
      expect(text()).toContain('For the key’s other sites use their numbers instead: 12 (Juniper Row).');
      expect(await dialog.getHarness(MatButtonHarness.with({ text: /Copy key/ }))).toBeTruthy();

      (
        Array.from(document.querySelectorAll('mat-dialog-container button')).find((b) =>
          b.textContent!.includes('I have stored the key'),
        ) as HTMLButtonElement
      ).click();
      (await next('GET', '/api/api-keys')).flush([key(9, 'Pump house logger', [11, 12])]);
      await fixture.whenStable();
      expect(await root.getAllHarnesses(MatDialogHarness)).toHaveLength(0);
      expect(document.body.innerHTML).not.toContain(SECRET);
      expect((await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())['sites']!.text).toEqual([
        'Cattail Commons, Juniper Row',
      ]);
    },
  );

  it(
    'when the admin confirms a revocation, then the key is revoked ' + 'and the list reloads; cancelling sends nothing',
    async () => {
      const { fixture, loader, root } = await open([key(1, 'Pump house logger', [11])]);
      const revoke = await loader.getHarness(MatButtonHarness.with({ text: 'Revoke' }));

      await revoke.click();
      let dialog = await root.getHarness(MatDialogHarness);
      expect(await dialog.getTitleText()).toBe('Revoke “Pump house logger”?');
      await (await dialog.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
      http.expectNone({ method: 'DELETE' });

      await revoke.click();
      dialog = await root.getHarness(MatDialogHarness);
      (
        Array.from(document.querySelectorAll('mat-dialog-container button')).find((b) =>
          b.textContent!.includes('Revoke key'),
        ) as HTMLButtonElement
      ).click();
      (await next('DELETE', '/api/api-keys/1')).flush(null, { status: 204, statusText: 'No Content' });
      (await next('GET', '/api/api-keys')).flush([
        key(1, 'Pump house logger', [11], { revokedAt: '2026-03-06T09:00:00Z' }),
      ]);
      await fixture.whenStable();
      expect((await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())['status']!.text).toEqual([
        'Revoked Mar 6, 2026',
      ]);
      expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Revoke' }))).toHaveLength(0);
    },
  );

  it('when the keys cannot be loaded, then an error with a retry appears, and the retry shows them', async () => {
    TestBed.configureTestingModule({
      imports: [ApiKeyList],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ApiKeyList);
    TestBed.tick();
    (await next('GET', '/api/sites')).flush({ items: SITES, total: SITES.length, page: 0, pageSize: 200 });
    (await next('GET', '/api/api-keys')).flush(null, { status: 500, statusText: 'Server Error' });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    expect(await loader.getAllHarnesses(MatTableHarness)).toHaveLength(0);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')!.textContent).toContain(
      'The server ran into a problem.',
    );

    (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('.rm-state-error button')!.click();
    (await next('GET', '/api/api-keys')).flush([key(1, 'Pump house logger', [11])]);
    await fixture.whenStable();
    expect((await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())['sites']!.text).toEqual([
      'Cattail Commons',
    ]);
  });
});
