import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { provideRouter } from '@angular/router';
import { BROWSER_STORAGE } from '../core/browser-storage';
import { KickStore } from '../core/kick-store';
import { type CachedPlayer, LOFTLINE_DB, type LocalSession, type LoftlineDb } from '../core/loftline-db';
import { SessionStore } from '../core/session-store';
import { SPEC_COACH, SPEC_IDS, freshDb, signedInStorage, until } from '../core/spec-support';
import { HANG_TIMER_CLOCK } from './hang-timer';
import { KickLogger } from './kick-logger';

const players: CachedPlayer[] = [
  {
    id: SPEC_IDS.playerA,
    squadId: SPEC_IDS.squad,
    squadName: 'U16',
    displayName: 'Ada Lovelock',
    shirtNumber: 7,
    dominantFoot: 'left',
    isMinor: true,
    fetchedAt: '2026-11-20T10:00:00.000Z',
  },
  {
    id: SPEC_IDS.playerB,
    squadId: SPEC_IDS.squad,
    squadName: 'U16',
    displayName: 'Bo Brennan',
    shirtNumber: 9,
    dominantFoot: 'right',
    isMinor: true,
    fetchedAt: '2026-11-20T10:00:00.000Z',
  },
];

describe('KickLogger (Pitchside logging)', () => {
  let db: LoftlineDb;
  let fixture: ComponentFixture<KickLogger>;
  let loader: HarnessLoader;
  let session: LocalSession;
  /** The stopwatch's clock, ms, stepped by hand. */
  let clockMs = 0;

  async function open(withDrill = true): Promise<void> {
    db = freshDb();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(SPEC_COACH) },
        { provide: LOFTLINE_DB, useValue: db },
        { provide: HANG_TIMER_CLOCK, useValue: () => clockMs },
      ],
    });
    await db.players.bulkPut(players);
    const sessions = TestBed.inject(SessionStore);
    session = await sessions.start({ squadId: SPEC_IDS.squad, ballSize: 5 });
    if (withDrill) {
      await sessions.addDrill(session.id, {
        technique: 'lofted',
        targetDistanceM: 35,
        targetRadiusM: 3,
        backspinStep: 2,
        sidespinStep: 0,
        label: null,
      });
    }
    fixture = TestBed.createComponent(KickLogger);
    fixture.componentRef.setInput('session', session);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await until('the chips or the drill form', () => text().includes('Ada') || text().includes('First drill'));
  }

  function text(): string {
    return (fixture.nativeElement as HTMLElement).textContent ?? '';
  }

  function status(): string {
    return (fixture.nativeElement as HTMLElement).querySelector('[data-testid="log-status"]')?.textContent ?? '';
  }

  async function button(name: string | RegExp): Promise<MatButtonHarness> {
    return loader.getHarness(MatButtonHarness.with({ text: name }));
  }

  async function chip(name: RegExp): Promise<MatButtonHarness> {
    return loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="player-chip"]', text: name }));
  }

  async function liveKicks() {
    return (await db.kicks.where('sessionId').equals(session.id).toArray()).filter((k) => !k.deletedAt);
  }

  afterEach(async () => {
    const http = TestBed.inject(HttpTestingController);
    for (const request of http.match(() => true)) request.error(new ProgressEvent('error'));
    TestBed.resetTestingModule();
    await db.delete();
  });

  it('logs a repetition in two taps — player, outcome — with the drill’s defaults', async () => {
    await open();
    expect(await (await button('On target')).isDisabled()).toBeTrue();

    await (await chip(/Ada/)).click();
    await (await button('On target')).click();

    await until('the kick in IndexedDB', async () => (await liveKicks()).length === 1);
    const [kick] = await liveKicks();
    expect(kick).toEqual(
      jasmine.objectContaining({
        playerId: SPEC_IDS.playerA,
        outcome: 'on_target',
        technique: 'lofted',
        foot: 'left',
        backspinStep: 2,
        targetDistanceM: 35,
        carryM: null,
      }),
    );
    expect(await db.outbox.where('entityId').equals(kick.id).count()).toBe(1);
    await until('the saved message', () => status().includes('Saved'));
    expect(status()).toContain('7 Ada Lovelock');
    await until('the count on the chip', async () => (await (await chip(/Ada/)).getText()).includes('1'));
  });

  it('takes a spin adjustment and a carry as the optional third tap, then returns to the drill’s spin', async () => {
    await open();
    await (await chip(/Bo/)).click();
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="More backspin"]' }))).click();
    const carry = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('input[inputmode="decimal"]')!;
    carry.value = '33,5';
    carry.dispatchEvent(new Event('input'));
    await (await button('Short')).click();

    await until('the kick', async () => (await liveKicks()).length === 1);
    const [kick] = await liveKicks();
    expect([kick.backspinStep, kick.carryM, kick.outcome]).toEqual([3, 33.5, 'short']);
    await until('spin back at the default', () => text().includes('backspin') && !text().includes('heavy backspin'));
    expect(carry.value).toBe('');
  });

  it('refuses a carry the server would reject, saving nothing', async () => {
    await open();
    await (await chip(/Ada/)).click();
    const carry = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('input[inputmode="decimal"]')!;
    carry.value = '300';
    carry.dispatchEvent(new Event('input'));
    await (await button('Long')).click();
    await fixture.whenStable();

    expect(text()).toContain('carryM must be more than 0 and at most 120 m');
    expect((await liveKicks()).length).toBe(0);
  });

  it('shows the kicking-load caution once a player passes the club’s limit', async () => {
    await open();
    const kicks = TestBed.inject(KickStore);
    for (let i = 0; i < 40; i++) {
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
        outcome: 'short',
      });
    }
    await until('40 on the chip', async () => (await (await chip(/Ada/)).getText()).includes('40'));
    expect(text()).not.toContain('passed 40 repetitions');

    await (await chip(/Ada/)).click();
    await (await button('Over')).click();

    await until('the caution', () => text().includes('Ada Lovelock has passed 40 repetitions'));
    expect(text()).toContain('medical staff');
    const host = await (await chip(/Ada/)).host();
    expect(await host.getAttribute('aria-label')).toContain('over the repetition limit');
  });

  it('undoes the last entry', async () => {
    await open();
    await (await chip(/Ada/)).click();
    await (await button('Left')).click();
    await until('one', async () => (await liveKicks()).length === 1);
    await (await button('Right')).click();
    await until('two', async () => (await liveKicks()).length === 2);

    await (await button(/Undo last/)).click();

    await until('one left', async () => (await liveKicks()).length === 1);
    expect((await liveKicks())[0].outcome).toBe('left');
    await until('the undo message', () => status().includes('Undone'));
  });

  it('corrects and voids entries from the session’s list', async () => {
    await open();
    await (await chip(/Bo/)).click();
    await (await button('Blocked')).click();
    await until('a kick', async () => (await liveKicks()).length === 1);
    await until('the entry counted', () => text().includes('Entries (1)'));
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: /^Entries/ }))).check();

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label^="Correct"]' }))).click();
    const long = await loader.getHarness(MatButtonToggleHarness.with({ text: 'Long' }));
    await long.check();
    await (await button('Save correction')).click();
    await until('the correction', async () => (await liveKicks())[0]?.outcome === 'long');

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label^="Correct"]' }))).click();
    await (await button('Void')).click();
    await until('voided', async () => (await liveKicks()).length === 0);
    await until('the empty list', () => text().includes('No repetitions logged yet.'));
  });

  it('attaches the stopwatch time to the next repetition when the drill has the stopwatch on', async () => {
    await open();
    expect(await loader.getHarnessOrNull(MatButtonHarness.with({ selector: '[data-testid="hang-timer-tap"]' }))).toBeNull();
    await (await loader.getHarness(MatSlideToggleHarness.with({ label: /Stopwatch/ }))).toggle();
    const tap = await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="hang-timer-tap"]' }));

    clockMs = 10_000;
    await tap.click();
    expect(await tap.getText()).toContain('Bounce');
    clockMs = 12_480;
    await tap.click();
    const reading = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="hang-time"]' }));
    expect(await reading.getValue()).toBe('2.48');
    // The club bias (product default 0.2 s until the server answers) is shown as the flight time used.
    expect(text()).toContain('about 2.28 s in the air');

    await (await chip(/Ada/)).click();
    await (await button('On target')).click();
    await until('the timed kick', async () => (await liveKicks()).length === 1);
    expect((await liveKicks())[0].hangTimeS).toBe(2.48);
    await until('the saved message', () => status().includes('2.48 s'));
    expect(await reading.getValue()).toBe('');

    // Without a new reading the next repetition is untimed; a typed correction is taken as it stands.
    await (await button('Short')).click();
    await until('two kicks', async () => (await liveKicks()).length === 2);
    expect((await liveKicks()).find((k) => k.outcome === 'short')!.hangTimeS).toBeNull();
    await reading.setValue('0.1');
    await (await button('Long')).click();
    await fixture.whenStable();
    expect(text()).toContain('hangTimeS must be at least 0.2 s');
    expect((await liveKicks()).length).toBe(2);
  });

  it('asks for the first drill before logging', async () => {
    await open(false);
    expect(text()).toContain('First drill');
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Curled' }))).check();
    await (await button('Use this drill')).click();

    await until('the drill', async () => (await db.drills.count()) === 1);
    const [drill] = await db.drills.toArray();
    expect([drill.technique, drill.targetDistanceM, drill.targetRadiusM]).toEqual(['curled', 30, 3]);
    expect(await db.outbox.where('entityId').equals(drill.id).count()).toBe(1);
    await until('the chips', () => text().includes('Ada'));
    // A curled drill shows the curl stepper.
    expect(text()).toContain('Curl');
  });
});
