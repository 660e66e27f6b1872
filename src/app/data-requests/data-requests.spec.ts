import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioButtonHarness } from '@angular/material/radio/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { PlayerSummary, SquadSummary } from '../../../shared/schemas/squads';
import { SPEC_IDS, until } from '../core/spec-support';
import { FileDownload } from '../core/file-download';
import { textOf } from '../ui/testing/file-input-support';
import { DataRequests } from './data-requests';

const SQUADS: SquadSummary[] = [{ id: SPEC_IDS.squad, name: 'U16', ageGroup: 'U16', ballSize: 5, playerCount: 2 }];
const ADA: PlayerSummary = {
  id: SPEC_IDS.playerA,
  squadId: SPEC_IDS.squad,
  squadName: 'U16',
  displayName: 'Ada Fixture',
  shirtNumber: 4,
  dominantFoot: 'left',
  isMinor: true,
};
const BO: PlayerSummary = { ...ADA, id: SPEC_IDS.playerB, displayName: 'Bo Fixture', shirtNumber: 8 };

describe('DataRequests', () => {
  let fixture: ComponentFixture<DataRequests>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;
  let saved: { blob: Blob; name: string }[];

  beforeEach(async () => {
    saved = [];
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: FileDownload, useValue: { save: (blob: Blob, name: string) => saved.push({ blob, name }) } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(DataRequests);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    backend.expectOne('/api/squads').flush({ squads: SQUADS });
    await fixture.whenStable();
    backend.expectOne(`/api/players?squadId=${SPEC_IDS.squad}`).flush({ players: [ADA, BO] });
    await fixture.whenStable();
    const players = await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Player' }))).getControl(MatSelectHarness);
    await players!.clickOptions({ text: '4 · Ada Fixture' });
  });

  afterEach(() => backend.verify());

  const eraseButton = () => loader.getHarness(MatButtonHarness.with({ text: /Erase Ada Fixture for good/ }));
  const confirmName = () => loader.getHarness(MatInputHarness.with({ selector: '[formControlName=confirmName]' }));

  it('says that erasure is irreversible, audited and a matter for the club’s policy and the law', () => {
    const text = textOf(fixture);
    expect(text).toContain('It cannot be undone.');
    expect(text).toContain('written to the club’s audit log');
    expect(text).toContain('safeguarding policy and the data-protection law');
  });

  it('keeps erasure closed until a mode is chosen and the name is typed exactly', async () => {
    expect(await (await eraseButton()).isDisabled()).toBeTrue();
    await (await confirmName()).setValue('Ada Fixture');
    expect(await (await eraseButton()).isDisabled()).toBeTrue();
    await (await loader.getHarness(MatRadioButtonHarness.with({ label: /Remove the kicks/ }))).check();
    expect(await (await eraseButton()).isDisabled()).toBeFalse();
    await (await confirmName()).setValue('ada fixture');
    expect(await (await eraseButton()).isDisabled()).toBeTrue();
    await (await confirmName()).setValue('  Ada Fixture ');
    expect(await (await eraseButton()).isDisabled()).toBeFalse();
  });

  it('erases with the chosen mode and the typed name, then says what happened', async () => {
    await (await loader.getHarness(MatRadioButtonHarness.with({ label: /anonymised aggregates/ }))).check();
    await (await confirmName()).setValue('Ada Fixture ');
    await (await eraseButton()).click();
    const request = backend.expectOne(`/api/admin/players/${SPEC_IDS.playerA}/erase`);
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ mode: 'anonymise', confirmName: 'Ada Fixture' });
    request.flush({ erased: true, kicksAffected: 12 });
    await fixture.whenStable();
    // The list is reloaded without the erased player; the field waits for it (an empty select cannot open).
    const players = await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Player' }))).getControl(MatSelectHarness);
    expect(await players!.isDisabled()).toBeTrue();
    expect(textOf(fixture)).toContain('Loading the players…');
    backend.expectOne(`/api/players?squadId=${SPEC_IDS.squad}`).flush({ players: [BO] });
    await fixture.whenStable();
    expect(await players!.isDisabled()).toBeFalse();
    expect(textOf(fixture)).toContain(
      'Ada Fixture has been erased: 12 kicks kept only as anonymised figures. The erasure is in the audit log.',
    );
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /for good/ }))).toEqual([]);
  });

  it('shows the server’s refusal and erases nothing', async () => {
    await (await loader.getHarness(MatRadioButtonHarness.with({ label: /Remove the kicks/ }))).check();
    await (await confirmName()).setValue('Ada Fixture');
    await (await eraseButton()).click();
    backend
      .expectOne(`/api/admin/players/${SPEC_IDS.playerA}/erase`)
      .flush(
        { error: { code: 'invalid', message: 'Type the player’s full name exactly to confirm' } },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    expect(textOf(fixture)).toContain('Nothing was erased.');
    expect(textOf(fixture)).toContain('Type the player’s full name exactly to confirm');
  });

  it('downloads everything held about the player as JSON', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Download Ada Fixture’s data \(JSON\)/ }))).click();
    backend.expectOne(`/api/exports/players/${SPEC_IDS.playerA}.json`).flush(new Blob(['{"player":{}}'], { type: 'application/json' }), {
      headers: { 'Content-Disposition': `attachment; filename="loftline-player-${SPEC_IDS.playerA}.json"` },
    });
    await until('the file to be saved', async () => {
      await fixture.whenStable();
      return saved.length > 0;
    });
    expect(saved[0]?.name).toBe(`loftline-player-${SPEC_IDS.playerA}.json`);
    await fixture.whenStable();
    expect(textOf(fixture)).toContain(`Saved loftline-player-${SPEC_IDS.playerA}.json.`);
  });

  it('starts afresh when another player is chosen, so a typed name never carries over', async () => {
    await (await confirmName()).setValue('Ada Fixture');
    const players = await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Player' }))).getControl(MatSelectHarness);
    await players!.clickOptions({ text: '8 · Bo Fixture' });
    expect(await (await confirmName()).getValue()).toBe('');
    expect(textOf(fixture)).toContain('Erase Bo Fixture');
  });
});
