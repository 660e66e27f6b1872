import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { PlayerSummary, SquadSummary } from '../../../shared/schemas/squads';
import type { AdminUser } from './admin-api';
import { InviteForm } from './invite-form';

const squads: SquadSummary[] = [
  { id: '3c9f1a7e-2b4d-4e6f-8a1b-5c7d9e0f1a01', name: 'U14', ageGroup: 'Under 14', ballSize: 4, playerCount: 16 },
  { id: '3c9f1a7e-2b4d-4e6f-8a1b-5c7d9e0f1a02', name: 'U16', ageGroup: 'Under 16', ballSize: 5, playerCount: 18 },
];
const players: PlayerSummary[] = [
  {
    id: '3c9f1a7e-2b4d-4e6f-8a1b-5c7d9e0f1a11',
    squadId: squads[0]!.id,
    squadName: 'U14',
    displayName: 'Ivo Lind',
    shirtNumber: 7,
    dominantFoot: 'right',
    isMinor: true,
  },
  {
    id: '3c9f1a7e-2b4d-4e6f-8a1b-5c7d9e0f1a12',
    squadId: 'first',
    squadName: 'First team',
    displayName: 'Rui Costa',
    shirtNumber: 10,
    dominantFoot: 'left',
    isMinor: false,
  },
];
const waiting: AdminUser = {
  id: 'u-1',
  email: 'kim@example.org',
  displayName: 'Kim Berg',
  role: 'guardian',
  invitedAt: '2026-11-28T12:00:00.000Z',
  activated: false,
  disabled: false,
};
const neverInvited: AdminUser = {
  id: 'u-2',
  email: 'admin@example.org',
  displayName: 'Ola Admin',
  role: 'admin',
  invitedAt: null,
  activated: true,
  disabled: false,
};

describe('InviteForm', () => {
  let fixture: ComponentFixture<InviteForm>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(InviteForm);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    backend.expectOne('/api/admin/users').flush({ users: [waiting, neverInvited] });
    backend.expectOne('/api/squads').flush({ squads });
    backend.expectOne('/api/players').flush({ players });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const fieldLabels = async (): Promise<(string | null)[]> =>
    Promise.all((await loader.getAllHarnesses(MatFormFieldHarness)).map((f) => f.getLabel()));
  const input = async (label: string) => (await field(label)).getControl(MatInputHarness);
  const select = async (label: string) => (await field(label)).getControl(MatSelectHarness);
  const send = async () => (await loader.getHarness(MatButtonHarness.with({ text: /Send invitation/ }))).click();
  const text = (): string => ((fixture.nativeElement as HTMLElement).textContent ?? '').replace(/\s+/g, ' ');

  async function chooseRole(label: string): Promise<void> {
    const role = await select('Role');
    await role?.open();
    await role?.clickOptions({ text: label });
  }

  async function fillPerson(): Promise<void> {
    await (await input('E-mail'))?.setValue(' Sam@Example.org ');
    await (await input('Display name'))?.setValue(' Sam Okoro ');
  }

  it('lists the invited accounts with their state, leaving out accounts never invited', async () => {
    const rows = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(rows['who']?.text).toEqual(['Kim Bergkim@example.org']);
    expect(rows['role']?.text).toEqual(['Guardian']);
    expect(rows['status']?.text).toEqual(['Waiting for the invitation to be accepted']);
  });

  it('asks for the squads of a coach and sends them as squadIds', async () => {
    await chooseRole('Assistant coach');
    expect(await fieldLabels()).toContain('Squads');
    expect(await fieldLabels()).not.toContain('Child');
    await fillPerson();
    await send();
    expect(await (await field('Squads')).getTextErrors()).toEqual(['Choose at least one squad']);
    backend.expectNone('/api/admin/invites');

    const squadSelect = await select('Squads');
    await squadSelect?.open();
    await squadSelect?.clickOptions({ text: /U14/ });
    await squadSelect?.clickOptions({ text: /U16/ });
    await send();
    const request = backend.expectOne('/api/admin/invites');
    expect(request.request.body).toEqual({
      email: 'sam@example.org',
      displayName: 'Sam Okoro',
      role: 'assistant_coach',
      squadIds: [squads[0]?.id, squads[1]?.id],
    });
    request.flush(
      { userId: 'u-3', email: 'sam@example.org', expiresAt: '2026-12-08T12:00:00.000Z' },
      { status: 201, statusText: 'Created' },
    );
    await fixture.whenStable();
    backend.expectOne('/api/admin/users').flush({ users: [waiting] });
    await fixture.whenStable();

    expect(text()).toContain('Invitation sent to sam@example.org. The link works until 8 Dec 2026');
  });

  it("asks a guardian's child among the under-18s and sends it as playerId", async () => {
    await chooseRole('Guardian');
    const child = await select('Child');
    await child?.open();
    expect(await Promise.all((await child!.getOptions()).map((option) => option.getText()))).toEqual(['Ivo Lind']);
    await child?.clickOptions({ text: 'Ivo Lind' });
    await fillPerson();
    await send();

    expect(backend.expectOne('/api/admin/invites').request.body).toEqual({
      email: 'sam@example.org',
      displayName: 'Sam Okoro',
      role: 'guardian',
      playerId: players[0]?.id,
    });
  });

  it('sends an admin invitation with neither squads nor a player', async () => {
    await chooseRole('Club administrator');
    expect(await fieldLabels()).toEqual(['E-mail', 'Display name', 'Role']);
    await fillPerson();
    await send();
    expect(backend.expectOne('/api/admin/invites').request.body).toEqual({
      email: 'sam@example.org',
      displayName: 'Sam Okoro',
      role: 'admin',
    });
  });

  it('puts the server field errors under the fields they name', async () => {
    await chooseRole('Player');
    const entry = await select('Player entry');
    await entry?.open();
    await entry?.clickOptions({ text: 'Rui Costa' });
    await fillPerson();
    await send();
    backend.expectOne('/api/admin/invites').flush(
      {
        error: {
          code: 'invalid',
          message: 'An account with this e-mail already exists',
          fields: [{ field: 'email', message: 'Already has an account' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();

    expect(await (await field('E-mail')).getTextErrors()).toEqual(['Already has an account']);
    expect(await (await field('Player entry')).getTextErrors()).toEqual([]);
    expect(text()).toContain('An account with this e-mail already exists');
  });
});
