import { toCsv } from '../../../shared/csv';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { FileDownload } from '../core/file-download';
import { FilePicker } from './file-picker';
import { ImportApi } from './import-api';
import { ImportPreview, type PreviewColumn } from './import-preview';
import { ImportRun } from './import-run';
import { problemsSentence } from './import-words';
import type { RosterSummary } from './import-types';
import { type LocalCsv, LocalCsvError, columnIndex, readLocalCsv } from './local-csv';
import { RefusalNote } from './refusal-note';
import { UploadProgress } from './upload-progress';
import { WizardSteps } from './wizard-steps';

/** The roster file's columns, in the order the template file lists them, with what each holds. */
export const ROSTER_COLUMNS: readonly { readonly name: string; readonly required: boolean; readonly holds: string }[] = [
  { name: 'squad', required: true, holds: 'Squad name, e.g. U14. A squad the club does not have yet is created.' },
  { name: 'name', required: true, holds: 'The player’s name as the staff should see it.' },
  { name: 'shirt_number', required: false, holds: 'Whole number from 1 to 99.' },
  { name: 'birth_year', required: false, holds: 'Year of birth, e.g. 2012 (or a birth_date column, YYYY-MM-DD).' },
  { name: 'foot', required: false, holds: 'left or right (right when empty).' },
  { name: 'guardian_emails', required: false, holds: 'Guardians’ e-mail addresses, separated by semicolons.' },
  { name: 'age_group', required: false, holds: 'Age group of a new squad (the squad name when empty).' },
  { name: 'ball_size', required: false, holds: '3, 4 or 5 for a new squad (from the age group when empty).' },
];

/** Summary counts, labelled, in reading order. */
const SUMMARY_LABELS: readonly (readonly [keyof RosterSummary, string, string])[] = [
  ['squadsCreated', 'squad created', 'squads created'],
  ['playersCreated', 'player added', 'players added'],
  ['playersUpdated', 'player updated', 'players updated'],
  ['guardiansCreated', 'guardian account created', 'guardian accounts created'],
  ['linksCreated', 'guardian link made', 'guardian links made'],
];

/**
 * Roster import (admin): a CSV of squads, players and guardians' e-mails. The file is read on the
 * device first (so a missing column is said at once), then previewed by the server without
 * writing, with every bad row highlighted; only a file without problems can be committed, and
 * the commit is all-or-nothing. Re-importing the same players updates them rather than doubling
 * them (the server matches a player by squad and name).
 */
@Component({
  selector: 'll-roster-import',
  imports: [MatButtonModule, MatIconModule, FilePicker, ImportPreview, RefusalNote, UploadProgress, WizardSteps],
  templateUrl: './roster-import.html',
  styleUrl: './imports-wizard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RosterImport {
  private readonly api = inject(ImportApi);
  private readonly download = inject(FileDownload);

  protected readonly rosterColumns = ROSTER_COLUMNS;
  protected readonly problems = problemsSentence;
  protected readonly file = signal<File | null>(null);
  protected readonly csv = signal<LocalCsv | null>(null);
  /** Why the chosen file cannot be sent at all (read on the device). */
  protected readonly localProblem = signal<string | null>(null);
  protected readonly preview = new ImportRun<RosterSummary>();
  protected readonly commit = new ImportRun<RosterSummary>();
  protected readonly steps = ['Choose the file', 'Check the rows', 'Imported'];

  /** The step on show: choose, check, done. */
  protected readonly step = computed(() => (this.commit.answer() ? 2 : this.preview.answer() ? 1 : 0));
  protected readonly previewAnswer = this.preview.answer;
  /** Row errors to highlight: the preview's, or those of a refused commit. */
  protected readonly rowErrors = computed(() => {
    const state = this.commit.state();
    return state.status === 'refused' && state.refusal.rowErrors.length > 0
      ? state.refusal.rowErrors
      : (this.previewAnswer()?.errors ?? []);
  });
  protected readonly canCommit = computed(() => {
    const answer = this.previewAnswer();
    return answer !== null && answer.errors.length === 0 && !answer.alreadyImported && !this.commit.busy();
  });
  protected readonly previewColumns = computed<PreviewColumn[]>(() =>
    (this.csv()?.header ?? []).map((header) => ({ header, label: header })),
  );
  protected readonly summaryLines = computed(() => summaryLines(this.commit.answer()?.summary ?? this.previewAnswer()?.summary ?? null));

  constructor() {
    inject(DestroyRef).onDestroy(() => {
      this.preview.cancel();
      this.commit.cancel();
    });
  }

  /** Reads the chosen file on the device, then asks the server for a preview. */
  protected async chooseFile(file: File): Promise<void> {
    this.preview.reset();
    this.commit.reset();
    this.localProblem.set(null);
    this.file.set(file);
    this.csv.set(null);
    let csv: LocalCsv;
    try {
      csv = await readLocalCsv(file);
    } catch (error) {
      this.localProblem.set(error instanceof LocalCsvError ? error.message : `${file.name} could not be read on this device.`);
      return;
    }
    const missing = ROSTER_COLUMNS.filter((c) => c.required && columnIndex(csv.header, c.name) < 0).map((c) => c.name);
    if (missing.length > 0) {
      this.localProblem.set(
        `The header row of ${file.name} lacks the column${missing.length > 1 ? 's' : ''} ${missing.join(' and ')}. The first row must name the columns (see the list below).`,
      );
      return;
    }
    this.csv.set(csv);
    this.checkAgain();
  }

  /** Sends the chosen file for a preview (again, e.g. after a failed upload). */
  protected checkAgain(): void {
    const file = this.file();
    if (file && this.csv()) {
      this.commit.reset();
      this.preview.start(this.api.roster(file, true), true);
    }
  }

  /** Commits the previewed file. */
  protected importNow(): void {
    const file = this.file();
    if (file && this.canCommit()) {
      this.commit.start(this.api.roster(file, false), false);
    }
  }

  /** Starts over with another file. */
  protected startOver(): void {
    this.preview.reset();
    this.commit.reset();
    this.file.set(null);
    this.csv.set(null);
    this.localProblem.set(null);
  }

  /** Back from the check to the file step, keeping the chosen file. */
  protected backToFile(): void {
    this.preview.reset();
    this.commit.reset();
  }

  /** Saves an empty roster file with the header row, to fill in a spreadsheet. */
  protected saveTemplate(): void {
    const header = ROSTER_COLUMNS.map((c) => c.name);
    const example = ['U14', 'Alex Example', 7, 2012, 'right', 'parent.one@example.org;parent.two@example.org', 'U14', 4];
    this.download.save(new Blob([toCsv(header, [example])], { type: 'text/csv;charset=utf-8' }), 'loftline-roster-template.csv');
  }
}

/** "2 squads created", … for the counts that are not zero ("Nothing to change" when all are). */
export function summaryLines(summary: RosterSummary | null): string[] {
  if (summary === null) return [];
  const lines = SUMMARY_LABELS.filter(([key]) => summary[key] > 0).map(
    ([key, one, many]) => `${summary[key]} ${summary[key] === 1 ? one : many}`,
  );
  return lines.length > 0 ? lines : ['Nothing to change: everyone in the file is already on the roster as written.'];
}
