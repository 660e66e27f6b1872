/**
 * Typed HTTP errors and the one middleware that shapes every failure as
 * `{ error: { code, message, fields? } }`. Handlers just `throw`.
 */
import type { ErrorRequestHandler } from 'express';
import type * as z from 'zod';

/** One offending input field (dotted path) and why it was refused. */
export interface FieldError {
  field: string;
  message: string;
}

/** Base class: an error with an HTTP status and a stable machine-readable code. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldError[],
  ) {
    super(message);
  }
}

/** An error whose answer carries more than the error object (e.g. an import's per-row errors). */
export class HttpErrorWithBody extends HttpError {
  constructor(
    status: number,
    code: string,
    message: string,
    readonly body: Record<string, unknown>,
  ) {
    super(status, code, message);
  }
}

/** 400: the request is malformed or fails validation. */
export class Invalid extends HttpError {
  constructor(message: string, fields?: FieldError[]) {
    super(400, 'invalid', message, fields);
  }
}
/** 401: no valid credentials. */
export class Unauthorized extends HttpError {
  constructor(message = 'Sign-in required', code = 'unauthorized') {
    super(401, code, message);
  }
}
/** 403: signed in, but the role or scope does not allow this. */
export class Forbidden extends HttpError {
  constructor(message = 'Your role does not allow this') {
    super(403, 'forbidden', message);
  }
}
/** 404: nothing there that the caller may see. */
export class NotFound extends HttpError {
  constructor(message = 'Not found') {
    super(404, 'not_found', message);
  }
}

/** 503: the database is locked by another writer for longer than the busy timeout; retrying later works. */
export class DatabaseBusy extends HttpError {
  /** Seconds the client should wait before retrying (sent as `Retry-After`). */
  readonly retryAfterS = 2;
  constructor() {
    super(503, 'database_busy', 'The database is busy with another write; nothing was changed — try again in a few seconds');
  }
}

/**
 * Converts zod issues into field errors (`body` when the whole value is wrong). Unknown keys
 * refused by a strict object are named one by one, so the caller sees which field to drop.
 */
export function fieldErrors(error: z.ZodError, root = 'body'): FieldError[] {
  return error.issues.flatMap((issue) => {
    const at = issue.path.map(String);
    if (issue.code === 'unrecognized_keys') {
      return issue.keys.map((key) => ({ field: [...at, key].join('.'), message: 'Unknown field' }));
    }
    return [{ field: at.length ? at.join('.') : root, message: issue.message }];
  });
}

/**
 * Parses `value` with `schema` or throws `Invalid` naming every bad field. `root` names the
 * value itself when it is not an object (a path parameter: `id`).
 */
export function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown, what = 'Request', root = 'body'): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    const fields = fieldErrors(result.error, root);
    const summary = fields.map((f) => `${f.field}: ${f.message}`).join('; ');
    throw new Invalid(`${what} is invalid — ${summary}`, fields);
  }
  return result.data;
}

interface BodyParserError {
  type?: string;
  status?: number;
  limit?: number;
  message?: string;
}

/** Whether `err` is SQLite's "database is locked" (better-sqlite3 `SqliteError` codes SQLITE_BUSY, SQLITE_BUSY_SNAPSHOT, …). */
export function isSqliteBusy(err: unknown): boolean {
  const code = err && typeof err === 'object' && 'code' in err ? (err as { code: unknown }).code : undefined;
  return typeof code === 'string' && (code === 'SQLITE_BUSY' || code.startsWith('SQLITE_BUSY_'));
}

/** The single error middleware. Unknown errors become a 500 without leaking internals. */
export const errorMiddleware: ErrorRequestHandler = (err: unknown, req, res, _next) => {
  // A write that waited out the busy timeout rolled back; tell the client to retry rather than report a server fault.
  if (isSqliteBusy(err)) {
    req.log?.warn({ err }, 'database busy: the write waited out the busy timeout');
    err = new DatabaseBusy();
  }
  if (err instanceof DatabaseBusy) res.setHeader('Retry-After', String(err.retryAfterS));
  if (err instanceof HttpError) {
    const extra = err instanceof HttpErrorWithBody ? err.body : {};
    res
      .status(err.status)
      .json({ ...extra, error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } });
    return;
  }
  const bp = err as BodyParserError;
  if (bp && bp.type === 'entity.parse.failed') {
    res.status(400).json({
      error: {
        code: 'invalid_json',
        message: 'The request body is not valid JSON',
        fields: [{ field: 'body', message: 'Malformed JSON' }],
      },
    });
    return;
  }
  if (bp && bp.type === 'entity.too.large') {
    // 413 Content Too Large (RFC 9110 §15.5.14): the status a proxy in front would send for the same body.
    res.status(413).json({
      error: {
        code: 'body_too_large',
        message: `The request body is larger than the ${bp.limit ?? ''} byte limit`.replace('  ', ' '),
        fields: [{ field: 'body', message: 'Too large' }],
      },
    });
    return;
  }
  if (bp && typeof bp.status === 'number' && bp.status >= 400 && bp.status < 500) {
    res.status(bp.status).json({ error: { code: 'bad_request', message: bp.message ?? 'Bad request' } });
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server' } });
};
