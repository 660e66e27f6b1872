import { HttpErrorResponse } from '@angular/common/http';
import { InjectionToken, inject } from '@angular/core';
import { AnalysisCache } from './analysis-cache';
import { Observable, catchError, from, map, switchMap, tap, throwError } from 'rxjs';

/** What kind of answer a cache entry holds (so the cache can be cleared by kind). */
export type AnswerKind = 'player' | 'squads' | 'progress' | 'kicks' | 'profile' | 'envelope' | 'week' | 'me' | 'spin';

/** The part of a key-value cache in IndexedDB the analysis screens use. */
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

/** Where the Player file and Squad week keep their last answers so they open offline. */
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
