/**
 * The profile refresher's worker thread: fits and stores stale profiles on its own database connection,
 * so a fit (tens to hundreds of milliseconds on a large academy) never holds up the API's event loop.
 * It answers each `{ playerId, technique }` with `{ ok }` once the row is written (or found fresh).
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { Technique } from '../../shared/schemas/sync';
import { openDatabase } from '../db/client';
import { ProfileCache } from './profile-cache';

const port = parentPort;
if (port) {
  const db = openDatabase((workerData as { dbPath: string }).dbPath);
  const cache = new ProfileCache(db);
  port.on('message', (job: { playerId: string; technique: Technique }) => {
    let ok = true;
    try {
      if (cache.isStale(job.playerId, job.technique)) cache.compute(job.playerId, job.technique);
    } catch {
      // A profile that cannot be fitted (or a database locked past the busy timeout) stays stale.
      ok = false;
    }
    port.postMessage({ ok });
  });
}
