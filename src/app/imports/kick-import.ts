import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { Subject, map, startWith, switchMap } from 'rxjs';
import type { Technique } from '../../../shared/schemas/sync';
import { LOADING, toLoadState } from '../core/load-state';
import { SquadApi } from '../core/squad-api';
import { TECHNIQUES, TECHNIQUE_LABELS } from '../../../shared/vocabulary';
import { LoadFailure } from '../ui/load-failure';
import { METRIC_UNITS, guessColumns, guessUnits } from './column-guess';
import { ColumnMapping } from './column-mapping';
import { DeviceMappings } from './device-mappings';
import { FilePicker } from './file-picker';
import { ImportApi } from './import-api';
import { ImportPreview, type PreviewColumn } from './import-preview';
import { ImportRun } from './import-run';
import { problemsSentence } from './import-words';
import type { KickMapping, KicksSummary } from './import-types';
import { OPTIONAL_FIELDS, createMappingForm, fillMapping, mappingOf } from './kick-mapping-form';
import { type LocalCsv, LocalCsvError, readLocalCsv } from './local-csv';
import { RefusalNote } from './refusal-note';
import { UploadProgress } from './upload-progress';
import { WizardSteps } from './wizard-steps';

/**
 * Measured-kick import (staff): a ball-measuring device's CSV export becomes one training session
 * of kicks for a squad. The coach says which drill the kicks were aimed at (technique, target
 * distance and radius: the outcome of each kick is judged against it), maps the device's columns
 * and units (remembered per device name), checks a server preview with unmatched players and bad
 * rows highlighted, and commits all-or-nothing. The same file imported twice adds nothing twice.
 */
@Component({
  selector: 'll-kick-import',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    ColumnMapping,
    FilePicker,
    ImportPreview,
    LoadFailure,
    RefusalNote,
    UploadProgress,
    WizardSteps,
  ],
  templateUrl: './kick-import.html',
  styleUrl: './imports-wizard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KickImport {
  private readonly api = inject(ImportApi);
  private readonly squadApi = inject(SquadApi);
  private readonly devices = inject(DeviceMappings);
  private readonly retries = new Subject<void>();

  protected readonly steps = ['Drill and file', 'Columns', 'Check the rows', 'Imported'];
  protected readonly techniques = TECHNIQUES;
  protected readonly techniqueLabels = TECHNIQUE_LABELS;
  protected readonly problems = problemsSentence;
  protected readonly squads = toSignal(
    this.retries.pipe(
      startWith(undefined),
      switchMap(() => this.squadApi.listSquads().pipe(toLoadState())),
    ),
    { initialValue: LOADING },
  );

  /** The drill the kicks were aimed at; the server judges each kick's outcome against it. */
  protected readonly drill = new FormGroup({
    squadId: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    technique: new FormControl<Technique>('lofted', { nonNullable: true }),
    // Limits of the shared kick schema: a pitch is at most 120 m long (IFAB Law 1).
    targetDistanceM: new FormControl<number | null>(null, [Validators.required, Validators.min(1), Validators.max(120)]),
    targetRadiusM: new FormControl<number | null>(3, [Validators.required, Validators.min(0.25), Validators.max(30)]),
  });
  protected readonly mapping = createMappingForm();

  protected readonly file = signal<File | null>(null);
  protected readonly csv = signal<LocalCsv | null>(null);
  protected readonly localProblem = signal<string | null>(null);
  /** Set when the file matched a saved device mapping, which was applied. */
  protected readonly matchedDevice = signal<string | null>(null);
  /** The step chosen with the buttons while there is no answer yet (drill or columns). */
  private readonly stage = signal<0 | 1>(0);
  /** The mapping the preview was made with: the commit must send exactly the same. */
  private readonly checkedMapping = signal<KickMapping | null>(null);
  protected readonly preview = new ImportRun<KicksSummary>();
  protected readonly commit = new ImportRun<KicksSummary>();

  protected readonly step = computed(() => (this.commit.answer() ? 3 : this.preview.answer() ? 2 : this.stage()));
  private readonly drillStatus = toSignal(this.drill.statusChanges.pipe(map(() => this.drill.status)), { initialValue: this.drill.status });
  private readonly mappingStatus = toSignal(this.mapping.statusChanges.pipe(map(() => this.mapping.status)), {
    initialValue: this.mapping.status,
  });
  protected readonly canMap = computed(() => this.drillStatus() === 'VALID' && this.csv() !== null);
  protected readonly canCheck = computed(() => this.mappingStatus() === 'VALID' && !this.preview.busy());
  protected readonly previewAnswer = this.preview.answer;
  protected readonly rowErrors = computed(() => {
    const state = this.commit.state();
    return state.status === 'refused' && state.refusal.rowErrors.length > 0
      ? state.refusal.rowErrors
      : (this.previewAnswer()?.errors ?? []);
  });
  protected readonly canCommit = computed(() => {
    const answer = this.previewAnswer();
    return (
      answer !== null && answer.errors.length === 0 && !answer.alreadyImported && answer.summary.kicksCreated > 0 && !this.commit.busy()
    );
  });
  protected readonly previewColumns = computed<PreviewColumn[]>(() => {
    const checked = this.checkedMapping();
    if (checked === null) return [];
    return (['player', ...OPTIONAL_FIELDS] as const).flatMap((field) => {
      const header = checked.columns[field];
      return header === undefined ? [] : [{ header, label: header }];
    });
  });
  /** "U16 · Lofted · 30 m target (r 3 m)", for the check and the summary. */
  protected readonly drillLabel = computed(() => {
    const checked = this.checkedMapping();
    const squads = this.squads();
    if (checked === null) return '';
    const squad = squads.status === 'ready' ? squads.value.find((s) => s.id === checked.squadId)?.name : undefined;
    return `${squad ?? 'Squad'} · ${TECHNIQUE_LABELS[checked.technique]} · ${checked.targetDistanceM} m target (r ${checked.targetRadiusM} m)`;
  });

  constructor() {
    // The first squad is the usual choice for a coach with one squad.
    effect(() => {
      const squads = this.squads();
      const first = squads.status === 'ready' ? squads.value[0] : undefined;
      if (first && this.drill.controls.squadId.value === '') {
        this.drill.controls.squadId.setValue(first.id);
      }
    });
    inject(DestroyRef).onDestroy(() => {
      this.preview.cancel();
      this.commit.cancel();
    });
  }

  /** "12 new kicks, 3 already in Loftline (left as they are)". */
  protected wouldImport(summary: KicksSummary): string {
    const fresh = `${summary.kicksCreated} new ${summary.kicksCreated === 1 ? 'kick' : 'kicks'}`;
    return summary.kicksSkipped > 0 ? `${fresh}, ${summary.kicksSkipped} already in Loftline (left as they are)` : fresh;
  }

  protected retrySquads(): void {
    this.retries.next();
  }

  /** Reads the file on the device and proposes a mapping: a saved device's if it fits, else a guess. */
  protected async chooseFile(file: File): Promise<void> {
    this.preview.reset();
    this.commit.reset();
    this.localProblem.set(null);
    this.matchedDevice.set(null);
    this.file.set(file);
    this.csv.set(null);
    try {
      const csv = await readLocalCsv(file);
      const saved = this.devices.bestFor(csv.header);
      if (saved) {
        fillMapping(this.mapping, csv.header, saved.columns, saved.units, saved.device);
        this.matchedDevice.set(saved.device);
      } else {
        const guess = guessColumns(csv.header);
        fillMapping(this.mapping, csv.header, guess, guessUnits(guess, METRIC_UNITS));
      }
      this.csv.set(csv);
    } catch (error) {
      this.localProblem.set(error instanceof LocalCsvError ? error.message : `${file.name} could not be read on this device.`);
    }
  }

  protected toColumns(): void {
    if (this.canMap()) {
      this.stage.set(1);
    } else {
      this.drill.markAllAsTouched();
    }
  }

  protected backToDrill(): void {
    this.preview.reset();
    this.stage.set(0);
  }

  /** Sends the file with the mapping for a preview; a successful check saves the device's mapping. */
  protected checkRows(): void {
    const file = this.file();
    const drill = this.drill.getRawValue();
    if (!file || this.mapping.invalid || drill.targetDistanceM === null || drill.targetRadiusM === null) {
      this.mapping.markAllAsTouched();
      return;
    }
    const { columns, units, device } = mappingOf(this.mapping.getRawValue());
    const mapping: KickMapping = {
      squadId: drill.squadId,
      technique: drill.technique,
      targetDistanceM: drill.targetDistanceM,
      targetRadiusM: drill.targetRadiusM,
      ...(device === '' ? {} : { device }),
      columns,
      units,
    };
    this.checkedMapping.set(mapping);
    this.commit.reset();
    this.preview.start(this.api.kicks(file, mapping, true), true, () => this.devices.save(device, columns, units));
  }

  protected backToMapping(): void {
    this.preview.reset();
    this.commit.reset();
    this.stage.set(1);
  }

  /** Commits the previewed file with the mapping it was previewed with. */
  protected importNow(): void {
    const file = this.file();
    const mapping = this.checkedMapping();
    if (file && mapping && this.canCommit()) {
      this.commit.start(this.api.kicks(file, mapping, false), false);
    }
  }

  /** Another file for the same drill and device: both stay filled in. */
  protected startOver(): void {
    this.preview.reset();
    this.commit.reset();
    this.file.set(null);
    this.csv.set(null);
    this.localProblem.set(null);
    this.matchedDevice.set(null);
    this.stage.set(0);
  }
}
