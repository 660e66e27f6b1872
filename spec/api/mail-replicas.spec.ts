import { Mailer } from '../../api/mail/mailer';
import { capturedMail, mailOutbox } from '../../api/db/schema';
import { createMailTestApp, type MailTestApp } from './fixture';

describe('mail outbox flushed by two processes at once', () => {
  let t: MailTestApp;
  beforeAll(async () => {
    t = await createMailTestApp();
  });
  afterAll(() => t.close());

  it('sends each queued message exactly once when two mailers flush the same outbox', async () => {
    // Two API replicas share one database and flush on their own schedules (README, "Scaling beyond one club").
    const other = new Mailer(t.db, t.smtp.url, t.config.mailFrom);
    try {
      const before = t.db.select().from(capturedMail).all().length;
      for (let i = 0; i < 12; i++) {
        t.mailer.queue({
          clubId: null,
          kind: 'invite',
          dedupeKey: `replica-spec-${i}`,
          to: `person${i}@example.test`,
          subject: `Invitation ${i}`,
          text: 'Hello',
        });
      }
      const [a, b] = await Promise.all([t.mailer.flush(), other.flush()]);
      expect(a + b).toBe(12);
      // The fake SMTP server stores what it received: one copy of each message.
      await new Promise((done) => setTimeout(done, 300));
      const received = t.db.select().from(capturedMail).all().slice(before);
      expect(received.length).toBe(12);
      expect(new Set(received.map((m) => m.subject)).size).toBe(12);
      expect(
        t.db
          .select()
          .from(mailOutbox)
          .all()
          .filter((m) => m.dedupeKey.startsWith('replica-spec-') && m.status !== 'sent'),
      ).toEqual([]);
    } finally {
      other.close();
    }
  });
});
