import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { Router, provideRouter } from '@angular/router';
import type { GroundConditions } from '../../../shared/schemas/grounds';
import type { SquadSummary } from '../../../shared/schemas/squads';
import { BROWSER_STORAGE } from '../core/browser-storage';
import { LOFTLINE_DB, type LoftlineDb } from '../core/loftline-db';
import { SessionStore } from '../core/session-store';
import { SPEC_COACH, SPEC_IDS, freshDb, signedInStorage, until } from '../core/spec-support';
import { SessionStart } from './session-start';
import { QuantityFormat } from '../../../shared/quantity-format';
import { DEFAULT_DISPLAY } from '../../../shared/schemas/club';

@Component({ template: '' })
class Blank {}

const U12 = '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1b12';
const U18 = '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1b18';
const GROUND_ID = '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1bf0';
const GROUND = { id: GROUND_ID, name: 'Longmere Lane', altitudeM: 88, kickingBearingDeg: 205 };
const squads: SquadSummary[] = [
  { id: SPEC_IDS.squad, name: 'U16', ageGroup: 'U16', ballSize: 5, playerCount: 16 },
  { id: U12, name: 'U12', ageGroup: 'U12', ballSize: 4, playerCount: 14 },
  { id: U18, name: 'U18', ageGroup: 'U18', ballSize: 5, playerCount: 18, ground: GROUND },
];
/** A 6 m/s wind straight from the kicking direction, as the server converts it. */
const MEASURED: GroundConditions = {
  source: 'weather',
  groundId: GROUND_ID,
  observedAt: '2026-11-20T17:45:00.000Z',
  fetchedAt: '2026-11-20T17:52:10.000Z',
  temperatureC: 9.5,
  relativeHumidityPct: 82,
  pressureHpa: 1001.4,
  windSpeedMs: 6,
  windFromBearingDeg: 205,
  windFromDeg: 0,
  altitudeM: 88,
};

describe('SessionStart (Pitchside)', () => {
  let db: LoftlineDb;
  let fixture: ComponentFixture<SessionStart>;
  let loader: HarnessLoader;
  let http: HttpTestingController;

  async function open(): Promise<void> {
    db = freshDb();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([{ path: 'pitchside/:sessionId', component: Blank }]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(SPEC_COACH) },
        { provide: LOFTLINE_DB, useValue: db },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SessionStart);
    loader = TestbedHarnessEnvironment.loader(fixture);
  }

  /** The roster comes from the API into IndexedDB, and from IndexedDB onto the screen. */
  async function answerRoster(): Promise<void> {
    await until('the squads request', () => {
      const found = http.match('/api/squads');
      found.forEach((r) => r.flush({ squads }));
      return found.length > 0;
    });
    await until('the players request', () => {
      const found = http.match('/api/players');
      found.forEach((r) => r.flush({ players: [] }));
      return found.length > 0;
    });
    await until('the squads on screen', () => text().includes('U12'));
  }

  function text(): string {
    return (fixture.nativeElement as HTMLElement).textContent ?? '';
  }

  async function tap(label: string | RegExp): Promise<void> {
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: label }))).check();
  }

  /** Answers the conditions request for the ground. */
  async function answerConditions(answer: GroundConditions): Promise<void> {
    await until('the conditions request', () => {
      const found = http.match(`/api/grounds/${GROUND_ID}/conditions`);
      found.forEach((r) => r.flush(answer));
      return found.length > 0;
    });
  }

  async function checked(label: string): Promise<boolean> {
    return (await loader.getHarness(MatButtonToggleHarness.with({ text: label }))).isChecked();
  }

  async function startAndRead() {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Start session/ }))).click();
    await until('the session', async () => (await db.sessions.count()) === 1);
    return (await db.sessions.toArray())[0];
  }

  // The screen writes times the club's way; this club keeps the default display settings.
  const hhmm = (iso: string): string => new QuantityFormat(DEFAULT_DISPLAY).time(iso);

  afterEach(async () => {
    for (const request of http.match(() => true)) request.error(new ProgressEvent('error'));
    TestBed.resetTestingModule();
    await db.delete();
  });

  it('offers the coach’s squads and takes the ball size from the squad’s age group', async () => {
    await open();
    await answerRoster();

    await tap('U12');
    expect(await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Size 4' }))).isChecked()).toBeTrue();
    await tap('U16');
    expect(await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Size 5' }))).isChecked()).toBeTrue();
    expect(text()).toContain('U16 plays size 5');
  });

  it('starts a session with the conditions as tapped and opens it', async () => {
    await open();
    await answerRoster();
    await tap('U12');
    await tap('Size 5');
    await tap('Headwind');
    await tap('Strong');
    const warmer = await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Warmer"]' }));
    await warmer.click();
    await warmer.click();

    await (await loader.getHarness(MatButtonHarness.with({ text: /Start session/ }))).click();

    await until('the session', async () => (await db.sessions.count()) === 1);
    const [session] = await db.sessions.toArray();
    expect(session).toEqual(jasmine.objectContaining({ squadId: U12, temperatureC: 14, windSpeedMs: 11, windFromDeg: 0, ballSize: 5 }));
    expect(session.conditionsSource).toEqual({ temperatureC: 'coach', windSpeedMs: 'coach', windFromDeg: 'coach', ballSize: 'coach' });
    expect((await db.outbox.toArray()).map((e) => [e.entity, e.entityId])).toEqual([['training_session', session.id]]);
    await until('the session page', () => TestBed.inject(Router).url === `/pitchside/${session.id}`);
  });

  it('records calm as no wind and a temperature left alone as a default', async () => {
    await open();
    await answerRoster();
    await tap('U16');
    expect(text()).not.toContain('Wind strength');

    await (await loader.getHarness(MatButtonHarness.with({ text: /Start session/ }))).click();

    await until('the session', async () => (await db.sessions.count()) === 1);
    const [session] = await db.sessions.toArray();
    expect([session.windSpeedMs, session.windFromDeg, session.temperatureC]).toEqual([0, null, 12]);
    expect(session.conditionsSource?.['temperatureC']).toBe('default');
    expect(session.conditionsSource?.['ballSize']).toBe('default');
  });

  it('asks for the squad before starting', async () => {
    await open();
    await answerRoster();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Start session/ }))).click();
    await fixture.whenStable();

    expect(text()).toContain('Pick the squad first.');
    expect(await db.sessions.count()).toBe(0);
  });

  it('offers a session still open on this phone to continue, also with no signal', async () => {
    await open();
    await db.squads.bulkPut(squads.map((s) => ({ ...s, userIds: [SPEC_COACH.id], fetchedAt: '2026-11-20T10:00:00.000Z' })));
    const open1 = await TestBed.inject(SessionStore).start({ squadId: SPEC_IDS.squad, ballSize: 5 });
    // No answer from the server: the roster request fails as on a pitch without signal.
    await until('the roster request', () => {
      const found = http.match('/api/squads');
      found.forEach((r) => r.error(new ProgressEvent('error')));
      return found.length > 0;
    });

    await until('the open session', () => text().includes('Continue a session'));
    await (await loader.getHarness(MatButtonHarness.with({ text: /U16 · started/ }))).click();
    await until('the session page', () => TestBed.inject(Router).url === `/pitchside/${open1.id}`);
  });

  it('prefills the conditions measured at the squad’s ground and stores them with their source', async () => {
    await open();
    await answerRoster();
    await tap('U18');
    await answerConditions(MEASURED);
    await until('the measurement on screen', () => text().includes(`Measured by the weather service at ${hhmm(MEASURED.observedAt)}`));
    expect(await checked('Headwind')).toBeTrue();
    expect(await checked('Moderate')).toBeTrue();
    expect(text()).toContain('9.5 °C');
    expect(text()).toContain('82 %');
    // Numbers follow the club's locale (en-GB groups thousands).
    expect(text()).toContain('1,001.4 hPa');
    expect(text()).toContain('6 m/s headwind');
    expect(text()).toContain('Altitude 88 m, from the ground (Longmere Lane)');

    const session = await startAndRead();
    expect(session).toEqual(
      jasmine.objectContaining({
        squadId: U18,
        groundId: GROUND_ID,
        temperatureC: 9.5,
        relativeHumidityPct: 82,
        pressureHpa: 1001.4,
        altitudeM: 88,
        windSpeedMs: 6,
        windFromDeg: 0,
        conditionsObservedAt: MEASURED.observedAt,
      }),
    );
    expect(session.conditionsSource).toEqual({
      temperatureC: 'weather',
      relativeHumidityPct: 'weather',
      pressureHpa: 'weather',
      windSpeedMs: 'weather',
      windFromDeg: 'weather',
      altitudeM: 'ground',
      ballSize: 'default',
    });
  });

  it('lets the coach override a measured value, which makes that value theirs', async () => {
    await open();
    await answerRoster();
    await tap('U18');
    await answerConditions(MEASURED);
    await until('the measurement on screen', () => text().includes('Measured by the weather service'));
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Warmer"]' }))).click();
    await tap('Tailwind');
    expect(text()).toContain('10.5 °C');
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="source-temperatureC"]')?.textContent?.trim()).toBe(
      'entered',
    );
    expect(text()).toContain('Use the measurement');

    const session = await startAndRead();
    expect([session.temperatureC, session.windFromDeg, session.windSpeedMs, session.pressureHpa]).toEqual([10.5, 180, 6, 1001.4]);
    expect(session.conditionsSource).toEqual(
      jasmine.objectContaining({ temperatureC: 'coach', windFromDeg: 'coach', windSpeedMs: 'weather', pressureHpa: 'weather' }),
    );
    expect(session.conditionsObservedAt).toBe(MEASURED.observedAt);
  });

  it('puts the measurement back after an override when asked', async () => {
    await open();
    await answerRoster();
    await tap('U18');
    await answerConditions(MEASURED);
    await until('the measurement on screen', () => text().includes('Measured by the weather service'));
    await tap('From left');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Use the measurement' }))).click();
    expect(await checked('Headwind')).toBeTrue();
    const session = await startAndRead();
    expect([session.windFromDeg, session.conditionsSource?.['windFromDeg']]).toEqual([0, 'weather']);
  });

  it('keeps the coach’s taps when the weather service is unavailable', async () => {
    await open();
    await answerRoster();
    await tap('U18');
    await answerConditions({ source: 'unavailable', groundId: GROUND_ID, reason: 'The weather service did not answer within 2 s' });
    await until('the note', () =>
      text().includes('No measurement from the weather service (The weather service did not answer within 2 s). Your taps are used.'),
    );
    expect(await checked('Calm')).toBeTrue();
    await tap('Headwind');
    const session = await startAndRead();
    expect(session).toEqual(
      jasmine.objectContaining({
        groundId: GROUND_ID,
        temperatureC: 12,
        windSpeedMs: 3,
        windFromDeg: 0,
        altitudeM: 88,
        conditionsObservedAt: null,
      }),
    );
    expect(session.relativeHumidityPct ?? null).toBeNull();
    expect(session.conditionsSource).toEqual({
      temperatureC: 'default',
      windSpeedMs: 'coach',
      windFromDeg: 'coach',
      altitudeM: 'ground',
      ballSize: 'default',
    });
  });

  it('starts at once while the conditions are still on their way', async () => {
    await open();
    await answerRoster();
    await tap('U18');
    await until('the question to the weather service', () => text().includes('Asking the weather service'));
    const session = await startAndRead();
    expect(session.conditionsSource?.['temperatureC']).toBe('default');
    expect(session.conditionsObservedAt ?? null).toBeNull();
  });
});
