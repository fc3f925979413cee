import { HttpClient, provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { csrfCookieName, csrfHeaderName, csrfInterceptor } from './csrf-interceptor';

describe('csrfInterceptor', () => {
  let http: HttpClient;
  let server: HttpTestingController;

  beforeEach(() => {
    document.cookie = `${csrfCookieName}=stale; path=/`;
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(
          withXsrfConfiguration({ cookieName: csrfCookieName, headerName: csrfHeaderName }),
          withInterceptors([csrfInterceptor]),
        ),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpClient);
    server = TestBed.inject(HttpTestingController);
  });

  afterEach(() => server.verify());

  it('fetches a fresh token and sends a write refused for a stale token once more', async () => {
    const answer = firstValueFrom(http.post('/api/projects', { name: 'Rig' }));

    const first = server.expectOne('/api/projects');
    expect(first.request.headers.get(csrfHeaderName)).toBe('stale');
    first.flush({ error: { code: 'csrf', message: 'stale token' } }, { status: 403, statusText: 'Forbidden' });

    document.cookie = `${csrfCookieName}=fresh; path=/`;
    server.expectOne({ method: 'GET', url: '/api/session' }).flush({ user: null });

    const retry = server.expectOne('/api/projects');
    expect(retry.request.headers.get(csrfHeaderName)).toBe('fresh');
    retry.flush({ id: 'p1' });
    await expect(answer).resolves.toEqual({ id: 'p1' });
  });

  it('passes other refusals through without a retry', async () => {
    const answer = firstValueFrom(http.post('/api/projects', { name: 'Rig' }));
    server
      .expectOne('/api/projects')
      .flush({ error: { code: 'forbidden', message: 'Viewers cannot create projects.' } }, { status: 403, statusText: 'Forbidden' });
    await expect(answer).rejects.toMatchObject({ status: 403 });
  });
});
