import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatTabNavBarHarness } from '@angular/material/tabs/testing';
import { provideRouter } from '@angular/router';
import type { SiteOverviewDto } from '@shared/readings/readings-dto';
import type { SiteDto } from '@shared/sites/site';
import { SiteWorkspace } from './site-workspace';

// Invented property and figures.
const SITE: SiteDto = {
  id: 7,
  name: 'Quailbrush Commons',
  kind: 'hoa-common-area',
  address: '40 Tumbleweed Loop',
  timeZone: 'America/Los_Angeles',
  notes: '',
  tags: [],
  organisationId: 2,
  organisationName: 'Saltgrass Property Partners',
  access: 'edit',
  shares: [],
  sharedWithYou: null,
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
};

function overview(from: string, to: string): SiteOverviewDto {
  return {
    site: { id: 7, name: SITE.name, timeZone: SITE.timeZone, organisationName: SITE.organisationName },
    from,
    to,
    figures: {
      useGallons: 61_250,
      budgetGallons: 50_000,
      percentOfBudget: 122.5,
      overBudgetGallons: 11_250,
      lastDataAt: '2026-11-30T20:00:00Z',
      openAlerts: 1,
      daysWithData: 30,
      days: 30,
    },
    days: [],
    uploads: [],
    alerts: [],
    budgetProblem: null,
  };
}

describe('SiteWorkspace', () => {
  let http: HttpTestingController;

  function nextRequest(match: { method: string; url: string }): Promise<TestRequest> {
    return vi.waitFor(() => http.expectOne(match));
  }

  async function openWorkspace() {
    TestBed.configureTestingModule({
      imports: [SiteWorkspace],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(SiteWorkspace);
    fixture.componentRef.setInput('id', '7');
    const loader = TestbedHarnessEnvironment.loader(fixture);
    TestBed.tick();
    const root = fixture.nativeElement as HTMLElement;
    const text = () => (root.textContent ?? '').replace(/\s+/g, ' ');
    /** The header's figures as [label, value] pairs, read from the list a screen reader announces. */
    const figures = () =>
      Array.from(root.querySelectorAll('[role="list"] [role="listitem"]')).map((item) => [
        item.querySelector('.k')!.textContent!.trim(),
        item.querySelector('.v')!.textContent!.trim(),
      ]);
    return { fixture, loader, text, figures };
  }

  async function answerFigures(fixture: { whenStable(): Promise<unknown> }, openAlerts = 3) {
    (await nextRequest({ method: 'GET', url: '/api/sites/7/overview?from=2026-11-01&to=2026-11-30' })).flush(
      overview('2026-11-01', '2026-11-30'),
    );
    (
      await nextRequest({
        method: 'GET',
        url: '/api/alerts?status=open&siteId=7&page=0&pageSize=1&sort=detected&dir=desc',
      })
    ).flush({ items: [], total: openAlerts, page: 0, pageSize: 1 });
    await fixture.whenStable();
  }

  beforeEach(() => {
    // 05:00 UTC on 1 December is still 30 November in Los Angeles: "this month" must follow the site's clock.
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2026-12-01T05:00:00Z'));
  });
  afterEach(() => {
    http.verify();
    vi.useRealTimers();
  });

  it(
    'when the site and its month load, then the header shows name, ' +
      'organisation, zone and the month-to-date figures with units',
    async () => {
      const { fixture, text, figures } = await openWorkspace();
      (await nextRequest({ method: 'GET', url: '/api/sites/7' })).flush(SITE);
      await answerFigures(fixture);

      const heading = (fixture.nativeElement as HTMLElement).querySelector('h1')!;
      expect(heading.textContent!.trim()).toBe('Quailbrush Commons');
      expect(text()).toContain('Saltgrass Property Partners · HOA common area · times in America/Los_Angeles');
      expect(figures()).toEqual([
        ['Use, 1–30 Nov 2026', '61,250 gal'],
        ['Budget to date', '50,000 gal'],
        ['Of budget', '123 %'],
        ['Open alerts', '3'],
        ['Latest data', '9 h ago'],
      ]);
    },
  );

  it('when the page opens, then every view of the site is a tab linking under /sites/:id', async () => {
    const { fixture, loader } = await openWorkspace();
    (await nextRequest({ method: 'GET', url: '/api/sites/7' })).flush(SITE);
    await answerFigures(fixture);

    const nav = await loader.getHarness(MatTabNavBarHarness);
    const links = await nav.getLinks();
    const tabs = await Promise.all(
      links.map(async (l) => [await l.getLabel(), await (await l.host()).getAttribute('href')]),
    );
    expect(tabs).toEqual([
      ['Overview', '/sites/7/overview'],
      ['Monthly table', '/sites/7/monthly'],
      ['Hydrozones', '/sites/7/hydrozones'],
      ['Meters & zones', '/sites/7/equipment'],
      ['Alerts', '/sites/7/alerts'],
      ['Uploads', '/sites/7/uploads'],
      ['Water budget', '/sites/7/budget'],
      ['Rates', '/sites/7/rates'],
      ['Audits', '/sites/7/audits'],
      ['Planner', '/sites/7/planner'],
      ['Details', '/sites/7'],
    ]);
    expect(await (await nav.host()).getAttribute('aria-label')).toBe('Site pages');
  });

  it('when the site is not found, then says so without tabs and retries on request', async () => {
    const { fixture, loader, text, figures } = await openWorkspace();
    (await nextRequest({ method: 'GET', url: '/api/sites/7' })).flush(
      { error: { code: 'not-found', message: 'Site not found.' } },
      { status: 404, statusText: 'Not Found' },
    );
    (
      await nextRequest({
        method: 'GET',
        url: '/api/alerts?status=open&siteId=7&page=0&pageSize=1&sort=detected&dir=desc',
      })
    ).flush({ items: [], total: 0, page: 0, pageSize: 1 });
    await fixture.whenStable();

    expect(text()).toContain('There is no site at this address, or it is not shared with you.');
    expect(await loader.getAllHarnesses(MatTabNavBarHarness)).toHaveLength(0);

    // Harness clicks wait for the app to settle, and a pending request keeps it busy: answer before awaiting.
    const clicked = (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    (await nextRequest({ method: 'GET', url: '/api/sites/7' })).flush(SITE);
    (await nextRequest({ method: 'GET', url: '/api/sites/7/overview?from=2026-11-01&to=2026-11-30' })).flush(
      overview('2026-11-01', '2026-11-30'),
    );
    await clicked;
    await fixture.whenStable();
    expect(figures()).toContainEqual(['Budget to date', '50,000 gal']);
    expect(await loader.getAllHarnesses(MatTabNavBarHarness)).toHaveLength(1);
  });

  it('when the figures fail, then the header offers to try again and shows them once they load', async () => {
    const { fixture, loader, text, figures } = await openWorkspace();
    (await nextRequest({ method: 'GET', url: '/api/sites/7' })).flush(SITE);
    (await nextRequest({ method: 'GET', url: '/api/sites/7/overview?from=2026-11-01&to=2026-11-30' })).flush('down', {
      status: 503,
      statusText: 'Unavailable',
    });
    (
      await nextRequest({
        method: 'GET',
        url: '/api/alerts?status=open&siteId=7&page=0&pageSize=1&sort=detected&dir=desc',
      })
    ).flush({ items: [], total: 0, page: 0, pageSize: 1 });
    await fixture.whenStable();
    expect(text()).toContain('This month’s figures could not be loaded.');
    // The tabs stay usable while the figures are missing.
    expect(await loader.getAllHarnesses(MatTabNavBarHarness)).toHaveLength(1);

    const clicked = (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    (await nextRequest({ method: 'GET', url: '/api/sites/7/overview?from=2026-11-01&to=2026-11-30' })).flush(
      overview('2026-11-01', '2026-11-30'),
    );
    await clicked;
    await fixture.whenStable();
    expect(text()).not.toContain('could not be loaded');
    expect(figures()).toContainEqual(['Of budget', '123 %']);
    expect(figures()).toContainEqual(['Open alerts', '0']);
  });
});
