import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { AuthStore } from '../auth/auth-store';
import { unauthorizedInterceptor } from './unauthorized-interceptor';

describe('unauthorizedInterceptor', () => {
  function setUp(currentUrl: string) {
    const auth = { forget: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([unauthorizedInterceptor])),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: AuthStore, useValue: auth },
      ],
    });
    const router = TestBed.inject(Router);
    vi.spyOn(router, 'url', 'get').mockReturnValue(currentUrl);
    const navigate = vi.spyOn(router, 'navigate').mockResolvedValue(true);
    return { auth, navigate, http: TestBed.inject(HttpTestingController), client: TestBed.inject(HttpClient) };
  }

  const unauthenticated = { error: { code: 'unauthenticated', message: 'Sign in first.' } };

  it(
    'when a data request answers 401, then forgets the user and sends ' + 'them to sign in, coming back afterwards',
    async () => {
      const { auth, navigate, http, client } = setUp('/sites/7');
      const loading = firstValueFrom(client.get('/api/sites/7'));
      http.expectOne('/api/sites/7').flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });

      await expect(loading).rejects.toMatchObject({ status: 401 });
      expect(auth.forget).toHaveBeenCalled();
      expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: '/sites/7' } });
    },
  );

  it('when the session check or sign-in answers 401, then leaves the answer to the caller', async () => {
    const { auth, navigate, http, client } = setUp('/sign-in');
    const me = firstValueFrom(client.get('/api/auth/me'));
    http.expectOne('/api/auth/me').flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });
    const signIn = firstValueFrom(client.post('/api/auth/sign-in', {}));
    http.expectOne('/api/auth/sign-in').flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });

    await expect(me).rejects.toMatchObject({ status: 401 });
    await expect(signIn).rejects.toMatchObject({ status: 401 });
    expect(auth.forget).not.toHaveBeenCalled();
    expect(navigate).not.toHaveBeenCalled();
  });

  it('when a request is forbidden (403), then does not redirect', async () => {
    const { navigate, http, client } = setUp('/admin/users');
    const loading = firstValueFrom(client.get('/api/users'));
    http
      .expectOne('/api/users')
      .flush({ error: { code: 'forbidden', message: 'No.' } }, { status: 403, statusText: 'Forbidden' });

    await expect(loading).rejects.toMatchObject({ status: 403 });
    expect(navigate).not.toHaveBeenCalled();
  });
});
