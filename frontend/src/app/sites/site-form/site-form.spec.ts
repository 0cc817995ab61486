import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';
import type { SiteLevel } from '@shared/auth/roles';
import type { SiteDto } from '@shared/sites/site';
import { SiteForm } from './site-form';

// Invented property.
function site(access: SiteLevel): SiteDto {
  return {
    id: 5,
    name: 'Cottonwood Flats Park',
    kind: 'park',
    address: '12 Sandwash Road, Dry Creek',
    timeZone: 'America/Phoenix',
    notes: 'Drip on shrub beds; turf on rotors.',
    tags: ['reclaimed'],
    organisationId: 3,
    organisationName: 'Bluestem Grounds Co.',
    access,
    shares: [
      { organisationId: 9, organisationName: 'Pinyon Water District', organisationKind: 'utility', access: 'read' },
    ],
    sharedWithYou: null,
    createdAt: '2026-01-01T00:00:00Z',
    updatedAt: '2026-01-01T00:00:00Z',
  };
}

describe('SiteForm', () => {
  let http: HttpTestingController;

  function nextRequest(method: string, url: string): Promise<TestRequest> {
    return vi.waitFor(() => http.expectOne({ method, url }));
  }

  async function openSite(access: SiteLevel) {
    TestBed.configureTestingModule({
      imports: [SiteForm],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(SiteForm);
    fixture.componentRef.setInput('id', '5');
    const loader = TestbedHarnessEnvironment.loader(fixture);
    TestBed.tick();
    (await nextRequest('GET', '/api/sites/5')).flush(site(access));
    await fixture.whenStable();
    const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
    const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
    return { fixture, loader, text, field };
  }

  afterEach(() => http.verify());

  it('when the user may only read the site, then shows its details and shares without a form or delete', async () => {
    const { loader, text } = await openSite('read');

    expect(await loader.getAllHarnesses(MatInputHarness)).toHaveLength(0);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Delete|Save/ }))).toHaveLength(0);
    expect(text()).toContain('12 Sandwash Road, Dry Creek');
    expect(text()).toContain('View only');
    expect(text()).toContain('Pinyon Water District');
  });

  it('when the user may edit but not own the site, then offers the form but no delete', async () => {
    const { loader, field } = await openSite('edit');

    expect(await (await (await field('Site name')).getControl(MatInputHarness))!.getValue()).toBe(
      'Cottonwood Flats Park',
    );
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Save changes' }))).toHaveLength(1);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Delete/ }))).toHaveLength(0);
  });

  it('when the time zone is unknown, then says so and sends nothing', async () => {
    const { loader, field } = await openSite('edit');
    await (await (await field('Time zone')).getControl(MatInputHarness))!.setValue('Mars/Olympus_Mons');

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save changes' }))).click();

    expect(await (await field('Time zone')).getTextErrors()).toEqual([
      'Pick a time zone from the list, e.g. America/Phoenix.',
    ]);
    http.expectNone({ method: 'PATCH' });
  });

  it('when the server reports a duplicate name, then shows its message under the name field', async () => {
    const { fixture, loader, field } = await openSite('edit');
    await (await (await field('Site name')).getControl(MatInputHarness))!.setValue('Sagebrush Commons');

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save changes' }))).click();
    const req = await nextRequest('PATCH', '/api/sites/5');
    expect(req.request.body).toMatchObject({
      name: 'Sagebrush Commons',
      timeZone: 'America/Phoenix',
      tags: ['reclaimed'],
    });
    req.flush(
      {
        error: {
          code: 'conflict',
          message: 'A site with this name already exists.',
          details: [{ field: 'name', message: 'Another site already has this name.' }],
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();

    expect(await (await field('Site name')).getTextErrors()).toEqual(['Another site already has this name.']);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain(
      'A site with this name already exists.',
    );
  });

  it('when the owner confirms deletion, then deletes the site and returns to the list', async () => {
    const { fixture, loader } = await openSite('own');
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);

    await (await loader.getHarness(MatButtonHarness.with({ text: /Delete/ }))).click();
    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Delete this site?');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Delete site' }))).click();

    (await nextRequest('DELETE', '/api/sites/5')).flush(null, { status: 204, statusText: 'No Content' });
    await vi.waitFor(() => expect(navigate).toHaveBeenCalledWith(['/sites']));
  });
});
