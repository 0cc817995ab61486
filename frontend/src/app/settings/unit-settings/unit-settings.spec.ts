import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import { capabilities, type Role } from '@shared/auth/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { UnitSystemStore } from '../../shared/unit-system/unit-system';
import { UnitSettings } from './unit-settings';

// An invented organisation.
const SETTINGS = { organisationId: 4, organisationName: 'Saltgrass Commons HOA', unitSystem: 'us' as const };

describe('UnitSettings', () => {
  let http: HttpTestingController;
  const next = (method: string, url: string): Promise<TestRequest> => vi.waitFor(() => http.expectOne({ method, url }));

  async function open(role: Role) {
    TestBed.configureTestingModule({
      imports: [UnitSettings],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: AuthStore, useValue: { capabilities: signal(capabilities(role)) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(UnitSettings);
    TestBed.tick();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
    return { fixture, loader, text };
  }

  afterEach(() => http.verify());

  it(
    'when an administrator picks metric and saves, then the organisation ' +
      'and the open pages switch to m³, mm and m²',
    async () => {
      const { fixture, loader, text } = await open('admin');
      (await next('GET', '/api/organisation/settings')).flush(SETTINGS);
      await fixture.whenStable();

      const group = await loader.getHarness(
        MatRadioGroupHarness.with({ selector: '[aria-label="Unit system for the organisation"]' }),
      );
      expect(await group.getCheckedValue()).toBe('us');
      const [us, metric] = await group.getRadioButtons();
      expect(await us!.getLabelText()).toContain('12,500 gal · 1.50 in · 8,000 ft²');
      expect(await metric!.getLabelText()).toContain('47.32 m³ · 38.0 mm · 743 m²');
      const save = await loader.getHarness(MatButtonHarness.with({ text: 'Save unit system' }));
      expect(await save.isDisabled()).toBe(true);

      await metric!.check();
      expect(await save.isDisabled()).toBe(false);
      await save.click();
      const req = await next('PATCH', '/api/organisation/settings');
      expect(req.request.body).toEqual({ unitSystem: 'metric' });
      req.flush({ ...SETTINGS, unitSystem: 'metric' });

      await vi.waitFor(() => expect(text()).toContain('Saved. Figures are now shown in Metric units.'));
      expect(TestBed.inject(UnitSystemStore).system()).toBe('metric');
      expect(TestBed.inject(UnitSystemStore).volume(264.172)).toBe('1.00 m³');
      expect(await save.isDisabled()).toBe(true);
    },
  );

  it('when the save is refused, then the message shows and the choice stays for another try', async () => {
    const { fixture, loader, text } = await open('admin');
    (await next('GET', '/api/organisation/settings')).flush(SETTINGS);
    await fixture.whenStable();
    const group = await loader.getHarness(MatRadioGroupHarness);
    await group.checkRadioButton({ label: /Metric/ });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save unit system' }))).click();
    (await next('PATCH', '/api/organisation/settings')).flush(
      { error: { code: 'forbidden', message: 'Only administrators can change organisation settings.', details: [] } },
      { status: 403, statusText: 'Forbidden' },
    );

    await vi.waitFor(() =>
      expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain(
        'Only administrators can change organisation settings.',
      ),
    );
    expect(await group.getCheckedValue()).toBe('metric');
    expect(TestBed.inject(UnitSystemStore).system()).toBe('us');
    expect(text()).not.toContain('Saved.');
  });

  it(
    'when an auditor opens it, then the system in force is shown ' + 'with its units and nothing can be changed',
    async () => {
      const { fixture, loader, text } = await open('auditor');
      (await next('GET', '/api/organisation/settings')).flush({ ...SETTINGS, unitSystem: 'metric' });
      await fixture.whenStable();

      expect(await loader.getAllHarnesses(MatRadioGroupHarness)).toHaveLength(0);
      expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Save/ }))).toHaveLength(0);
      expect(text()).toContain('Metric');
      expect(text()).toContain('cubic metres (m³), millimetres (mm), square metres (m²)');
      expect(text()).toContain('Only administrators can change the unit system.');
    },
  );

  it('when the settings cannot be loaded, then an error with a retry appears, and the retry loads them', async () => {
    const { fixture, loader, text } = await open('manager');
    (await next('GET', '/api/organisation/settings')).flush(null, { status: 503, statusText: 'Unavailable' });
    await fixture.whenStable();
    expect(text()).toContain('The server ran into a problem.');

    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Try again' }))).toHaveLength(1);
    // A native click: the harness would wait for the request this click starts, which only the test answers.
    (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('.rm-state-error button')!.click();
    (await next('GET', '/api/organisation/settings')).flush(SETTINGS);
    await fixture.whenStable();
    expect(text()).toContain('US customary');
    expect(text()).toContain('gallons (gal), inches (in), square feet (ft²)');
  });
});
