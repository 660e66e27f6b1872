import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule, type MatAutocompleteSelectedEvent } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { map, startWith, switchMap } from 'rxjs';
import { DeviceMappings } from './device-mappings';
import type { KickField } from './import-types';
import { FIELD_LABELS, OPTIONAL_FIELDS, type MappingForm, fillMapping } from './kick-mapping-form';
import { type LocalCsv, columnIndex } from './local-csv';
import { mappingSample } from './mapping-sample';
import { ClubFormat } from '../core/club-format';

/**
 * The column-mapping step of the measured-kick import: which of the file's columns holds the
 * player, time, speed, launch angle, spin, carry and lateral offset, and in which units. Each
 * choice shows the column's first values, and a small table shows how the first rows will read in
 * Loftline's units, so a wrong column or unit is caught before the upload. The device name picks
 * a mapping saved on this device (the wizard saves it after a successful check).
 */
@Component({
  selector: 'll-column-mapping',
  imports: [
    ReactiveFormsModule,
    MatAutocompleteModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
  ],
  templateUrl: './column-mapping.html',
  styleUrl: './column-mapping.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ColumnMapping {
  /** The mapping form, owned by the wizard. */
  readonly form = input.required<MappingForm>();
  /** The file as read on the device. */
  readonly csv = input.required<LocalCsv>();

  protected readonly devices = inject(DeviceMappings);
  private readonly fmt = inject(ClubFormat).format;
  protected readonly fields = ['player', ...OPTIONAL_FIELDS] as const;
  protected readonly labels = FIELD_LABELS;
  /** What applying a saved mapping did, e.g. which of its columns this file lacks. */
  protected readonly appliedNote = signal<string | null>(null);

  /** The form's value as a signal, so the samples follow every change. */
  protected readonly value = toSignal(
    toObservable(this.form).pipe(
      switchMap((form) =>
        form.valueChanges.pipe(
          startWith(null),
          map(() => form.getRawValue()),
        ),
      ),
    ),
  );

  protected readonly sample = computed(() => {
    const value = this.value();
    return value ? mappingSample(this.csv(), value, this.fmt()) : null;
  });
  protected readonly mappingError = computed(() => {
    this.value();
    const errors = this.form().errors;
    return typeof errors?.['mapping'] === 'string' ? errors['mapping'] : null;
  });
  /** The saved devices whose name starts with what is typed. */
  protected readonly deviceOptions = computed(() => {
    const typed = (this.value()?.device ?? '').trim().toLowerCase();
    return this.devices.saved().filter((entry) => entry.device.toLowerCase().includes(typed));
  });
  protected readonly savedDevice = computed(() => this.devices.find(this.value()?.device ?? ''));
  protected readonly showsSpeedUnit = computed(() => (this.value()?.speed ?? '') !== '');
  protected readonly showsSpinUnit = computed(() => (this.value()?.spin ?? '') !== '');
  protected readonly showsDistanceUnit = computed(() => (this.value()?.carry ?? '') !== '' || (this.value()?.lateral ?? '') !== '');

  /** The first few values of a column, as a hint under its select. */
  protected examples(column: string): string {
    const csv = this.csv();
    const index = columnIndex(csv.header, column);
    if (index < 0) return '';
    const values = csv.rows
      .slice(0, 20)
      .map((row) => row[index] ?? '')
      .filter((v) => v !== '')
      // Long values (dates) one at a time, so the hint stays on one line.
      .slice(0, 3)
      .filter((v, i) => i === 0 || v.length <= 12);
    return values.length > 0 ? `e.g. ${values.join(', ')}` : 'empty in the first rows';
  }

  protected hintFor(field: KickField): string {
    const column = this.value()?.[field] ?? '';
    return column === '' ? this.labels[field].holds : this.examples(column);
  }

  /** Applies the saved mapping of the device picked from the list. */
  protected applySaved(event: MatAutocompleteSelectedEvent): void {
    const entry = this.devices.find(String(event.option.value));
    if (!entry) return;
    const missing = fillMapping(this.form(), this.csv().header, entry.columns, entry.units, entry.device);
    this.appliedNote.set(
      missing.length === 0
        ? `Columns and units saved for ${entry.device} applied.`
        : `Saved columns for ${entry.device} applied, but this file has no ${missing.map((m) => `“${m}”`).join(', ')}: choose those again.`,
    );
  }

  /** Forgets the saved mapping of the device named in the field. */
  protected forgetDevice(): void {
    const entry = this.savedDevice();
    if (entry) {
      this.devices.forget(entry.device);
      this.appliedNote.set(`The saved columns of ${entry.device} are forgotten on this device.`);
    }
  }
}
