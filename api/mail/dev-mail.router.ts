/**
 * `/api/dev/mail`: what the local fake SMTP server captured (admins; only while it runs, never in
 * production). Captured mail holds reset and invite links, so an admin sees only messages addressed to
 * an account of their own club.
 */
import { and, desc, eq, sql, type SQL } from 'drizzle-orm';
import { Router } from 'express';
import * as z from 'zod';
import type { CapturedMailMessage, CapturedMailSummary } from '../../shared/schemas/mail';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { capturedMail, users } from '../db/schema';
import { NotFound, parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';

/** Whether any recipient of the captured message is an account of `clubId` (e-mails compared without case). */
function addressedToClub(clubId: string): SQL {
  return sql`exists (select 1 from json_each(${capturedMail.toJson}) as rcpt join ${users} on lower(${users.email}) = lower(rcpt.value) where ${users.clubId} = ${clubId})`;
}

/** Builds the router; mounted only when the fake SMTP server is the mail transport. */
export function devMailRouter(db: Db): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', (req, res) => {
    const clubId = scopeOf(req).user.clubId;
    const rows = db.select().from(capturedMail).where(addressedToClub(clubId)).orderBy(desc(capturedMail.receivedAt)).limit(500).all();
    const messages: CapturedMailSummary[] = rows.map((r) => ({
      id: r.id,
      from: r.fromAddress,
      to: JSON.parse(r.toJson) as string[],
      subject: r.subject,
      receivedAt: r.receivedAt,
    }));
    res.json({ messages });
  });
  router.get('/:id', (req, res) => {
    const id = parseOrThrow(z.uuid({ error: 'id must be a UUID' }), req.params['id'], 'Mail id');
    const clubId = scopeOf(req).user.clubId;
    const r = db
      .select()
      .from(capturedMail)
      .where(and(eq(capturedMail.id, id), addressedToClub(clubId)))
      .get();
    // Another club's message is as absent as one that never existed.
    if (!r) throw new NotFound('No such captured message');
    const message: CapturedMailMessage = {
      id: r.id,
      from: r.fromAddress,
      to: JSON.parse(r.toJson) as string[],
      subject: r.subject,
      receivedAt: r.receivedAt,
      text: r.textBody,
      html: r.htmlBody,
      headers: JSON.parse(r.headersJson) as Record<string, string>,
    };
    res.json({ message });
  });
  return router;
}
