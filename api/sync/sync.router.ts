/** `/api/sync`: push the device's outbox, pull changes since a cursor. */
import { Router } from 'express';
import { pullQuerySchema, pushRequestSchema, type PullWindow } from '../../shared/schemas/sync';
import { requireStaff } from '../auth/passport';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { pull, push } from './sync.service';

/** Builds the sync router (mounted behind authentication and scope). Players and guardians cannot push. */
export function syncRouter(db: Db): Router {
  const router = Router();
  router.post('/push', requireStaff(), (req, res) => {
    const body = parseOrThrow(pushRequestSchema, req.body, 'Push');
    res.json(push(db, scopeOf(req), body.deviceId, body.mutations));
  });
  router.get('/pull', (req, res) => {
    const q = parseOrThrow(pullQuerySchema, req.query, 'Query');
    const window: PullWindow | undefined =
      q.part === 'recent' && q.from
        ? { part: 'recent', from: q.from }
        : q.part === 'history' && q.upTo !== undefined
          ? { part: 'history', upTo: q.upTo }
          : undefined;
    res.json(pull(db, scopeOf(req), q.since, q.limit, window));
  });
  return router;
}
