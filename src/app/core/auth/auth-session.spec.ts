import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import type { AuthTokens, MeResponse, SessionUser } from '../../../../shared/schemas/auth';
import { AuthSession, SESSION_STORAGE_KEY, SessionExpiredError } from './auth-session';
import { BROWSER_STORAGE, MemoryStorage } from '../browser-storage';
import { LOFTLINE_DB, type LoftlineDb } from '../loftline-db';
import { freshDb } from '../spec-support';

const player: SessionUser = {
  id: 'user-player',
  email: 'player@example.org',
  displayName: 'Sam Player',
  role: 'player',
  clubId: 'club-1',
};

const signedIn: AuthTokens = { accessToken: 'access-1', refreshToken: 'refresh-token-number-1', user: player };

describe('AuthSession', () => {
  let storage: MemoryStorage;
  let backend: HttpTestingController;

  function setUp(): AuthSession {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: storage },
        { provide: LOFTLINE_DB, useValue: db },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    return TestBed.inject(AuthSession);
  }

  let db: LoftlineDb;

  beforeEach(() => {
    storage = new MemoryStorage();
    db = freshDb();
  });

  afterEach(async () => {
    backend.verify();
    db.close();
    await db.delete();
  });

  it('starts signed out on a fresh device', () => {
    const session = setUp();
    expect(session.isSignedIn()).toBeFalse();
    expect(session.user()).toBeNull();
  });

  it('stores the tokens and user on sign-in so the next visit starts signed in', async () => {
    const session = setUp();
    const user = new Promise<SessionUser>((resolve) => session.signIn({ email: 'player@example.org', password: 'pw' }).subscribe(resolve));
    const request = backend.expectOne('/api/auth/login');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'player@example.org', password: 'pw' });
    request.flush(signedIn);

    // The device is handed over (DeviceHandover) before the session is stored.
    expect(await user).toEqual(player);
    expect(session.accessToken()).toBe('access-1');
    expect(JSON.parse(storage.getItem(SESSION_STORAGE_KEY) ?? 'null')).toEqual({ ...signedIn, club: null });
  });

  it('restores a stored session', () => {
    storage.setItem(SESSION_STORAGE_KEY, JSON.stringify({ ...signedIn, club: { id: 'club-1', name: 'Harbour Academy' } }));
    const session = setUp();
    expect(session.user()).toEqual(player);
    expect(session.role()).toBe('player');
    expect(session.club()?.name).toBe('Harbour Academy');
  });

  it('ignores a stored session that is corrupt or of an unknown shape', () => {
    storage.setItem(SESSION_STORAGE_KEY, JSON.stringify({ ...signedIn, user: { ...player, role: 'chairman' }, club: null }));
    expect(setUp().isSignedIn()).toBeFalse();
    TestBed.resetTestingModule();
    storage.setItem(SESSION_STORAGE_KEY, '{not json');
    expect(setUp().isSignedIn()).toBeFalse();
  });

  it('signs out at once and asks the server to revoke the refresh token', () => {
    storage.setItem(SESSION_STORAGE_KEY, JSON.stringify({ ...signedIn, club: null }));
    const session = setUp();
    session.signOut();
    expect(session.isSignedIn()).toBeFalse();
    expect(storage.getItem(SESSION_STORAGE_KEY)).toBeNull();
    const logout = backend.expectOne('/api/auth/logout');
    expect(logout.request.body).toEqual({ refreshToken: 'refresh-token-number-1' });
    expect(logout.request.headers.get('Authorization')).toBe('Bearer access-1');
    // Best effort: a failing logout call changes nothing.
    logout.error(new ProgressEvent('error'));
    expect(session.isSignedIn()).toBeFalse();
  });

  it('rejects a refresh without a refresh token as an expired session', () => {
    const session = setUp();
    let failure: unknown;
    session.refresh().subscribe({ error: (error: unknown) => (failure = error) });
    expect(failure).toBeInstanceOf(SessionExpiredError);
    backend.expectNone('/api/auth/refresh');
  });

  it('keeps the club from GET /api/me for the shell', () => {
    storage.setItem(SESSION_STORAGE_KEY, JSON.stringify({ ...signedIn, club: null }));
    const session = setUp();
    const me: MeResponse = {
      user: { ...player, displayName: 'Sam P.' },
      club: { id: 'club-1', name: 'Harbour Academy' },
      playerId: 'player-7',
      childPlayerIds: [],
    };
    session.rememberProfile(me);
    expect(session.club()?.name).toBe('Harbour Academy');
    expect(session.user()?.displayName).toBe('Sam P.');
    expect(JSON.parse(storage.getItem(SESSION_STORAGE_KEY) ?? 'null').club.name).toBe('Harbour Academy');
  });

  it('does not take a profile of another user', () => {
    storage.setItem(SESSION_STORAGE_KEY, JSON.stringify({ ...signedIn, club: null }));
    const session = setUp();
    session.rememberProfile({
      user: { ...player, id: 'someone-else' },
      club: { id: 'club-2', name: 'Other Club' },
      playerId: null,
      childPlayerIds: [],
    });
    expect(session.club()).toBeNull();
  });
});
