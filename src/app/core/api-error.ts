import { HttpErrorResponse } from '@angular/common/http';
import type { ApiErrorBody } from '../../../shared/schemas/squads';

/** What a screen needs to tell the user about a failed API call. */
export interface ApiProblem {
  /** A sentence the user can read and act on. */
  message: string;
  /** Whether the server could not be reached at all (offline, server down, DNS). */
  unreachable: boolean;
  /** The server's error code (`invalid_credentials`, `invalid`, …) when it sent one. */
  code: string | null;
  /** Per-field messages of a validation failure, keyed by field path. */
  fields: Readonly<Record<string, string>>;
}

/** Shown when the request never got an answer: the usual state of a training pitch. */
export const UNREACHABLE_MESSAGE = 'The Loftline server cannot be reached. Check your connection and try again.';

/**
 * Whether a response body has the shape every failing Loftline API call answers with.
 * Checked at run time because proxies and captive portals answer with HTML or nothing.
 */
export function isApiErrorBody(body: unknown): body is ApiErrorBody {
  if (typeof body !== 'object' || body === null || !('error' in body)) {
    return false;
  }
  const error: unknown = body.error;
  return (
    typeof error === 'object' &&
    error !== null &&
    'message' in error &&
    typeof error.message === 'string' &&
    'code' in error &&
    typeof error.code === 'string'
  );
}

/**
 * Turns anything an HTTP call can fail with into one readable problem, so every screen
 * words failures the same way: the server's own message when it sent one, a clear
 * "cannot be reached" when there was no answer, and a plain fallback otherwise.
 */
export function describeApiError(error: unknown): ApiProblem {
  if (!(error instanceof HttpErrorResponse)) {
    return { message: 'Something went wrong. Try again.', unreachable: false, code: null, fields: {} };
  }
  if (error.status === 0) {
    return { message: UNREACHABLE_MESSAGE, unreachable: true, code: null, fields: {} };
  }
  const body: unknown = error.error;
  if (isApiErrorBody(body)) {
    const fields: Record<string, string> = {};
    for (const entry of body.error.fields ?? []) {
      fields[entry.field] ??= entry.message;
    }
    return { message: body.error.message, unreachable: false, code: body.error.code, fields };
  }
  if (error.status === 429) {
    return {
      message: 'Too many attempts in a short time. Wait a minute and try again.',
      unreachable: false,
      code: null,
      fields: {},
    };
  }
  if (error.status >= 500) {
    return {
      message: `The Loftline server had a problem (HTTP ${error.status}). Try again in a moment.`,
      unreachable: false,
      code: null,
      fields: {},
    };
  }
  return {
    message: `The request failed (HTTP ${error.status}). Try again.`,
    unreachable: false,
    code: null,
    fields: {},
  };
}
