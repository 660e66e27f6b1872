/** `/api/digests`: run the weekly mail now (admin, head coach); the one-click unsubscribe (public). */
import { audit } from '../audit';
import { eq } from 'drizzle-orm';
import { Router } from 'express';
import * as z from 'zod';
import type { RequestHandler } from 'express';
import { requireRole } from '../auth/passport';
import type { AppConfig } from '../config';
import type { Db } from '../db/client';
import { guardianLinks, players } from '../db/schema';
import { HttpError, parseOrThrow } from '../errors';
import { firstNameOf } from '../guardians/guardians.service';
import type { DigestJob } from './digests.service';
import { verifyUnsubscribeToken } from './unsubscribe-token';

export const runSchema = z
  .strictObject({ weekStart: z.iso.date({ error: 'weekStart must be a date (YYYY-MM-DD)' }).optional() })
  .default({});

/** Public part: `POST /api/digests/unsubscribe?token=` (RFC 8058 one-click; idempotent). */
export function unsubscribeRouter(db: Db, config: AppConfig): Router {
  const router = Router();
  router.post('/unsubscribe', (req, res) => {
    const token = typeof req.query['token'] === 'string' ? req.query['token'] : '';
    const linkId = verifyUnsubscribeToken(config.jwtSecret, token);
    const link = linkId ? db.select().from(guardianLinks).where(eq(guardianLinks.id, linkId)).get() : undefined;
    if (!link)
      throw new HttpError(
        400,
        'unsubscribe_invalid',
        'This unsubscribe link is not valid or has expired; sign in to change your digest settings',
      );
    if (link.digestOptIn) {
      db.update(guardianLinks).set({ digestOptIn: false, updatedAt: new Date().toISOString() }).where(eq(guardianLinks.id, link.id)).run();
      audit(db, { userId: link.guardianUserId, action: 'digest.unsubscribed', entity: 'guardian_link', entityId: link.id });
    }
    const player = db.select({ name: players.displayName }).from(players).where(eq(players.id, link.playerId)).get();
    res.json({ unsubscribed: true, firstName: player ? firstNameOf(player.name) : '' });
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
