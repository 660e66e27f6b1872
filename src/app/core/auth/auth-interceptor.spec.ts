import { HttpClient, HttpErrorResponse, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { AuthTokens, SessionUser } from '../../../../shared/schemas/auth';
import { authInterceptor } from './auth-interceptor';
import { AuthSession, SESSION_STORAGE_KEY } from './auth-session';
import { BROWSER_STORAGE, MemoryStorage } from '../browser-storage';

const coach: SessionUser = {
  id: 'user-coach',
  email: 'coach@example.org',
  displayName: 'Robin Coach',
  role: 'assistant_coach',
  clubId: 'club-1',
};

function tokens(n: number): AuthTokens {
  return { accessToken: `access-${n}`, refreshToken: `refresh-token-number-${n}`, user: coach };
}

const unauthorized = { status: 401, statusText: 'Unauthorized' };
const expiredBody = { error: { code: 'token_expired', message: 'Access token expired' } };

describe('authInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let session: AuthSession;
  let storage: MemoryStorage;
  let navigate: jasmine.Spy;

  beforeEach(() => {
    storage = new MemoryStorage();
    storage.setItem(SESSION_STORAGE_KEY, JSON.stringify({ ...tokens(1), club: null }));
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: BROWSER_STORAGE, useValue: storage },
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    session = TestBed.inject(AuthSession);
    navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
  });

  afterEach(() => backend.verify());

  it('adds the access token to API requests', () => {
    http.get('/api/squads').subscribe();
    const request = backend.expectOne('/api/squads');
    expect(request.request.headers.get('Authorization')).toBe('Bearer access-1');
    request.flush({ squads: [] });
  });

  it('sends no token to the login and refresh endpoints', () => {
    http.post('/api/auth/login', { email: 'a@b.org', password: 'x' }).subscribe();
    http.post('/api/auth/refresh', { refreshToken: 'r' }).subscribe();
    const login = backend.expectOne('/api/auth/login');
    const refresh = backend.expectOne('/api/auth/refresh');
    expect(login.request.headers.has('Authorization')).toBeFalse();
    expect(refresh.request.headers.has('Authorization')).toBeFalse();
    login.flush(tokens(2));
    refresh.flush(tokens(3));
  });

  it('never sends the token to another origin or to non-API paths', () => {
    http.get('https://maps.example.net/api/tiles').subscribe();
    http.get('/icons/icon-192.png', { responseType: 'blob' }).subscribe();
    const foreign = backend.expectOne('https://maps.example.net/api/tiles');
    const asset = backend.expectOne('/icons/icon-192.png');
    expect(foreign.request.headers.has('Authorization')).toBeFalse();
    expect(asset.request.headers.has('Authorization')).toBeFalse();
    foreign.flush({});
    asset.flush(new Blob());
  });

  it('refreshes once on a 401 and retries the request with the new token', () => {
    let body: unknown;
    http.get('/api/me').subscribe((value) => (body = value));

    backend.expectOne('/api/me').flush(expiredBody, unauthorized);
    const refresh = backend.expectOne('/api/auth/refresh');
    expect(refresh.request.body).toEqual({ refreshToken: 'refresh-token-number-1' });
    refresh.flush(tokens(2));

    const retry = backend.expectOne('/api/me');
    expect(retry.request.headers.get('Authorization')).toBe('Bearer access-2');
    retry.flush({ ok: true });

    expect(body).toEqual({ ok: true });
    expect(session.accessToken()).toBe('access-2');
    expect(JSON.parse(storage.getItem(SESSION_STORAGE_KEY) ?? '{}').refreshToken).toBe('refresh-token-number-2');
  });

  it('shares one refresh between concurrent 401s', () => {
    const answers: unknown[] = [];
    http.get('/api/squads').subscribe((value) => answers.push(value));
    http.get('/api/players').subscribe((value) => answers.push(value));
    http.get('/api/me').subscribe((value) => answers.push(value));

    backend.expectOne('/api/squads').flush(expiredBody, unauthorized);
    backend.expectOne('/api/players').flush(expiredBody, unauthorized);
    backend.expectOne('/api/me').flush(expiredBody, unauthorized);

    // expectOne fails if a second refresh was sent.
    backend.expectOne('/api/auth/refresh').flush(tokens(2));

    for (const url of ['/api/squads', '/api/players', '/api/me']) {
      const retry = backend.expectOne(url);
      expect(retry.request.headers.get('Authorization')).toBe('Bearer access-2');
      retry.flush({ url });
    }
    expect(answers.length).toBe(3);
  });

  it('retries without refreshing when another call already renewed the token', () => {
    http.get('/api/squads').subscribe();
    http.get('/api/players').subscribe();
    const squads = backend.expectOne('/api/squads');
    const players = backend.expectOne('/api/players');

    squads.flush(expiredBody, unauthorized);
    backend.expectOne('/api/auth/refresh').flush(tokens(2));
    backend.expectOne('/api/squads').flush({ squads: [] });

    // This one was sent with the old token and only fails now, after the refresh.
    players.flush(expiredBody, unauthorized);
    backend.expectNone('/api/auth/refresh');
    const retry = backend.expectOne('/api/players');
    expect(retry.request.headers.get('Authorization')).toBe('Bearer access-2');
    retry.flush({ players: [] });
  });

  it('retries only once: a second 401 reaches the caller without another refresh', () => {
    let failure: unknown;
    http.get('/api/me').subscribe({ error: (error: unknown) => (failure = error) });

    backend.expectOne('/api/me').flush(expiredBody, unauthorized);
    backend.expectOne('/api/auth/refresh').flush(tokens(2));
    backend.expectOne('/api/me').flush(expiredBody, unauthorized);
    backend.expectNone('/api/auth/refresh');

    expect(failure instanceof HttpErrorResponse && failure.status).toBe(401);
    expect(session.isSignedIn()).toBeTrue();
  });

  it('signs out and goes to the sign-in page when the refresh is rejected', () => {
    let failure: unknown;
    http.get('/api/squads').subscribe({ error: (error: unknown) => (failure = error) });

    backend.expectOne('/api/squads').flush(expiredBody, unauthorized);
    backend.expectOne('/api/auth/refresh').flush({ error: { code: 'invalid_token', message: 'Refresh token is not valid' } }, unauthorized);

    expect(session.isSignedIn()).toBeFalse();
    expect(storage.getItem(SESSION_STORAGE_KEY)).toBeNull();
    expect(navigate).toHaveBeenCalledOnceWith(['/sign-in'], jasmine.anything());
    expect(failure instanceof HttpErrorResponse && failure.status).toBe(401);
  });

  it('keeps the session when the refresh fails for want of network', () => {
    let failure: unknown;
    http.get('/api/squads').subscribe({ error: (error: unknown) => (failure = error) });

    backend.expectOne('/api/squads').flush(expiredBody, unauthorized);
    backend.expectOne('/api/auth/refresh').error(new ProgressEvent('error'));

    expect(session.isSignedIn()).toBeTrue();
    expect(navigate).not.toHaveBeenCalled();
    expect(failure instanceof HttpErrorResponse && failure.status).toBe(0);

    // The next 401 tries a fresh refresh instead of replaying the failed one.
    http.get('/api/squads').subscribe();
    backend.expectOne('/api/squads').flush(expiredBody, unauthorized);
    backend.expectOne('/api/auth/refresh').flush(tokens(2));
    backend.expectOne('/api/squads').flush({ squads: [] });
    expect(session.accessToken()).toBe('access-2');
  });

  it('passes other errors through untouched', () => {
    let failure: unknown;
    http.get('/api/squads').subscribe({ error: (error: unknown) => (failure = error) });
    backend.expectOne('/api/squads').flush({ error: { code: 'forbidden', message: 'No' } }, { status: 403, statusText: 'Forbidden' });
    backend.expectNone('/api/auth/refresh');
    expect(failure instanceof HttpErrorResponse && failure.status).toBe(403);
  });
});
