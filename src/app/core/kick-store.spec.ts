import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { BROWSER_STORAGE } from './browser-storage';
import { InvalidEntryError } from './entry-validation';
import { KickStore, type NewKick } from './kick-store';
import { LOFTLINE_DB, LoftlineDb, type LocalKick } from './loftline-db';
import { SessionStore } from './session-store';
import { SPEC_COACH, SPEC_IDS, freshDb, signedInStorage } from './spec-support';
import { settlePush, takeBatch } from './sync/sync-apply';

describe('KickStore and SessionStore (real IndexedDB)', () => {
  let db: LoftlineDb;
  let kicks: KickStore;
  let sessions: SessionStore;
  let sessionId: string;

  function kick(extra: Partial<NewKick> = {}): NewKick {
    return {
      sessionId,
      drillId: null,
      playerId: SPEC_IDS.playerA,
      technique: 'lofted',
      foot: 'right',
      backspinStep: 1,
      sidespinStep: 0,
      targetDistanceM: 35,
      targetRadiusM: 3,
      outcome: 'on_target',
      carryM: null,
      lateralM: null,
      ...extra,
    };
  }

  beforeEach(async () => {
    db = freshDb();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(SPEC_COACH) },
        { provide: LOFTLINE_DB, useValue: db },
      ],
    });
    kicks = TestBed.inject(KickStore);
    sessions = TestBed.inject(SessionStore);
    sessionId = (await sessions.start({ squadId: SPEC_IDS.squad, ballSize: 5, temperatureC: 9, windSpeedMs: 3, windFromDeg: 0 })).id;
    // The session's own create is not under test here: pretend the server took it.
    await db.outbox.clear();
    await db.sessions.update(sessionId, { version: 1 });
  });

  afterEach(async () => {
    TestBed.resetTestingModule();
    await db.delete();
  });

  it('writes the kick and its outbox mutation in one transaction', async () => {
    const logged = await kicks.log(kick({ carryM: 33.5 }));

    const stored = await db.kicks.get(logged.id);
    const outbox = await db.outbox.toArray();
    expect(stored?.outcome).toBe('on_target');
    expect(stored?.version).toBe(0);
    expect(outbox.length).toBe(1);
    expect(outbox[0]).toEqual(
      jasmine.objectContaining({ entity: 'kick', entityId: logged.id, sessionId, op: 'upsert', state: 'pending', userId: SPEC_COACH.id }),
    );
    expect(outbox[0].baseVersion).toBeUndefined();
    expect(outbox[0].data['carryM']).toBe(33.5);
    // Local bookkeeping never travels to the server.
    expect(Object.keys(outbox[0].data)).not.toContain('version');
    expect(Object.keys(outbox[0].data)).not.toContain('recordedBy');
  });

  it('saves nothing when the outbox write fails, so "saved" is never shown for half a write', async () => {
    db.outbox.hook('creating', () => {
      throw new Error('disk full');
    });

    await expectAsync(kicks.log(kick())).toBeRejected();

    expect(await db.kicks.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
  });

  it('refuses a kick the server would reject, before writing anything', async () => {
    const error = await kicks.log(kick({ backspinStep: 5 })).then(
      () => null,
      (e: unknown) => e,
    );

    expect(error).toBeInstanceOf(InvalidEntryError);
    expect((error as InvalidEntryError).fields['backspinStep']).toContain('at most 3');
    expect(await db.kicks.count()).toBe(0);
  });

  it('folds an edit of a kick not yet sent into its pending create (same mutation id)', async () => {
    const logged = await kicks.log(kick());
    const [create] = await db.outbox.toArray();

    await kicks.edit(logged.id, { outcome: 'short', carryM: 31 });

    const outbox = await db.outbox.toArray();
    expect(outbox.length).toBe(1);
    expect(outbox[0].id).toBe(create.id);
    expect(outbox[0].baseVersion).toBeUndefined();
    expect(outbox[0].revision).toBe(1);
    expect(outbox[0].data['outcome']).toBe('short');
    expect((await db.kicks.get(logged.id))?.carryM).toBe(31);
  });

  it('gives an edit made while the create is on its way its own mutation, based on version 1', async () => {
    const logged = await kicks.log(kick());
    await takeBatch(db, SPEC_COACH.id, 500);

    await kicks.edit(logged.id, { outcome: 'long' });

    const outbox = await db.outbox.orderBy('seq').toArray();
    expect(outbox.map((e) => [e.state, e.baseVersion])).toEqual([
      ['in_flight', undefined],
      ['pending', 1],
    ]);
  });

  it('bases changes of a synced kick on its server version plus the changes still waiting', async () => {
    const synced: LocalKick = {
      ...kick(),
      id: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1d01',
      recordedAt: '2026-11-20T18:41:12.345Z',
      updatedAt: '2026-11-20T18:41:13.000Z',
      version: 3,
      deletedAt: null,
      recordedBy: SPEC_COACH.id,
    };
    await db.kicks.put(synced);
    await kicks.edit(synced.id, { outcome: 'left' });
    await takeBatch(db, SPEC_COACH.id, 500);

    await kicks.void(synced.id);

    const outbox = await db.outbox.orderBy('seq').toArray();
    expect(outbox.map((e) => [e.op, e.baseVersion])).toEqual([
      ['upsert', 3],
      ['delete', 4],
    ]);
    expect(outbox[1].data).toEqual({ id: synced.id });
    // The server's copy is kept while changes are outstanding, for a discard.
    expect((await db.kicks.get(synced.id))?.confirmed?.['outcome']).toBe('on_target');
  });

  it('raises the known version when the server acknowledges, so the next edit is based on it', async () => {
    const logged = await kicks.log(kick());
    const batch = await takeBatch(db, SPEC_COACH.id, 500);
    await settlePush(db, batch, [{ id: batch[0].id, status: 'applied' }]);

    await kicks.edit(logged.id, { outcome: 'over' });

    expect((await db.kicks.get(logged.id))?.version).toBe(1);
    expect((await db.outbox.toArray()).map((e) => e.baseVersion)).toEqual([1]);
  });

  it('undoes the coach’s last kick of the session as a void the server will see', async () => {
    const first = await kicks.log(kick({ outcome: 'short' }));
    const second = await kicks.log(kick({ outcome: 'long', playerId: SPEC_IDS.playerB }));

    const undone = await kicks.undoLast(sessionId);

    expect(undone?.id).toBe(second.id);
    expect((await db.kicks.get(second.id))?.deletedAt).not.toBeNull();
    expect((await db.kicks.get(first.id))?.deletedAt).toBeNull();
    const forSecond = await db.outbox.where('entityId').equals(second.id).sortBy('seq');
    expect(forSecond.map((e) => [e.op, e.baseVersion])).toEqual([
      ['upsert', undefined],
      ['delete', 1],
    ]);
  });

  it('removes a voided kick the server never accepted instead of sending a tombstone', async () => {
    const logged = await kicks.log(kick());
    const batch = await takeBatch(db, SPEC_COACH.id, 500);
    await settlePush(db, batch, [
      { id: batch[0].id, status: 'rejected', error: { code: 'invalid', message: 'data.playerId: Unknown player' } },
    ]);

    await kicks.void(logged.id);

    expect(await db.kicks.get(logged.id)).toBeUndefined();
    expect(await db.outbox.count()).toBe(0);
  });

  it('keeps the outbox when the app is reloaded (the database is reopened)', async () => {
    await kicks.log(kick());
    await kicks.log(kick({ outcome: 'blocked' }));
    db.close();

    const reopened = new LoftlineDb(db.name);
    try {
      expect(await reopened.outbox.count()).toBe(2);
      expect((await reopened.kicks.toArray()).map((k) => k.outcome).sort()).toEqual(['blocked', 'on_target']);
    } finally {
      reopened.close();
    }
    await db.open();
  });

  it('records a drill with its default spin and the session’s conditions in the outbox', async () => {
    const drill = await sessions.addDrill(sessionId, {
      technique: 'chipped',
      targetDistanceM: 18,
      targetRadiusM: 2,
      backspinStep: 2,
      sidespinStep: 0,
      label: null,
    });
    await sessions.update(sessionId, { windSpeedMs: 6 });

    const outbox = await db.outbox.orderBy('seq').toArray();
    expect(outbox.map((e) => e.entity)).toEqual(['drill', 'training_session']);
    expect(outbox[0].data).toEqual(jasmine.objectContaining({ id: drill.id, sessionId, backspinStep: 2 }));
    expect(outbox[1].baseVersion).toBe(1);
    expect(outbox[1].data['windSpeedMs']).toBe(6);
  });
});
