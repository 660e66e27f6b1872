import type { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import type { MatTableHarness } from '@angular/material/table/testing';
import { until } from '../../core/spec-support';

/*
 * Shared set-up for the import screens' specs. Nothing in the app imports this file.
 */

/** Chooses `file` in the file field named `label`, as the device's file chooser would. */
export function chooseFile(fixture: ComponentFixture<unknown>, label: string, file: File): void {
  const input = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>(`input[type=file][aria-label="${label}"]`);
  if (input === null) {
    throw new Error(`No file field labelled ${label}`);
  }
  const transfer = new DataTransfer();
  transfer.items.add(file);
  input.files = transfer.files;
  input.dispatchEvent(new Event('change'));
}

/** A CSV file with the given lines (CRLF line ends, as spreadsheets save them). */
export function csvFile(name: string, lines: readonly string[]): File {
  return new File([lines.join('\r\n') + '\r\n'], name, { type: 'text/csv' });
}

/** Waits for the one upload to `url` with `dryRun` (files are read asynchronously first). */
export async function nextUpload(
  backend: HttpTestingController,
  url: string,
  dryRun: boolean,
  fixture: ComponentFixture<unknown>,
): Promise<TestRequest> {
  const matches = (): TestRequest[] => backend.match((r) => r.url === url && r.params.get('dryRun') === String(dryRun));
  let found: TestRequest[] = [];
  await until(`an upload to ${url} (dryRun=${dryRun})`, async () => {
    await fixture.whenStable();
    found = matches();
    return found.length > 0;
  });
  const [request, ...more] = found;
  if (request === undefined || more.length > 0) {
    throw new Error(`Expected one upload to ${url}, found ${found.length}`);
  }
  return request;
}

/** The text of the fixture, with runs of white space collapsed. */
export function textOf(fixture: ComponentFixture<unknown>): string {
  return ((fixture.nativeElement as HTMLElement).textContent ?? '').replace(/\s+/g, ' ');
}

/** The texts of the preview cells marked as refused, row by row, through the table's harness. */
export async function badCellTexts(table: MatTableHarness): Promise<string[]> {
  const texts: string[] = [];
  for (const row of await table.getRows()) {
    for (const cell of await row.getCells()) {
      if (await (await cell.host()).hasClass('preview__cell--bad')) {
        texts.push(await cell.getText());
      }
    }
  }
  return texts;
}
