/*
 * The one offline cache of server answers, with its two ways to read: `cachedAnswer` (network first:
 * the server's answer, the device's copy only when the server cannot be reached — the analysis
 * screens) and `cacheFirst` (the device's copy at once, then the server's answer — the planner, which
 * must open on a pitch without signal). Both keep what they fetch in one store, `ANSWER_STORE`
 * (IndexedDB through `AnalysisCache`), so clearing the device clears them all.
 */
import { HttpErrorResponse } from '@angular/common/http';
import { InjectionToken, inject } from '@angular/core';
import { AnalysisCache } from './analysis/analysis-cache';
import { ApiProblem, describeApiError } from './api-error';
import { Observable, catchError, concat, filter, from, map, of, scan, switchMap, tap, throwError } from 'rxjs';

/** What kind of answer a cache entry holds (so the cache can be cleared by kind). */
export type AnswerKind =
  | 'player'
  | 'squads'
  | 'progress'
  | 'kicks'
  | 'profile'
  | 'envelope'
  | 'week'
  | 'me'
  | 'spin'
  | 'planner-squads'
  | 'planner-profiles'
  | 'planner-ranking'
  | 'planner-plan';

/** The key-value cache in IndexedDB the screens keep server answers in. */
export interface AnswerStore {
  get<T>(key: string): Promise<T | undefined>;
  put<T>(key: string, kind: AnswerKind, value: T): Promise<void>;
}

/** An answer and where it came from. */
export interface Answer<T> {
  readonly value: T;
  /** When the server gave this answer (ISO 8601). */
  readonly fetchedAt: string;
  /** Whether it came from this device's cache because the server could not be reached. */
  readonly fromCache: boolean;
}

/** How an answer is kept in the cache. */
interface StoredAnswer<T> {
  readonly value: T;
  readonly fetchedAt: string;
}

/**
 * A cache that keeps answers only while the page is open: what specs use when they do not care
 * about persistence (the app itself uses the IndexedDB-backed AnalysisCache).
 */
export class MemoryAnswerStore implements AnswerStore {
  private readonly entries = new Map<string, { kind: AnswerKind; value: unknown }>();

  get<T>(key: string): Promise<T | undefined> {
    return Promise.resolve(this.entries.get(key)?.value as T | undefined);
  }

  put<T>(key: string, kind: AnswerKind, value: T): Promise<void> {
    this.entries.set(key, { kind, value });
    return Promise.resolve();
  }

  /** How many entries of a kind are held (for specs). */
  count(kind: AnswerKind): number {
    return [...this.entries.values()].filter((e) => e.kind === kind).length;
  }
}

/** Where the Player file, Squad week and the planner keep their last answers so they open offline. */
export const ANSWER_STORE = new InjectionToken<AnswerStore>('ANSWER_STORE', {
  providedIn: 'root',
  factory: () => inject(AnalysisCache),
});

/**
 * Whether a failure means "no answer from the server" (offline, server down, a proxy's 502–504)
 * rather than a real refusal. Only then is the cached copy shown: a 404 for someone else's
 * player must never be papered over with an old answer.
 */
export function isUnreachable(error: unknown): boolean {
  return error instanceof HttpErrorResponse && (error.status === 0 || error.status === 502 || error.status === 503 || error.status === 504);
}

/**
 * Asks the server and keeps the answer under `key`; when the server cannot be reached, answers
 * from the cache instead (marked `fromCache`, with the time of the original answer), so a coach
 * on a pitch without signal still sees last week. Without a cached copy the original error is
 * passed on. A failing cache write never fails the request.
 */
export function cachedAnswer<T>(
  store: AnswerStore,
  key: string,
  kind: AnswerKind,
  request: Observable<T>,
  now: () => Date = () => new Date(),
): Observable<Answer<T>> {
  return request.pipe(
    map((value): Answer<T> => ({ value, fetchedAt: now().toISOString(), fromCache: false })),
    tap((answer) => {
      const stored: StoredAnswer<T> = { value: answer.value, fetchedAt: answer.fetchedAt };
      store.put(key, kind, stored).catch(() => undefined);
    }),
    catchError((error: unknown) => {
      if (!isUnreachable(error)) {
        return throwError(() => error);
      }
      return from(store.get<StoredAnswer<T>>(key).catch(() => undefined)).pipe(
        switchMap((stored) =>
          stored === undefined
            ? throwError(() => error)
            : [{ value: stored.value, fetchedAt: stored.fetchedAt, fromCache: true } satisfies Answer<T>],
        ),
      );
    }),
  );
}

/** Something loaded from the server, maybe from the device's copy while the server cannot be reached. */
export type CachedLoad<T> =
  | { readonly status: 'loading' }
  | { readonly status: 'ready'; readonly value: T; readonly savedAt: string | null; readonly refreshProblem: ApiProblem | null }
  | { readonly status: 'error'; readonly problem: ApiProblem };

/** A value kept by `cacheFirst` (or put beside it), with when it was kept. */
export interface CachedValue<T> {
  savedAt: string;
  value: T;
}

/**
 * The device's copy under `key` first (if any, with `savedAt`), then the server's answer, kept for
 * next time. A failed refresh after a kept copy leaves the copy shown with `refreshProblem`; without
 * one it is an `error`. A failing cache read or write never fails the load.
 */
export function cacheFirst<T>(store: AnswerStore, key: string, kind: AnswerKind, fetch: () => Observable<T>): Observable<CachedLoad<T>> {
  const kept = from(store.get<CachedValue<T>>(key).catch(() => undefined)).pipe(
    filter((v): v is CachedValue<T> => v !== undefined),
    map((v): CachedLoad<T> => ({ status: 'ready', value: v.value, savedAt: v.savedAt, refreshProblem: null })),
  );
  const fresh = fetch().pipe(
    tap((value) => void store.put<CachedValue<T>>(key, kind, { savedAt: new Date().toISOString(), value }).catch(() => undefined)),
    map((value): CachedLoad<T> => ({ status: 'ready', value, savedAt: null, refreshProblem: null })),
    catchError((e: unknown) => of<CachedLoad<T>>({ status: 'error', problem: describeApiError(e) })),
  );
  return concat(of<CachedLoad<T>>({ status: 'loading' }), kept, fresh).pipe(
    scan((prev: CachedLoad<T>, next: CachedLoad<T>) =>
      next.status === 'error' && prev.status === 'ready' ? { ...prev, refreshProblem: next.problem } : next,
    ),
  );
}
