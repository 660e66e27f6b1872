/**
 * Sends imports to a worker thread with its own database connection, so a 50,000-row roster or device
 * file never holds up the API's event loop (the request waits; `/api/health` and everyone else do not).
 * One worker, started on first use, runs jobs one at a time (they take SQLite's write lock anyway); an
 * in-memory database cannot be shared with a thread, so there the job runs in-process.
 */
import { Worker } from 'node:worker_threads';
import type { AuthUser } from '../auth/passport';
import type { Db } from '../db/client';
import { runImportJob } from './import-jobs';
import { errorOf, failureOf, type ImportJob, type ImportReply } from './import-protocol';
import type { ImportAnswer } from './import-types';
import type { KicksSummary } from './kicks-import.service';
import type { RosterSummary } from './roster.service';

/** A job before it gets its id (`Omit` applied to each kind of job). */
type WithoutId<J> = J extends unknown ? Omit<J, 'id'> : never;
type JobInput = WithoutId<ImportJob>;

interface Pending {
  resolve(result: ImportAnswer<unknown>): void;
  reject(err: Error): void;
}

/** Runs imports off the API thread. */
export class ImportRunner {
  private worker: Worker | null = null;
  private readonly pending = new Map<number, Pending>();
  private nextId = 1;

  constructor(
    private readonly db: Db,
    private readonly dbPath: string,
  ) {}

  /** Previews or commits a roster file for the admin's club. */
  roster(user: AuthUser, file: { name: string; buffer: Buffer }, dryRun: boolean): Promise<ImportAnswer<RosterSummary>> {
    return this.run({ kind: 'roster', user, file, dryRun }) as Promise<ImportAnswer<RosterSummary>>;
  }

  /** Previews or commits a device export for one squad. */
  kicks(user: AuthUser, file: { name: string; buffer: Buffer }, mapping: unknown, dryRun: boolean): Promise<ImportAnswer<KicksSummary>> {
    return this.run({ kind: 'kicks', user, file, mapping, dryRun }) as Promise<ImportAnswer<KicksSummary>>;
  }

  /** Stops the worker; jobs still running are refused. */
  async close(): Promise<void> {
    const worker = this.worker;
    this.worker = null;
    this.failAll(new Error('The server is shutting down; the import was not finished'));
    if (worker) await worker.terminate();
  }

  private run(input: JobInput): Promise<ImportAnswer<unknown>> {
    const job = { ...input, id: this.nextId++ } as ImportJob;
    if (this.dbPath === ':memory:') {
      try {
        return Promise.resolve(runImportJob(this.db, job));
      } catch (err) {
        return Promise.reject(errorOf(failureOf(err)));
      }
    }
    const worker = this.ensureWorker();
    return new Promise((resolve, reject) => {
      this.pending.set(job.id, { resolve, reject });
      // A job under way keeps the process alive; an idle worker does not.
      worker.ref();
      worker.postMessage(job);
    });
  }

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    const worker = new Worker(new URL('./import-worker-boot.mjs', import.meta.url), { workerData: { dbPath: this.dbPath } });
    worker.unref();
    worker.on('message', (reply: ImportReply) => {
      const waiting = this.pending.get(reply.id);
      this.pending.delete(reply.id);
      if (this.pending.size === 0) worker.unref();
      if (!waiting) return;
      if (reply.ok) waiting.resolve(reply.result);
      else waiting.reject(errorOf(reply.failure));
    });
    const lost = (err: unknown): void => {
      if (this.worker !== worker) return;
      // The next import starts a fresh worker; the ones in flight were rolled back with their transaction.
      this.worker = null;
      this.failAll(new Error(`The import worker stopped: ${err instanceof Error ? err.message : String(err)}`));
    };
    worker.on('error', lost);
    worker.on('exit', (code) => lost(new Error(`exit code ${code}`)));
    this.worker = worker;
    return worker;
  }

  private failAll(err: Error): void {
    for (const waiting of this.pending.values()) waiting.reject(err);
    this.pending.clear();
  }
}
