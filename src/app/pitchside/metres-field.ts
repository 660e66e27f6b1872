import type { ValidatorFn } from '@angular/forms';
import type * as z from 'zod';
import { parseDecimal } from '../../../shared/quantity-format';
import { distanceToM, type DistanceUnit } from '../../../shared/units';

/**
 * Parses an optional distance field as typed on a phone — blank is null, a comma or a point is the decimal
 * mark — in the club's unit, returning metres (storage is SI). Seconds fields use it with the default 'm'
 * (no conversion).
 */
export function optionalMetres(text: string, unit: DistanceUnit = 'm'): number | null {
  const value = parseDecimal(text);
  return value === null || Number.isNaN(value) ? value : distanceToM(value, unit);
}

/**
 * A validator for an optional distance text field (carry, lateral offset) against the shared
 * kick schema's field (in metres, after conversion from the club's unit), so the phone refuses what the
 * server would. Text rather than `type="number"` because some phone keyboards cannot type a decimal comma
 * into one. The error is `{ schema: '<message>' }`, like `zodValidator`. `unitWord` names the unit in the
 * not-a-number message (the stopwatch field reads seconds with the same parsing); `unit` is read at each
 * check, so a club switching to yards needs no new form.
 */
export function metresValidator(
  schema: z.ZodType,
  unitWord: string | (() => string) = 'metres',
  unit: () => DistanceUnit = () => 'm',
): ValidatorFn {
  return (control) => {
    const value = optionalMetres(String(control.value ?? ''), unit());
    if (value === null) {
      return null;
    }
    if (Number.isNaN(value)) {
      return { schema: `Enter a number of ${typeof unitWord === 'string' ? unitWord : unitWord()}` };
    }
    const result = schema.safeParse(value);
    return result.success ? null : { schema: result.error.issues[0]?.message ?? 'Not valid' };
  };
}
