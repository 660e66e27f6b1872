import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { MAX_PUSH_MUTATIONS, type MutationResult, type PushResponse, type SyncRow } from '../../../../shared/schemas/sync';
import { authInterceptor } from '../auth/auth-interceptor';
import { AuthSession } from '../auth/auth-session';
import { BROWSER_STORAGE } from '../browser-storage';
import { Connectivity } from '../connectivity';
import { KickStore, type NewKick } from '../kick-store';
import { LOFTLINE_DB, type LoftlineDb } from '../loftline-db';
import { SessionStore } from '../session-store';
import { SPEC_COACH, SPEC_IDS, freshDb, signedInStorage, until } from '../spec-support';
import { SyncIssues } from './sync-issues';
import { PUSH_BATCH_SIZE, SYNC_TIMING, SyncQueue, backoffDelayMs, type SyncTiming } from './sync-queue';

@Component({ template: '' })
class Blank {}

/** Short timings so the spec runs in real time; jitter fixed at the middle of its range. */
const TIMING: SyncTiming = {
  writeDebounceMs: 20,
  periodMs: 3_600_000,
  backoffBaseMs: 60,
  backoffMaxMs: 1000,
  pullPageSize: 2,
  random: () => 0.5,
};

describe('SyncQueue (real IndexedDB, HttpTestingController)', () => {
  let db: LoftlineDb;
  let http: HttpTestingController;
  let kicks: KickStore;
  let sessionId: string;

  function kick(extra: Partial<NewKick> = {}): NewKick {
    return {
      sessionId,
      drillId: null,
      playerId: SPEC_IDS.playerA,
      technique: 'driven',
      foot: 'left',
      backspinStep: 0,
      sidespinStep: 0,
      targetDistanceM: 40,
      targetRadiusM: 4,
      outcome: 'on_target',
      ...extra,
    };
  }

  /** Waits for the next request to a sync endpoint. */
  async function next(path: '/api/sync/push' | '/api/sync/pull'): Promise<TestRequest> {
    let found: TestRequest[] = [];
    await until(`a request to ${path}`, () => (found = http.match((r) => r.url === path)).length > 0);
    expect(found.length).withContext(`one request to ${path}`).toBe(1);
    return found[0];
  }

  function pushBody(request: TestRequest): {
    deviceId: string;
    mutations: { id: string; entity: string; baseVersion?: number; data: Record<string, unknown> }[];
  } {
    return request.request.body as ReturnType<typeof pushBody>;
  }

  function answerAll(request: TestRequest, status: MutationResult['status'] = 'applied'): void {
    const results = pushBody(request).mutations.map((m) => ({ id: m.id, status }));
    request.flush({ results, cursor: 100 } satisfies PushResponse);
  }

  async function emptyPull(cursor = 0): Promise<void> {
    (await next('/api/sync/pull')).flush({ changes: [], cursor, hasMore: false });
  }

  /** Sets up the app with a session already written locally; the queue is not created yet. */
  beforeEach(async () => {
    db = freshDb();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([{ path: 'sign-in', component: Blank }]),
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(SPEC_COACH) },
        { provide: LOFTLINE_DB, useValue: db },
        { provide: SYNC_TIMING, useValue: TIMING },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    kicks = TestBed.inject(KickStore);
    sessionId = (await TestBed.inject(SessionStore).start({ squadId: SPEC_IDS.squad, ballSize: 5 })).id;
  });

  afterEach(async () => {
    // Answer anything left so no round stays parked on an open request.
    for (const open of http.match(() => true)) open.error(new ProgressEvent('error'));
    TestBed.resetTestingModule();
    await db.delete();
  });

  function startQueue(): SyncQueue {
    const queue = TestBed.inject(SyncQueue);
    TestBed.tick();
    return queue;
  }

  it('uses the server’s batch limit', () => {
    expect(PUSH_BATCH_SIZE).toBe(MAX_PUSH_MUTATIONS);
  });

  it('doubles the retry delay per failure up to the cap, with half of it random', () => {
    const timing = { backoffBaseMs: 1000, backoffMaxMs: 8000 };
    expect(backoffDelayMs(1, { ...timing, random: () => 0 })).toBe(500);
    expect(backoffDelayMs(1, { ...timing, random: () => 0.999999 })).toBe(1000);
    expect(backoffDelayMs(3, { ...timing, random: () => 0.5 })).toBe(3000);
    expect(backoffDelayMs(10, { ...timing, random: () => 0 })).toBe(4000);
    expect(backoffDelayMs(10, { ...timing, random: () => 0.999999 })).toBe(8000);
  });

  it('pushes on start with the token and device id, then pulls page by page from its cursor', async () => {
    const first = await kicks.log(kick());
    const queue = startQueue();

    const push = await next('/api/sync/push');
    expect(push.request.headers.get('Authorization')).toBe('Bearer access-1');
    expect(pushBody(push).deviceId).toMatch(/^[0-9a-f-]{36}$/);
    expect(pushBody(push).mutations.map((m) => m.entity)).toEqual(['training_session', 'kick']);
    answerAll(push);

    const page1 = await next('/api/sync/pull');
    expect(page1.request.params.get('since')).toBe('0');
    expect(page1.request.params.get('limit')).toBe('2');
    const pulled: SyncRow = {
      ...(await db.kicks.get(first.id))!,
      version: 1,
      updatedAt: '2026-11-20T18:41:13.000Z',
      deletedAt: null,
      carryM: 36,
    };
    page1.flush({ changes: [{ entity: 'kick', changeSeq: 7, data: pulled }], cursor: 7, hasMore: true });
    const page2 = await next('/api/sync/pull');
    expect(page2.request.params.get('since')).toBe('7');
    page2.flush({ changes: [], cursor: 7, hasMore: false });

    await until('the round to finish', () => queue.phase() === 'idle');
    expect(await db.outbox.count()).toBe(0);
    expect((await db.syncState.get(SPEC_COACH.id))?.cursor).toBe(7);
    expect((await db.kicks.get(first.id))?.carryM).toBe(36);
    expect(queue.lastSyncedAt()).not.toBeNull();
  });

  it('sends again what a page closed mid-push left marked as on its way', async () => {
    await kicks.log(kick());
    await db.outbox.toCollection().modify({ state: 'in_flight' });
    const queue = startQueue();

    const push = await next('/api/sync/push');
    expect(pushBody(push).mutations.length).toBe(2);
    answerAll(push, 'duplicate');
    await emptyPull();
    await until('acknowledged', () => queue.unsynced() === 0);
  });

  it('waits while offline, then pushes when the browser comes back online', async () => {
    TestBed.inject(Connectivity);
    window.dispatchEvent(new Event('offline'));
    await kicks.log(kick());
    const queue = startQueue();
    await new Promise((r) => setTimeout(r, 100));

    http.expectNone((r) => r.url.startsWith('/api/sync/'));
    expect(queue.phase()).toBe('offline');
    await until('the unsynced count', () => queue.unsynced() === 2);

    window.dispatchEvent(new Event('online'));
    answerAll(await next('/api/sync/push'));
    await emptyPull();
    await until('nothing left to send', () => queue.unsynced() === 0);
  });

  it('pushes shortly after new kicks, in one batch for a quick run of taps', async () => {
    const queue = startQueue();
    answerAll(await next('/api/sync/push'));
    await emptyPull();
    await until('idle', () => queue.phase() === 'idle');

    await kicks.log(kick({ outcome: 'short' }));
    await kicks.log(kick({ outcome: 'long' }));
    await kicks.log(kick({ outcome: 'left' }));

    const push = await next('/api/sync/push');
    expect(pushBody(push).mutations.map((m) => m.data['outcome'])).toEqual(['short', 'long', 'left']);
    answerAll(push, 'duplicate');
    await emptyPull();
    await until('all acknowledged', () => queue.unsynced() === 0);
  });

  it('backs off exponentially with jitter on failure and never drops the batch', async () => {
    await kicks.log(kick());
    const queue = startQueue();

    const attempt1 = await next('/api/sync/push');
    const failedAt1 = Date.now();
    attempt1.flush({ error: { code: 'unavailable', message: 'down' } }, { status: 503, statusText: 'Service Unavailable' });
    await until('the first failure', () => queue.failures() === 1);
    expect(queue.phase()).toBe('waiting');
    // backoff 1: ceiling 60 ms, half fixed + 0.5 × half = 45 ms.
    expect(queue.nextAttemptAt()! - failedAt1).toBeGreaterThanOrEqual(35);
    expect((await db.outbox.toArray()).map((e) => [e.state, e.attempts])).toEqual([
      ['pending', 1],
      ['pending', 1],
    ]);

    const attempt2 = await next('/api/sync/push');
    expect(Date.now() - failedAt1).toBeGreaterThanOrEqual(40);
    const failedAt2 = Date.now();
    attempt2.error(new ProgressEvent('error'));
    await until('the second failure', () => queue.failures() === 2);
    // backoff 2: ceiling 120 ms → 90 ms.
    expect(queue.nextAttemptAt()! - failedAt2).toBeGreaterThanOrEqual(80);

    const attempt3 = await next('/api/sync/push');
    expect(Date.now() - failedAt2).toBeGreaterThanOrEqual(85);
    expect(pushBody(attempt3).mutations.length).toBe(2);
    answerAll(attempt3);
    await emptyPull();
    await until('recovered', () => queue.failures() === 0 && queue.unsynced() === 0);
    expect(queue.nextAttemptAt()).toBeNull();
  });

  it('settles a partly failed batch answer by answer and keeps what the server did not acknowledge', async () => {
    await kicks.log(kick({ outcome: 'short' }));
    const bad = await kicks.log(kick({ outcome: 'long' }));
    await kicks.log(kick({ outcome: 'left' }));
    const queue = startQueue();

    const push = await next('/api/sync/push');
    const [session, k1, k2, k3] = pushBody(push).mutations;
    push.flush({
      results: [
        { id: session.id, status: 'applied' },
        { id: k1.id, status: 'applied' },
        { id: k2.id, status: 'rejected', error: { code: 'invalid', message: 'data.playerId: the player is not on this session’s squad' } },
        // k3 unanswered: it must stay for the next push.
      ],
      cursor: 3,
    });
    // The pull after the push fails: the acknowledged entries are still settled.
    (await next('/api/sync/pull')).error(new ProgressEvent('error'));
    await until('the failed round', () => queue.failures() === 1);

    const left = await db.outbox.orderBy('seq').toArray();
    expect(left.map((e) => [e.id, e.state])).toEqual([
      [k2.id, 'rejected'],
      [k3.id, 'pending'],
    ]);
    expect(left[0].error?.message).toContain('not on this session’s squad');
    expect((await db.kicks.get(bad.id))?.outcome).toBe('long');

    const retry = await next('/api/sync/push');
    expect(pushBody(retry).mutations.map((m) => m.id)).toEqual([k3.id]);
    answerAll(retry);
    (await next('/api/sync/pull')).flush({ changes: [], cursor: 3, hasMore: false });
    await until('the rejected one alone left', () => queue.unsynced() === 1 && queue.rejected() === 1);
    expect((await db.syncState.get(SPEC_COACH.id))?.cursor).toBe(3);
  });

  it('keeps a rejected change with its reason until it is fixed, then sends the fix under the same id', async () => {
    const rejected = await kicks.log(kick({ playerId: SPEC_IDS.playerB }));
    const queue = startQueue();
    const push = await next('/api/sync/push');
    const [session, k] = pushBody(push).mutations;
    push.flush({
      results: [
        { id: session.id, status: 'applied' },
        {
          id: k.id,
          status: 'rejected',
          error: {
            code: 'invalid',
            message: 'data.playerId: Unknown player',
            fields: [{ field: 'data.playerId', message: 'Unknown player' }],
          },
        },
      ],
      cursor: 2,
    });
    await emptyPull(2);
    await until('the rejection', () => queue.rejected() === 1);
    const issues = TestBed.inject(SyncIssues);
    TestBed.tick();
    await until('the rejection listed', () => issues.rejected().length === 1);
    expect(issues.rejected()[0].error?.fields?.[0].field).toBe('data.playerId');

    // Further rounds leave it alone: it is not sent again as it is.
    queue.syncNow();
    await emptyPull(2);
    http.expectNone('/api/sync/push');

    await kicks.edit(rejected.id, { playerId: SPEC_IDS.playerA });
    const fixed = await next('/api/sync/push');
    expect(pushBody(fixed).mutations.map((m) => [m.id, m.data['playerId']])).toEqual([[k.id, SPEC_IDS.playerA]]);
    answerAll(fixed);
    await emptyPull(3);
    await until('accepted', () => queue.unsynced() === 0 && queue.rejected() === 0);
  });

  it('on conflict keeps the server’s row, records what changed, and can put the coach’s version back', async () => {
    const theirsBase = { ...(await kicks.log(kick())), version: 2, deletedAt: null };
    await db.outbox.clear();
    await db.kicks.put(theirsBase);
    await kicks.edit(theirsBase.id, { outcome: 'long', carryM: 44 });
    const queue = startQueue();

    const push = await next('/api/sync/push');
    const [edit] = pushBody(push).mutations;
    expect(edit.baseVersion).toBe(2);
    const current: SyncRow = {
      ...edit.data,
      id: theirsBase.id,
      outcome: 'short',
      carryM: 44,
      version: 3,
      updatedAt: '2026-11-21T10:00:00.000Z',
      deletedAt: null,
    };
    push.flush({ results: [{ id: edit.id, status: 'conflict', current }], cursor: 9 });
    await emptyPull(9);

    await until('the conflict', () => queue.conflicts() === 1);
    const stored = await db.kicks.get(theirsBase.id);
    expect([stored?.outcome, stored?.version]).toEqual(['short', 3]);
    expect(await db.outbox.count()).toBe(0);
    const [notice] = await db.conflicts.toArray();
    expect(notice.changedFields).toEqual(['outcome']);
    expect(notice.mine['outcome']).toBe('long');

    await TestBed.inject(SyncIssues).keepMine(notice);
    const again = await next('/api/sync/push');
    expect(pushBody(again).mutations.map((m) => [m.baseVersion, m.data['outcome']])).toEqual([[3, 'long']]);
    answerAll(again);
    await emptyPull(10);
    await until('settled', () => queue.unsynced() === 0 && queue.conflicts() === 0);
  });

  it('does not let a pull overwrite a row whose changes are still waiting', async () => {
    const mine = await kicks.log(kick({ outcome: 'over' }));
    TestBed.inject(Connectivity);
    const queue = startQueue();
    const push = await next('/api/sync/push');
    push.error(new ProgressEvent('error'));
    await until('failure', () => queue.failures() === 1);

    // A later round: the push fails again but imagine the server sends an older copy on pull.
    const retry = await next('/api/sync/push');
    const results = pushBody(retry)
      .mutations.filter((m) => m.entity === 'training_session')
      .map((m) => ({ id: m.id, status: 'applied' as const }));
    retry.flush({ results, cursor: 5 });
    const older: SyncRow = { ...mine, outcome: 'short', version: 1, deletedAt: null };
    (await next('/api/sync/pull')).flush({ changes: [{ entity: 'kick', changeSeq: 5, data: older }], cursor: 5, hasMore: false });
    await until('the pull landed', async () => (await db.syncState.get(SPEC_COACH.id))?.cursor === 5);

    const stored = await db.kicks.get(mine.id);
    expect(stored?.outcome).toBe('over');
    expect(stored?.confirmed?.['outcome']).toBe('short');
  });

  it('keeps the outbox when the session expires while offline, and pushes after signing in again', async () => {
    await kicks.log(kick());
    const queue = startQueue();

    (await next('/api/sync/push')).flush(
      { error: { code: 'unauthorized', message: 'Token expired' } },
      { status: 401, statusText: 'Unauthorized' },
    );
    let refresh: TestRequest[] = [];
    await until('the refresh', () => (refresh = http.match('/api/auth/refresh')).length > 0);
    refresh[0].flush({ error: { code: 'invalid_refresh', message: 'Expired' } }, { status: 401, statusText: 'Unauthorized' });
    await until('signed out', () => queue.phase() === 'signed_out');
    expect(await db.outbox.count()).toBe(2);

    TestBed.inject(AuthSession).signIn({ email: SPEC_COACH.email, password: 'correct horse' }).subscribe();
    http.expectOne('/api/auth/login').flush({ accessToken: 'access-2', refreshToken: 'refresh-token-number-2', user: SPEC_COACH });
    TestBed.tick();

    const push = await next('/api/sync/push');
    expect(push.request.headers.get('Authorization')).toBe('Bearer access-2');
    expect(pushBody(push).mutations.length).toBe(2);
    answerAll(push);
    await emptyPull();
    await until('sent', () => queue.unsynced() === 0);
  });

  it('pushes only the signed-in coach’s changes and keeps everything on sign-out', async () => {
    await kicks.log(kick());
    await db.outbox.add({
      ...(await db.outbox.orderBy('seq').last())!,
      id: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1e01',
      seq: 99,
      userId: 'someone-else',
    });
    const queue = startQueue();
    const push = await next('/api/sync/push');
    expect(pushBody(push).mutations.length).toBe(2);
    push.error(new ProgressEvent('error'));
    await until('failure', () => queue.failures() === 1);

    TestBed.inject(AuthSession).signOut();
    TestBed.tick();
    http.match('/api/auth/logout').forEach((r) => r.flush(null, { status: 204, statusText: 'No Content' }));
    expect(queue.phase()).toBe('signed_out');
    await new Promise((r) => setTimeout(r, 150));
    http.expectNone('/api/sync/push');
    expect(await db.outbox.count()).toBe(3);
  });
});
