import type { FormGroup } from '@angular/forms';
import type { ApiProblem } from '../core/api-error';

/**
 * Puts a failed call's field errors under the form fields they name (as `{ server: message }`)
 * and returns the message for the form as a whole. Field names the form does not have stay in
 * the returned message, which the server words to make sense on its own.
 */
export function applyServerErrors(form: FormGroup, problem: ApiProblem): string {
  for (const [field, message] of Object.entries(problem.fields)) {
    // `squadIds.1` belongs under the squads field: fall back to the first segment of a path.
    const control = form.get(field) ?? form.get(field.split('.')[0] ?? field);
    if (control) {
      control.setErrors({ ...control.errors, server: message });
      control.markAsTouched();
    }
  }
  return problem.message;
}
