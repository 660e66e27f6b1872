import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { PlayerSummary } from '../../../shared/schemas/squads';
import { SPEC_CONSENT_TEXT, specConsentedLink, specLink } from '../core/guardians/spec-fixtures';
import type { AdminUser } from './admin-api';
import { GuardianLinks } from './guardian-links';

const guardianUser: AdminUser = {
  id: '7a1e0c52-3f0d-4a8e-9b61-2c4d5e6f7a01',
  email: 'sasha@example.org',
  displayName: 'Sasha Lind',
  role: 'guardian',
  invitedAt: '2026-11-01T12:00:00.000Z',
  activated: false,
  disabled: false,
};
const players: PlayerSummary[] = [
  {
    id: '7a1e0c52-3f0d-4a8e-9b61-2c4d5e6f7a11',
    squadId: 's-u14',
    squadName: 'U14',
    displayName: 'Ivo Lind',
    shirtNumber: 7,
    dominantFoot: 'right',
    isMinor: true,
  },
  {
    id: '7a1e0c52-3f0d-4a8e-9b61-2c4d5e6f7a12',
    squadId: 's-u16',
    squadName: 'U16',
    displayName: 'Ada Berg',
    shirtNumber: 9,
    dominantFoot: 'left',
    isMinor: true,
  },
];
const existing = [
  specConsentedLink({ digestOptIn: true }),
  specLink({
    id: '0b8c5a0e-8d1f-4a52-9d0e-6f3b0b6a1c21',
    guardianName: 'Kim Berg',
    guardianEmail: 'kim@example.org',
    playerName: 'Ada Berg',
    playerFirstName: 'Ada',
    squadName: 'U16',
  }),
];

describe('GuardianLinks', () => {
  let fixture: ComponentFixture<GuardianLinks>;
  let loader: HarnessLoader;
  let overlay: HarnessLoader;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(GuardianLinks);
    loader = TestbedHarnessEnvironment.loader(fixture);
    overlay = TestbedHarnessEnvironment.documentRootLoader(fixture);
    await fixture.whenStable();
    backend.expectOne('/api/guardians/links').flush({ links: existing });
    backend
      .expectOne((request) => request.url === '/api/admin/users' && request.params.get('role') === 'guardian')
      .flush({ users: [guardianUser] });
    backend.expectOne('/api/players').flush({ players });
    backend.expectOne('/api/guardians/consent-text').flush(SPEC_CONSENT_TEXT);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const text = (): string => ((fixture.nativeElement as HTMLElement).textContent ?? '').replace(/\s+/g, ' ');
  const table = () => loader.getHarness(MatTableHarness);
  const select = (label: string) =>
    loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label })).then((f) => f.getControl(MatSelectHarness));

  it('lists every link with its consent and digest state', async () => {
    const rows = await (await table()).getCellTextByColumnName();
    expect(rows['guardian']?.text).toEqual(['Morgan Reyesmorgan@example.org', 'Kim Bergkim@example.org']);
    expect(rows['child']?.text).toEqual(['Nia ReyesU14', 'Ada BergU16']);
    expect(rows['consent']?.text[0]).toContain('Consent recorded on 20 Nov 2026');
    expect(rows['consent']?.text[1]).toBe('No consent recorded.');
    expect(rows['digest']?.text).toEqual(['On', 'Off — no consent']);
    expect(rows['relationship']?.text).toEqual(['Parent', 'Parent']);
  });

  it('filters the list by name, e-mail or squad', async () => {
    const filter = await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: /Filter/ }))).getControl(MatInputHarness);
    await filter?.setValue('u16');
    expect((await (await table()).getCellTextByColumnName())['guardian']?.text).toEqual(['Kim Bergkim@example.org']);
    await filter?.setValue('nobody');
    expect(text()).toContain('No link matches the filter.');
  });

  it('links a chosen guardian to a chosen player and adds the new link to the list', async () => {
    await (await select('Guardian'))?.open();
    await (await select('Guardian'))?.clickOptions({ text: /Sasha Lind/ });
    await (await select('Player'))?.open();
    expect(await (await select('Player'))?.getOptionGroups().then((groups) => Promise.all(groups.map((g) => g.getLabelText())))).toEqual([
      'U14',
      'U16',
    ]);
    await (await select('Player'))?.clickOptions({ text: 'Ivo Lind' });
    await (await loader.getHarness(MatButtonHarness.with({ text: /Link guardian/ }))).click();

    const request = backend.expectOne((r) => r.method === 'POST' && r.url === '/api/guardians/links');
    expect(request.request.body).toEqual({ guardianUserId: guardianUser.id, playerId: players[0]?.id, relationship: 'parent' });
    request.flush(
      {
        link: specLink({
          id: 'new-link',
          guardianName: 'Sasha Lind',
          guardianEmail: guardianUser.email,
          playerName: 'Ivo Lind',
          squadName: 'U14',
        }),
      },
      { status: 201, statusText: 'Created' },
    );
    await fixture.whenStable();

    expect(text()).toContain('Sasha Lind is now linked to Ivo Lind (U14).');
    expect((await (await table()).getCellTextByColumnName())['guardian']?.text[0]).toBe('Sasha Lindsasha@example.org');
  });

  it('asks for both choices before linking, and shows server field errors under the right field', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Link guardian/ }))).click();
    expect(await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Guardian' }))).getTextErrors()).toEqual([
      'Choose a guardian',
    ]);
    expect(await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Player' }))).getTextErrors()).toEqual([
      'Choose a player',
    ]);
    backend.expectNone((r) => r.method === 'POST');

    await (await select('Guardian'))?.open();
    await (await select('Guardian'))?.clickOptions({ text: /Sasha Lind/ });
    await (await select('Player'))?.open();
    await (await select('Player'))?.clickOptions({ text: 'Ada Berg' });
    await (await loader.getHarness(MatButtonHarness.with({ text: /Link guardian/ }))).click();
    backend
      .expectOne((r) => r.method === 'POST')
      .flush(
        {
          error: { code: 'invalid', message: 'The player is not in your club', fields: [{ field: 'playerId', message: 'Unknown player' }] },
        },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();

    expect(await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Player' }))).getTextErrors()).toEqual([
      'Unknown player',
    ]);
    expect(await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Guardian' }))).getTextErrors()).toEqual([]);
    expect(text()).toContain('The player is not in your club');
  });

  it('removes a link after confirmation', async () => {
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove the link between Kim Berg and Ada Berg"]' }))
    ).click();
    const dialog = await overlay.getHarness(MatDialogHarness);
    expect(await dialog.getContentText()).toContain('Kim Berg will no longer see Ada Berg’s summary');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Remove link' }))).click();
    await fixture.whenStable();

    const request = backend.expectOne(`/api/guardians/links/${existing[1]?.id}`);
    expect(request.request.method).toBe('DELETE');
    request.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect((await (await table()).getCellTextByColumnName())['guardian']?.text).toEqual(['Morgan Reyesmorgan@example.org']);
  });
});
