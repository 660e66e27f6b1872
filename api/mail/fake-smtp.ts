/**
 * A real SMTP server on a loopback port that accepts every message and stores it (headers,
 * text, HTML) in `captured_mail`, for development, tests and the demo (docs/design.md §8). Nothing
 * leaves the machine; admins read the captures at /admin/mail.
 */
import { randomUUID } from 'node:crypto';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/client';
import { capturedMail } from '../db/schema';

/** A running fake SMTP server. */
export interface FakeSmtp {
  port: number;
  /** `smtp://127.0.0.1:<port>` for nodemailer. */
  url: string;
  close(): Promise<void>;
}

/** Starts the fake SMTP server on 127.0.0.1 (`port` 0 picks a free one), storing into `db`. */
export function startFakeSmtp(db: Db, port: number): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream, { keepCidLinks: true })
        .then((parsed) => {
          const headers: Record<string, string> = {};
          for (const line of parsed.headerLines) {
            const name = line.key.toLowerCase();
            const value = line.line.slice(line.line.indexOf(':') + 1).trim();
            headers[name] = headers[name] ? `${headers[name]}, ${value}` : value;
          }
          db.insert(capturedMail)
            .values({
              id: randomUUID(),
              fromAddress: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              toJson: JSON.stringify(session.envelope.rcptTo.map((r) => r.address)),
              subject: parsed.subject ?? '',
              textBody: parsed.text ?? '',
              htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
              headersJson: JSON.stringify(headers),
              attachmentCount: parsed.attachments.length,
            })
            .run();
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  return new Promise((resolvePromise, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      const address = server.server.address();
      const actual = typeof address === 'object' && address ? address.port : port;
      resolvePromise({
        port: actual,
        url: `smtp://127.0.0.1:${actual}`,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
