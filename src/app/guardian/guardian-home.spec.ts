import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCardHarness } from '@angular/material/card/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import type { SessionUser } from '../../../shared/schemas/auth';
import { UNREACHABLE_MESSAGE } from '../core/api-error';
import { BROWSER_STORAGE } from '../core/browser-storage';
import { signedInStorage } from '../core/spec-support';
import type { ChildSummary } from '../core/guardians/guardian-api';
import { GuardianHome } from './guardian-home';
import { SPEC_CONSENT_TEXT, specConsentedLink, specLink } from '../core/guardians/spec-fixtures';

const guardian: SessionUser = {
  id: '0b8c5a0e-8d1f-4a52-9d0e-6f3b0b6a1c02',
  email: 'morgan@example.org',
  displayName: 'Morgan Reyes',
  role: 'guardian',
  clubId: 'club-1',
};

const nia = specConsentedLink({ digestOptIn: true });
const theo = specLink({
  id: '0b8c5a0e-8d1f-4a52-9d0e-6f3b0b6a1c11',
  playerId: '0b8c5a0e-8d1f-4a52-9d0e-6f3b0b6a1c13',
  playerName: 'Theo Reyes',
  playerFirstName: 'Theo',
  squadName: 'U12',
});

function summaryOf(playerId: string, firstName: string, squadName: string): ChildSummary {
  return {
    playerId,
    firstName,
    squadName,
    weeks: [
      { weekStart: '2026-11-02', reps: 18, hitRate: 0.5 },
      { weekStart: '2026-11-09', reps: 22, hitRate: 0.59 },
    ],
    highlight: `${firstName}’s lofted passes reached 32 m on target.`,
  };
}

describe('GuardianHome', () => {
  let fixture: ComponentFixture<GuardianHome>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  async function open(): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(guardian) },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(GuardianHome);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  const text = (): string => (fixture.nativeElement as HTMLElement).textContent?.replace(/\s+/g, ' ') ?? '';

  afterEach(() => backend.verify());

  it("shows each linked child with first name, squad, weekly summary, highlight and that child's consent", async () => {
    await open();
    backend.expectOne('/api/guardians/consent-text').flush(SPEC_CONSENT_TEXT);
    backend.expectOne('/api/guardians/links').flush({ links: [nia, theo] });
    await fixture.whenStable();
    backend.expectOne(`/api/guardians/children/${nia.playerId}/summary`).flush(summaryOf(nia.playerId, 'Nia', 'U14'));
    backend.expectOne(`/api/guardians/children/${theo.playerId}/summary`).flush(summaryOf(theo.playerId, 'Theo', 'U12'));
    await fixture.whenStable();

    const cards = await loader.getAllHarnesses(MatCardHarness);
    expect(await Promise.all(cards.map((card) => card.getTitleText()))).toEqual(['Nia', 'Theo']);
    expect(await Promise.all(cards.map((card) => card.getSubtitleText()))).toEqual(['U14', 'U12']);
    expect(text()).toContain('Nia logged 40 repetitions over 2 weeks. Hit rate 50 % at first, 59 % in the latest week (up 9 points).');
    expect(text()).toContain('Nia’s lofted passes reached 32 m on target.');
    const tableCells = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('ll-weekly-trend-chart td')).map((cell) =>
      cell.textContent?.trim(),
    );
    expect(tableCells.slice(0, 3)).toEqual(['2 Nov', '18', '50 %']);
    expect((fixture.nativeElement as HTMLElement).querySelectorAll('ll-weekly-trend-chart rect.ll-trend__bar').length).toBe(4);

    const toggles = await loader.getAllHarnesses(MatSlideToggleHarness);
    expect(await Promise.all(toggles.map((toggle) => toggle.isChecked()))).toEqual([true, false]);
    expect(await Promise.all(toggles.map((toggle) => toggle.isDisabled()))).toEqual([false, true]);
  });

  it('says what the digest contains and defers to the club policy and data-protection law', async () => {
    await open();
    backend.expectOne('/api/guardians/consent-text').flush(SPEC_CONSENT_TEXT);
    backend.expectOne('/api/guardians/links').flush({ links: [] });
    await fixture.whenStable();

    expect(text()).toContain('No children are linked to your account yet.');
    expect(text()).toContain('only your child’s first name, their number of training repetitions, their hit-rate trend and one highlight');
    expect(text()).toContain('nothing about other children');
    expect(text()).toContain('safeguarding policy and by local data-protection law');
  });

  it('keeps the page when one summary fails, and retries the children list on request', async () => {
    await open();
    backend.expectOne('/api/guardians/consent-text').flush(SPEC_CONSENT_TEXT);
    backend.expectOne('/api/guardians/links').error(new ProgressEvent('error'));
    await fixture.whenStable();
    expect(text()).toContain('Your children could not be loaded.');
    expect(text()).toContain(UNREACHABLE_MESSAGE);

    await (await loader.getHarness(MatButtonHarness.with({ text: /Try again/ }))).click();
    backend.expectOne('/api/guardians/links').flush({ links: [nia] });
    await fixture.whenStable();
    backend
      .expectOne(`/api/guardians/children/${nia.playerId}/summary`)
      .flush({ error: { code: 'not_found', message: 'No such child among yours' } }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();

    expect(text()).toContain('Nia’s summary could not be loaded.');
    expect(text()).toContain('No such child among yours');
    expect(text()).toContain('Consent for Nia');
  });

  it('updates the child in place when the digest choice changes', async () => {
    await open();
    backend.expectOne('/api/guardians/consent-text').flush(SPEC_CONSENT_TEXT);
    backend.expectOne('/api/guardians/links').flush({ links: [nia] });
    await fixture.whenStable();
    backend.expectOne(`/api/guardians/children/${nia.playerId}/summary`).flush(summaryOf(nia.playerId, 'Nia', 'U14'));
    await fixture.whenStable();

    await (await loader.getHarness(MatSlideToggleHarness)).toggle();
    backend.expectOne(`/api/guardians/links/${nia.id}/digest`).flush({ link: { ...nia, digestOptIn: false } });
    await fixture.whenStable();
    expect(await (await loader.getHarness(MatSlideToggleHarness)).isChecked()).toBeFalse();
    expect(text()).toContain('Consent alone sends nothing');
  });
});
