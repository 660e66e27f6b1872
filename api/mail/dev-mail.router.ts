/**
 * `/api/dev/mail`: what the local fake SMTP server captured (admins; only while it runs, never in
 * production), scoped to messages addressed to the admin's own club (`dev-mail.service.ts`).
 */
import { idSchema } from '../id-param';
import { Router } from 'express';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { capturedMailOf, capturedMessage } from './dev-mail.service';

/** Builds the router; mounted only when the fake SMTP server is the mail transport. */
export function devMailRouter(db: Db): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', (req, res) => {
    res.json({ messages: capturedMailOf(db, scopeOf(req).user.clubId) });
  });
  router.get('/:id', (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Mail id');
    res.json({ message: capturedMessage(db, scopeOf(req).user.clubId, id) });
  });
  return router;
}
