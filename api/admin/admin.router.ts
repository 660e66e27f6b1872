/** `/api/admin`: users to choose from, invites (and renewed ones), disabling an account, and the mail outbox (admin only). */
import { and, desc, eq } from 'drizzle-orm';
import { Router } from 'express';
import * as z from 'zod';
import { ROLES } from '../../shared/roles';
import { inviteRequestSchema, type OutboxMail } from '../../shared/schemas/mail';
import type { AccountsService } from '../accounts/accounts.service';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { mailOutbox, users } from '../db/schema';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';

export const usersQuerySchema = z.object({ role: z.enum(ROLES, { error: `role must be one of ${ROLES.join(', ')}` }).optional() });

/** Builds the admin router (behind authentication and scope). */
export function adminRouter(db: Db, accounts: AccountsService): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/users', (req, res) => {
    const { role } = parseOrThrow(usersQuerySchema, req.query, 'Query');
    const clubId = scopeOf(req).user.clubId;
    const rows = db
      .select()
      .from(users)
      .where(role ? and(eq(users.clubId, clubId), eq(users.role, role)) : eq(users.clubId, clubId))
      .orderBy(users.displayName)
      .all();
    res.json({
      users: rows.map((u) => ({
        id: u.id,
        email: u.email,
        displayName: u.displayName,
        role: u.role,
        invitedAt: u.invitedAt,
        activated: u.passwordHash !== null,
        disabled: u.disabledAt !== null,
      })),
    });
  });
  router.post('/invites', (req, res) => {
    const body = parseOrThrow(inviteRequestSchema, req.body, 'Invite');
    res.status(201).json(accounts.invite(scopeOf(req).user, body));
  });
  router.post('/users/:id/invite', (req, res) => {
    const id = parseOrThrow(z.uuid({ error: 'id must be a UUID' }), req.params['id'], 'User id', 'id').toLowerCase();
    res.status(201).json(accounts.reinvite(scopeOf(req).user, id));
  });
  router.post('/users/:id/disable', (req, res) => {
    const id = parseOrThrow(z.uuid({ error: 'id must be a UUID' }), req.params['id'], 'User id', 'id').toLowerCase();
    accounts.disable(scopeOf(req).user, id);
    res.status(204).end();
  });
  router.get('/outbox', (req, res) => {
    const rows = db
      .select()
      .from(mailOutbox)
      .where(eq(mailOutbox.clubId, scopeOf(req).user.clubId))
      .orderBy(desc(mailOutbox.createdAt))
      .limit(500)
      .all();
    const mails: OutboxMail[] = rows.map((r) => ({
      id: r.id,
      kind: r.kind,
      toAddress: r.toAddress,
      subject: r.subject,
      status: r.status,
      attempts: r.attempts,
      lastError: r.lastError,
      createdAt: r.createdAt,
      sentAt: r.sentAt,
    }));
    res.json({ mails });
  });
  return router;
}
