/**
 * The profile refresher's worker thread: fits and stores stale profiles on its own database connection,
 * so a fit (tens to hundreds of milliseconds on a large academy) never holds up the API's event loop.
 * It answers each job (`RefreshJob`: a profile, or a week's held-out calibration) with `{ ok, calibration }`
 * once the row is written (or found fresh) or the calibration computed (the API thread keeps it).
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { Technique } from '../../shared/schemas/sync';
import { openDatabase } from '../db/client';
import { ProfileCache, type CalibrationResult, type RefreshJob } from './profile-cache';

const port = parentPort;
if (port) {
  const db = openDatabase((workerData as { dbPath: string }).dbPath);
  const cache = new ProfileCache(db);
  port.on('message', (job: RefreshJob) => {
    let ok = true;
    let calibration: CalibrationResult | null = null;
    try {
      calibration = cache.runJob(job);
    } catch {
      // A profile that cannot be fitted (or a database locked past the busy timeout) stays stale.
      ok = false;
    }
    port.postMessage({ ok, calibration });
  });
}
