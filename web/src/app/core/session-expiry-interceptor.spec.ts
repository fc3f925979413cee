import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { Session } from './session';
import { sessionExpiryInterceptor } from './session-expiry-interceptor';

describe('sessionExpiryInterceptor', () => {
  let http: HttpClient;
  let server: HttpTestingController;
  const signedIn = signal(true);
  const forget = vi.fn(() => signedIn.set(false));
  const navigate = vi.fn(() => Promise.resolve(true));

  beforeEach(() => {
    signedIn.set(true);
    forget.mockClear();
    navigate.mockClear();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([sessionExpiryInterceptor])),
        provideHttpClientTesting(),
        { provide: Session, useValue: { signedIn, forget } },
        { provide: Router, useValue: { navigate } },
      ],
    });
    http = TestBed.inject(HttpClient);
    server = TestBed.inject(HttpTestingController);
  });

  afterEach(() => server.verify());

  const unauthenticated = { error: { code: 'unauthenticated', message: 'Sign in first.' } };

  it('forgets the user and opens the sign-in page when the server no longer knows them', async () => {
    const answer = firstValueFrom(http.get('/api/projects'));
    server.expectOne('/api/projects').flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });
    await expect(answer).rejects.toMatchObject({ status: 401 });
    expect(forget).toHaveBeenCalledOnce();
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { reason: 'expired' } });
  });

  it('leaves a refused sign-in to the sign-in page', async () => {
    const answer = firstValueFrom(http.post('/api/session', {}));
    server.expectOne('/api/session').flush({ error: { code: 'bad_credentials', message: 'No.' } }, { status: 401, statusText: 'Unauthorized' });
    await expect(answer).rejects.toMatchObject({ status: 401 });
    expect(forget).not.toHaveBeenCalled();
    expect(navigate).not.toHaveBeenCalled();
  });

  it('does nothing for a visitor who was not signed in', async () => {
    signedIn.set(false);
    const answer = firstValueFrom(http.get('/api/projects'));
    server.expectOne('/api/projects').flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });
    await expect(answer).rejects.toMatchObject({ status: 401 });
    expect(navigate).not.toHaveBeenCalled();
  });
});
