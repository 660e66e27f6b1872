import type { QuantityFormat } from '../../../shared/quantity-format';
import type { KickField } from './import-types';
import { FIELD_LABELS, OPTIONAL_FIELDS, type MappingValue } from './kick-mapping-form';
import { type LocalCsv, columnIndex, rowNumberOf } from './local-csv';
import { parseDeviceNumber, toMetres, toMetresPerSecond, toRevsPerSecond } from './unit-conversion';

/** One cell of the "how the first rows will read" check. */
export interface SampleCell {
  /** The value as Loftline will store it (SI, in the club's locale), e.g. "24.6" or "24,6", or the player's raw text. */
  readonly text: string;
  /** Why the server will refuse it, or null when it looks fine. */
  readonly warning: string | null;
}

/** One row of the check. */
export interface SampleRow {
  readonly row: number;
  readonly cells: readonly SampleCell[];
}

/** The check: which fields it shows (with their unit), and the first rows. */
export interface MappingSample {
  readonly fields: readonly { readonly field: KickField; readonly label: string }[];
  readonly rows: readonly SampleRow[];
}

/**
 * The ranges the server accepts after conversion (the shared kick schema's limits: a pitch is at
 * most 120 m long, IFAB Law 1; 45 m/s leaves headroom above the ~35 m/s of maximal instep kicks).
 */
const RANGES: Readonly<Partial<Record<KickField, { readonly min: number; readonly max: number; readonly unit: string }>>> = {
  speed: { min: 0, max: 45, unit: 'm/s' },
  launchAngle: { min: -10, max: 90, unit: '°' },
  spin: { min: -30, max: 30, unit: 'rev/s' },
  carry: { min: 0, max: 120, unit: 'm' },
  lateral: { min: -75, max: 75, unit: 'm' },
};

/**
 * The first `count` rows of the file read through the mapping and converted to Loftline's units,
 * flagging what the server would refuse. A wrong unit shows at once (a 90 m/s kick means the file
 * was in km/h), before anything is uploaded. Numbers and times are written in the club's locale (`f`).
 */
export function mappingSample(csv: LocalCsv, value: MappingValue, f: QuantityFormat, count = 3): MappingSample {
  const fields = (['player', ...OPTIONAL_FIELDS] as const).filter((field) => value[field] !== '');
  const decimalComma = csv.delimiter === ';';
  const indexes = fields.map((field) => columnIndex(csv.header, value[field]));
  const rows = csv.rows.slice(0, count).map((values, i) => ({
    row: rowNumberOf(i),
    cells: fields.map((field, j) => readCell(field, values[indexes[j] ?? -1] ?? '', value, decimalComma, f)),
  }));
  return {
    fields: fields.map((field) => {
      const unit = RANGES[field]?.unit;
      return { field, label: unit ? `${FIELD_LABELS[field].label} (${unit})` : FIELD_LABELS[field].label };
    }),
    rows,
  };
}

function readCell(field: KickField, raw: string, value: MappingValue, decimalComma: boolean, f: QuantityFormat): SampleCell {
  if (field === 'player') {
    return { text: raw === '' ? '(empty)' : raw, warning: raw.trim() === '' ? 'No player given' : null };
  }
  if (field === 'time') {
    if (raw.trim() === '') return { text: '–', warning: 'No time given' };
    // The server reads "2026-11-30 18:05:10" as it reads the ISO form with a "T".
    const at = Date.parse(raw.trim().replace(' ', 'T'));
    return Number.isNaN(at)
      ? { text: raw, warning: 'Not a date and time the server can read (e.g. 2026-11-30 18:05:10)' }
      : { text: f.dateTime(at, { dateStyle: 'medium', timeStyle: 'medium' }), warning: null };
  }
  const number = parseDeviceNumber(raw, decimalComma);
  if (raw.trim() === '') return { text: '–', warning: null };
  if (number === null) return { text: raw, warning: 'Not a number' };
  const converted =
    field === 'speed'
      ? toMetresPerSecond(number, value.speedUnit)
      : field === 'spin'
        ? toRevsPerSecond(number, value.spinUnit)
        : field === 'carry' || field === 'lateral'
          ? toMetres(number, value.distanceUnit)
          : number;
  const range = RANGES[field];
  const text = f.number(converted, 1);
  if (range && (converted < range.min || converted > range.max)) {
    return { text, warning: `Outside ${range.min} to ${range.max} ${range.unit}: is the unit right?` };
  }
  return { text, warning: null };
}
