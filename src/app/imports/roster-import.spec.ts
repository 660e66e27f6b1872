import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { until } from '../core/spec-support';
import { FileDownload } from '../core/file-download';
import { ImportApi } from './import-api';
import { badCellTexts, chooseFile, csvFile, nextUpload, textOf } from '../ui/testing/file-input-support';
import type { ImportAnswer, RosterSummary } from './import-types';
import { RosterImport } from './roster-import';

const ROSTER = csvFile('roster.csv', [
  'squad,name,shirt_number,birth_year,foot,guardian_emails',
  'U12,Ada Fixture,4,2014,left,ada.parent@example.org',
  'U12,Bo Fixture,8,2014,sideways,',
  'U12,Cy Fixture,9,2013,right,',
]);
const SUMMARY: RosterSummary = { squadsCreated: 1, playersCreated: 3, playersUpdated: 0, guardiansCreated: 1, linksCreated: 1 };
const clean = (dryRun: boolean): ImportAnswer<RosterSummary> => ({
  dryRun,
  uploadId: dryRun ? null : 'u-1',
  alreadyImported: false,
  rows: 3,
  errors: [],
  summary: SUMMARY,
});

describe('RosterImport', () => {
  let fixture: ComponentFixture<RosterImport>;
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
        ImportApi,
        { provide: FileDownload, useValue: { save: (blob: Blob, name: string) => saved.push({ blob, name }) } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RosterImport);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const table = () => loader.getHarness(MatTableHarness);
  const importButton = () => loader.getHarness(MatButtonHarness.with({ text: /Import \d+ rows?$/ }));

  it('refuses a file without the squad and name columns before uploading anything', async () => {
    chooseFile(fixture, 'Choose the roster CSV', csvFile('players.csv', ['player,foot', 'Ada,left']));
    await until('the refusal', async () => {
      await fixture.whenStable();
      return textOf(fixture).includes('lacks the columns squad and name');
    });
    expect(textOf(fixture)).toContain('This file cannot be imported.');
    backend.expectNone(() => true);
  });

  it('highlights every refused row with its column and reason, and keeps the import closed', async () => {
    chooseFile(fixture, 'Choose the roster CSV', ROSTER);
    const preview = await nextUpload(backend, '/api/imports/roster', true, fixture);
    preview.flush({ ...clean(true), errors: [{ row: 3, column: 'foot', message: 'Foot must be left or right' }] });
    await fixture.whenStable();

    expect(textOf(fixture)).toContain('1 problem in 1 of 3 rows');
    const cells = await (await table()).getCellTextByColumnName();
    expect(cells['row']?.text).toEqual(['3']);
    expect(cells['problems']?.text).toEqual(['foot: Foot must be left or right']);
    expect(cells['c4']?.text).toEqual(['sideways']);
    const [row] = await (await table()).getRows();
    expect(await (await row!.host()).hasClass('preview__row--problem')).toBeTrue();
    expect(await badCellTexts(await table())).toEqual(['sideways']);
    expect(await (await importButton()).isDisabled()).toBeTrue();

    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'All rows (3)' }))).check();
    expect((await (await table()).getCellTextByColumnName())['row']?.text).toEqual(['2', '3', '4']);
  });

  it('commits a clean file and says what the import did', async () => {
    chooseFile(fixture, 'Choose the roster CSV', ROSTER);
    (await nextUpload(backend, '/api/imports/roster', true, fixture)).flush(clean(true));
    await fixture.whenStable();
    expect(textOf(fixture)).toContain('All 3 rows can be imported.');
    expect(textOf(fixture)).toContain(
      'Importing would make: 1 squad created · 3 players added · 1 guardian account created · 1 guardian link made.',
    );

    await (await importButton()).click();
    const commit = backend.expectOne('/api/imports/roster?dryRun=false');
    expect(((commit.request.body as FormData).get('file') as File).name).toBe('roster.csv');
    commit.flush(clean(false), { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(textOf(fixture)).toContain('Roster imported');
    expect(textOf(fixture)).toContain('3 rows of roster.csv imported.');
    expect(textOf(fixture)).toContain('3 players added');
  });

  it('shows the server’s reason and the rows when it refuses the commit', async () => {
    chooseFile(fixture, 'Choose the roster CSV', ROSTER);
    (await nextUpload(backend, '/api/imports/roster', true, fixture)).flush(clean(true));
    await fixture.whenStable();
    await (await importButton()).click();
    backend.expectOne('/api/imports/roster?dryRun=false').flush(
      {
        error: {
          code: 'import_invalid',
          message: 'Row 2: ada.parent@example.org belongs to an account that is not a guardian of this club; nothing was imported',
        },
        errors: [{ row: 2, column: 'guardian_emails', message: 'ada.parent@example.org is not a guardian account of this club' }],
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(textOf(fixture)).toContain('Nothing was imported.');
    expect(textOf(fixture)).toContain(
      'Row 2: ada.parent@example.org belongs to an account that is not a guardian of this club; nothing was imported',
    );
    const cells = await (await table()).getCellTextByColumnName();
    expect(cells['row']?.text).toEqual(['2']);
    expect(cells['problems']?.text).toEqual(['guardian_emails: ada.parent@example.org is not a guardian account of this club']);
  });

  it('shows how much of a slow upload has gone, and stops it on request', async () => {
    chooseFile(fixture, 'Choose the roster CSV', ROSTER);
    const preview = await nextUpload(backend, '/api/imports/roster', true, fixture);
    preview.event({ type: HttpEventType.UploadProgress, loaded: 1024, total: 4096 });
    await fixture.whenStable();
    expect(await (await loader.getHarness(MatProgressBarHarness)).getValue()).toBe(25);
    expect(textOf(fixture)).toContain('Sending roster.csv: 1 kB of 4 kB (25 %)');

    preview.event({ type: HttpEventType.UploadProgress, loaded: 4096, total: 4096 });
    await fixture.whenStable();
    expect(textOf(fixture)).toContain('Checking every row on the server…');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Cancel' }))).toEqual([]);
  });

  it('cancels an upload that is still sending', async () => {
    chooseFile(fixture, 'Choose the roster CSV', ROSTER);
    const preview = await nextUpload(backend, '/api/imports/roster', true, fixture);
    preview.event({ type: HttpEventType.UploadProgress, loaded: 100, total: 4096 });
    await fixture.whenStable();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    expect(preview.cancelled).toBeTrue();
    expect(await loader.getAllHarnesses(MatProgressBarHarness)).toEqual([]);
  });

  it('says the server cannot be reached and offers to check again', async () => {
    chooseFile(fixture, 'Choose the roster CSV', ROSTER);
    (await nextUpload(backend, '/api/imports/roster', true, fixture)).error(new ProgressEvent('error'), { status: 0 });
    await fixture.whenStable();
    expect(textOf(fixture)).toContain('The Loftline server cannot be reached.');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Check again/ }))).click();
    (await nextUpload(backend, '/api/imports/roster', true, fixture)).flush(clean(true));
  });

  it('saves a template file with the header row', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save a template file/ }))).click();
    expect(saved.length).toBe(1);
    expect(saved[0]?.name).toBe('loftline-roster-template.csv');
    expect((await saved[0]!.blob.text()).split('\r\n')[0]).toBe(
      'squad,name,shirt_number,birth_year,foot,guardian_emails,age_group,ball_size',
    );
  });
});
