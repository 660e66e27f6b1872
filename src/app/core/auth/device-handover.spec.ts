import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import type { AuthTokens, SessionUser } from '../../../../shared/schemas/auth';
import { AnalysisCache } from '../analysis/analysis-cache';
import { BROWSER_STORAGE, MemoryStorage } from '../browser-storage';
import { LOFTLINE_DB, type LocalSession, type LoftlineDb, type OutboxEntry } from '../loftline-db';
import { SPEC_COACH, SPEC_IDS, freshDb, until } from '../spec-support';
import { AuthSession } from './auth-session';
import { DEVICE_USER_STORAGE_KEY, DeviceHandover, handOverDevice } from './device-handover';

const OTHER: SessionUser = { ...SPEC_COACH, id: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1a09', email: 'head@example.org', role: 'head_coach' };

function session(id: string): LocalSession {
  return {
    id,
    squadId: SPEC_IDS.squad,
    startedAt: '2026-11-20T18:30:00.000Z',
    ballSize: 5,
    version: 1,
    updatedAt: '2026-11-20T18:30:00.000Z',
    deletedAt: null,
  };
}

function entry(id: string, userId: string, entityId: string): OutboxEntry {
  return {
    id,
    seq: 1,
    userId,
    entity: 'training_session',
    entityId,
    sessionId: entityId,
    op: 'upsert',
    data: { ...session(entityId) },
    queuedAt: '2026-11-20T18:31:00.000Z',
    state: 'pending',
    revision: 0,
    attempts: 0,
  };
}

/** A device the head coach used: pulled rows, caches, a pull cursor and one change not yet synced. */
async function usedBy(db: LoftlineDb, user: SessionUser): Promise<void> {
  await db.sessions.bulkPut([session('s-pulled'), session('s-unsynced')]);
  await db.squads.put({
    id: SPEC_IDS.squad,
    clubId: user.clubId,
    name: 'First team',
    ageGroup: 'Open',
    ballSize: 5,
    userIds: [user.id],
    fetchedAt: 'x',
  } as never);
  await db.syncState.put({ userId: user.id, cursor: 42, lastPulledAt: null });
  await db.analysisCache.put({ key: `${user.id}|planner:last`, kind: 'planner-plan', value: { squad: 'First team' }, updatedAt: 'x' });
  await db.outbox.put(entry('m-1', user.id, 's-unsynced'));
}

describe('DeviceHandover (shared phones)', () => {
  let db: LoftlineDb;
  let storage: MemoryStorage;

  beforeEach(() => {
    db = freshDb();
    storage = new MemoryStorage();
  });
  afterEach(async () => {
    TestBed.resetTestingModule();
    db.close();
    await db.delete();
  });

  it("clears the previous user's rows and caches when another user signs in, keeping their unsynced change under them", async () => {
    await usedBy(db, OTHER);
    storage.setItem(DEVICE_USER_STORAGE_KEY, OTHER.id);
    const result = await handOverDevice(db, storage, SPEC_COACH.id);
    expect(result).toEqual({ cleared: true, keptForOthers: 1 });
    expect(await db.sessions.count()).toBe(0);
    expect(await db.squads.count()).toBe(0);
    expect(await db.syncState.count()).toBe(0);
    expect(await db.analysisCache.count()).toBe(0);
    const kept = await db.outbox.toArray();
    expect(kept.map((e) => [e.id, e.userId])).toEqual([['m-1', OTHER.id]]);
    expect(storage.getItem(DEVICE_USER_STORAGE_KEY)).toBe(SPEC_COACH.id);
  });

  it('keeps everything when the same user signs in again, and keeps the own unsynced rows of the one signing in', async () => {
    await usedBy(db, SPEC_COACH);
    storage.setItem(DEVICE_USER_STORAGE_KEY, SPEC_COACH.id);
    expect(await handOverDevice(db, storage, SPEC_COACH.id)).toEqual({ cleared: false, keptForOthers: 0 });
    expect(await db.sessions.count()).toBe(2);
    // A device last used by nobody we know (an older app version): clear, but never the signer's own outbox rows.
    storage.removeItem(DEVICE_USER_STORAGE_KEY);
    expect((await handOverDevice(db, storage, SPEC_COACH.id)).cleared).toBeTrue();
    expect((await db.sessions.toArray()).map((s) => s.id)).toEqual(['s-unsynced']);
    expect(await db.outbox.count()).toBe(1);
  });

  it('clears before the new user is signed in, and counts the changes kept for others', async () => {
    await usedBy(db, OTHER);
    storage.setItem(DEVICE_USER_STORAGE_KEY, OTHER.id);
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: storage },
        { provide: LOFTLINE_DB, useValue: db },
      ],
    });
    const auth = TestBed.inject(AuthSession);
    const signedIn = new Promise<SessionUser>((resolve) => auth.signIn({ email: SPEC_COACH.email, password: 'pw' }).subscribe(resolve));
    const tokens: AuthTokens = { accessToken: 'a', refreshToken: 'refresh-token-number-2', user: SPEC_COACH };
    TestBed.inject(HttpTestingController).expectOne('/api/auth/login').flush(tokens);
    expect(auth.isSignedIn()).toBeFalse();
    expect(await signedIn).toEqual(SPEC_COACH);
    expect(await db.sessions.count()).toBe(0);
    const handover = TestBed.inject(DeviceHandover);
    await TestBed.inject(AnalysisCache).put('planner:last', 'planner-plan', { squad: 'U16' });
    expect(await TestBed.inject(AnalysisCache).get('planner:last')).toEqual({ squad: 'U16' });
    // The other user's planner answer would be under their own id: never this user's.
    expect(await db.analysisCache.get(`${OTHER.id}|planner:last`)).toBeUndefined();
    await until('the kept-for-others count', () => handover.keptForOthers() === 1);
  });
});
