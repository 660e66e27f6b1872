import { liveSignal } from '../live-signal';
import { DOCUMENT } from '@angular/common';
import { Injectable, InjectionToken, Signal, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { Dexie } from 'dexie';
import {
  EMPTY,
  Observable,
  Subject,
  debounceTime,
  exhaustMap,
  filter,
  from,
  fromEvent,
  interval,
  map,
  merge,
  switchMap,
  tap,
  timer,
  firstValueFrom,
} from 'rxjs';
import { isStaffRole } from '../../../../shared/roles';
import type { MutationResult, PullWindow } from '../../../../shared/schemas/sync';
import { describeApiError } from '../api-error';
import { AuthSession } from '../auth/auth-session';
import { Connectivity } from '../connectivity';
import { DEVICE_ID } from '../device-id';
import { LocalWrites } from './local-writes';
import { LOFTLINE_DB, type LoftlineDb } from '../loftline-db';
import { landHistory, landPulledChanges, releaseBatch, releaseStaleInFlight, settlePush, takeBatch } from './sync-apply';
import { SyncApi } from './sync-api';

/**
 * Most mutations per push: the server's `MAX_PUSH_MUTATIONS`. Repeated rather than imported
 * because importing `shared/schemas/sync.ts` as a value would pull zod into the first
 * download; `sync-queue.spec.ts` checks that the two agree.
 */
export const PUSH_BATCH_SIZE = 500;

/** Timings of the queue; specs shorten them. */
export interface SyncTiming {
  /** Quiet time after the last logged change before pushing, so a run of taps makes one push. */
  readonly writeDebounceMs: number;
  /** How often to sync while the app is open and visible. */
  readonly periodMs: number;
  /** First retry delay after a failure; doubles with each further failure. */
  readonly backoffBaseMs: number;
  /** The longest retry delay. */
  readonly backoffMaxMs: number;
  /** Changes asked for per pull request (a page is parsed and landed in one go, so it stays small). */
  readonly pullPageSize: number;
  /** How far back a new device's first pull reaches; older sessions come on demand (`fetchHistory`). */
  readonly recentHistoryMs: number;
  /** Source of jitter in [0, 1). */
  readonly random: () => number;
}

/** Production timings. */
export const DEFAULT_SYNC_TIMING: SyncTiming = {
  writeDebounceMs: 1500,
  periodMs: 60_000,
  backoffBaseMs: 2000,
  backoffMaxMs: 5 * 60_000,
  pullPageSize: 500,
  // Two weeks: the sessions a coach resumes or looks back on pitch-side (common practice, no standard).
  recentHistoryMs: 14 * 24 * 60 * 60 * 1000,
  random: Math.random,
};

/** The queue's timings (a token so specs can make them short and the jitter predictable). */
export const SYNC_TIMING = new InjectionToken<SyncTiming>('SYNC_TIMING', {
  providedIn: 'root',
  factory: () => DEFAULT_SYNC_TIMING,
});

/**
 * Delay before the next attempt after `failures` failures in a row: exponential (base × 2ⁿ⁻¹,
 * capped) with "equal jitter" — half fixed, half random — so phones that lost the same
 * server do not all come back in the same millisecond, yet never retry at once.
 */
export function backoffDelayMs(failures: number, timing: Pick<SyncTiming, 'backoffBaseMs' | 'backoffMaxMs' | 'random'>): number {
  const ceiling = Math.min(timing.backoffMaxMs, timing.backoffBaseMs * 2 ** Math.max(0, failures - 1));
  return Math.round(ceiling / 2 + timing.random() * (ceiling / 2));
}

/** What the queue is doing. */
export type SyncPhase = 'signed_out' | 'offline' | 'idle' | 'syncing' | 'waiting';

/** Why a sync round was asked for. */
type SyncReason = 'start' | 'online' | 'visible' | 'write' | 'periodic' | 'retry' | 'manual' | 'again';

/** Reasons that respect a running backoff; the rest (a regained connection, the coach) cut it short. */
const PATIENT_REASONS: readonly SyncReason[] = ['write', 'periodic'];

class UserChanged extends Error {}

/** Lets input and rendering run between two pulled pages (and two slices of one), so landing a long pull never freezes a tap. */
function yieldToInput(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/**
 * Sends the outbox to the server and brings the server's changes down into IndexedDB.
 *
 * When: on start (and after each sign-in), when the browser comes back online, when the page
 * becomes visible or gets focus, shortly after local changes (debounced), and every minute
 * while visible — there is no background sync to rely on in every browser. A failure retries
 * with exponential backoff and jitter. Each round pushes everything pending, oldest first, in
 * batches of at most 500, then pulls from the user's cursor until the server has no more. A device
 * that has never pulled for the user pulls the last two weeks' sessions first (Pitchside is useful at
 * once) and fetches older sessions only when asked (`fetchHistory`); pages are small and the queue
 * yields between them, so landing a pull never blocks a tap for long.
 * Only staff push (the server refuses players and guardians) and only their own entries.
 * Across tabs a Web Lock keeps one round at a time, so an entry is never sent twice at once.
 * Nothing leaves the outbox without an answer from the server (see `sync-apply.ts`).
 */
@Injectable({ providedIn: 'root' })
export class SyncQueue {
  private readonly db: LoftlineDb = inject(LOFTLINE_DB);
  private readonly api = inject(SyncApi);
  private readonly session = inject(AuthSession);
  private readonly connectivity = inject(Connectivity);
  private readonly deviceId = inject(DEVICE_ID);
  private readonly timing = inject(SYNC_TIMING);
  private readonly document = inject(DOCUMENT);

  private readonly requests = new Subject<SyncReason>();
  private readonly retries = new Subject<number | null>();
  private readonly rounds = new Subject<void>();
  private readonly working = signal(false);
  private readonly waitingUntil = signal<number | null>(null);
  private rerunRequested = false;

  /** The user whose outbox this device pushes: the signed-in staff member, else null. */
  readonly userId = computed(() => {
    const user = this.session.user();
    return user && isStaffRole(user.role) ? user.id : null;
  });
  /** Failed rounds in a row (0 after a success). */
  readonly failures = signal(0);
  /** When the last round completed, ISO. */
  readonly lastSyncedAt = signal<string | null>(null);
  /** Why the last round failed, in words, or null. */
  readonly lastProblem = signal<string | null>(null);
  /** When the next retry is due (epoch ms) during a backoff, else null. */
  readonly nextAttemptAt = this.waitingUntil.asReadonly();
  /** What the queue is doing now. */
  readonly phase = computed<SyncPhase>(() => {
    if (this.userId() === null) return 'signed_out';
    if (this.working()) return 'syncing';
    if (!this.connectivity.online()) return 'offline';
    return this.waitingUntil() === null ? 'idle' : 'waiting';
  });
  /** The user's changes the server has not acknowledged yet (pending, on their way, or rejected). */
  readonly unsynced: Signal<number> = this.forUser(0, (id) =>
    this.db.outbox.where('[userId+seq]').between([id, Dexie.minKey], [id, Dexie.maxKey]).count(),
  );
  /** The user's changes the server rejected, awaiting a fix or a discard. */
  readonly rejected: Signal<number> = this.forUser(0, (id) => this.db.outbox.where('[userId+state]').equals([id, 'rejected']).count());
  /** Edits of the user's the server refused because its row had changed meanwhile, not yet reviewed. */
  readonly conflicts: Signal<number> = this.forUser(0, (id) => this.db.conflicts.where('userId').equals(id).count());
  /** Whether older sessions a new device's first pull left out are still only on the server. */
  readonly historyOnServer: Signal<boolean> = this.forUser(false, async (id) => (await this.db.syncState.get(id))?.history !== undefined);
  /** Whether `fetchHistory` is under way. */
  readonly fetchingHistory = signal(false);
  /** Emits after each successful round (e.g. for caches that refresh alongside). */
  readonly synced$: Observable<void> = this.rounds.asObservable();

  constructor() {
    const win = this.document.defaultView;
    const visible = (): boolean => this.document.visibilityState === 'visible';
    const reasons: Observable<SyncReason>[] = [
      this.requests,
      toObservable(this.userId).pipe(
        filter((id) => id !== null),
        map((): SyncReason => 'start'),
      ),
      this.connectivity.online$.pipe(map((): SyncReason => 'online')),
      fromEvent(this.document, 'visibilitychange').pipe(
        filter(visible),
        map((): SyncReason => 'visible'),
      ),
      inject(LocalWrites).written$.pipe(
        debounceTime(this.timing.writeDebounceMs),
        map((): SyncReason => 'write'),
      ),
      interval(this.timing.periodMs).pipe(
        filter(visible),
        map((): SyncReason => 'periodic'),
      ),
      this.retries.pipe(
        switchMap((delay) => (delay === null ? EMPTY : timer(delay))),
        map((): SyncReason => 'retry'),
      ),
    ];
    if (win) {
      reasons.push(fromEvent(win, 'focus').pipe(map((): SyncReason => 'visible')));
    }
    merge(...reasons)
      .pipe(
        filter((reason) => this.mayRun(reason)),
        tap(() => {
          if (this.working()) this.rerunRequested = true;
        }),
        exhaustMap(() => from(this.round())),
        takeUntilDestroyed(),
      )
      .subscribe();
  }

  /** Syncs now (the coach asked, or a screen knows it is a good moment). */
  syncNow(): void {
    this.requests.next('manual');
  }

  private mayRun(reason: SyncReason): boolean {
    if (this.userId() === null || !this.connectivity.online()) {
      return false;
    }
    return !(PATIENT_REASONS.includes(reason) && this.waitingUntil() !== null);
  }

  private async round(): Promise<void> {
    const userId = this.userId();
    if (userId === null) {
      return;
    }
    this.retries.next(null);
    this.waitingUntil.set(null);
    this.working.set(true);
    try {
      await this.withLock(() => this.pushThenPull(userId));
      this.failures.set(0);
      this.lastProblem.set(null);
      this.lastSyncedAt.set(new Date().toISOString());
      this.rounds.next();
    } catch (error) {
      if (!(error instanceof UserChanged)) {
        const failures = this.failures() + 1;
        const delay = backoffDelayMs(failures, this.timing);
        this.failures.set(failures);
        this.rerunRequested = false;
        this.lastProblem.set(describeApiError(error).message);
        this.waitingUntil.set(Date.now() + delay);
        this.retries.next(delay);
      }
    } finally {
      this.working.set(false);
    }
    if (this.rerunRequested && this.waitingUntil() === null) {
      this.rerunRequested = false;
      this.requests.next('again');
    }
  }

  private async pushThenPull(userId: string): Promise<void> {
    await releaseStaleInFlight(this.db, userId);
    for (;;) {
      this.checkUser(userId);
      const batch = await takeBatch(this.db, userId, PUSH_BATCH_SIZE);
      if (batch.length === 0) {
        break;
      }
      let results: MutationResult[];
      try {
        results = (await firstValueFrom(this.api.push(this.deviceId, batch))).results;
      } catch (error) {
        await releaseBatch(this.db, batch);
        throw error;
      }
      const settled = await settlePush(this.db, batch, results);
      if (settled.unanswered > 0) {
        break; // Entries without an answer wait for the next round rather than spin in this one.
      }
    }
    let state = await this.db.syncState.get(userId);
    if (!state) {
      // A device that has never pulled for this user: the recent sessions first, the rest on demand.
      state = { userId, cursor: 0, lastPulledAt: null, firstPullFrom: new Date(Date.now() - this.timing.recentHistoryMs).toISOString() };
      await this.db.syncState.put(state);
    }
    let cursor = state.cursor;
    let firstPullFrom = state.firstPullFrom;
    for (;;) {
      this.checkUser(userId);
      const window: PullWindow | undefined = firstPullFrom === undefined ? undefined : { part: 'recent', from: firstPullFrom };
      const page = await firstValueFrom(this.api.pull(cursor, this.timing.pullPageSize, window));
      this.checkUser(userId);
      const firstPullDone = firstPullFrom !== undefined && !page.hasMore;
      await landPulledChanges(
        this.db,
        userId,
        page.changes,
        page.cursor,
        firstPullDone ? { firstPullFrom: undefined, history: { upTo: page.cursor, cursor: 0 } } : {},
        async () => {
          await yieldToInput();
          this.checkUser(userId);
        },
      );
      if (firstPullDone) firstPullFrom = undefined;
      cursor = page.cursor;
      if (!page.hasMore) {
        break;
      }
      await yieldToInput();
    }
  }

  /**
   * Fetches the history a new device's first pull left on the server (older sessions), page by page,
   * under the same lock as the rounds; resolves when it is all on the device. Fails like a round
   * (no signal, server down); what landed stays and the next call goes on from there.
   */
  async fetchHistory(): Promise<void> {
    const userId = this.userId();
    if (userId === null) return;
    this.fetchingHistory.set(true);
    try {
      await this.withLock(async () => {
        for (;;) {
          this.checkUser(userId);
          const history = (await this.db.syncState.get(userId))?.history;
          if (!history) return;
          const page = await firstValueFrom(
            this.api.pull(history.cursor, this.timing.pullPageSize, { part: 'history', upTo: history.upTo }),
          );
          this.checkUser(userId);
          await landHistory(this.db, userId, page.changes, page.cursor, !page.hasMore);
          await yieldToInput();
        }
      });
    } finally {
      this.fetchingHistory.set(false);
    }
  }

  private checkUser(userId: string): void {
    if (this.userId() !== userId) {
      throw new UserChanged();
    }
  }

  private async withLock(work: () => Promise<void>): Promise<void> {
    const locks = this.document.defaultView?.navigator.locks;
    if (!locks) {
      await work();
      return;
    }
    // One lock per database: two tabs share it, two databases (specs) do not.
    await locks.request(`loftline-sync:${this.db.name}`, () => work());
  }

  /** A live count (or other query) over the current user's rows, as a signal. */
  private forUser<T>(initial: T, query: (userId: string) => Promise<T>): Signal<T> {
    return liveSignal(this.userId, query, { whenNull: initial, initial });
  }
}
