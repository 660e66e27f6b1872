import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection, type Provider } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import { BALL_SIZES, setPieceCheck } from '../../../shared/flight';
import { setPieceCloud } from '../flight/set-piece-rank';
import { attackingHalfMarkings } from '../ui/pitch-markings';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { ANSWER_STORE, type AnswerStore } from '../core/offline-cache';
import { SliderFieldHarness } from '../ui/slider-field-harness';
import { FIXTURE_PROFILES, FIXTURE_SQUAD } from './planner-fixture';
import { Planner } from './planner';
import { PLANNER_SAMPLES, PLANNER_SEED, PlannerStore } from './planner-store';
import type { PlannerSpot } from './planner-rank';

async function until(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 20000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

/** A cache in memory with the shape of the app's analysis cache, shared between two openings. */
function memoryCache(): AnswerStore & { keys(): string[] } {
  const store = new Map<string, unknown>();
  return {
    get: <T>(key: string) => Promise.resolve(store.get(key) as T | undefined),
    put: <T>(key: string, _kind: string, value: T) => {
      store.set(key, structuredClone(value));
      return Promise.resolve();
    },
    keys: () => [...store.keys()],
  };
}

/** The specs' spot: 22 m out, 6 m left of centre (pitch frame x = −6). */
const SPOT: PlannerSpot = { ball: { x: -6, y: 22 }, wallHeightM: 2, aimXM: 0 };

function expectedShares(spot: PlannerSpot) {
  const ball = BALL_SIZES[5];
  return FIXTURE_PROFILES.players.flatMap((p) =>
    p.profile
      ? [
          {
            name: p.displayName,
            result: setPieceCheck({
              ballX: spot.ball.y,
              ballY: -spot.ball.x,
              wallHeightM: spot.wallHeightM,
              aimYM: 0,
              profile: p.profile,
              conditions: { ball: { massKg: ball.massKg, radiusM: ball.radiusM } },
              samples: PLANNER_SAMPLES,
              seed: PLANNER_SEED,
            }),
          },
        ]
      : [],
  );
}

describe('Planner (Set-piece planner)', () => {
  let fixture: ComponentFixture<Planner>;
  let loader: HarnessLoader;
  let http: HttpTestingController;

  function open(cache: AnswerStore, providers: Provider[] = []): void {
    TestBed.configureTestingModule({
      providers: [...providers, provideZonelessChangeDetection(), provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    TestBed.overrideComponent(Planner, { set: { providers: [PlannerStore, { provide: ANSWER_STORE, useValue: cache }] } });
    fixture = TestBed.createComponent(Planner);
    loader = TestbedHarnessEnvironment.loader(fixture);
    http = TestBed.inject(HttpTestingController);
  }

  /** Wait for a request to `url` and answer it (`match` takes requests off the list, so it is called once per look). */
  async function answer(url: string, body: object | 'offline'): Promise<void> {
    let found: ReturnType<HttpTestingController['match']> = [];
    await until(`a request to ${url}`, () => {
      found = http.match((r) => r.urlWithParams === url);
      return found.length > 0;
    });
    for (const req of found) {
      if (body === 'offline') req.error(new ProgressEvent('error'), { status: 0 });
      else req.flush(body);
    }
  }

  const profilesUrl = `/api/squads/${FIXTURE_SQUAD.id}/profiles?technique=curled`;

  async function openOnline(cache: AnswerStore): Promise<void> {
    open(cache);
    fixture.componentInstance['store'].spot.set(SPOT);
    await answer('/api/squads', { squads: [FIXTURE_SQUAD] });
    await answer(profilesUrl, FIXTURE_PROFILES);
  }

  async function rankingNames(): Promise<string[]> {
    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getRows();
    return Promise.all(rows.map(async (r) => (await r.getCellTextByColumnName())['player'] ?? ''));
  }

  function count(selector: string): number {
    return (fixture.nativeElement as HTMLElement).querySelectorAll(selector).length;
  }

  afterEach(() => {
    for (const req of http.match(() => true)) req.error(new ProgressEvent('error'), { status: 0 });
    TestBed.resetTestingModule();
  }, 60_000);

  it('ranks the squad for the spot by share in under the bar, players without a profile last', async () => {
    await openOnline(memoryCache());
    const expected = expectedShares(SPOT).sort((a, b) => b.result.shares.onTarget - a.result.shares.onTarget);
    await until(
      'the ranking',
      async () => (await rankingNames()).length === 4 && count('g.ll-goal-mouth__cloud path.ll-goal-mouth__mark') > 0,
    );
    const names = await rankingNames();
    expect(names.slice(0, 3)).toEqual(expected.map((e) => jasmine.stringContaining(e.name) as unknown as string));
    expect(names[3]).toContain('Di Marsh');
    expect(names[3]).toContain('no profile');
    const table = await loader.getHarness(MatTableHarness);
    const first = await (await table.getRows())[0]!.getCellTextByColumnName();
    expect(first['onTarget']).toBe(`${Math.round(expected[0]!.result.shares.onTarget * 100)} %`);
    expect(first['clearsWall']).toBe(`${Math.round(expected[0]!.result.shares.clearsWall * 100)} %`);
    expect(await (await loader.getHarness(MatSelectHarness)).getValueText()).toContain('U16');
  }, 60_000);

  it('draws the pitch to scale, one wall and ball, and one goal-mouth mark per kick of the chosen player that reached the line', async () => {
    await openOnline(memoryCache());
    await until('the cloud', () => count('g.ll-goal-mouth__cloud path.ll-goal-mouth__mark') > 0);
    expect(count('ll-set-piece-pitch path.ll-pitch__line')).toBe(attackingHalfMarkings().paths.length);
    expect(count('ll-set-piece-pitch line.ll-pitch__wall')).toBe(1);
    expect(count('[data-testid="planner-ball"]')).toBe(1);

    const best = expectedShares(SPOT).sort((a, b) => b.result.shares.onTarget - a.result.shares.onTarget)[0]!;
    const profile = FIXTURE_PROFILES.players.find((p) => p.displayName === best.name)!.profile!;
    const ball = BALL_SIZES[5];
    const cloud = setPieceCloud({
      ballX: 22,
      ballY: 6,
      wallHeightM: 2,
      aimYM: 0,
      profile,
      conditions: { ball: { massKg: ball.massKg, radiusM: ball.radiusM } },
      samples: PLANNER_SAMPLES,
      seed: PLANNER_SEED,
    }).cloud;
    expect(count('g.ll-goal-mouth__cloud path.ll-goal-mouth__mark')).toBe(cloud.kind.length);
    expect(count('g.ll-goal-mouth__cloud path.ll-goal-mouth__mark--in')).toBe(cloud.kind.filter((k) => k === 0).length);
    expect(count('ll-trajectory-chart path.ll-trajectory__trace')).toBe(1);

    // Picking another player redraws the cloud for them.
    const bo = await loader.getHarness(MatButtonHarness.with({ text: /Bo Brennan/ }));
    await bo.click();
    const boResult = expectedShares(SPOT).find((e) => e.name === 'Bo Brennan')!.result;
    const reached = Math.round(PLANNER_SAMPLES * (boResult.shares.onTarget + boResult.shares.over + boResult.shares.wide));
    await until('Bo’s cloud', () => count('g.ll-goal-mouth__cloud path.ll-goal-mouth__mark') === reached);
    expect((fixture.nativeElement as HTMLElement).querySelector('#planner-player-title')?.textContent).toContain('Bo Brennan');
  }, 60_000);

  it("takes the aim in a yards club's unit and keeps it in metres, inside the posts", async () => {
    const storage = new MemoryStorage();
    storage.setItem('loftline.clubSettings', JSON.stringify({ timingBiasS: 0.2, timingSdS: 0.08, distanceUnit: 'yd', locale: 'en-GB' }));
    open(memoryCache(), [{ provide: BROWSER_STORAGE, useValue: storage }]);
    const aim = await loader.getHarness(SliderFieldHarness.with({ label: 'Aim' }));
    // 9.15 m (Law 13) is 10.01 yd.
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('The wall stands 10.01 yd away');
    // 2 yd = 1.8288 m (1 yd = 0.9144 m exactly, international yard and pound agreement, 1959).
    await aim.type('2');
    await until('the aim in metres', () => fixture.componentInstance['store'].spot().aimXM === 1.8288);
    // Half a metre inside a post is 3.16 m from the centre (Law 1: 7.32 m between the posts) = 3.46 yd.
    await aim.type('3.5');
    expect(await aim.getError()).toBe('-3.4 to 3.4 yd');
    expect(fixture.componentInstance['store'].spot().aimXM).toBe(1.8288);
  });

  it('recomputes when the ball is moved with the keyboard', async () => {
    await openOnline(memoryCache());
    await until(
      'the ranking',
      async () => (await rankingNames()).length === 4 && count('g.ll-goal-mouth__cloud path.ll-goal-mouth__mark') > 0,
    );
    const ball = (fixture.nativeElement as HTMLElement).querySelector<SVGGElement>('[data-testid="planner-ball"]')!;
    for (let i = 0; i < 4; i++) ball.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowDown', shiftKey: true, bubbles: true }));
    const moved: PlannerSpot = { ...SPOT, ball: { x: -6, y: 30 } };
    const expected = expectedShares(moved).sort((a, b) => b.result.shares.onTarget - a.result.shares.onTarget);
    await until('the ranking for 30 m', async () => {
      const table = await loader.getHarness(MatTableHarness);
      const row = (await table.getRows())[0];
      const first = row ? await row.getCellTextByColumnName() : {};
      return (
        (first['player'] ?? '').includes(expected[0]!.name) &&
        first['onTarget'] === `${Math.round(expected[0]!.result.shares.onTarget * 100)} %`
      );
    });
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Ball 30.0 m out');
  }, 60_000);

  it('opens offline on the last spot with the kept profiles and ranking', async () => {
    const cache = memoryCache();
    await openOnline(cache);
    await until('the ranking', async () => (await rankingNames()).length === 4);
    const online = await rankingNames();
    await until(
      'the ranking kept',
      () => cache.keys().some((k) => k.startsWith('planner:') && k !== 'planner:last') && cache.keys().includes('planner:last'),
      4000,
    );
    for (const req of http.match(() => true)) req.error(new ProgressEvent('error'), { status: 0 });
    TestBed.resetTestingModule();

    open(cache);
    await answer('/api/squads', 'offline');
    await answer(profilesUrl, 'offline');
    await until('the kept ranking', async () => (await rankingNames()).length === 4);
    expect(await rankingNames()).toEqual(online);
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Profiles saved on this device');
    expect(text).toContain('Ranking kept on this device');
    expect(text).toContain('Ball 22.0 m out, 6.0 m left of centre');
  }, 60_000);
});
