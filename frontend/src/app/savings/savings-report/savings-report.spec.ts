import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { SavingsReportDto } from '@shared/savings/savings-project-dto';
import { SavingsReport } from './savings-report';

// An invented site and a report whose model fails Guideline 14.
const report = {
  project: {
    id: 7,
    siteId: 3,
    siteName: 'Larkspur Green',
    title: 'Path drip retrofit',
    changeKind: 'spray-to-drip',
    changeDescription: '',
    installedOn: '2026-04-14',
    baselineFrom: '2025-04',
    baselineTo: '2026-03',
    reportingFrom: '2026-05',
    reportingTo: '2026-09',
    modelForm: 'eto',
    createdBy: null,
    createdAt: '',
    updatedAt: '',
  },
  site: { id: 3, name: 'Larkspur Green', timeZone: 'America/Denver' },
  station: { id: 1, name: 'Dry Creek station' },
  baselineMonths: [],
  reportingMonths: [],
  model: {
    form: 'eto',
    equation: 'use (gal/month) = base use + b × ETo (mm/month)',
    coefficients: [],
    statistics: {
      n: 12,
      p: 2,
      meanActual: 1,
      rSquared: 0.41,
      adjustedRSquared: 0.35,
      rmse: 1,
      cvRmsePercent: 31.2,
      nmbePercent: 0,
    },
    baselineDays: 365,
  },
  savings: {
    periods: [],
    predictedGal: 100_000,
    actualGal: 80_000,
    savedGal: 20_000,
    savedPercent: 20,
    savedMoney: 61.5,
    currency: 'USD',
    uncertainty: {
      confidence: 0.68,
      degreesOfFreedom: 10,
      t: 1,
      standardErrorGal: 15_000,
      plusMinusGal: 15_500,
      fractional: 0.78,
    },
  },
  verdict: {
    canClaimSavings: false,
    baselineModelAcceptable: false,
    route: null,
    reasons: [],
    summary:
      'The baseline model is not good enough to claim savings because ' +
      'its CV(RMSE) is 31.2 %, above the 20 % Guideline 14 allows.',
    checks: [
      {
        id: 'cv-rmse',
        label: 'CV(RMSE)',
        value: 31.2,
        limit: '≤ 20 %',
        passed: false,
        source: 'ASHRAE Guideline 14-2002 §5.2.11',
      },
    ],
    criteria: {
      standard: 'ASHRAE Guideline 14-2002',
      clause: '§5.2.11',
      version: 'Rillmark savings criteria, version 1 (December 2026)',
    },
  },
  warnings: [],
  method: ['We fitted a straight-line model.'],
} as unknown as SavingsReportDto;

describe('SavingsReport', () => {
  it(
    'when the model fails Guideline 14, then the verdict, the failed ' + 'check and the figures with units are shown',
    async () => {
      TestBed.configureTestingModule({
        imports: [SavingsReport],
        providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
      });
      const http = TestBed.inject(HttpTestingController);
      const fixture = TestBed.createComponent(SavingsReport);
      fixture.componentRef.setInput('id', '7');
      TestBed.tick();
      (await vi.waitFor(() => http.expectOne('/api/savings-projects/7/report'))).flush(report);
      await vi.waitFor(() =>
        expect((fixture.nativeElement as HTMLElement).textContent).toContain('not good enough to claim savings'),
      );
      fixture.detectChanges();
      const text = (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');
      expect(text).toContain('20,000 gal');
      expect(text).toContain('20.0 %');
      expect(text).toContain('61.50 USD');
      expect(text).toContain('31.2 %');
      expect(text).toMatch(/≤ 20 %\s*fail/);
      // What a client may read: the standard and the criteria version, never a provenance note.
      expect(text).toContain('Criteria applied: Rillmark savings criteria, version 1');
      expect(text).not.toMatch(/from memory/i);
      (await vi.waitFor(() => http.expectOne((r) => r.url === '/api/savings-projects/7/history'))).flush({
        items: [{ at: '2026-05-01T10:00:00Z', userName: 'Dana Ruiz', action: 'Created the project', lines: [] }],
        total: 1,
        page: 0,
        pageSize: 100,
      });
      await vi.waitFor(() => expect((fixture.nativeElement as HTMLElement).textContent).toContain('Dana Ruiz'));
      expect(
        (fixture.nativeElement as HTMLElement).querySelector('a[href="/api/savings-projects/7/report.pdf"]'),
      ).not.toBeNull();
      http.verify();
    },
  );
});
