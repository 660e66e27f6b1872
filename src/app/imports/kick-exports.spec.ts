import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { PlayerSummary, SquadSummary } from '../../../shared/schemas/squads';
import { SPEC_IDS, until } from '../core/spec-support';
import { EXPORT_CLOCK } from './export-dates';
import { FileDownload } from '../core/file-download';
import { textOf } from '../ui/testing/file-input-support';
import { KickExports, countRecords } from './kick-exports';

const SQUADS: SquadSummary[] = [{ id: SPEC_IDS.squad, name: 'U16', ageGroup: 'U16', ballSize: 5, playerCount: 2 }];
const PLAYERS: PlayerSummary[] = [
  {
    id: SPEC_IDS.playerA,
    squadId: SPEC_IDS.squad,
    squadName: 'U16',
    displayName: 'Ada Fixture',
    shirtNumber: 4,
    dominantFoot: 'left',
    isMinor: true,
  },
  {
    id: SPEC_IDS.playerB,
    squadId: SPEC_IDS.squad,
    squadName: 'U16',
    displayName: 'Bo Fixture',
    shirtNumber: null,
    dominantFoot: 'right',
    isMinor: true,
  },
];
const CSV = 'kick_id,recorded_at,player\r\nk1,2026-11-20T18:00:00Z,"Fixture, Ada"\r\nk2,2026-11-21T18:00:00Z,"Two\r\nlines"\r\n';

describe('KickExports', () => {
  let fixture: ComponentFixture<KickExports>;
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
        { provide: EXPORT_CLOCK, useValue: () => new Date(2026, 10, 30, 21, 30) },
        { provide: FileDownload, useValue: { save: (blob: Blob, name: string) => saved.push({ blob, name }) } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(KickExports);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    backend.expectOne('/api/squads').flush({ squads: SQUADS });
    await fixture.whenStable();
    backend.expectOne(`/api/players?squadId=${SPEC_IDS.squad}`).flush({ players: PLAYERS });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const download = () => loader.getHarness(MatButtonHarness.with({ text: /Download kicks CSV/ }));
  const dateField = (label: string) => loader.getHarness(MatInputHarness.with({ selector: `[formControlName=${label}]` }));

  async function saveWith(check: (params: URLSearchParams) => void): Promise<void> {
    await (await download()).click();
    const request = backend.expectOne((r) => r.url === '/api/exports/kicks.csv');
    check(new URLSearchParams(request.request.params.toString()));
    request.flush(new Blob([CSV], { type: 'text/csv' }), {
      headers: { 'Content-Disposition': 'attachment; filename="loftline-kicks-2026-11-03-2026-11-30.csv"' },
    });
    await until('the file to be saved', async () => {
      await fixture.whenStable();
      return saved.length > 0;
    });
    await fixture.whenStable();
  }

  it('exports the whole squad for the last four weeks by default and says what it saved', async () => {
    expect(await (await dateField('from')).getValue()).toBe('2026-11-03');
    expect(await (await dateField('to')).getValue()).toBe('2026-11-30');
    await saveWith((params) => {
      expect(params.get('squadId')).toBe(SPEC_IDS.squad);
      expect(params.has('playerId')).toBeFalse();
      expect(params.get('from')).toBe('2026-11-03');
      expect(params.get('to')).toBe('2026-11-30');
    });
    expect(saved[0]?.name).toBe('loftline-kicks-2026-11-03-2026-11-30.csv');
    expect(await saved[0]!.blob.text()).toBe(CSV);
    expect(textOf(fixture)).toContain('Saved loftline-kicks-2026-11-03-2026-11-30.csv: 2 kicks, 1 kB.');
  });

  it('exports one player when one is chosen', async () => {
    const players = await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Player' }))).getControl(MatSelectHarness);
    await players!.clickOptions({ text: '4 · Ada Fixture' });
    await saveWith((params) => {
      expect(params.get('playerId')).toBe(SPEC_IDS.playerA);
      expect(params.has('squadId')).toBeFalse();
    });
  });

  it('refuses a range that ends before it starts', async () => {
    await (await dateField('from')).setValue('2026-12-05');
    expect(textOf(fixture)).toContain('The first day is after the last day.');
    expect(await (await download()).isDisabled()).toBeTrue();
  });

  it('shows the server’s reason when it refuses the export', async () => {
    await (await download()).click();
    backend
      .expectOne((r) => r.url === '/api/exports/kicks.csv')
      .flush(
        new Blob([JSON.stringify({ error: { code: 'not_found', message: 'No such squad among yours' } })], { type: 'application/json' }),
        {
          status: 404,
          statusText: 'Not Found',
        },
      );
    await until('the refusal', async () => {
      await fixture.whenStable();
      return textOf(fixture).includes('No such squad among yours');
    });
    expect(textOf(fixture)).toContain('The export could not be made.');
    expect(saved).toEqual([]);
  });
});

describe('countRecords', () => {
  // RFC 4180 §2.6: a quoted field may hold line breaks; they do not end the record.
  it('counts data rows, not line breaks inside quoted fields', () => {
    expect(countRecords(CSV)).toBe(2);
    expect(countRecords('a,b\r\n')).toBe(0);
    expect(countRecords('a,b\n1,2')).toBe(1);
    expect(countRecords('')).toBe(0);
  });
});
