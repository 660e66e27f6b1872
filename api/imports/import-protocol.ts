/**
 * Messages between the API and the import worker thread (`import-worker.ts`). An import's parsing,
 * checking and commit run there on the worker's own database connection; the API thread only sends the
 * file and relays the answer, so `/api/health` and every other request keep answering during a
 * 50,000-row import.
 */
import type { AuthUser } from '../auth/passport';
import { HttpError, HttpErrorWithBody, type FieldError } from '../errors';
import type { ImportAnswer } from './import-types';

/** How long an import on the worker waits for SQLite's write lock, ms. */
export const IMPORT_BUSY_TIMEOUT_MS = 60_000;

/** An uploaded file as it crosses to the worker (a `Buffer` arrives as a plain `Uint8Array`). */
export interface UploadedFile {
  name: string;
  buffer: Uint8Array;
}

/** One import to run. */
export type ImportJob =
  | { id: number; kind: 'roster'; user: AuthUser; file: UploadedFile; dryRun: boolean }
  | { id: number; kind: 'kicks'; user: AuthUser; file: UploadedFile; mapping: unknown; dryRun: boolean };

/** A failure, as data: an HTTP error the client should see, or anything else (a 500, or SQLite busy). */
export type ImportFailure =
  | { http: { status: number; code: string; message: string; fields?: FieldError[]; body?: Record<string, unknown> } }
  | { other: { message: string; code?: string } };

/** The worker's answer to job `id`. */
export type ImportReply = { id: number; ok: true; result: ImportAnswer<unknown> } | { id: number; ok: false; failure: ImportFailure };

/** Turns a thrown error into data that survives `postMessage`. */
export function failureOf(err: unknown): ImportFailure {
  if (err instanceof HttpError) {
    return {
      http: {
        status: err.status,
        code: err.code,
        message: err.message,
        ...(err.fields ? { fields: err.fields } : {}),
        ...(err instanceof HttpErrorWithBody ? { body: err.body } : {}),
      },
    };
  }
  const code = err && typeof err === 'object' && 'code' in err && typeof err.code === 'string' ? err.code : undefined;
  return { other: { message: err instanceof Error ? err.message : String(err), ...(code ? { code } : {}) } };
}

/** The error to throw on the API thread for a failure the worker reported. */
export function errorOf(failure: ImportFailure): Error {
  if ('http' in failure) {
    const h = failure.http;
    return h.body ? new HttpErrorWithBody(h.status, h.code, h.message, h.body) : new HttpError(h.status, h.code, h.message, h.fields);
  }
  // Keep SQLite's code (e.g. SQLITE_BUSY) so the error middleware answers "busy, retry" rather than 500.
  return Object.assign(new Error(failure.other.message), failure.other.code ? { code: failure.other.code } : {});
}
