/**
 * The import worker thread: runs each import job (parse, check, commit) on its own database connection
 * and answers with the result or the error as data (see `import-protocol.ts`). One job at a time.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { openDatabase } from '../db/client';
import { runImportJob } from './import-jobs';
import { failureOf, IMPORT_BUSY_TIMEOUT_MS, type ImportJob, type ImportReply } from './import-protocol';

const port = parentPort;
if (port) {
  const db = openDatabase((workerData as { dbPath: string }).dbPath);
  // Waiting for the write lock blocks only this thread: an import waits up to a minute for a long write elsewhere
  // to finish instead of failing after the API connection's 5 s.
  db.$client.pragma(`busy_timeout = ${IMPORT_BUSY_TIMEOUT_MS}`);
  port.on('message', (job: ImportJob) => {
    let reply: ImportReply;
    try {
      reply = { id: job.id, ok: true, result: runImportJob(db, job) };
    } catch (err) {
      reply = { id: job.id, ok: false, failure: failureOf(err) };
    }
    port.postMessage(reply);
  });
}
