/** `/api/admin`: users to choose from, invites (and renewed ones), disabling an account, and the mail outbox (admin only). */
import { idSchema } from '../id-param';
import { Router } from 'express';
import { inviteRequestSchema } from '../../shared/schemas/mail';
import type { AccountsService } from '../accounts/accounts.service';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { usersQuerySchema } from './admin.schemas';
import { clubOutbox, clubUsers } from './admin.service';

/** Builds the admin router (behind authentication and scope). */
export function adminRouter(db: Db, accounts: AccountsService): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/users', (req, res) => {
    const { role } = parseOrThrow(usersQuerySchema, req.query, 'Query');
    res.json({ users: clubUsers(db, scopeOf(req).user.clubId, role) });
  });
  router.post('/invites', (req, res) => {
    const body = parseOrThrow(inviteRequestSchema, req.body, 'Invite');
    res.status(201).json(accounts.invite(scopeOf(req).user, body));
  });
  router.post('/users/:id/invite', (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'User id', 'id').toLowerCase();
    res.status(201).json(accounts.reinvite(scopeOf(req).user, id));
  });
  router.post('/users/:id/disable', (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'User id', 'id').toLowerCase();
    accounts.disable(scopeOf(req).user, id);
    res.status(204).end();
  });
  router.get('/outbox', (req, res) => {
    res.json({ mails: clubOutbox(db, scopeOf(req).user.clubId) });
  });
  return router;
}
