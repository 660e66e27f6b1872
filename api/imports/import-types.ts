import { HttpErrorWithBody } from '../errors';

/** Shapes shared by the import services. */

/** One problem with one cell (or row) of an upload. */
export interface RowError {
  row: number;
  column: string;
  message: string;
}

/** A preview or commit answer. */
export interface ImportResult<S> {
  dryRun: boolean;
  uploadId: string | null;
  /** Whether this exact file was already committed (nothing was applied again). */
  alreadyImported: boolean;
  rows: number;
  errors: RowError[];
  summary: S;
}

/** 400 for a commit of a file with problems: nothing was written; the rows' errors come back. */
export class ImportInvalid extends HttpErrorWithBody {
  constructor(message: string, errors: RowError[]) {
    super(400, 'import_invalid', message, { errors });
  }
}
