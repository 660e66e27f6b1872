import type { ValidatorFn } from '@angular/forms';
import type * as z from 'zod';

/** Parses an optional metres field as typed on a phone: blank is null, a comma is a decimal point. */
export function optionalMetres(text: string): number | null {
  const trimmed = text.trim().replace(',', '.');
  return trimmed === '' ? null : Number(trimmed);
}

/**
 * A validator for an optional metres text field (carry, lateral offset) against the shared
 * kick schema's field, so the phone refuses what the server would. Text rather than
 * `type="number"` because some phone keyboards cannot type a decimal comma into one.
 * The error is `{ schema: '<message>' }`, like `zodValidator`. `unitWord` names the unit in the
 * not-a-number message (the stopwatch field reads seconds with the same parsing).
 */
export function metresValidator(schema: z.ZodType, unitWord = 'metres'): ValidatorFn {
  return (control) => {
    const value = optionalMetres(String(control.value ?? ''));
    if (value === null) {
      return null;
    }
    if (Number.isNaN(value)) {
      return { schema: `Enter a number of ${unitWord}` };
    }
    const result = schema.safeParse(value);
    return result.success ? null : { schema: result.error.issues[0]?.message ?? 'Not valid' };
  };
}
