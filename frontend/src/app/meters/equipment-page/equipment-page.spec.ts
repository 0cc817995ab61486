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
import { provideRouter } from '@angular/router';
import type { SiteLevel } from '@shared/auth/roles';
import type { ControllerDto, MeterDto } from '@shared/meters/meter';
import type { SiteDto } from '@shared/sites/site';
import { EquipmentPage } from './equipment-page';

// Invented site and equipment.
const site = (access: SiteLevel): SiteDto => ({
  id: 4,
  name: 'Juniper Row Office Park',
  kind: 'office-park',
  address: '9 Caliche Way',
  timeZone: 'America/Los_Angeles',
  notes: '',
  tags: [],
  organisationId: 2,
  organisationName: 'Saltgrass Property Partners',
  access,
  shares: [],
  sharedWithYou: null,
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
});
// 07:30 UTC on 2 March is still 1 March on the site's clock.
const METER: MeterDto = {
  id: 31,
  siteId: 4,
  ref: 'JR-IRR-01',
  unit: 'ccf',
  registerMultiplier: 1,
  registerDigits: 6,
  purpose: 'dedicated-irrigation',
  waterSource: 'recycled',
  installedAt: '2025-03-02T07:30:00Z',
  removedAt: null,
  previousRegisters: [],
};
const CONTROLLER: ControllerDto = {
  id: 12,
  siteId: 4,
  ref: 'CTL-NORTH',
  name: 'North clock',
  zones: [
    {
      id: 1,
      controllerId: 12,
      station: '1',
      name: 'Entry turf',
      hydrozoneId: 8,
      designGpm: 12.5,
      emitterCount: null,
      emitterGph: null,
    },
    {
      id: 2,
      controllerId: 12,
      station: '2',
      name: 'Parking shrubs',
      hydrozoneId: null,
      designGpm: null,
      emitterCount: 40,
      emitterGph: 1,
    },
  ],
};
const HYDROZONES = { items: [{ id: 8, name: 'Front turf' }], total: 1, page: 0, pageSize: 200 };

describe('EquipmentPage', () => {
  let http: HttpTestingController;

  function nextRequest(match: { method: string; url: string }): Promise<TestRequest> {
    return vi.waitFor(() => http.expectOne(match));
  }

  async function openPage(access: SiteLevel, meters: MeterDto[] | 'fail' = [METER]) {
    TestBed.configureTestingModule({
      imports: [EquipmentPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(EquipmentPage);
    fixture.componentRef.setInput('id', '4');
    const loader = TestbedHarnessEnvironment.loader(fixture);
    TestBed.tick();
    (await nextRequest({ method: 'GET', url: '/api/sites/4' })).flush(site(access));
    const metersReq = await nextRequest({ method: 'GET', url: '/api/sites/4/meters' });
    if (meters === 'fail') metersReq.flush('down', { status: 503, statusText: 'Unavailable' });
    else metersReq.flush(meters);
    (await nextRequest({ method: 'GET', url: '/api/sites/4/controllers' })).flush([CONTROLLER]);
    (await nextRequest({ method: 'GET', url: '/api/sites/4/hydrozones?pageSize=200' })).flush(HYDROZONES);
    await fixture.whenStable();
    const text = () => ((fixture.nativeElement as HTMLElement).textContent ?? '').replace(/\s+/g, ' ');
    return { fixture, loader, text };
  }

  afterEach(() => http.verify());

  it(
    'when the page opens, then lists meters and each controller’s ' +
      'zones with units, site-calendar dates and the safety caution',
    async () => {
      const { loader, text } = await openPage('contribute');

      const meters = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Meters"]' }));
      expect(await (await meters.getRows())[0]!.getCellTextByColumnName()).toMatchObject({
        ref: 'JR-IRR-01',
        unit: 'CCF',
        multiplier: '× 1',
        digits: '6',
        purpose: 'Irrigation only',
        source: 'Recycled',
        installed: '2025-03-01',
        removed: 'In service',
      });

      const zones = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Zones of North clock"]' }));
      const cells = await Promise.all((await zones.getRows()).map((r) => r.getCellTextByColumnName()));
      expect(cells).toEqual([
        {
          station: '1',
          name: 'Entry turf',
          hydrozone: 'Front turf',
          designGpm: '12.5 gpm',
          emitters: '—',
          actions: 'edit',
        },
        {
          station: '2',
          name: 'Parking shrubs',
          hydrozone: 'Not linked',
          designGpm: '—',
          emitters: '40 × 1 gph',
          actions: 'edit',
        },
      ]);
      expect(text()).toContain("the controller's transformer runs on mains power");
      expect(text()).toContain('backflow prevention assemblies, to licensed professionals');
      expect(
        await loader.getAllHarnesses(MatButtonHarness.with({ text: /Add meter|Add controller|Add zone/ })),
      ).toHaveLength(3);
    },
  );

  it('when the user may only read the site, then offers no way to add, edit or delete', async () => {
    const { loader } = await openPage('read');

    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Add/ }))).toHaveLength(0);
    expect(
      await loader.getAllHarnesses(
        MatButtonHarness.with({ selector: '[aria-label^="Edit meter"], [aria-label^="Delete meter"]' }),
      ),
    ).toHaveLength(0);
    const meters = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Meters"]' }));
    expect(await meters.getHeaderRows().then((r) => r[0]!.getCellTextByIndex())).not.toContain('Actions');
  });

  it(
    'when a contributor adds a meter, then the dialog sends it with ' +
      'the install day at the site’s midnight and the list reloads',
    async () => {
      const { fixture, loader } = await openPage('contribute', []);
      await (await loader.getHarness(MatButtonHarness.with({ text: /Add meter/ }))).click();
      const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
      expect(await dialog.getTitleText()).toBe('New meter');
      const input = async (label: string) =>
        (await (
          await dialog.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))
        ).getControl(MatInputHarness))!;
      await (await input('Meter ref or serial')).setValue('  JR-IRR-02 ');
      await (await input('Register multiplier')).setValue('10');
      await (await input('Register digits')).setValue('5');
      await (await input('Installed on')).setValue('2026-03-08');
      const unit = await dialog.getHarness(MatSelectHarness.with({ selector: '[formControlName="unit"]' }));
      await unit.open();
      await unit.clickOptions({ text: 'kgal' });

      const clicked = (await dialog.getHarness(MatButtonHarness.with({ text: 'Add meter' }))).click();
      const post = await nextRequest({ method: 'POST', url: '/api/sites/4/meters' });
      expect(post.request.body).toEqual({
        ref: 'JR-IRR-02',
        unit: 'kgal',
        registerMultiplier: 10,
        registerDigits: 5,
        purpose: 'dedicated-irrigation',
        waterSource: 'potable',
        // Midnight on 8 March 2026 in Los Angeles is still PST (UTC−8); the clocks change at 02:00.
        installedAt: '2026-03-08T08:00:00.000Z',
        removedAt: null,
        previousRegisters: [],
      });
      post.flush({
        ...METER,
        id: 32,
        ref: 'JR-IRR-02',
        unit: 'kgal',
        registerMultiplier: 10,
        registerDigits: 5,
        waterSource: 'potable',
        installedAt: '2026-03-08T08:00:00.000Z',
      });
      (await nextRequest({ method: 'GET', url: '/api/sites/4/meters' })).flush([
        { ...METER, id: 32, ref: 'JR-IRR-02' },
      ]);
      await clicked;
      await fixture.whenStable();

      expect(
        await TestbedHarnessEnvironment.documentRootLoader(fixture).getAllHarnesses(MatDialogHarness),
      ).toHaveLength(0);
      const meters = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Meters"]' }));
      expect((await meters.getCellTextByColumnName())['ref']!.text).toEqual(['JR-IRR-02']);
    },
  );

  it(
    'when a contributor links a zone to its hydrozone, then the edit ' +
      'is sent for that zone and the controllers reload',
    async () => {
      const { fixture, loader } = await openPage('contribute');
      await (
        await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Edit zone 2 of North clock"]' }))
      ).click();
      const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
      expect(await dialog.getTitleText()).toBe('Edit zone 2 on North clock');
      const hydrozone = await dialog.getHarness(MatSelectHarness.with({ selector: '[formControlName="hydrozoneId"]' }));
      await hydrozone.open();
      await hydrozone.clickOptions({ text: 'Front turf' });

      const clicked = (await dialog.getHarness(MatButtonHarness.with({ text: 'Save zone' }))).click();
      const patch = await nextRequest({ method: 'PATCH', url: '/api/sites/4/controllers/12/zones/2' });
      expect(patch.request.body).toEqual({
        station: '2',
        name: 'Parking shrubs',
        hydrozoneId: 8,
        designGpm: null,
        emitterCount: 40,
        emitterGph: 1,
      });
      const linked = { ...CONTROLLER, zones: [CONTROLLER.zones[0]!, { ...CONTROLLER.zones[1]!, hydrozoneId: 8 }] };
      patch.flush(linked);
      (await nextRequest({ method: 'GET', url: '/api/sites/4/controllers' })).flush([linked]);
      await clicked;
      await fixture.whenStable();

      const zones = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Zones of North clock"]' }));
      expect((await zones.getCellTextByColumnName())['hydrozone']!.text).toEqual(['Front turf', 'Front turf']);
    },
  );

  it('when the meters fail to load, then says so and loads them again on request', async () => {
    const { fixture, loader, text } = await openPage('contribute', 'fail');
    expect(text()).toContain('The server ran into a problem.');

    const clicked = (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    (await nextRequest({ method: 'GET', url: '/api/sites/4/meters' })).flush([METER]);
    await clicked;
    await fixture.whenStable();
    expect(text()).not.toContain('ran into a problem');
    const meters = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Meters"]' }));
    expect((await meters.getCellTextByColumnName())['ref']!.text).toEqual(['JR-IRR-01']);
  });
});
