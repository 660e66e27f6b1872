import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { textOf } from '../ui/testing/file-input-support';
import { ImportPreview } from './import-preview';
import type { ImportRowError } from './import-types';
import type { LocalCsv } from './local-csv';

/** 60 rows of kicks by players "P1" … "P60". */
const CSV: LocalCsv = {
  fileName: 'long.csv',
  sizeBytes: 2000,
  header: ['Kicker', 'Speed'],
  rows: Array.from({ length: 60 }, (_, i) => [`P${i + 1}`, String(20 + i / 10)]),
  delimiter: ',',
  encoding: 'utf-8',
};

describe('ImportPreview', () => {
  let fixture: ComponentFixture<ImportPreview>;
  let loader: HarnessLoader;

  async function show(errors: readonly ImportRowError[], playerColumn: string | null = 'Kicker'): Promise<void> {
    fixture.componentRef.setInput('csv', CSV);
    fixture.componentRef.setInput('errors', errors);
    fixture.componentRef.setInput('columns', [
      { header: 'Kicker', label: 'Kicker' },
      { header: 'Speed', label: 'Speed' },
    ]);
    fixture.componentRef.setInput('playerColumn', playerColumn);
    await fixture.whenStable();
  }

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection()] });
    fixture = TestBed.createComponent(ImportPreview);
    loader = TestbedHarnessEnvironment.loader(fixture);
  });

  const rowNumbers = async (): Promise<string[]> =>
    (await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName())['row']?.text ?? [];

  it('pages through the rows with problems, 25 at a time', async () => {
    // Every other row names nobody: rows 2, 4, … 60 (30 rows).
    const errors = Array.from({ length: 30 }, (_, i) => ({ row: 2 + 2 * i, column: 'Kicker', message: 'No player' }));
    await show(errors);
    const page = await rowNumbers();
    expect(page.length).toBe(25);
    expect(page[0]).toBe('2');
    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    expect(await rowNumbers()).toEqual(['52', '54', '56', '58', '60']);

    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'All rows (60)' }))).check();
    expect((await rowNumbers())[0]).toBe('2');
    expect((await rowNumbers()).length).toBe(25);
  });

  it('gathers the unknown players into one list with their row counts', async () => {
    await show([
      { row: 2, column: 'kicker', message: 'No player' },
      { row: 3, column: 'Kicker', message: 'No player' },
      { row: 3, column: 'Speed', message: 'Speed is not a number' },
    ]);
    expect(textOf(fixture)).toContain('“P1” · 1 row');
    expect(textOf(fixture)).toContain('“P2” · 1 row');
    expect(textOf(fixture)).not.toContain('“20.1”');
    expect(await loader.getAllHarnesses(MatPaginatorHarness)).toEqual([]);
  });

  it('lists problems no row of the file can show above the table', async () => {
    await show(
      [
        { row: 2, column: 'Spin', message: 'The file has no Spin column' },
        { row: 0, column: '', message: 'The mapping is invalid' },
      ],
      null,
    );
    expect(textOf(fixture)).toContain('Row 2, Spin: The file has no Spin column');
    expect(textOf(fixture)).toContain('The mapping is invalid');
    expect(textOf(fixture)).not.toContain('Players not found');
  });

  it('shows every row, unmarked, when there are no problems', async () => {
    await show([]);
    expect(await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'All rows (60)' }))).isChecked()).toBeTrue();
    expect(await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Rows with problems (0)' }))).isDisabled()).toBeTrue();
    expect((await rowNumbers()).slice(0, 3)).toEqual(['2', '3', '4']);
  });
});
