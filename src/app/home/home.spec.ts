import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCardHarness } from '@angular/material/card/testing';
import { provideRouter } from '@angular/router';
import type { Role } from '../../../shared/roles';
import type { MeResponse, SessionUser } from '../../../shared/schemas/auth';
import type { PlayerSummary, SquadSummary } from '../../../shared/schemas/squads';
import { UNREACHABLE_MESSAGE } from '../core/api-error';
import { SESSION_STORAGE_KEY } from '../core/auth/auth-session';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { Home } from './home';

const club = { id: 'club-1', name: 'Harbour Academy' };

function userWith(role: Role): SessionUser {
  return { id: `user-${role}`, email: `${role}@example.org`, displayName: `Alex ${role}`, role, clubId: club.id };
}

function player(id: string, displayName: string, shirtNumber: number | null): PlayerSummary {
  return { id, squadId: 'squad-u16', squadName: 'U16 Blue', displayName, shirtNumber, dominantFoot: 'left', isMinor: true };
}

const squads: SquadSummary[] = [
  { id: 'squad-u16', name: 'U16 Blue', ageGroup: 'Under 16', ballSize: 5, playerCount: 18 },
  { id: 'squad-u12', name: 'U12 Amber', ageGroup: 'Under 12', ballSize: 4, playerCount: 14 },
];

describe('Home', () => {
  let fixture: ComponentFixture<Home>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  async function openAs(role: Role): Promise<SessionUser> {
    const user = userWith(role);
    const storage = new MemoryStorage();
    storage.setItem(
      SESSION_STORAGE_KEY,
      JSON.stringify({ accessToken: 'access-1', refreshToken: 'refresh-token-number-1', user, club: null }),
    );
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: BROWSER_STORAGE, useValue: storage },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Home);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    return user;
  }

  function answerMe(user: SessionUser, extra: Partial<MeResponse> = {}): void {
    backend.expectOne('/api/me').flush({ user, club, playerId: null, childPlayerIds: [], ...extra });
  }

  function text(): string {
    return (fixture.nativeElement as HTMLElement).textContent ?? '';
  }

  async function cardTitles(): Promise<string[]> {
    const cards = await loader.getAllHarnesses(MatCardHarness);
    return Promise.all(cards.map((card) => card.getTitleText()));
  }

  afterEach(() => backend.verify());

  it('greets staff and lists their squads with age group, ball size and player count', async () => {
    const user = await openAs('head_coach');
    answerMe(user);
    backend.expectOne('/api/squads').flush({ squads });
    backend.expectNone('/api/players');
    await fixture.whenStable();

    expect(text()).toContain('Hello, Alex head_coach');
    expect(text()).toContain('Head coach · Harbour Academy');
    expect(await cardTitles()).toEqual(['U16 Blue', 'U12 Amber']);
    const [first] = await loader.getAllHarnesses(MatCardHarness);
    expect(await first?.getSubtitleText()).toBe('Under 16');
    expect(await first?.getText()).toContain('size 5');
    expect(await first?.getText()).toContain('18');
  });

  it('tells staff without squads who can add them', async () => {
    const user = await openAs('assistant_coach');
    answerMe(user);
    backend.expectOne('/api/squads').flush({ squads: [] });
    await fixture.whenStable();

    expect(await cardTitles()).toEqual([]);
    expect(text()).toContain('No squads are assigned to you yet');
  });

  it('shows a player their own entry, not squads', async () => {
    const user = await openAs('player');
    answerMe(user, { playerId: 'player-7' });
    backend.expectNone('/api/squads');
    backend.expectOne('/api/players').flush({ players: [player('player-7', 'Sam Keeper', 7)] });
    await fixture.whenStable();

    expect(text()).toContain('Your player entry');
    expect(await cardTitles()).toEqual(['Sam Keeper']);
  });

  it('shows a guardian their linked children', async () => {
    const user = await openAs('guardian');
    answerMe(user, { childPlayerIds: ['player-7', 'player-9'] });
    backend.expectOne('/api/players').flush({
      players: [player('player-7', 'Sam Keeper', 7), player('player-9', 'Jo Keeper', null)],
    });
    await fixture.whenStable();

    expect(text()).toContain('Your children');
    expect(await cardTitles()).toEqual(['Sam Keeper', 'Jo Keeper']);
    expect(text()).toContain('not set');
  });

  it('says when the server cannot be reached and loads again on request', async () => {
    const user = await openAs('admin');
    answerMe(user);
    backend.expectOne('/api/squads').error(new ProgressEvent('error'));
    await fixture.whenStable();

    expect(text()).toContain('Your squads could not be loaded.');
    expect(text()).toContain(UNREACHABLE_MESSAGE);

    await (await loader.getHarness(MatButtonHarness.with({ text: /Try again/ }))).click();
    backend.expectOne('/api/squads').flush({ squads });
    await fixture.whenStable();

    expect(text()).not.toContain(UNREACHABLE_MESSAGE);
    expect(await cardTitles()).toEqual(['U16 Blue', 'U12 Amber']);
  });

  it('shows a failing profile with its own retry', async () => {
    await openAs('admin');
    backend
      .expectOne('/api/me')
      .flush({ error: { code: 'internal', message: 'Database is busy' } }, { status: 500, statusText: 'Server Error' });
    backend.expectOne('/api/squads').flush({ squads: [] });
    await fixture.whenStable();

    expect(text()).toContain('Your profile could not be loaded.');
    expect(text()).toContain('Database is busy');
  });
});
