import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router, provideRouter } from '@angular/router';
import type { Page } from '@shared/api/page';
import { capabilities, type Role } from '@shared/auth/roles';
import type { SiteDto } from '@shared/sites/site';
import { AuthStore } from '../../core/auth/auth-store';
import { SiteList } from './site-list';

// Invented properties only.
function site(id: number, name: string, extra: Partial<SiteDto> = {}): SiteDto {
  return {
    id,
    name,
    kind: 'office-park',
    address: `${id} Larkspur Loop, Dry Creek`,
    timeZone: 'America/Denver',
    notes: '',
    tags: ['reclaimed'],
    organisationId: 3,
    organisationName: 'Bluestem Grounds Co.',
    access: 'edit',
    shares: [],
    sharedWithYou: null,
    createdAt: '2026-01-01T00:00:00Z',
    updatedAt: '2026-01-01T00:00:00Z',
    ...extra,
  };
}

function page(items: SiteDto[], total = items.length, index = 0): Page<SiteDto> {
  return { items, total, page: index, pageSize: 25 };
}

describe('SiteList', () => {
  let http: HttpTestingController;

  async function setUp(role: Role = 'manager', url = '/sites') {
    TestBed.configureTestingModule({
      imports: [SiteList],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        // Any address is valid: the list writes its state into the query string.
        provideRouter([{ path: '**', children: [] }]),
        { provide: AuthStore, useValue: { capabilities: signal(capabilities(role)) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    await TestBed.inject(Router).navigateByUrl(url);
    const fixture = TestBed.createComponent(SiteList);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    TestBed.tick();
    (await nextRequest('/api/sites/tags')).flush(['reclaimed', 'zone-3']);
    return { fixture, loader };
  }

  /** Waits for the component to issue its next request to `url` (the request starts inside an effect). */
  function nextRequest(url: string): Promise<TestRequest> {
    return vi.waitFor(() => http.expectOne((req) => req.url === url));
  }

  afterEach(() => http.verify());

  it('when the server returns a page, then shows one row per site with its details', async () => {
    const { fixture, loader } = await setUp();
    const req = await nextRequest('/api/sites');
    expect(req.request.params.get('page')).toBe('0');
    expect(req.request.params.get('pageSize')).toBe('25');
    expect(req.request.params.get('sort')).toBe('name');
    expect(req.request.params.get('dir')).toBe('asc');
    req.flush(
      page([
        site(1, 'Juniper Court HOA', { kind: 'hoa-common-area', tags: ['reclaimed', 'zone-3'] }),
        site(2, 'Marigold Business Park', { access: 'read', organisationName: 'Saltbush Property Group' }),
      ]),
    );
    await fixture.whenStable();

    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getCellTextByColumnName();
    expect(rows['name'].text).toEqual(['Juniper Court HOA', 'Marigold Business Park']);
    expect(rows['kind'].text).toEqual(['HOA common area', 'Office or business park']);
    expect(rows['timeZone'].text).toEqual(['America/Denver', 'America/Denver']);
    expect(rows['organisationName'].text).toEqual(['Bluestem Grounds Co.', 'Saltbush Property Group']);
    expect(rows['access'].text).toEqual(['Edit', 'View only']);
    expect(rows['tags'].text[0]).toContain('zone-3');
  });

  it(
    'when a column header is clicked, then asks the server for that ' + 'sort, and again for the other direction',
    async () => {
      const { fixture, loader } = await setUp();
      (await nextRequest('/api/sites')).flush(page([site(1, 'Juniper Court HOA')]));
      await fixture.whenStable();
      const [kindHeader] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Kind' });

      const firstClick = kindHeader.click();
      const ascending = await nextRequest('/api/sites');
      expect(ascending.request.params.get('sort')).toBe('kind');
      expect(ascending.request.params.get('dir')).toBe('asc');
      expect(ascending.request.params.get('page')).toBe('0');
      ascending.flush(page([site(1, 'Juniper Court HOA')]));
      await firstClick;

      const secondClick = kindHeader.click();
      const descending = await nextRequest('/api/sites');
      expect(descending.request.params.get('sort')).toBe('kind');
      expect(descending.request.params.get('dir')).toBe('desc');
      descending.flush(page([site(1, 'Juniper Court HOA')]));
      await secondClick;
      expect(await kindHeader.getSortDirection()).toBe('desc');
    },
  );

  it('when the next page is requested, then asks the server for page 1 and keeps the sort', async () => {
    const { fixture, loader } = await setUp();
    const sites = Array.from({ length: 25 }, (_, i) => site(i + 1, `Site ${String(i + 1).padStart(2, '0')}`));
    (await nextRequest('/api/sites')).flush(page(sites, 60));
    await fixture.whenStable();
    const paginator = await loader.getHarness(MatPaginatorHarness);
    expect(await paginator.getRangeLabel()).toBe('1 – 25 of 60');

    const turning = paginator.goToNextPage();
    const req = await nextRequest('/api/sites');
    expect(req.request.params.get('page')).toBe('1');
    expect(req.request.params.get('sort')).toBe('name');
    req.flush(page([site(26, 'Tamarisk Median Strip')], 60, 1));
    await turning;

    expect(await paginator.getRangeLabel()).toBe('26 – 50 of 60');
    const table = await loader.getHarness(MatTableHarness);
    expect((await table.getCellTextByColumnName())['name'].text).toEqual(['Tamarisk Median Strip']);
  });

  it(
    'when opened with a view in the address, then requests that view, ' + 'and records changes in the address',
    async () => {
      const { fixture, loader } = await setUp(
        'manager',
        '/sites?sort=timeZone&dir=desc&tag=reclaimed&kind=park&page=1',
      );
      const req = await nextRequest('/api/sites');
      expect(req.request.params.get('sort')).toBe('timeZone');
      expect(req.request.params.get('dir')).toBe('desc');
      expect(req.request.params.get('tag')).toBe('reclaimed');
      expect(req.request.params.get('kind')).toBe('park');
      expect(req.request.params.get('page')).toBe('1');
      req.flush(page([site(26, 'Tamarisk Median Strip', { kind: 'park' })], 26, 1));
      await fixture.whenStable();

      const [nameHeader] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Name' });
      const clicking = nameHeader.click();
      (await nextRequest('/api/sites')).flush(page([site(1, 'Juniper Court HOA', { kind: 'park' })], 1));
      await clicking;

      const url = new URL(TestBed.inject(Router).url, 'http://x');
      // Name ascending and page 0 are the defaults, so they leave the address; the filters stay.
      expect(url.searchParams.get('sort')).toBeNull();
      expect(url.searchParams.get('page')).toBeNull();
      expect(url.searchParams.get('tag')).toBe('reclaimed');
      expect(url.searchParams.get('kind')).toBe('park');
    },
  );

  it('when loading fails, then shows the error and retries on request', async () => {
    const { fixture, loader } = await setUp();
    (await nextRequest('/api/sites')).flush(
      { error: { code: 'database_unavailable', message: 'The database is not answering.' } },
      { status: 503, statusText: 'Service Unavailable' },
    );
    await fixture.whenStable();
    const alert = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('The database is not answering.');

    const retrying = (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    (await nextRequest('/api/sites')).flush(page([site(1, 'Juniper Court HOA')]));
    await retrying;

    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')).toBeNull();
    const table = await loader.getHarness(MatTableHarness);
    expect((await table.getCellTextByColumnName())['name'].text).toEqual(['Juniper Court HOA']);
  });

  it(
    'when the user may create sites and there are none, then offers ' + '"New site" and says the list is empty',
    async () => {
      const manager = await setUp('manager');
      (await nextRequest('/api/sites')).flush(page([]));
      await manager.fixture.whenStable();
      expect(await manager.loader.getAllHarnesses(MatButtonHarness.with({ text: /New site/ }))).toHaveLength(1);
      expect((manager.fixture.nativeElement as HTMLElement).textContent).toContain('No sites yet.');
    },
  );

  it('when the user is an auditor, then there is no "New site" button', async () => {
    const auditor = await setUp('auditor');
    (await nextRequest('/api/sites')).flush(page([]));
    await auditor.fixture.whenStable();
    expect(await auditor.loader.getAllHarnesses(MatButtonHarness.with({ text: /New site/ }))).toHaveLength(0);
  });
});
