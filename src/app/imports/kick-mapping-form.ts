import { FormControl, FormGroup, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import { METRIC_UNITS, type ColumnGuess } from './column-guess';
import type { DistanceUnit, KickColumns, KickField, KickUnits, SpeedUnit, SpinUnit } from './import-types';
import { columnIndex } from './local-csv';

/** The optional fields, in the order the mapping form lists them. */
export const OPTIONAL_FIELDS = ['time', 'speed', 'launchAngle', 'spin', 'carry', 'lateral'] as const satisfies readonly KickField[];

/** What each field is called on screen, and what it holds. */
export const FIELD_LABELS: Readonly<Record<KickField, { readonly label: string; readonly holds: string }>> = {
  player: { label: 'Player', holds: 'Shirt number or name of a player in the squad' },
  time: { label: 'Time', holds: 'When the kick was measured, e.g. 2026-11-30 18:05:10' },
  speed: { label: 'Ball speed', holds: 'Launch speed of the ball' },
  launchAngle: { label: 'Launch angle', holds: 'Vertical launch angle, degrees' },
  spin: { label: 'Spin', holds: 'Spin rate; backspin positive' },
  carry: { label: 'Carry', holds: 'Distance to where the ball first came down' },
  lateral: { label: 'Lateral', holds: 'Sideways distance from the aim line; left positive' },
};

/** The column mapping's form: a column name per field ('' = not in this file), units, device. */
export type MappingForm = FormGroup<{
  device: FormControl<string>;
  player: FormControl<string>;
  time: FormControl<string>;
  speed: FormControl<string>;
  launchAngle: FormControl<string>;
  spin: FormControl<string>;
  carry: FormControl<string>;
  lateral: FormControl<string>;
  speedUnit: FormControl<SpeedUnit>;
  spinUnit: FormControl<SpinUnit>;
  distanceUnit: FormControl<DistanceUnit>;
}>;

/** The form's value. */
export type MappingValue = ReturnType<MappingForm['getRawValue']>;

/**
 * A new mapping form. Its validator asks for what the server asks for: a player column, and a
 * speed or a carry column (a kick without either cannot be placed), and it refuses one column
 * mapped to two fields, which is always a slip.
 */
export function createMappingForm(): MappingForm {
  const text = (): FormControl<string> => new FormControl('', { nonNullable: true });
  return new FormGroup(
    {
      device: text(),
      player: text(),
      time: text(),
      speed: text(),
      launchAngle: text(),
      spin: text(),
      carry: text(),
      lateral: text(),
      speedUnit: new FormControl<SpeedUnit>(METRIC_UNITS.speed, { nonNullable: true }),
      spinUnit: new FormControl<SpinUnit>(METRIC_UNITS.spin, { nonNullable: true }),
      distanceUnit: new FormControl<DistanceUnit>(METRIC_UNITS.distance, { nonNullable: true }),
    },
    { validators: mappingValidator },
  );
}

/** The validator behind {@link createMappingForm}; the error's `mapping` key holds the message. */
export const mappingValidator: ValidatorFn = (control): ValidationErrors | null => {
  const value = (control as MappingForm).getRawValue();
  if (value.player === '') {
    return { mapping: 'Choose the column that names the player.' };
  }
  if (value.speed === '' && value.carry === '') {
    return { mapping: 'Choose a ball speed or a carry column: a kick needs at least one of them.' };
  }
  const seen = new Map<string, KickField>();
  for (const field of ['player', ...OPTIONAL_FIELDS] as const) {
    const column = value[field];
    if (column === '') continue;
    const other = seen.get(column);
    if (other !== undefined) {
      return {
        mapping: `“${column}” is chosen for both ${FIELD_LABELS[other].label.toLowerCase()} and ${FIELD_LABELS[field].label.toLowerCase()}.`,
      };
    }
    seen.set(column, field);
  }
  return null;
};

/** The mapping's columns and units as the server takes them (fields not in the file left out). */
export function mappingOf(value: MappingValue): { columns: KickColumns; units: KickUnits; device: string } {
  const columns: { player: string } & Partial<Record<(typeof OPTIONAL_FIELDS)[number], string>> = { player: value.player };
  for (const field of OPTIONAL_FIELDS) {
    if (value[field] !== '') columns[field] = value[field];
  }
  return { columns, units: { speed: value.speedUnit, spin: value.spinUnit, distance: value.distanceUnit }, device: value.device.trim() };
}

/**
 * Fills the form from a guess or a saved mapping, taking each column only when this file's
 * header has it (spelled as in this file). Returns the columns that were asked for but missing.
 */
export function fillMapping(
  form: MappingForm,
  header: readonly string[],
  columns: ColumnGuess,
  units: KickUnits,
  device?: string,
): string[] {
  const missing: string[] = [];
  const pick = (wanted: string | undefined): string => {
    if (wanted === undefined) return '';
    const index = columnIndex(header, wanted);
    if (index < 0) missing.push(wanted);
    return index < 0 ? '' : (header[index] ?? '');
  };
  form.setValue({
    device: device ?? form.controls.device.value,
    player: pick(columns.player),
    time: pick(columns.time),
    speed: pick(columns.speed),
    launchAngle: pick(columns.launchAngle),
    spin: pick(columns.spin),
    carry: pick(columns.carry),
    lateral: pick(columns.lateral),
    speedUnit: units.speed,
    spinUnit: units.spin,
    distanceUnit: units.distance,
  });
  return missing;
}
