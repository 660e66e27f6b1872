/** `/api/me`: who the caller is, for the app shell. */
import { Router } from 'express';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { digestOptInSchema } from '../../shared/schemas/mail';
import { digestSelfOptIn, me, setDigestSelfOptIn } from './me.service';

/** Builds the me router (mounted behind authentication and scope). */
export function meRouter(db: Db): Router {
  const router = Router();
  router.get('/', (req, res) => {
    res.json(me(db, scopeOf(req)));
  });
  /** An adult player's own choice about Family digests sent to their linked guardians (none without it). */
  router.get('/digest-opt-in', requireRole('player'), (req, res) => {
    res.json({ optIn: digestSelfOptIn(db, scopeOf(req)) });
  });
  router.put('/digest-opt-in', requireRole('player'), (req, res) => {
    const { optIn } = parseOrThrow(digestOptInSchema, req.body, 'Digest opt-in');
    setDigestSelfOptIn(db, scopeOf(req), optIn);
    res.json({ optIn });
  });
  return router;
}
