import { HttpClient, HttpErrorResponse, HttpHeaders } from '@angular/common/http';
import { DestroyRef, Injectable, Injector, PendingTasks, computed, inject, signal } from '@angular/core';
import { Observable, catchError, finalize, from, map, shareReplay, switchMap, tap, throwError } from 'rxjs';
import { ROLES, type Role } from '../../../../shared/roles';
import type { AuthTokens, LoginRequest, MeResponse, SessionUser } from '../../../../shared/schemas/auth';
import { BROWSER_STORAGE } from '../browser-storage';

/** The localStorage key of the persisted session (versioned so a format change can start clean). */
export const SESSION_STORAGE_KEY = 'loftline.session.v1';

/** The club the signed-in user belongs to, as `GET /api/me` names it. */
export interface SessionClub {
  id: string;
  name: string;
}

/** What is kept between visits: enough to call the API and draw the shell while offline. */
interface StoredSession {
  accessToken: string;
  refreshToken: string;
  user: SessionUser;
  club: SessionClub | null;
}

/**
 * Thrown by {@link AuthSession.refresh} when the server rejected the refresh token (or there
 * was none): the user has to sign in again. A network failure is *not* this error, because a
 * coach on a pitch without signal must stay signed in.
 */
export class SessionExpiredError extends Error {
  constructor() {
    super('The session has expired. Sign in again.');
    this.name = 'SessionExpiredError';
  }
}

/**
 * The signed-in user and their tokens, for the whole app.
 *
 * Tokens live in signals so the shell and guards react to sign-in and sign-out, and in
 * localStorage so a phone stays signed in for as long as the refresh token lasts (30 days):
 * coaches open the app pitch-side and must not meet a sign-in form there. `refresh()` is
 * single-flight because the server rotates refresh tokens: two parallel refreshes with the
 * same token would make the second one fail and sign the user out.
 */
@Injectable({ providedIn: 'root' })
export class AuthSession {
  private readonly http = inject(HttpClient);
  private readonly storage = inject(BROWSER_STORAGE);
  private readonly injector = inject(Injector);
  private readonly pendingTasks = inject(PendingTasks);
  private readonly state = signal<StoredSession | null>(this.restore());
  private refreshInFlight: Observable<string> | null = null;

  /** The signed-in user, or null when signed out. */
  readonly user = computed(() => this.state()?.user ?? null);
  /** The signed-in user's role, or null when signed out. */
  readonly role = computed<Role | null>(() => this.state()?.user.role ?? null);
  /** The user's club, once `GET /api/me` has named it (kept for offline starts). */
  readonly club = computed(() => this.state()?.club ?? null);
  /** The current access token, or null when signed out. */
  readonly accessToken = computed(() => this.state()?.accessToken ?? null);
  /** Whether someone is signed in on this device. */
  readonly isSignedIn = computed(() => this.state() !== null);

  constructor() {
    // Another tab signed in or out: follow it, so two tabs never hold different refresh
    // tokens (the older one would be rejected after rotation).
    const onStorage = (event: StorageEvent): void => {
      if (event.key === SESSION_STORAGE_KEY) {
        this.state.set(this.restore());
      }
    };
    globalThis.addEventListener?.('storage', onStorage);
    inject(DestroyRef).onDestroy(() => globalThis.removeEventListener?.('storage', onStorage));
  }

  /**
   * Signs in with e-mail and password. On success the device is handed over first (a different user's
   * local data is cleared, `handOverDevice`), then the tokens and user are stored; on failure the HTTP
   * error is passed on untouched so the form can show the server's message.
   */
  signIn(credentials: LoginRequest): Observable<SessionUser> {
    return this.http.post<AuthTokens>('/api/auth/login', credentials).pipe(
      // A pending task, so the app (and a spec's whenStable) waits for the clean-up before the first screen.
      switchMap((tokens) => {
        const done = this.pendingTasks.add();
        return from(this.handOver(tokens.user.id).finally(done)).pipe(map(() => tokens));
      }),
      tap((tokens) => this.store(tokens)),
      map((tokens) => tokens.user),
    );
  }

  /**
   * Exchanges the refresh token for a new pair and returns the new access token. Calls made
   * while one refresh is under way share it. Fails with {@link SessionExpiredError} (after
   * clearing the session) when the server rejects the token; other failures, such as no
   * network, are passed on and leave the session in place.
   */
  refresh(): Observable<string> {
    if (this.refreshInFlight) {
      return this.refreshInFlight;
    }
    const refreshToken = this.state()?.refreshToken;
    if (!refreshToken) {
      this.clear();
      return throwError(() => new SessionExpiredError());
    }
    this.refreshInFlight = this.http.post<AuthTokens>('/api/auth/refresh', { refreshToken }).pipe(
      tap((tokens) => this.store(tokens)),
      map((tokens) => tokens.accessToken),
      catchError((error: unknown) => {
        if (error instanceof HttpErrorResponse && isRejection(error.status)) {
          this.clear();
          return throwError(() => new SessionExpiredError());
        }
        return throwError(() => error);
      }),
      finalize(() => {
        this.refreshInFlight = null;
      }),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
    return this.refreshInFlight;
  }

  /**
   * Signs out on this device at once and tells the server to revoke the refresh token.
   * The server call is best-effort: a coach who signs out without signal is still signed out
   * here, and the token dies on its own when it expires.
   */
  signOut(): void {
    const current = this.state();
    this.clear();
    if (!current) {
      return;
    }
    const headers = new HttpHeaders({ Authorization: `Bearer ${current.accessToken}` });
    this.http.post('/api/auth/logout', { refreshToken: current.refreshToken }, { headers }).subscribe({ error: () => undefined });
  }

  /**
   * Records what `GET /api/me` says about the user and their club, so renamed users and the
   * club name show in the shell, also on the next offline start.
   */
  rememberProfile(me: MeResponse): void {
    const current = this.state();
    if (!current || current.user.id !== me.user.id) {
      return;
    }
    this.persist({ ...current, user: me.user, club: { id: me.club.id, name: me.club.name } });
  }

  /**
   * The hand-over and the device's database (Dexie) load on the first sign-in, not with the app: the
   * sign-in screen draws without them and a phone on a weak signal gets its form sooner.
   */
  private async handOver(userId: string): Promise<void> {
    const { handOverDeviceOf } = await import('./device-handover');
    await handOverDeviceOf(this.injector, this.storage, userId);
  }

  private store(tokens: AuthTokens): void {
    const previous = this.state();
    const club = previous && previous.user.id === tokens.user.id ? previous.club : null;
    this.persist({ accessToken: tokens.accessToken, refreshToken: tokens.refreshToken, user: tokens.user, club });
  }

  private persist(session: StoredSession): void {
    this.state.set(session);
    try {
      this.storage.setItem(SESSION_STORAGE_KEY, JSON.stringify(session));
    } catch {
      // Storage full or refused: the session still works until the tab closes.
    }
  }

  private clear(): void {
    this.state.set(null);
    try {
      this.storage.removeItem(SESSION_STORAGE_KEY);
    } catch {
      // Nothing stored, nothing to remove.
    }
  }

  private restore(): StoredSession | null {
    let raw: string | null;
    try {
      raw = this.storage.getItem(SESSION_STORAGE_KEY);
    } catch {
      return null;
    }
    if (raw === null) {
      return null;
    }
    try {
      const parsed: unknown = JSON.parse(raw);
      return isStoredSession(parsed) ? parsed : null;
    } catch {
      return null;
    }
  }
}

/** Whether a refresh answer means the token is dead (rather than the server being unwell). */
function isRejection(status: number): boolean {
  return status === 400 || status === 401 || status === 403;
}

/** Checks a stored session by hand: zod would pull its whole runtime into the first download. */
function isStoredSession(value: unknown): value is StoredSession {
  if (typeof value !== 'object' || value === null) {
    return false;
  }
  const record = value as Record<string, unknown>;
  return (
    typeof record['accessToken'] === 'string' &&
    typeof record['refreshToken'] === 'string' &&
    isSessionUser(record['user']) &&
    (record['club'] === null || isClub(record['club']))
  );
}

function isSessionUser(value: unknown): value is SessionUser {
  if (typeof value !== 'object' || value === null) {
    return false;
  }
  const record = value as Record<string, unknown>;
  const role = record['role'];
  return (
    typeof record['id'] === 'string' &&
    typeof record['email'] === 'string' &&
    typeof record['displayName'] === 'string' &&
    typeof record['clubId'] === 'string' &&
    typeof role === 'string' &&
    (ROLES as readonly string[]).includes(role)
  );
}

function isClub(value: unknown): value is SessionClub {
  if (typeof value !== 'object' || value === null) {
    return false;
  }
  const record = value as Record<string, unknown>;
  return typeof record['id'] === 'string' && typeof record['name'] === 'string';
}
