/**
 * A real SMTP server on a loopback port that accepts every message and keeps it, for
 * development and tests (DESIGN §8). Nothing leaves the machine; admins can read captures.
 */
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/** One message the fake server received. */
export interface CapturedMail {
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}

/** A running fake SMTP server. */
export interface FakeSmtp {
  port: number;
  messages: CapturedMail[];
  close(): Promise<void>;
}

/** Starts the fake SMTP server on 127.0.0.1 (`port` 0 picks a free one). Keeps the last 500 messages. */
export function startFakeSmtp(port: number): Promise<FakeSmtp> {
  const messages: CapturedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          messages.push({
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            receivedAt: new Date().toISOString(),
          });
          if (messages.length > 500) messages.shift();
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
        messages,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
