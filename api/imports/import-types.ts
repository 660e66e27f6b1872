import type { ImportRowError } from '../../shared/schemas/imports';
import { HttpErrorWithBody } from '../errors';

/** Shapes shared by the import services. */

/** The answer shapes live in shared/ (one definition for server, client and the OpenAPI document). */
export type { ImportAnswer, ImportRowError } from '../../shared/schemas/imports';

/** 400 for a commit of a file with problems: nothing was written; the rows' errors come back. */
export class ImportInvalid extends HttpErrorWithBody {
  constructor(message: string, errors: ImportRowError[]) {
    super(400, 'import_invalid', message, { errors });
  }
}
