import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { ComplianceReportDto, ComplianceRowDto } from '@shared/reports/compliance-report-dto';
import type { Role } from '@shared/auth/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { CompliancePage } from './compliance-page';

// Invented sites only.
function row(rank: number, siteName: string, percentOfBudget: number | null): ComplianceRowDto {
  return {
    rank,
    siteId: rank,
    siteName,
    siteKind: 'park',
    ownerId: 5,
    organisationName: 'Bluestem Grounds Co.',
    tags: [],
    group: percentOfBudget === null ? 'no-budget' : percentOfBudget > 100 ? 'over-budget' : 'incomplete-data',
    openAlerts: rank - 1,
    useGal: 1000 * rank,
    budgetGal: percentOfBudget === null ? null : 900,
    fullBudgetGal: percentOfBudget === null ? null : 900,
    allowanceShare: null,
    percentOfBudget,
    annualUseGal: 0,
    annualMawaGal: null,
    annualAllowanceGal: null,
    annualPercentOfMawa: null,
    completeness: 0.5,
    presentDays: 15,
    expectedDays: 30,
    trendPercent: -12.5,
    lastYearUseGal: 1200,
    problem: percentOfBudget === null ? 'no hydrozones' : null,
    noticeSentAt: null,
  };
}

describe('CompliancePage', () => {
  let http: HttpTestingController;
  const next = (url: string): Promise<TestRequest> => vi.waitFor(() => http.expectOne((req) => req.url === url));

  async function setUp(role: Role) {
    TestBed.configureTestingModule({
      imports: [CompliancePage],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: AuthStore, useValue: { user: signal({ organisation: { role } }) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(CompliancePage);
    TestBed.tick();
    (await next('/api/sites/tags')).flush([]);
    (await next('/api/sites')).flush({ items: [], total: 0, page: 0, pageSize: 200 });
    (await next('/api/organisation/settings')).flush({ unitSystem: 'us' });
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  afterEach(() => http.verify());

  it(
    'when an auditor opens it, then the ranking shows units, bars ' + 'and a send action only for sites over budget',
    async () => {
      const { fixture, loader } = await setUp('auditor');
      const req = await next('/api/reports/compliance');
      expect(req.request.params.get('sort')).toBe('rank');
      expect(req.request.params.get('month')).toMatch(/^\d{4}-\d{2}$/);
      const report: ComplianceReportDto = {
        year: 2026,
        month: '2026-06',
        period: { from: '2026-06-01', to: '2026-06-30' },
        basis: "Metered use in 2026-06 against that month's water budget.",
        allowanceLabel: "The month's water budget.",
        owners: [{ id: 5, name: 'Bluestem Grounds Co.' }],
        groups: [
          { group: 'over-budget', label: 'Over budget', count: 1 },
          { group: 'incomplete-data', label: 'Incomplete data', count: 1 },
          { group: 'no-budget', label: 'No budget', count: 1 },
        ],
        items: [row(1, 'Larkspur Green', 140), row(2, 'Dry Creek Park', 80), row(3, 'Ochre Yard', null)],
        total: 3,
        page: 0,
        pageSize: 25,
      };
      req.flush(report);
      await fixture.whenStable();
      const rows = await (await loader.getHarness(MatTableHarness)).getRows();
      const cells = await Promise.all(rows.map((r) => r.getCellTextByColumnName()));
      expect(cells[0]!['use']).toBe('1,000 gal');
      expect(cells[0]!['percent']).toContain('140 %');
      expect(cells[0]!['completeness']).toBe('50 %');
      expect(cells[0]!['trend']).toBe('-12.5 %');
      expect(cells[0]!['notice']).toContain('Send');
      expect(cells[1]!['notice']).not.toContain('Send');
      expect(cells[2]!['percent']).toContain('no hydrozones');
      // Groups in words, never codes.
      expect(cells[0]!['group']).toBe('Over budget');
      expect(cells[1]!['group']).toBe('Incomplete data');
      expect(cells[1]!['alerts']).toBe('1');
    },
  );

  it('when a column header is clicked, then the server is asked for that order from the first page', async () => {
    const { fixture, loader } = await setUp('manager');
    (await next('/api/reports/compliance')).flush({
      year: 2026,
      month: null,
      period: { from: '2026-01-01', to: '2026-12-31' },
      basis: '',
      allowanceLabel: '',
      owners: [],
      groups: [],
      items: [row(1, 'Larkspur Green', 140)],
      total: 1,
      page: 0,
      pageSize: 25,
    });
    await fixture.whenStable();
    expect(await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Site' })).toHaveLength(1);
    // A native click: the harness would wait for the request this click starts, which only the test answers.
    (fixture.nativeElement as HTMLElement)
      .querySelector<HTMLElement>('th.mat-column-name [role="button"], th.mat-column-name .mat-sort-header-container')!
      .click();
    TestBed.tick();
    const req = await next('/api/reports/compliance');
    expect(req.request.params.get('sort')).toBe('name');
    expect(req.request.params.get('page')).toBe('0');
    req.flush({
      year: 2026,
      month: null,
      period: { from: '2026-01-01', to: '2026-12-31' },
      basis: '',
      allowanceLabel: '',
      owners: [],
      groups: [],
      items: [],
      total: 0,
      page: 0,
      pageSize: 25,
    });
  });

  it('when a contractor opens it, then no ranking is requested', async () => {
    const { fixture } = await setUp('contractor');
    await fixture.whenStable();
    http.expectNone((req) => req.url === '/api/reports/compliance');
    expect(fixture.nativeElement.textContent).not.toContain('Budget worklist');
  });
});
