import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';
import type { AlertDetailDto } from '@shared/alerts/alert-dto';
import { AlertDetail } from './alert-detail';

// Invented site and numbers only.
function alert(extra: Partial<AlertDetailDto> = {}): AlertDetailDto {
  return {
    id: 7,
    siteId: 3,
    siteName: 'Bramblecourt Commons',
    timeZone: 'America/Denver',
    kind: 'leak',
    subKind: 'continuous-flow',
    zoneId: null,
    zoneName: null,
    periodStartUtc: '2026-11-10T07:00:00Z',
    periodEndUtc: '2026-11-12T07:00:00Z',
    severity: 'act-soon',
    status: 'open',
    ongoing: false,
    waterLostGal: 1234.4,
    moneyLost: { amount: 18.5, currency: 'USD' },
    firstDetectedAt: '2026-11-11T07:00:00Z',
    lastSeenAt: '2026-11-12T07:00:00Z',
    reopenCount: 0,
    evidence: {
      numbers: { hoursFlowing: 48, lowestHourGal: 25.7 },
      series: [],
      suspectZoneIds: [],
      detectedAtUtc: '2026-11-11T07:00:00Z',
    },
    explanation: 'The meter never stopped for 48 hours in a row.',
    events: [
      { id: 1, action: 'opened', note: null, at: '2026-11-12T09:00:00Z', userId: null, userName: 'Nightly watch' },
    ],
    canAct: true,
    resolution: null,
    repairedAt: null,
    verification: null,
    ...extra,
  };
}

describe('AlertDetail', () => {
  async function setUp(dto: AlertDetailDto) {
    TestBed.configureTestingModule({
      imports: [AlertDetail],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const fixture = TestBed.createComponent(AlertDetail);
    fixture.componentRef.setInput('id', '7');
    const http = TestBed.inject(HttpTestingController);
    TestBed.tick();
    // The request starts inside the resource's effect.
    (await vi.waitFor(() => http.expectOne('/api/alerts/7'))).flush(dto);
    await fixture.whenStable();
    return { fixture, http, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('shows the loss with units, times in the site zone, and the actions for someone who may act', async () => {
    const { fixture, loader } = await setUp(alert());
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('1,234 gal');
    expect(text).toContain('18.50 USD');
    expect(text).toContain('Nov 10, 2026, 12:00 AM MST');
    expect(text).toContain('Hours of flow without a break48 h');
    expect(text).toContain('25.7 gal');
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: 'Acknowledge' }))).isDisabled()).toBe(false);
  });

  it('hides every action from a read-only user', async () => {
    const { loader } = await setUp(alert({ canAct: false }));
    expect(
      await loader.getAllHarnesses(MatButtonHarness.with({ text: /Acknowledge|Mark resolved|Add note/ })),
    ).toHaveLength(0);
  });

  it('sends the note with an acknowledgement and shows the new status', async () => {
    const { fixture, http, loader } = await setUp(alert());
    (fixture.componentInstance as unknown as { note: string }).note = 'Crew booked';
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Acknowledge' }))).click();
    const req = await vi.waitFor(() => http.expectOne('/api/alerts/7/acknowledge'));
    expect(req.request.body).toEqual({ note: 'Crew booked' });
    req.flush(
      alert({
        status: 'acknowledged',
        events: [
          ...alert().events,
          {
            id: 2,
            action: 'acknowledged',
            note: 'Crew booked',
            at: '2026-11-12T10:00:00Z',
            userId: 5,
            userName: 'Rowan Test',
          },
        ],
      }),
    );
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('status: acknowledged');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Acknowledge' }))).toHaveLength(0);
  });

  it('resolves as fixed with the day of the repair, then shows the repair being checked', async () => {
    const { fixture, http, loader } = await setUp(alert());
    (fixture.componentInstance as unknown as { repairedOn: string }).repairedOn = '2026-11-13';
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Mark resolved' }))).click();
    const req = await vi.waitFor(() => http.expectOne('/api/alerts/7/resolve'));
    expect(req.request.body).toEqual({ resolution: 'fixed', repairedOn: '2026-11-13' });
    req.flush(
      alert({
        status: 'resolved',
        resolution: 'fixed',
        repairedAt: '2026-11-14T07:00:00Z',
        verification: { status: 'watching', decidedAt: null, numbers: {}, series: [], explanation: null },
      }),
    );
    // Under load the re-render can land after the first stable point: wait for the section itself.
    await vi.waitFor(async () => {
      await fixture.whenStable();
      const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
      expect(text).toContain('Repair check: Repair being checked against the meter');
      expect(text).toContain('Repaired by Nov 14, 2026, 12:00 AM MST');
    });
  });
});
