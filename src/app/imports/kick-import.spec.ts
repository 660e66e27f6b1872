import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { SquadSummary } from '../../../shared/schemas/squads';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { SPEC_IDS, until } from '../core/spec-support';
import { DEVICE_MAPPINGS_KEY } from './device-mappings';
import { ImportApi } from './import-api';
import { badCellTexts, chooseFile, csvFile, nextUpload, textOf } from '../ui/testing/file-input-support';
import type { ImportAnswer, KickMapping, KicksSummary } from './import-types';
import { KickImport } from './kick-import';

const SQUADS: SquadSummary[] = [{ id: SPEC_IDS.squad, name: 'U16', ageGroup: 'U16', ballSize: 5, playerCount: 15 }];
const HEADER = 'Shot,Kicker,Recorded,Ball speed (mph),Launch (deg),Spin (rpm),Carry (yd),Side (yd)';
const DEVICE_FILE = csvFile('radar.csv', [
  HEADER,
  '1,7,2026-11-30 18:05:10,58.1,24,420,33.5,-1.2',
  '2,42,2026-11-30 18:05:41,61.0,22,360,35.1,0.8',
  '3,Nobody Here,2026-11-30 18:06:02,fast,27,480,31.0,2.0',
]);
const EXPECTED_MAPPING: KickMapping = {
  squadId: SPEC_IDS.squad,
  technique: 'lofted',
  targetDistanceM: 30,
  targetRadiusM: 3,
  device: 'Pitch radar A',
  columns: {
    player: 'Kicker',
    time: 'Recorded',
    speed: 'Ball speed (mph)',
    launchAngle: 'Launch (deg)',
    spin: 'Spin (rpm)',
    carry: 'Carry (yd)',
    lateral: 'Side (yd)',
  },
  units: { speed: 'mph', spin: 'rpm', distance: 'yd' },
};
const answer = (dryRun: boolean, errors: ImportAnswer<KicksSummary>['errors'] = []): ImportAnswer<KicksSummary> => ({
  dryRun,
  uploadId: dryRun ? null : 'u-9',
  alreadyImported: false,
  rows: 3,
  errors,
  summary: { kicksCreated: 3 - new Set(errors.map((e) => e.row)).size, kicksSkipped: 0, sessionId: dryRun ? null : 's-9' },
});

describe('KickImport', () => {
  let fixture: ComponentFixture<KickImport>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;
  let storage: MemoryStorage;

  async function open(): Promise<void> {
    fixture = TestBed.createComponent(KickImport);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    backend.expectOne('/api/squads').flush({ squads: SQUADS });
    await fixture.whenStable();
  }

  beforeEach(async () => {
    storage = new MemoryStorage();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        ImportApi,
        { provide: BROWSER_STORAGE, useValue: storage },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    await open();
  });

  afterEach(() => backend.verify());

  const button = (text: string | RegExp) => loader.getHarness(MatButtonHarness.with({ text }));
  async function select(label: string): Promise<MatSelectHarness> {
    const control = await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatSelectHarness);
    if (control === null) throw new Error(`No select labelled ${label}`);
    return control;
  }

  /** Fills the drill, chooses `file` and goes on to the columns. */
  async function toColumns(file: File): Promise<void> {
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=targetDistanceM]' }))).setValue('30');
    chooseFile(fixture, 'Choose the device CSV', file);
    await until('the file to be read', async () => {
      await fixture.whenStable();
      return textOf(fixture).includes('rows and');
    });
    await (await button(/Next: columns/)).click();
  }

  async function checkRows(device = 'Pitch radar A') {
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=device]' }))).setValue(device);
    await (await button(/Check the rows/)).click();
    return nextUpload(backend, '/api/imports/kicks', true, fixture);
  }

  it('waits for a target distance and a file before the columns', async () => {
    expect(await (await button(/Next: columns/)).isDisabled()).toBeTrue();
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=targetDistanceM]' }))).setValue('150');
    expect(textOf(fixture)).not.toContain('From 1 to 120 m.');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=targetDistanceM]' }))).blur();
    expect(textOf(fixture)).toContain('From 1 to 120 m.');
    expect(await (await button(/Next: columns/)).isDisabled()).toBeTrue();
  });

  it('proposes columns and units from the header and shows the first rows in Loftline units', async () => {
    await toColumns(DEVICE_FILE);
    expect(await (await select('Player (required)')).getValueText()).toBe('Kicker');
    expect(await (await select('Ball speed')).getValueText()).toBe('Ball speed (mph)');
    expect(await (await select('Lateral')).getValueText()).toBe('Side (yd)');
    expect(await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'mph' }))).isChecked()).toBeTrue();
    expect(await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'yards' }))).isChecked()).toBeTrue();
    // 58.1 mph = 25.97 m/s; 420 rpm = 7 rev/s; 33.5 yd = 30.63 m.
    expect(textOf(fixture)).toContain('7 30 Nov 2026, 18:05:10 26 24 7 30.6 -1.1');
    expect(textOf(fixture)).toContain('Not a number');

    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'km/h' }))).check();
    // Read as km/h the same numbers are 16.1 m/s.
    expect(textOf(fixture)).toContain('7 30 Nov 2026, 18:05:10 16.1 24');
  });

  it('sends the mapping on screen and highlights players the squad does not know', async () => {
    await toColumns(DEVICE_FILE);
    const preview = await checkRows();
    expect(JSON.parse(String((preview.request.body as FormData).get('mapping')))).toEqual(EXPECTED_MAPPING);
    preview.flush(
      answer(true, [
        { row: 3, column: 'Kicker', message: 'No player with shirt number or name "42" in U16' },
        { row: 4, column: 'Kicker', message: 'No player with shirt number or name "Nobody Here" in U16' },
        { row: 4, column: 'Ball speed (mph)', message: 'Speed (m/s) is not a number' },
      ]),
    );
    await fixture.whenStable();

    expect(textOf(fixture)).toContain('3 problems in 2 of 3 rows');
    expect(textOf(fixture)).toContain('Players not found in this squad');
    expect(textOf(fixture)).toContain('“42” · 1 row');
    expect(textOf(fixture)).toContain('“Nobody Here” · 1 row');
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['row']?.text).toEqual(['3', '4']);
    expect(cells['problems']?.text[0]).toBe('Kicker: No player with shirt number or name "42" in U16');
    expect(cells['problems']?.text[1]).toContain('Kicker: No player with shirt number or name "Nobody Here" in U16');
    expect(cells['problems']?.text[1]).toContain('Ball speed (mph): Speed (m/s) is not a number');
    expect(await badCellTexts(await loader.getHarness(MatTableHarness))).toEqual(['42', 'Nobody Here', 'fast']);
    expect(await (await button(/Import 1 kick$/)).isDisabled()).toBeTrue();
  });

  it('commits with exactly the mapping it previewed and reports the new session', async () => {
    await toColumns(DEVICE_FILE);
    (await checkRows()).flush(answer(true));
    await fixture.whenStable();
    expect(textOf(fixture)).toContain('All 3 rows can be imported: 3 new kicks.');
    await (await button(/Import 3 kicks$/)).click();
    const commit = backend.expectOne((r) => r.url === '/api/imports/kicks' && r.params.get('dryRun') === 'false');
    expect(JSON.parse(String((commit.request.body as FormData).get('mapping')))).toEqual(EXPECTED_MAPPING);
    commit.flush(answer(false), { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(textOf(fixture)).toContain('3 kicks imported into a new session.');
    expect(textOf(fixture)).toContain('U16 · Lofted · 30 m target (r 3 m)');
  });

  it('remembers a device’s columns after a good check and offers them for its next file', async () => {
    const odd = csvFile('b.csv', ['Who,V,Dist', '7,90,30']);
    await toColumns(odd);
    await (await select('Player (required)')).clickOptions({ text: 'Who' });
    await (await select('Ball speed')).clickOptions({ text: 'V' });
    await (await select('Carry')).clickOptions({ text: 'Dist' });
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'km/h' }))).check();
    (await checkRows('Radar B')).flush({ ...answer(true), rows: 1 });
    await fixture.whenStable();

    expect(storage.getItem(DEVICE_MAPPINGS_KEY)).toContain('Radar B');

    fixture.destroy();
    await open();
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=targetDistanceM]' }))).setValue('30');
    chooseFile(fixture, 'Choose the device CSV', csvFile('b2.csv', ['Who,V,Dist', '9,80,28']));
    await until('the saved columns to be offered', async () => {
      await fixture.whenStable();
      return textOf(fixture).includes('Its columns match those saved for Radar B.');
    });
    await (await button(/Next: columns/)).click();
    expect(await (await select('Player (required)')).getValueText()).toBe('Who');
    expect(await (await select('Carry')).getValueText()).toBe('Dist');
    expect(await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'km/h' }))).isChecked()).toBeTrue();
    expect(await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=device]' }))).getValue()).toBe('Radar B');
  });

  it('shows the server’s refusal of the whole upload in its own words', async () => {
    await toColumns(DEVICE_FILE);
    (await checkRows()).flush(
      { error: { code: 'forbidden', message: 'You may not import kicks into this squad' } },
      { status: 403, statusText: 'Forbidden' },
    );
    await fixture.whenStable();
    expect(textOf(fixture)).toContain('The file could not be checked.');
    expect(textOf(fixture)).toContain('You may not import kicks into this squad');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Check again/ }))).toEqual([]);
  });
});
