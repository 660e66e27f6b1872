/** `/api/digests`: run the weekly mail now (admin, head coach); the one-click unsubscribe (public). */
import { Router } from 'express';
import type { RequestHandler } from 'express';
import { requireRole } from '../auth/passport';
import type { AppConfig } from '../config';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { runSchema } from './digests.schemas';
import type { DigestJob } from './digests.service';
import { unsubscribe } from './unsubscribe.service';

/** Public part: `POST /api/digests/unsubscribe?token=` (RFC 8058 one-click; idempotent). */
export function unsubscribeRouter(db: Db, config: AppConfig): Router {
  const router = Router();
  router.post('/unsubscribe', (req, res) => {
    const token = typeof req.query['token'] === 'string' ? req.query['token'] : '';
    res.json(unsubscribe(db, config.jwtSecret, token));
  });
  return router;
}

/** Authenticated part: `POST /api/digests/run`. */
export function digestsRouter(job: DigestJob): Router {
  const router = Router();
  const run: RequestHandler = async (req, res) => {
    const body = parseOrThrow(runSchema, req.body ?? {}, 'Digest run');
    res.json(await job.run({ clubId: req.user!.clubId, weekStart: body.weekStart }));
  };
  router.post('/run', requireRole('admin', 'head_coach'), run);
  return router;
}
