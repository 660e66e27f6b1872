/** Runs one import job on a database connection; shared by the worker thread and the in-process fallback. */
import type { Db } from '../db/client';
import { Scope } from '../scope/scope';
import type { ImportJob } from './import-protocol';
import type { ImportAnswer } from './import-types';
import { importKicks } from './kicks-import.service';
import { importRoster } from './roster.service';

/** Runs `job` on `db`; throws the services' typed errors. */
export function runImportJob(db: Db, job: ImportJob): ImportAnswer<unknown> {
  const file = { name: job.file.name, buffer: Buffer.from(job.file.buffer.buffer, job.file.buffer.byteOffset, job.file.buffer.byteLength) };
  if (job.kind === 'roster') return importRoster(db, job.user, file, job.dryRun);
  // The scope is computed on this connection at the time of the import, as the request's would be.
  return importKicks(db, Scope.for(db, job.user), file, job.mapping, job.dryRun);
}
