import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { BROWSER_STORAGE } from '../core/browser-storage';
import { Connectivity } from '../core/connectivity';
import { KickStore } from '../core/kick-store';
import { LOFTLINE_DB, type LoftlineDb } from '../core/loftline-db';
import { SessionStore } from '../core/session-store';
import { SPEC_COACH, SPEC_IDS, freshDb, signedInStorage, until } from '../core/spec-support';
import { Pitchside } from './pitchside';

describe('Pitchside', () => {
  let db: LoftlineDb;
  let fixture: ComponentFixture<Pitchside>;
  let http: HttpTestingController;

  beforeEach(() => {
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
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(async () => {
    for (const request of http.match(() => true)) request.error(new ProgressEvent('error'));
    TestBed.resetTestingModule();
    await db.delete();
  });

  function text(): string {
    return (fixture.nativeElement as HTMLElement).textContent ?? '';
  }

  function badge(): string {
    return (fixture.nativeElement as HTMLElement).querySelector('[data-testid="sync-badge"]')?.textContent?.trim() ?? '';
  }

  it('opens a session from IndexedDB with no signal and says how many entries the server lacks', async () => {
    TestBed.inject(Connectivity);
    window.dispatchEvent(new Event('offline'));
    await db.squads.put({
      id: SPEC_IDS.squad,
      name: 'U16',
      ageGroup: 'U16',
      ballSize: 5,
      playerCount: 16,
      userIds: [SPEC_COACH.id],
      fetchedAt: '2026-11-20T10:00:00.000Z',
    });
    const session = await TestBed.inject(SessionStore).start({
      squadId: SPEC_IDS.squad,
      ballSize: 5,
      temperatureC: 9,
      windSpeedMs: 6,
      windFromDeg: 0,
    });
    const kicks = TestBed.inject(KickStore);
    for (const outcome of ['short', 'long', 'over'] as const) {
      await kicks.log({
        sessionId: session.id,
        drillId: null,
        playerId: SPEC_IDS.playerA,
        technique: 'lofted',
        foot: 'left',
        backspinStep: 0,
        sidespinStep: 0,
        targetDistanceM: 35,
        targetRadiusM: 3,
        outcome,
      });
    }

    fixture = TestBed.createComponent(Pitchside);
    fixture.componentRef.setInput('sessionId', session.id);

    await until('the badge count', () => badge().includes('4 unsynced'));
    expect(badge()).toContain('Offline');
    await until('the summary', () => text().includes('U16 ·'));
    expect(text()).toContain('9 °C · headwind moderate · ball 5');
    http.expectNone((r) => r.url.startsWith('/api/sync/'));

    window.dispatchEvent(new Event('online'));
  });

  it('says so when the session is not on this phone', async () => {
    fixture = TestBed.createComponent(Pitchside);
    fixture.componentRef.setInput('sessionId', '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1f01');

    await until('the message', () => text().includes('not on this phone'));
  });

  it('shows the sync details, including whether storage is persistent, when the badge is tapped', async () => {
    fixture = TestBed.createComponent(Pitchside);
    await until('the badge', () => badge() !== '');

    ((fixture.nativeElement as HTMLElement).querySelector('[data-testid="sync-badge"]') as HTMLButtonElement).click();

    await until('the details', () => text().includes('Sync now'));
    await until('the storage line', () => /persistent storage|is not known/.test(text()));
  });
});
