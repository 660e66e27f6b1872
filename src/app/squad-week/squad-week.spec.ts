import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { CarryBasis } from '../../../shared/schemas/analysis';
import { BROWSER_STORAGE } from '../core/browser-storage';
import { signedInStorage, until } from '../core/spec-support';
import { FIXTURE_IDS, FIXTURE_SQUAD, fixtureProfile, fixtureUser, fixtureWeek, profileEntry } from '../core/analysis/spec-fixtures';
import { ANSWER_STORE, MemoryAnswerStore } from '../core/offline-cache';
import { SquadWeek } from './squad-week';
import { FileDownload } from '../core/file-download';
import { REVIEW_CLOCK } from './week-dates';

const SQUAD = FIXTURE_IDS.squad;

describe('SquadWeek', () => {
  let harness: RouterTestingHarness;
  let loader: HarnessLoader;
  let backend: HttpTestingController;
  let saved: { name: string; text: string }[];

  async function open(url = '/squad-week'): Promise<void> {
    saved = [];
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'squad-week', component: SquadWeek }], withComponentInputBinding()),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(fixtureUser('head_coach')) },
        { provide: ANSWER_STORE, useValue: new MemoryAnswerStore() },
        // A Wednesday: the week under way starts on 10 Mar, the last complete one on 3 Mar.
        { provide: REVIEW_CLOCK, useValue: () => new Date('2025-03-12T10:00:00Z') },
        { provide: FileDownload, useValue: { saveText: (name: string, text: string) => saved.push({ name, text }) } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url, SquadWeek);
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
  }

  const text = (): string => (harness.fixture.nativeElement as HTMLElement).textContent ?? '';
  const count = (selector: string): number => (harness.fixture.nativeElement as HTMLElement).querySelectorAll(selector).length;

  function expectWeek(start: string, carry: CarryBasis = 'logged'): TestRequest {
    return backend.expectOne(
      (r) => r.url === `/api/squads/${SQUAD}/week` && r.params.get('start') === start && r.params.get('carry') === carry,
    );
  }

  async function answerSquadAndWeek(start = '2025-03-03'): Promise<void> {
    backend.expectOne('/api/squads').flush({ squads: [FIXTURE_SQUAD] });
    await harness.fixture.whenStable();
    expectWeek(start).flush(fixtureWeek(start));
    await harness.fixture.whenStable();
    backend
      .expectOne((r) => r.url === `/api/squads/${SQUAD}/profiles` && r.params.get('technique') === 'lofted')
      .flush({
        squadId: SQUAD,
        technique: 'lofted',
        players: [
          { ...profileEntry(FIXTURE_IDS.playerAda, 'lofted', fixtureProfile()), displayName: 'Ada Okafor', shirtNumber: 7 },
          { ...profileEntry(FIXTURE_IDS.playerBo, 'lofted', fixtureProfile('lofted', 60)), displayName: 'Bo Lind', shirtNumber: 9 },
          { ...profileEntry(FIXTURE_IDS.playerCy, 'lofted', null), displayName: 'Cy Marsh', shirtNumber: 11 },
        ],
      });
    await harness.fixture.whenStable();
  }

  async function playerColumn(): Promise<string[]> {
    const table = await loader.getHarness(MatTableHarness);
    return (await table.getCellTextByColumnName())['player']?.text ?? [];
  }

  afterEach(() => backend.verify());

  it('opens on the last complete week with a line per player, change arrows and the load caution', async () => {
    await open();
    await answerSquadAndWeek();
    expect(await playerColumn()).toEqual(['Ada Okafor', 'Bo Lind', 'Cy Marsh']);
    expect(text()).toContain('3 Mar – 9 Mar 2025');
    const up = (harness.fixture.nativeElement as HTMLElement).querySelector('[aria-label="up 10 points"]');
    const down = (harness.fixture.nativeElement as HTMLElement).querySelector('[aria-label="down 15 points"]');
    expect(up?.textContent).toContain('+10');
    expect(down?.textContent).toContain('-15');
    expect(text()).toContain('Bo Lind (44 on Tue 4 Mar)');
    expect(text()).toContain("Defer to the club's medical staff");
    expect(count('[aria-label="1 session over 40 repetitions"]')).toBe(1);
  });

  it('draws a bar per distance band and a dot per player with predictions', async () => {
    await open();
    await answerSquadAndWeek();
    expect(count('ll-zone-rate-chart rect.ll-zone__bar')).toBe(3);
    expect(count('ll-calibration-chart circle.ll-calibration__point')).toBe(2);
  });

  it('sorts by hit rate and filters by name', async () => {
    await open();
    await answerSquadAndWeek();
    const sort = await loader.getHarness(MatSortHarness);
    const [hitRate] = await sort.getSortHeaders({ label: 'Hit rate' });
    await hitRate!.click();
    expect(await playerColumn()).toEqual(['Cy Marsh', 'Bo Lind', 'Ada Okafor']);
    await hitRate!.click();
    expect(await playerColumn()).toEqual(['Ada Okafor', 'Bo Lind', 'Cy Marsh']);
    const filter = await loader.getHarness(MatInputHarness.with({ placeholder: 'Name or shirt number' }));
    await filter.setValue('bo');
    expect(await playerColumn()).toEqual(['Bo Lind']);
    await filter.setValue('11');
    expect(await playerColumn()).toEqual(['Cy Marsh']);
  });

  it('exports the table as shown to CSV', async () => {
    await open();
    await answerSquadAndWeek();
    const sort = await loader.getHarness(MatSortHarness);
    const [reps] = await sort.getSortHeaders({ label: 'Reps' });
    await reps!.click();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Export CSV/ }))).click();
    expect(saved.length).toBe(1);
    expect(saved[0]!.name).toBe('squad-week-u16-kestrels-2025-03-03-lofted.csv');
    const lines = saved[0]!.text.trim().split('\r\n');
    expect(lines.length).toBe(4);
    expect(lines.slice(1).map((l) => l.split(',')[1])).toEqual(['Cy Marsh', 'Ada Okafor', 'Bo Lind']);
  });

  it('suggests next targets with one tap into Pitchside', async () => {
    await open();
    await answerSquadAndWeek();
    await until('next targets', () => count('a[href^="/pitchside"]') === 2, 25000);
    const link = new URL((harness.fixture.nativeElement as HTMLElement).querySelector<HTMLAnchorElement>('a[href^="/pitchside"]')!.href);
    expect(link.searchParams.get('drillTechnique')).toBe('lofted');
    expect(link.searchParams.get('drillRadiusM')).toBe('3');
    expect(text()).toContain('no repetitions');
  });

  it('steps to the previous week and refetches with still-air carry when asked', async () => {
    await open();
    await answerSquadAndWeek();
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Previous week"]' }))).click();
    await harness.fixture.whenStable();
    expectWeek('2025-02-24').flush(fixtureWeek('2025-02-24'));
    await harness.fixture.whenStable();
    expect(text()).toContain('24 Feb – 2 Mar 2025');
    const toggle = await loader.getHarness(MatSlideToggleHarness.with({ label: 'Still-air carry' }));
    await toggle.toggle();
    expectWeek('2025-02-24', 'still-air').flush({ ...fixtureWeek('2025-02-24'), carryBasis: 'still-air' });
    await harness.fixture.whenStable();
    expect(text()).toContain('Lofted still-air carry');
    expect(text()).toContain('normalised through the flight model to still air');
    await until('next targets', () => count('a[href^="/pitchside"]') === 2, 25000);
  });

  it('refuses a week in the future and opens the one asked for in the address', async () => {
    await open('/squad-week?week=2025-02-17&technique=driven');
    backend.expectOne('/api/squads').flush({ squads: [FIXTURE_SQUAD] });
    await harness.fixture.whenStable();
    expectWeek('2025-02-17').flush(fixtureWeek('2025-02-17'));
    await harness.fixture.whenStable();
    backend
      .expectOne((r) => r.url === `/api/squads/${SQUAD}/profiles` && r.params.get('technique') === 'driven')
      .flush({ squadId: SQUAD, technique: 'driven', players: [] });
    await harness.fixture.whenStable();
    expect(count('ll-zone-rate-chart rect.ll-zone__bar')).toBe(1);
    expect(text()).toContain('Driven hit rate');
    await harness.navigateByUrl('/squad-week?week=2025-03-17');
    await harness.fixture.whenStable();
    expectWeek('2025-03-03').flush(fixtureWeek());
    await harness.fixture.whenStable();
    backend
      .expectOne((r) => r.url === `/api/squads/${SQUAD}/profiles` && r.params.get('technique') === 'lofted')
      .flush({ squadId: SQUAD, technique: 'lofted', players: [] });
    expect(text()).toContain('3 Mar – 9 Mar 2025');
  });
});
