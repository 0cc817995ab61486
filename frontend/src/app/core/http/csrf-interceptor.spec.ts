import { HttpClient, provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { csrfInterceptor } from './csrf-interceptor';

describe('csrfInterceptor', () => {
  let http: HttpTestingController;
  let client: HttpClient;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(
          withInterceptors([csrfInterceptor]),
          withXsrfConfiguration({ cookieName: 'XSRF-TOKEN', headerName: 'X-XSRF-TOKEN' }),
        ),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
  });

  afterEach(() => http.verify());

  function next(method: string, url: string): Promise<TestRequest> {
    return vi.waitFor(() => http.expectOne({ method, url }));
  }

  it('when no token is known yet, then fetches one before the first state-changing request', async () => {
    const saving = firstValueFrom(client.post('/api/sites', { name: 'Cottonwood Flats Park' }));

    (await next('GET', '/api/auth/csrf')).flush({ token: 'first-token' });
    const post = await next('POST', '/api/sites');
    expect(post.request.headers.get('X-XSRF-TOKEN')).toBe('first-token');
    post.flush({ id: 1 });
    await expect(saving).resolves.toEqual({ id: 1 });
  });

  it('when the server rejects the token, then fetches a fresh one and retries once', async () => {
    const saving = firstValueFrom(client.patch('/api/sites/1', { name: 'Renamed' }));
    (await next('GET', '/api/auth/csrf')).flush({ token: 'stale' });
    (await next('PATCH', '/api/sites/1')).flush(
      { error: { code: 'csrf_invalid', message: 'The security token is out of date.' } },
      { status: 403, statusText: 'Forbidden' },
    );

    (await next('GET', '/api/auth/csrf')).flush({ token: 'fresh' });
    const retry = await next('PATCH', '/api/sites/1');
    expect(retry.request.headers.get('X-XSRF-TOKEN')).toBe('fresh');
    retry.flush({ id: 1 });
    await expect(saving).resolves.toEqual({ id: 1 });
  });

  it('when a read is made, then adds nothing and fetches no token', async () => {
    const reading = firstValueFrom(client.get('/api/sites'));
    const get = await next('GET', '/api/sites');
    expect(get.request.headers.has('X-XSRF-TOKEN')).toBe(false);
    get.flush([]);
    await reading;
    http.expectNone('/api/auth/csrf');
  });
});
