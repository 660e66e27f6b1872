/**
 * Outgoing mail through nodemailer over SMTP. Every message is first written to `mail_outbox`
 * with an idempotency key (a job that runs twice, or two racing processes, queue it once),
 * then sent; failures are retried with exponential backoff and stay visible in the outbox.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, eq, isNull, lte, or } from 'drizzle-orm';
import nodemailer, { type Transporter } from 'nodemailer';
import type { Db } from '../db/client';
import { mailOutbox } from '../db/schema';

/** One inline attachment (e.g. a digest chart referenced as `cid:`). */
export interface InlineAttachment {
  filename: string;
  cid: string;
  contentType: string;
  contentBase64: string;
}

/** A message to queue. */
export interface OutgoingMail {
  clubId: string | null;
  kind: 'invite' | 'password_reset' | 'family_digest' | 'squad_week';
  dedupeKey: string;
  to: string;
  subject: string;
  text: string;
  html?: string;
  headers?: Record<string, string>;
  attachments?: InlineAttachment[];
}

/** Attempts before a message is marked failed (it stays visible with its last error). */
export const MAX_MAIL_ATTEMPTS = 6;
/** How long a flushing process holds a claimed message before another may try it, ms. */
const MAIL_LEASE_MS = 5 * 60_000;

/** Queues and sends mail. */
export class Mailer {
  private readonly transport: Transporter | null;
  private flushing: Promise<number> | null = null;
  /** Whether `close()` was called: a send still in flight then records nothing (the database may be closed too). */
  private closed = false;

  constructor(
    private readonly db: Db,
    smtpUrl: string | null,
    private readonly from: string,
  ) {
    // Without a URL nothing is sent: mail stays queued (and visible in the outbox) until a server is configured.
    this.transport = smtpUrl ? nodemailer.createTransport(smtpUrl) : null;
  }

  /** Queues a message unless one with the same key exists; returns whether it was new. */
  queue(mail: OutgoingMail): boolean {
    const result = this.db
      .insert(mailOutbox)
      .values({
        id: randomUUID(),
        clubId: mail.clubId,
        kind: mail.kind,
        dedupeKey: mail.dedupeKey,
        toAddress: mail.to,
        subject: mail.subject,
        textBody: mail.text,
        htmlBody: mail.html ?? null,
        headersJson: mail.headers ? JSON.stringify(mail.headers) : null,
        attachmentsJson: mail.attachments ? JSON.stringify(mail.attachments) : null,
      })
      .onConflictDoNothing({ target: mailOutbox.dedupeKey })
      .run();
    return result.changes > 0;
  }

  /** Sends every due queued message (one flush at a time); returns how many were sent. */
  flush(): Promise<number> {
    this.flushing ??= this.sendDue().finally(() => {
      this.flushing = null;
    });
    return this.flushing;
  }

  private async sendDue(): Promise<number> {
    const transport = this.transport;
    if (!transport || this.closed) return 0;
    const now = new Date().toISOString();
    const due = this.db
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.status, 'queued'), or(isNull(mailOutbox.nextAttemptAt), lte(mailOutbox.nextAttemptAt, now))))
      .orderBy(asc(mailOutbox.createdAt))
      .limit(200)
      .all();
    let sent = 0;
    for (const row of due) {
      if (this.closed) break;
      // Claim the row with a lease before sending, so two processes flushing one outbox never both send it;
      // a process that dies mid-send leaves the lease to run out and the message is tried again.
      const claimed = this.db
        .update(mailOutbox)
        .set({ nextAttemptAt: new Date(Date.now() + MAIL_LEASE_MS).toISOString() })
        .where(
          and(
            eq(mailOutbox.id, row.id),
            eq(mailOutbox.status, 'queued'),
            or(isNull(mailOutbox.nextAttemptAt), lte(mailOutbox.nextAttemptAt, now)),
          ),
        )
        .run();
      if (claimed.changes !== 1) continue;
      try {
        const attachments = row.attachmentsJson ? (JSON.parse(row.attachmentsJson) as InlineAttachment[]) : [];
        await transport.sendMail({
          from: this.from,
          to: row.toAddress,
          subject: row.subject,
          text: row.textBody,
          html: row.htmlBody ?? undefined,
          headers: row.headersJson ? (JSON.parse(row.headersJson) as Record<string, string>) : undefined,
          attachments: attachments.map((a) => ({
            filename: a.filename,
            cid: a.cid,
            contentType: a.contentType,
            content: Buffer.from(a.contentBase64, 'base64'),
          })),
        });
        // Closed while sending (shutting down): the lease runs out and the next start records or resends it.
        if (this.closed) break;
        this.db
          .update(mailOutbox)
          .set({ status: 'sent', sentAt: new Date().toISOString(), attempts: row.attempts + 1, lastError: null })
          .where(eq(mailOutbox.id, row.id))
          .run();
        sent++;
      } catch (err) {
        // A send cut short by `close()` is not a failed attempt; the lease runs out and it is tried again.
        if (this.closed) break;
        const attempts = row.attempts + 1;
        // Exponential backoff: 1, 2, 4, 8, 16 minutes, then give up (still listed, with the error).
        const next = new Date(Date.now() + 60_000 * 2 ** (attempts - 1)).toISOString();
        this.db
          .update(mailOutbox)
          .set({
            attempts,
            lastError: err instanceof Error ? err.message : String(err),
            status: attempts >= MAX_MAIL_ATTEMPTS ? 'failed' : 'queued',
            nextAttemptAt: next,
          })
          .where(eq(mailOutbox.id, row.id))
          .run();
      }
    }
    return sent;
  }

  /** Closes the SMTP connection pool. */
  close(): void {
    this.closed = true;
    this.transport?.close();
  }
}
