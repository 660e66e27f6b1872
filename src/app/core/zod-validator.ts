import type { ValidatorFn } from '@angular/forms';
import type * as z from 'zod';

/**
 * An Angular validator backed by one of the shared zod schemas, so a form field rejects
 * exactly what the server would reject, with the same words. Empty values pass: whether a
 * field is required is `Validators.required`'s job, with its own message.
 * The error is `{ schema: '<first issue message>' }`.
 */
export function zodValidator(schema: z.ZodType): ValidatorFn {
  return (control) => {
    const value: unknown = control.value;
    if (value === null || value === undefined || value === '') {
      return null;
    }
    const result = schema.safeParse(value);
    if (result.success) {
      return null;
    }
    return { schema: result.error.issues[0]?.message ?? 'Not valid' };
  };
}
