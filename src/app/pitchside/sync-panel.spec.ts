import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';
import { BROWSER_STORAGE } from '../core/browser-storage';
import { KickStore } from '../core/kick-store';
import { type CachedPlayer, LOFTLINE_DB, type LocalKick, type LoftlineDb } from '../core/loftline-db';
import { SPEC_COACH, SPEC_IDS, freshDb, signedInStorage, until } from '../core/spec-support';
import { settlePush, takeBatch } from '../core/sync/sync-apply';
import { Connectivity } from '../core/connectivity';
import { SyncPanel } from './sync-panel';

const ada: CachedPlayer = {
  id: SPEC_IDS.playerA,
  squadId: SPEC_IDS.squad,
  squadName: 'U16',
  displayName: 'Ada Lovelock',
  shirtNumber: 7,
  dominantFoot: 'left',
  isMinor: true,
  fetchedAt: '2026-11-20T10:00:00.000Z',
};

describe('SyncPanel', () => {
  let db: LoftlineDb;
  let fixture: ComponentFixture<SyncPanel>;
  let loader: HarnessLoader;
  let synced: LocalKick;

  beforeEach(async () => {
    db = freshDb();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(SPEC_COACH) },
        { provide: LOFTLINE_DB, useValue: db },
      ],
    });
    synced = {
      id: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f3001',
      sessionId: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f3002',
      drillId: null,
      playerId: ada.id,
      technique: 'lofted',
      foot: 'left',
      backspinStep: 1,
      sidespinStep: 0,
      targetDistanceM: 35,
      targetRadiusM: 3,
      outcome: 'on_target',
      carryM: null,
      lateralM: null,
      recordedAt: '2026-11-20T18:41:12.345Z',
      updatedAt: '2026-11-20T18:41:13.000Z',
      version: 2,
      deletedAt: null,
      recordedBy: SPEC_COACH.id,
    };
    await db.kicks.put(synced);
    await TestBed.inject(KickStore).edit(synced.id, { outcome: 'long' });
    // No signal: the queue leaves the outbox to the spec.
    TestBed.inject(Connectivity);
    window.dispatchEvent(new Event('offline'));
    fixture = TestBed.createComponent(SyncPanel);
    fixture.componentRef.setInput('players', [ada]);
    loader = TestbedHarnessEnvironment.loader(fixture);
  });

  afterEach(async () => {
    const http = TestBed.inject(HttpTestingController);
    for (const request of http.match(() => true)) request.error(new ProgressEvent('error'));
    TestBed.resetTestingModule();
    await db.delete();
  });

  function text(): string {
    return (fixture.nativeElement as HTMLElement).textContent ?? '';
  }

  it('lists a rejected change with the server’s reason, and a discard puts the server’s version back', async () => {
    const batch = await takeBatch(db, SPEC_COACH.id, 500);
    await settlePush(db, batch, [
      { id: batch[0].id, status: 'rejected', error: { code: 'forbidden', message: 'You may not change this squad’s sessions' } },
    ]);

    await until('the rejection', () => text().includes('Not accepted by the server'));
    expect(text()).toContain('Repetition by Ada Lovelock · Long — You may not change this squad’s sessions');
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: 'Fix' }))).isDisabled()).toBeFalse();

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Discard' }))).click();

    await until('discarded', async () => (await db.outbox.count()) === 0);
    const restored = await db.kicks.get(synced.id);
    expect([restored?.outcome, restored?.version]).toEqual(['on_target', 2]);
    await until('the list gone', () => !text().includes('Not accepted by the server'));
  });

  it('shows what changed on the server in a conflict, and keeping the server’s version clears it', async () => {
    const batch = await takeBatch(db, SPEC_COACH.id, 500);
    const current = {
      ...batch[0].data,
      id: synced.id,
      outcome: 'short',
      version: 3,
      updatedAt: '2026-11-21T09:00:00.000Z',
      deletedAt: null,
    };
    await settlePush(db, batch, [{ id: batch[0].id, status: 'conflict', current }]);

    await until('the conflict', () => text().includes('Changed on the server meanwhile'));
    expect(text()).toContain('outcome: yours Long, server Short');
    expect((await db.kicks.get(synced.id))?.outcome).toBe('short');

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Keep server’s' }))).click();

    await until('dismissed', async () => (await db.conflicts.count()) === 0);
    expect(await db.outbox.count()).toBe(0);
    expect((await db.kicks.get(synced.id))?.outcome).toBe('short');
  });
});
