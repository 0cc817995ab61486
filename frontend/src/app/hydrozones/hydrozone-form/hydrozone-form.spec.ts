import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { HydrozoneDto } from '@shared/hydrozones/hydrozone-dto';
import { HydrozoneForm, type HydrozoneFormData } from './hydrozone-form';

describe('HydrozoneForm', () => {
  let http: HttpTestingController;
  const close = vi.fn();

  async function open(data: Partial<HydrozoneFormData> = {}) {
    close.mockReset();
    TestBed.configureTestingModule({
      imports: [HydrozoneForm],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MAT_DIALOG_DATA, useValue: { siteId: 7, zone: null, areaUnit: 'ft2', ...data } },
        { provide: MatDialogRef, useValue: { close } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(HydrozoneForm);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
    const input = async (label: string) => (await (await field(label)).getControl(MatInputHarness))!;
    const select = async (label: string) => (await (await field(label)).getControl(MatSelectHarness))!;
    const errorsOf = async (label: string) => (await field(label)).getTextErrors();
    const submit = async (text: RegExp) => (await loader.getHarness(MatButtonHarness.with({ text }))).click();
    return { fixture, loader, input, select, errorsOf, submit };
  }

  afterEach(() => http.verify());

  it('when the figures are out of range, then each field says what is wrong and nothing is sent', async () => {
    const { loader, input, select, errorsOf, submit } = await open();
    await (await input('Hydrozone name')).setValue('Bed by the gate');
    await (await input('Irrigated area')).setValue('0');
    await (await select('Plant water use')).open();
    await (await select('Plant water use')).clickOptions({ text: /^Low/ });
    await (await input('Plant factor')).setValue('0.5');
    await (await select('Irrigation method')).open();
    await (await select('Irrigation method')).clickOptions({ text: /^Drip/ });
    await (await input('Irrigation efficiency (override)')).setValue('1.2');
    await (await loader.getHarness(MatCheckboxHarness)).check();

    await submit(/Add hydrozone/);

    expect(await errorsOf('Irrigated area')).toEqual(['Area must be greater than 0.']);
    expect(await errorsOf('Plant factor')).toEqual(['Outside the low range 0.1–0.3.']);
    expect(await errorsOf('Irrigation efficiency (override)')).toEqual(['Efficiency must be above 0 and at most 1.']);
    expect(await errorsOf('Why it is special')).toEqual(['Say why: recycled water, edible plants or recreation turf.']);
    http.expectNone('/api/sites/7/hydrozones');
    expect(close).not.toHaveBeenCalled();
  });

  it('when neither a category nor a plant factor is given, then the plant factor asks for one', async () => {
    const { input, errorsOf, submit } = await open();
    await (await input('Hydrozone name')).setValue('Bare bed');
    await (await input('Irrigated area')).setValue('100');
    await submit(/Add hydrozone/);
    expect(await errorsOf('Plant factor')).toEqual(['Choose a plant water use or enter a plant factor.']);
    http.expectNone('/api/sites/7/hydrozones');
  });

  it('when the area is entered in m², then the request carries the m² figure and unit', async () => {
    const { loader, input, select, submit } = await open();
    await (await input('Hydrozone name')).setValue('Play lawn');
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'm²' }))).check();
    await (await input('Irrigated area')).setValue('250');
    await (await input('Plant factor')).setValue('0.8');
    await (await select('Irrigation method')).open();
    await (await select('Irrigation method')).clickOptions({ text: /^Rotor/ });

    await submit(/Add hydrozone/);

    const req = await vi.waitFor(() => http.expectOne({ method: 'POST', url: '/api/sites/7/hydrozones' }));
    expect(req.request.body).toMatchObject({
      name: 'Play lawn',
      area: 250,
      areaUnit: 'm2',
      plantFactor: 0.8,
      irrigationMethod: 'rotor',
      plantWaterUse: null,
    });
    req.flush({ id: 1, name: 'Play lawn' } as HydrozoneDto);
    await vi.waitFor(() => expect(close).toHaveBeenCalledWith(expect.objectContaining({ id: 1 })));
  });

  it('when switching an existing area from ft² to m², then the number is converted, not reinterpreted', async () => {
    const zone = {
      id: 3,
      name: 'Beds',
      areaFt2: 1076.39,
      plantWaterUse: 'low',
      plantFactor: null,
      irrigationMethod: 'drip',
      efficiencyOverride: null,
      specialLandscapeArea: false,
      specialLandscapeKind: null,
      designFlowGpm: null,
      emitterCount: null,
      emitterGph: null,
      soilIntakeInPerHour: null,
      notes: '',
    } as unknown as HydrozoneDto;
    const { loader, input } = await open({ zone });
    expect(await (await input('Irrigated area')).getValue()).toBe('1076.39');
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'm²' }))).check();
    // 1,076.39 ft² × 0.09290304 m²/ft² = 100.00 m²
    expect(await (await input('Irrigated area')).getValue()).toBe('100');
  });
});
