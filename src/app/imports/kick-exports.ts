import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators, type ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Subject, Subscription, map, of, startWith, switchMap } from 'rxjs';
import { type ApiProblem, describeApiError } from '../core/api-error';
import { LOADING, type LoadState, toLoadState } from '../core/load-state';
import { SquadApi } from '../core/squad-api';
import type { PlayerSummary } from '../../../shared/schemas/squads';
import { LoadFailure } from '../ui/load-failure';
import { ExportApi, type KickExportQuery } from '../core/export-api';
import { FileDownload } from '../core/file-download';
import { EXPORT_CLOCK, daysBefore, localDate } from './export-dates';
import { kilobytes } from './upload-progress';

/** Where the download stands. */
type DownloadState =
  | { readonly status: 'idle' }
  | { readonly status: 'downloading' }
  | { readonly status: 'saved'; readonly fileName: string; readonly sizeBytes: number; readonly kicks: number }
  | { readonly status: 'failed'; readonly problem: ApiProblem };

/** Refuses a range that ends before it starts. */
const rangeInOrder: ValidatorFn = (group) => {
  const from: unknown = group.get('from')?.value;
  const to: unknown = group.get('to')?.value;
  return typeof from === 'string' && typeof to === 'string' && from !== '' && to !== '' && from > to
    ? { range: 'The first day is after the last day.' }
    : null;
};

/**
 * Kick exports (staff): every kick of a squad, or of one player, between two days, as a CSV file
 * a spreadsheet opens. Squad week has its own export of the weekly table; this one is the raw
 * kicks, for the club's own analysis or to move them elsewhere. The file names players, so the
 * screen says to keep it within the staff.
 */
@Component({
  selector: 'll-kick-exports',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    LoadFailure,
  ],
  templateUrl: './kick-exports.html',
  styleUrl: './imports-wizard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KickExports {
  private readonly squadApi = inject(SquadApi);
  private readonly exports = inject(ExportApi);
  private readonly download = inject(FileDownload);
  private readonly retries = new Subject<void>();
  private request: Subscription | null = null;

  protected readonly form = new FormGroup(
    {
      squadId: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
      /** '' for the whole squad. */
      playerId: new FormControl('', { nonNullable: true }),
      from: new FormControl(daysBefore(inject(EXPORT_CLOCK)(), 27), { nonNullable: true, validators: [Validators.required] }),
      to: new FormControl(localDate(inject(EXPORT_CLOCK)()), { nonNullable: true, validators: [Validators.required] }),
    },
    { validators: rangeInOrder },
  );

  protected readonly squads = toSignal(
    this.retries.pipe(
      startWith(undefined),
      switchMap(() => this.squadApi.listSquads().pipe(toLoadState())),
    ),
    { initialValue: LOADING },
  );
  private readonly squadId = toSignal(this.form.controls.squadId.valueChanges, { initialValue: '' });
  protected readonly players = toSignal(
    toObservable(this.squadId).pipe(
      switchMap((squadId) =>
        squadId === '' ? of<LoadState<PlayerSummary[]>>(LOADING) : this.squadApi.listPlayers(squadId).pipe(toLoadState()),
      ),
    ),
    { initialValue: LOADING },
  );
  private readonly formValid = toSignal(this.form.statusChanges.pipe(map((status) => status === 'VALID')), {
    initialValue: this.form.valid,
  });
  protected readonly state = signal<DownloadState>({ status: 'idle' });
  protected readonly canDownload = computed(() => this.formValid() && this.state().status !== 'downloading');

  constructor() {
    effect(() => {
      const squads = this.squads();
      const first = squads.status === 'ready' ? squads.value[0] : undefined;
      if (first && this.form.controls.squadId.value === '') {
        this.form.controls.squadId.setValue(first.id);
      }
    });
    // Another squad: its players, so "whole squad" again.
    this.form.controls.squadId.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.form.controls.playerId.setValue(''));
    inject(DestroyRef).onDestroy(() => this.request?.unsubscribe());
  }

  protected retry(): void {
    this.retries.next();
  }

  /** Fetches the CSV and saves it on the device. */
  protected downloadCsv(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { squadId, playerId, from, to } = this.form.getRawValue();
    const query: KickExportQuery = playerId === '' ? { squadId, from, to } : { playerId, from, to };
    this.request?.unsubscribe();
    this.state.set({ status: 'downloading' });
    this.request = this.exports
      .kicksCsv(query)
      .pipe(switchMap((file) => file.blob.text().then((text) => ({ file, kicks: countRecords(text) }))))
      .subscribe({
        next: ({ file, kicks }) => {
          this.download.save(file.blob, file.fileName);
          this.state.set({ status: 'saved', fileName: file.fileName, sizeBytes: file.blob.size, kicks });
        },
        error: (error: unknown) => this.state.set({ status: 'failed', problem: describeApiError(error) }),
      });
  }

  protected sizeOf(bytes: number): string {
    return kilobytes(bytes);
  }
}

/** Data rows of an RFC 4180 file (line breaks inside quotes do not count), without the header. */
export function countRecords(csv: string): number {
  let records = 0;
  let quoted = false;
  let content = false;
  for (const ch of csv) {
    if (ch === '"') quoted = !quoted;
    if (!quoted && ch === '\n') {
      if (content) records++;
      content = false;
    } else if (ch !== '\r') {
      content = true;
    }
  }
  if (content) records++;
  return Math.max(0, records - 1);
}
