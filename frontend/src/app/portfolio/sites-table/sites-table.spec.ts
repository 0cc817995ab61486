import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { PortfolioRow } from '@shared/portfolio/portfolio-dto';
import { SitesTable } from './sites-table';

const NOW = Date.parse('2025-07-02T12:00:00Z');

// Invented properties only.
function row(
  siteId: number,
  siteName: string,
  useGallons: number,
  budgetGallons: number | null,
  lastDataAt: string | null,
): PortfolioRow {
  return {
    siteId,
    siteName,
    organisationName: 'Bluestem Grounds Co.',
    timeZone: 'America/Denver',
    tags: [],
    useGallons,
    budgetGallons,
    percentOfBudget: budgetGallons ? (useGallons / budgetGallons) * 100 : null,
    trend: Array.from({ length: 12 }, (_, i) => ({ month: `2024-${String(i + 1).padStart(2, '0')}`, gallons: i * 10 })),
    openAlerts: siteId === 1 ? 2 : 0,
    lastDataAt,
    budgetProblem: budgetGallons ? null : 'This site has no hydrozones yet',
  };
}

async function setup(phone = false) {
  TestBed.configureTestingModule({ providers: [provideRouter([])] });
  const fixture = TestBed.createComponent(SitesTable);
  const set = (name: string, value: unknown) => fixture.componentRef.setInput(name, value);
  set('rows', [
    row(1, 'Heron Flats HOA', 12_500, 10_000, '2025-07-02T09:00:00Z'),
    row(2, 'Quarry Park', 3_000, null, '2025-06-20T00:00:00Z'),
  ]);
  set('total', 60);
  set('pageIndex', 0);
  set('pageSize', 25);
  set('sort', 'percentOfBudget');
  set('direction', 'desc');
  set('now', NOW);
  set('phone', phone);
  const sorts: unknown[] = [];
  const pages: unknown[] = [];
  fixture.componentInstance.sortChange.subscribe((e) => sorts.push(e));
  fixture.componentInstance.pageChange.subscribe((e) => pages.push(e));
  await fixture.whenStable();
  return { fixture, sorts, pages, loader: TestbedHarnessEnvironment.loader(fixture) };
}

describe('SitesTable', () => {
  it(
    'when rows arrive, then each shows use and budget in gallons, ' + 'percent, alerts and the age of its data',
    async () => {
      const { loader } = await setup();
      const table = await loader.getHarness(MatTableHarness);
      const cells = await table.getCellTextByColumnName();
      expect(cells['siteName']!.text[0]).toContain('Heron Flats HOA');
      expect(cells['useGallons']!.text).toEqual(['12,500 gal', '3,000 gal']);
      expect(cells['budgetGallons']!.text).toEqual(['10,000 gal', '—']);
      expect(cells['percentOfBudget']!.text).toEqual(['125 %', 'no budget']);
      expect(cells['openAlerts']!.text).toEqual(['2', '0']);
      expect(cells['lastDataAt']!.text[0]).toBe('3 h ago');
      expect(cells['lastDataAt']!.text[1]).toContain('13 d ago');
    },
  );

  it('when a header is clicked, then the sort is emitted for the server to apply', async () => {
    const { loader, sorts } = await setup();
    const sort = await loader.getHarness(MatSortHarness);
    const [header] = await sort.getSortHeaders({ label: 'Use' });
    await header!.click();
    expect(sorts).toEqual([{ sort: 'useGallons', dir: 'asc' }]);
  });

  it('when the next page is asked for, then the page change is emitted', async () => {
    const { loader, pages } = await setup();
    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    expect(pages).toEqual([{ pageIndex: 1, pageSize: 25 }]);
  });

  it(
    'when the screen is phone-wide, then only site, percent and latest ' +
      'data remain, and the site links to its overview',
    async () => {
      const { loader, fixture } = await setup(true);
      const table = await loader.getHarness(MatTableHarness);
      expect(await (await table.getHeaderRows())[0]!.getCellTextByColumnName()).toEqual({
        siteName: 'Site',
        percentOfBudget: 'Of budget',
        lastDataAt: 'Latest data',
      });
      const link = fixture.nativeElement.querySelector('a.site-link') as HTMLAnchorElement;
      expect(link.getAttribute('href')).toBe('/sites/1/overview');
    },
  );
});
