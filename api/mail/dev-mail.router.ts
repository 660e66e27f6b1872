/** `/api/dev/mail`: what the local fake SMTP server captured (admins; only while it runs). */
import { desc, eq } from 'drizzle-orm';
import { Router } from 'express';
import * as z from 'zod';
import type { CapturedMailMessage, CapturedMailSummary } from '../../shared/schemas/mail';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { capturedMail } from '../db/schema';
import { NotFound, parseOrThrow } from '../errors';

/** Builds the router; mounted only when the fake SMTP server is the mail transport. */
export function devMailRouter(db: Db): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', (_req, res) => {
    const rows = db.select().from(capturedMail).orderBy(desc(capturedMail.receivedAt)).limit(500).all();
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
    const r = db.select().from(capturedMail).where(eq(capturedMail.id, id)).get();
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
