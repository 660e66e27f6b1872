/**
 * `POST /api/admin/players/:id/erase` (admin): erases a player on request (see erasure.service.ts).
 * Written to the audit log; the name must be typed to confirm.
 */
import { idSchema } from '../id-param';
import { Router } from 'express';
import * as z from 'zod';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import type { Erasure } from '../../shared/schemas/exports';
import { erasePlayer } from './erasure.service';

export const eraseSchema = z.strictObject({
  mode: z.enum(['anonymise', 'remove'], { error: 'mode must be anonymise or remove' }),
  confirmName: z.string({ error: 'confirmName is required' }),
});

/** Builds the erasure router, mounted at `/api/admin/players`. */
export function erasureRouter(db: Db): Router {
  const router = Router();
  router.post('/:id/erase', requireRole('admin'), (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Player id', 'id').toLowerCase();
    const { mode, confirmName } = parseOrThrow(eraseSchema, req.body, 'Erasure');
    const kicksAffected = erasePlayer(db, scopeOf(req).user, id, mode, confirmName);
    res.json({ erased: true, kicksAffected } satisfies Erasure);
  });
  return router;
}
