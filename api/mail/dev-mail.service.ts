/**
 * What the local fake SMTP server captured, as an admin of one club may see it: only messages
 * addressed to an account of their own club (captured mail holds reset and invite links).
 */
import { and, desc, eq, sql, type SQL } from 'drizzle-orm';
import type { CapturedMailMessage, CapturedMailSummary } from '../../shared/schemas/mail';
import type { Db } from '../db/client';
import { capturedMail, users } from '../db/schema';
import { NotFound } from '../errors';

/** Whether any recipient of the captured message is an account of `clubId` (e-mails compared without case). */
function addressedToClub(clubId: string): SQL {
  return sql`exists (select 1 from json_each(${capturedMail.toJson}) as rcpt join ${users} on lower(${users.email}) = lower(rcpt.value) where ${users.clubId} = ${clubId})`;
}

type CapturedRow = typeof capturedMail.$inferSelect;

function summaryOf(r: CapturedRow): CapturedMailSummary {
  return { id: r.id, from: r.fromAddress, to: JSON.parse(r.toJson) as string[], subject: r.subject, receivedAt: r.receivedAt };
}

/** The latest 500 messages addressed to `clubId`'s accounts, newest first. */
export function capturedMailOf(db: Db, clubId: string): CapturedMailSummary[] {
  return db
    .select()
    .from(capturedMail)
    .where(addressedToClub(clubId))
    .orderBy(desc(capturedMail.receivedAt))
    .limit(500)
    .all()
    .map(summaryOf);
}

/** One captured message; another club's message is as absent as one that never existed. */
export function capturedMessage(db: Db, clubId: string, id: string): CapturedMailMessage {
  const r = db
    .select()
    .from(capturedMail)
    .where(and(eq(capturedMail.id, id), addressedToClub(clubId)))
    .get();
  if (!r) throw new NotFound('No such captured message');
  return {
    ...summaryOf(r),
    text: r.textBody,
    html: r.htmlBody,
    headers: JSON.parse(r.headersJson) as Record<string, string>,
  };
}
