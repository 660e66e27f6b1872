import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { SpinEstimatesResponse } from '../../../shared/schemas/analysis';
import type { SessionUser } from '../../../shared/schemas/auth';
import type { Technique } from '../../../shared/schemas/sync';
import { BROWSER_STORAGE } from '../core/browser-storage';
import { signedInStorage, until } from '../core/spec-support';
import {
  FIXTURE_IDS,
  FIXTURE_SQUAD,
  fixturePlayer,
  fixtureProfile,
  fixtureUser,
  kick,
  profileEntry,
  progressWeek,
} from '../core/analysis/spec-fixtures';
import { ANSWER_STORE, MemoryAnswerStore } from '../core/offline-cache';
import { PlayerFile } from './player-file';

const ADA = FIXTURE_IDS.playerAda;
const WEEKS = [
  progressWeek('2025-02-17', 'lofted', 20, 0.45, 26),
  progressWeek('2025-02-24', 'lofted', 24, 0.5, 27),
  progressWeek('2025-03-03', 'lofted', 30, 0.6, 29),
  progressWeek('2025-03-03', 'driven', 6, 0.5, 18),
];

/** A server answer for the spin estimates: four timed lofted repetitions, three of them used. */
const SPIN_ESTIMATES: SpinEstimatesResponse = {
  playerId: FIXTURE_IDS.playerAda,
  timing: { biasS: 0.2, sdS: 0.08 },
  perTechniqueLimit: 60,
  techniques: [
    {
      technique: 'lofted',
      timedCount: 4,
      solvedCount: 3,
      skipped: { no_carry: 1, time_too_short: 0, time_too_long: 0, carry_out_of_reach: 0, spread_unresolved: 0 },
      backspinRps: 4.62,
      backspinUncertaintyRps: 0.71,
      backspinScatterRps: 0.9,
      speedMs: 22.1,
      speedUncertaintyMs: 0.4,
      eyeBackspinRps: 6,
    },
  ],
};

describe('PlayerFile', () => {
  let fixture: ComponentFixture<PlayerFile>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;
  let store: MemoryAnswerStore;

  function open(user: SessionUser, id: string, answers: MemoryAnswerStore = new MemoryAnswerStore()): void {
    store = answers;
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(user) },
        { provide: ANSWER_STORE, useValue: store },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(PlayerFile);
    fixture.componentRef.setInput('id', id);
    loader = TestbedHarnessEnvironment.loader(fixture);
    document.body.appendChild(fixture.nativeElement as HTMLElement);
  }

  const text = (): string => (fixture.nativeElement as HTMLElement).textContent ?? '';
  const count = (selector: string): number => (fixture.nativeElement as HTMLElement).querySelectorAll(selector).length;

  function expectGet(path: string, param?: [string, string]): TestRequest {
    return backend.expectOne((r) => r.method === 'GET' && r.url === path && (!param || r.params.get(param[0]) === param[1]));
  }

  /** Answers everything the file asks for with a lofted profile and no other. */
  async function answerAll(carry = 'logged'): Promise<void> {
    await fixture.whenStable();
    expectGet(`/api/players/${ADA}`).flush({ player: fixturePlayer() });
    expectGet(`/api/players/${ADA}/progress`, ['carry', carry]).flush({ playerId: ADA, carryBasis: carry, weeks: WEEKS });
    expectGet(`/api/players/${ADA}/kicks`, ['limit', '500']).flush({
      playerId: ADA,
      total: 12,
      kicks: Array.from({ length: 12 }, (_, i) => kick(i, 'lofted', i % 3 === 0 ? 'on_target' : 'short', 24 + i, i < 8 ? 30 : 35)),
    });
    expectGet(`/api/players/${ADA}/spin-estimates`).flush(SPIN_ESTIMATES);
    expectGet('/api/squads').flush({ squads: [FIXTURE_SQUAD] });
    await fixture.whenStable();
    for (const technique of ['driven', 'lofted', 'chipped', 'curled'] as Technique[]) {
      const entry =
        technique === 'lofted'
          ? profileEntry(ADA, technique, fixtureProfile())
          : { ...profileEntry(ADA, technique, null), pending: technique === 'chipped' };
      expectGet(`/api/players/${ADA}/profile`, ['technique', technique]).flush(entry);
    }
    await fixture.whenStable();
  }

  afterEach(() => {
    backend.verify();
    (fixture.nativeElement as HTMLElement).remove();
  });

  it('shows a coach the progress, outcome mix, envelope, reach and recent kicks of a player', async () => {
    open(fixtureUser('head_coach'), ADA);
    await answerAll();
    expect(text()).toContain('7 · Ada Okafor');
    expect(text()).toContain('Progress · Lofted');
    // Three lofted weeks with a carry: three points; outcome mix: three outcomes in each of three weeks.
    expect(count('ll-progress-chart circle.ll-progress__point')).toBe(3);
    expect(count('ll-outcome-mix-chart rect.ll-outcome__segment')).toBe(9);
    // The envelope comes from the flight worker: 1000 landings, the two drill targets and the next target.
    await until('the envelope', () => count('ll-reach-diagram circle.ll-reach__landing') === 1000, 25000);
    await fixture.whenStable();
    expect(count('ll-reach-diagram circle.ll-reach__target--drill')).toBe(2);
    expect(count('ll-reach-diagram circle.ll-reach__target--next')).toBe(1);
    expect(text()).toContain('40 repetitions · 3 m target');
    expect(text()).toMatch(/likely \d+\.\d–\d+\.\d m \(±1 standard error of launch speed\)/);
    expect(text()).toContain('No repetitions yet');
    expect(text()).toContain('Being fitted from the newest kicks');

    const add = (fixture.nativeElement as HTMLElement).querySelector<HTMLAnchorElement>('ll-reach-table a[href^="/pitchside"]');
    expect(add).not.toBeNull();
    const link = new URL(add!.href);
    expect(link.searchParams.get('drillTechnique')).toBe('lofted');
    expect(Number(link.searchParams.get('drillRadiusM'))).toBe(3);
    const distance = Number(link.searchParams.get('drillTargetM'));
    expect(distance * 2).toBe(Math.round(distance * 2));

    // Spin from hang time, with its uncertainty and how many repetitions were timed.
    expect(text()).toContain('Spin from hang time');
    const spinRow = (fixture.nativeElement as HTMLElement).querySelector('ll-hang-time-spin tr[data-technique="lofted"]')!;
    expect(spinRow.textContent).toContain('4.6 ± 0.7 rev/s');
    expect(spinRow.textContent).toContain('6.0 rev/s');
    expect(text()).toContain('Left out: 1 no carry logged');
    expect(text()).toContain('timing bias (0.20 s)');

    const tables = await loader.getAllHarnesses(MatTableHarness);
    const kicksTable = tables[tables.length - 1]!;
    expect((await kicksTable.getRows()).length).toBe(10);
  });

  it('switches the charts and the table to still-air carry and says so', async () => {
    open(fixtureUser('assistant_coach'), ADA);
    await answerAll();
    expect(text()).toContain('Carries as logged');
    const toggle = await loader.getHarness(MatSlideToggleHarness.with({ label: 'Still-air carry' }));
    await toggle.toggle();
    expectGet(`/api/players/${ADA}/progress`, ['carry', 'still-air']).flush({
      playerId: ADA,
      carryBasis: 'still-air',
      weeks: WEEKS.slice(2),
    });
    await fixture.whenStable();
    expect(await toggle.isChecked()).toBeTrue();
    expect(text()).toContain('normalised through the flight model to still air at ISA sea level, 15 °C, no wind');
    expect(text()).toContain('Still-air carry');
    expect(count('ll-progress-chart circle.ll-progress__point')).toBe(1);
    await until('the envelope', () => count('ll-reach-diagram circle.ll-reach__landing') === 1000, 25000);
  });

  it('follows the technique chosen', async () => {
    open(fixtureUser('head_coach'), ADA);
    await answerAll();
    const driven = await loader.getHarness(MatButtonToggleHarness.with({ text: 'Driven' }));
    await driven.check();
    expect(text()).toContain('Progress · Driven');
    expect(count('ll-progress-chart circle.ll-progress__point')).toBe(1);
    expect(text()).toContain('No driven repetitions logged yet');
  });

  it('opens a player’s own file from "me" without offering Pitchside drills', async () => {
    const user = fixtureUser('player');
    open(user, 'me');
    await fixture.whenStable();
    backend.expectOne('/api/me').flush({ user, club: { id: FIXTURE_IDS.club, name: 'Kestrel' }, playerId: ADA, childPlayerIds: [] });
    await answerAll();
    await until('the envelope', () => count('ll-reach-diagram circle.ll-reach__landing') === 1000, 25000);
    await fixture.whenStable();
    expect(text()).toContain('Ada Okafor');
    expect(count('ll-reach-table a[href^="/pitchside"]')).toBe(0);
  });

  it('refuses another player’s file and shows none of it', async () => {
    open(fixtureUser('player'), FIXTURE_IDS.playerBo);
    await fixture.whenStable();
    const refusal = { error: { code: 'not_found', message: 'No such player in your squads' } };
    for (const path of [
      `/api/players/${FIXTURE_IDS.playerBo}`,
      `/api/players/${FIXTURE_IDS.playerBo}/progress`,
      `/api/players/${FIXTURE_IDS.playerBo}/kicks`,
      `/api/players/${FIXTURE_IDS.playerBo}/spin-estimates`,
    ]) {
      expectGet(path).flush(refusal, { status: 404, statusText: 'Not Found' });
    }
    backend.expectOne('/api/squads').flush({ squads: [] });
    await fixture.whenStable();
    expect(text()).toContain('This player file is not available to you');
    expect(count('ll-progress-chart, ll-reach-diagram, ll-recent-kicks')).toBe(0);
  });

  it('opens offline with the last answers and says how old they are', async () => {
    const answers = new MemoryAnswerStore();
    open(fixtureUser('head_coach'), ADA, answers);
    await answerAll();
    await until('the envelope', () => count('ll-reach-diagram circle.ll-reach__landing') === 1000, 25000);
    backend.verify();
    fixture.destroy();
    TestBed.resetTestingModule();

    open(fixtureUser('head_coach'), ADA, answers);
    await fixture.whenStable();
    const offline = { status: 0, statusText: 'Unknown Error' };
    for (const path of [
      `/api/players/${ADA}`,
      `/api/players/${ADA}/progress`,
      `/api/players/${ADA}/kicks`,
      `/api/players/${ADA}/spin-estimates`,
      '/api/squads',
    ]) {
      expectGet(path).error(new ProgressEvent('error'), offline);
    }
    // The cached answers are read asynchronously; the profiles are asked for once the squad is known.
    await fixture.whenStable();
    await new Promise((resolve) => setTimeout(resolve, 0));
    await fixture.whenStable();
    for (const technique of ['driven', 'lofted', 'chipped', 'curled']) {
      expectGet(`/api/players/${ADA}/profile`, ['technique', technique]).error(new ProgressEvent('error'), offline);
    }
    await fixture.whenStable();
    expect(text()).toContain('The server cannot be reached: showing what this device saved, last updated');
    expect(count('ll-progress-chart circle.ll-progress__point')).toBe(3);
    // The envelope comes from the device's cache, so it is there at once.
    await until('the cached envelope', () => count('ll-reach-diagram circle.ll-reach__landing') === 1000, 10000);
    expect(store.count('envelope')).toBe(3);
  });
});
