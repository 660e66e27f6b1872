/**
 * Captured mail holds password-reset and invite links: an admin reads only their own club's, and a
 * production server never captures mail at all.
 */
import bcrypt from 'bcryptjs';
import { eq } from 'drizzle-orm';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pino } from 'pino';
import request from 'supertest';
import { createApp } from '../../api/app';
import { loadConfig } from '../../api/config';
import { capturedMail, mailOutbox, users } from '../../api/db/schema';
import { startServer } from '../../api/server';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../seed/scenario';
import { createMailTestApp, createTestApp, OTHER_CLUB, signIn, type MailTestApp } from './fixture';

const OTHER_ADMIN = { id: '00000000-0000-4000-8000-0000000000c7', email: 'admin@harrow-fen.test' };

describe('the captured-mail viewer across clubs', () => {
  let t: MailTestApp;
  let demoAdmin: string;
  let otherAdmin: string;
  const captured = () => t.db.select().from(capturedMail).all();
  const to = (id: string) => (JSON.parse(t.db.select().from(capturedMail).where(eq(capturedMail.id, id)).get()!.toJson) as string[])[0];

  beforeAll(async () => {
    t = await createMailTestApp();
    t.db
      .insert(users)
      .values({
        id: OTHER_ADMIN.id,
        clubId: OTHER_CLUB.clubId,
        email: OTHER_ADMIN.email,
        displayName: 'Other Admin',
        role: 'admin',
        passwordHash: bcrypt.hashSync(DEMO_PASSWORD, 4),
      })
      .run();
    demoAdmin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
    otherAdmin = (await signIn(t.app, OTHER_ADMIN.email)).accessToken;
    for (const email of [DEMO_ACCOUNTS.player, OTHER_CLUB.coachEmail]) {
      expect((await request(t.app).post('/api/auth/forgot-password').send({ email })).status).toBe(202);
    }
    // A flush already under way may have started before the second message was queued: flush until both arrived.
    for (let i = 0; i < 10 && captured().length < 2; i++) await t.mailer.flush();
  }, 30_000);
  afterAll(() => t.close());

  it('shows each admin only the mail addressed to accounts of their own club', async () => {
    expect(captured().length).toBe(2);
    const demoList = await request(t.app).get('/api/dev/mail').set('Authorization', `Bearer ${demoAdmin}`);
    const otherList = await request(t.app).get('/api/dev/mail').set('Authorization', `Bearer ${otherAdmin}`);
    expect(demoList.status).toBe(200);
    expect(otherList.status).toBe(200);
    expect((demoList.body.messages as { to: string[] }[]).map((m) => m.to)).toEqual([[DEMO_ACCOUNTS.player]]);
    expect((otherList.body.messages as { to: string[] }[]).map((m) => m.to)).toEqual([[OTHER_CLUB.coachEmail]]);
  });

  it('answers 404 when an admin opens another club’s message by id', async () => {
    const demoMessage = captured().find((m) => to(m.id) === DEMO_ACCOUNTS.player)!;
    const res = await request(t.app).get(`/api/dev/mail/${demoMessage.id}`).set('Authorization', `Bearer ${otherAdmin}`);
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain('token=');
    const own = await request(t.app).get(`/api/dev/mail/${demoMessage.id}`).set('Authorization', `Bearer ${demoAdmin}`);
    expect(own.status).toBe(200);
    expect(own.body.message.text).toContain('reset-password?token=');
  });
});

describe('mail in production without SMTP_URL', () => {
  it('has no captured-mail viewer even when asked for one', async () => {
    const t = createTestApp();
    try {
      const app = createApp({ db: t.db, config: { ...t.config, env: 'production' }, logger: pino({ level: 'silent' }), devMail: true });
      const admin = (await signIn(app, DEMO_ACCOUNTS.admin)).accessToken;
      expect((await request(app).get('/api/dev/mail').set('Authorization', `Bearer ${admin}`)).status).toBe(404);
    } finally {
      t.close();
    }
  });

  it('starts no fake SMTP server, says so loudly at start, and keeps mail waiting in the outbox', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'loftline-prod-mail-'));
    const errors: string[] = [];
    spyOn(console, 'error').and.callFake((...args: unknown[]) => void errors.push(args.map(String).join(' ')));
    const config = loadConfig(
      {
        NODE_ENV: 'production',
        PORT: '0',
        LOFTLINE_HOST: '127.0.0.1',
        LOFTLINE_DB: join(dir, 'prod.db'),
        LOFTLINE_JWT_SECRET: 'prod-secret-0123456789-0123456789-abcdef',
        LOFTLINE_LOG_LEVEL: 'silent',
      },
      { clientDir: join(dir, 'no-client') },
    );
    const server = await startServer(config);
    try {
      expect(server.smtp).toBeNull();
      expect(errors.join('\n')).toContain('NO SMTP_URL IN PRODUCTION');
      const base = `http://127.0.0.1:${server.port}`;
      expect((await fetch(`${base}/api/dev/mail`)).status).toBe(401);
      // The administrator's password-reset mail waits in the outbox, unsent.
      const { createClub } = await import('../../api/club/club-setup');
      const club = createClub(server.db, config.publicUrl, { name: 'Prod Town FC', adminEmail: 'admin@prod-town.test' });
      server.db
        .update(users)
        .set({ passwordHash: bcrypt.hashSync(DEMO_PASSWORD, 4) })
        .where(eq(users.id, club.adminUserId))
        .run();
      const reset = await fetch(`${base}/api/auth/forgot-password`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: 'admin@prod-town.test' }),
      });
      expect(reset.status).toBe(202);
      const outbox = server.db.select().from(mailOutbox).all();
      expect(outbox.map((m) => [m.toAddress, m.status])).toEqual([['admin@prod-town.test', 'queued']]);
      expect(server.db.select().from(capturedMail).all()).toEqual([]);
    } finally {
      await server.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
