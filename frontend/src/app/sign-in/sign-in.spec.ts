import { HttpErrorResponse } from '@angular/common/http';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';
import type { ApiErrorBody } from '@shared/api/errors';
import { AuthStore } from '../core/auth/auth-store';
import { SignIn } from './sign-in';

describe('SignIn', () => {
  async function setUp(returnUrl?: string) {
    const auth = { signIn: vi.fn() };
    TestBed.configureTestingModule({
      imports: [SignIn],
      providers: [provideRouter([]), { provide: AuthStore, useValue: auth }],
    });
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    const fixture = TestBed.createComponent(SignIn);
    if (returnUrl) fixture.componentRef.setInput('returnUrl', returnUrl);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
    const submit = () => loader.getHarness(MatButtonHarness.with({ text: 'Sign in' })).then((button) => button.click());
    const alertText = () =>
      (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent?.trim() ?? null;
    return { fixture, auth, navigate, field, submit, alertText };
  }

  it('when submitted empty, then says what is missing and does not call the server', async () => {
    const { auth, field, submit } = await setUp();

    await submit();

    expect(await (await field('E-mail address')).getTextErrors()).toEqual(['Enter your e-mail address.']);
    expect(await (await field('Password')).getTextErrors()).toEqual(['Enter your password.']);
    expect(auth.signIn).not.toHaveBeenCalled();
  });

  it('when the e-mail address is malformed, then says so', async () => {
    const { auth, field, submit } = await setUp();
    const email = await (await field('E-mail address')).getControl(MatInputHarness);
    await email!.setValue('not-an-address');
    await (await (await field('Password')).getControl(MatInputHarness))!.setValue('long enough secret');

    await submit();

    expect(await (await field('E-mail address')).getTextErrors()).toEqual([
      'Enter an e-mail address like name@example.com.',
    ]);
    expect(auth.signIn).not.toHaveBeenCalled();
  });

  it('when the form is valid, then signs in through the auth store and goes to the return address', async () => {
    const { auth, navigate, field, submit } = await setUp('/sites/42');
    auth.signIn.mockResolvedValue({ id: 1 });
    await (await (await field('E-mail address')).getControl(MatInputHarness))!.setValue(' pat@example.test ');
    await (await (await field('Password')).getControl(MatInputHarness))!.setValue('correct horse staple');

    await submit();

    expect(auth.signIn).toHaveBeenCalledWith('pat@example.test', 'correct horse staple');
    expect(navigate).toHaveBeenCalledWith('/sites/42');
  });

  it('when the return address points off-site, then goes to the portfolio (home) instead', async () => {
    const { auth, navigate, field, submit } = await setUp('//elsewhere.example/phish');
    auth.signIn.mockResolvedValue({ id: 1 });
    await (await (await field('E-mail address')).getControl(MatInputHarness))!.setValue('pat@example.test');
    await (await (await field('Password')).getControl(MatInputHarness))!.setValue('correct horse staple');

    await submit();

    expect(navigate).toHaveBeenCalledWith('/portfolio');
  });

  it('when the server answers 401, then shows that the credentials are wrong and clears the password', async () => {
    const { auth, navigate, field, submit, alertText } = await setUp();
    const body: ApiErrorBody = { error: { code: 'unauthenticated', message: 'Invalid credentials.' } };
    auth.signIn.mockRejectedValue(new HttpErrorResponse({ status: 401, error: body }));
    await (await (await field('E-mail address')).getControl(MatInputHarness))!.setValue('pat@example.test');
    const password = (await (await field('Password')).getControl(MatInputHarness))!;
    await password.setValue('wrong password here');

    await submit();

    expect(alertText()).toContain('The e-mail address or password is not correct.');
    expect(await password.getValue()).toBe('');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('when the server rate-limits (429), then shows its message', async () => {
    const { auth, field, submit, alertText } = await setUp();
    const body: ApiErrorBody = {
      error: { code: 'rate_limited', message: 'Too many attempts. Try again in 15 minutes.' },
    };
    auth.signIn.mockRejectedValue(new HttpErrorResponse({ status: 429, error: body }));
    await (await (await field('E-mail address')).getControl(MatInputHarness))!.setValue('pat@example.test');
    await (await (await field('Password')).getControl(MatInputHarness))!.setValue('whatever it is');

    await submit();

    expect(alertText()).toContain('Too many attempts. Try again in 15 minutes.');
  });
});
