import { HttpErrorResponse } from '@angular/common/http';
import { describeApiError } from '../core/api-error';
import type { ImportRowError } from './import-types';

/** Why an upload was refused, in words, with the rows the server named. */
export interface ImportRefusal {
  /** A sentence the coach can read and act on. */
  readonly message: string;
  /** Whether the server could not be reached (no signal): the file is fine, try again later. */
  readonly unreachable: boolean;
  /** The server's error code (`import_invalid`, `file_too_large`, …) when it sent one. */
  readonly code: string | null;
  /** The rows a refused commit named (`import_invalid`); empty for a refusal of the whole file. */
  readonly rowErrors: readonly ImportRowError[];
}

/**
 * Turns a failed upload into one readable refusal. On top of the app's usual wording
 * ({@link describeApiError}) it keeps the per-row errors a refused commit carries beside the
 * error (`{ error, errors: [...] }`), words a proxy's "413 too large" the way the server would,
 * and keeps the message of a client-side failure instead of a generic "something went wrong".
 */
export function describeImportFailure(error: unknown): ImportRefusal {
  if (!(error instanceof HttpErrorResponse)) {
    const message = error instanceof Error && error.message ? error.message : 'Something went wrong. Try again.';
    return { message, unreachable: false, code: null, rowErrors: [] };
  }
  const problem = describeApiError(error);
  if (error.status === 413 && problem.code === null) {
    return {
      message: 'The file is larger than the server accepts (5 MB). Split it and upload the parts one by one.',
      unreachable: false,
      code: 'file_too_large',
      rowErrors: [],
    };
  }
  return { message: problem.message, unreachable: problem.unreachable, code: problem.code, rowErrors: rowErrorsOf(error.error) };
}

/** The `errors` array of a refusal body, keeping only well-formed entries. */
function rowErrorsOf(body: unknown): ImportRowError[] {
  if (typeof body !== 'object' || body === null || !('errors' in body) || !Array.isArray(body.errors)) {
    return [];
  }
  const list: unknown[] = body.errors;
  return list.filter(isRowError);
}

/** Whether a value is one `{ row, column, message }` entry. */
export function isRowError(value: unknown): value is ImportRowError {
  if (typeof value !== 'object' || value === null) {
    return false;
  }
  const record = value as Record<string, unknown>;
  return typeof record['row'] === 'number' && typeof record['column'] === 'string' && typeof record['message'] === 'string';
}
