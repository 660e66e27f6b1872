/**
 * Issue 15 (second round), the account side: sign-in timing, sessions that end, tokens out of the log,
 * throttles that cannot lock the owner out, re-invites and tokens without an expiry.
 */
import bcrypt from 'bcryptjs';
import { and, eq, isNull } from 'drizzle-orm';
import jwt from 'jsonwebtoken';
import { Writable } from 'node:stream';
import request from 'supertest';
import { createApp } from '../../api/app';
import { accountTokens, mailOutbox, refreshTokens, users } from '../../api/db/schema';
import { createLogger, redactUrl } from '../../api/logger';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../seed/scenario';
import { createMailTestApp, createTestApp, signIn, type MailTestApp, type TestApp } from './fixture';

/** Waits until `check` holds, giving the event loop a turn between tries (no wall-clock deadline). */
async function until(check: () => boolean, turns = 200): Promise<void> {
  for (let i = 0; i < turns && !check(); i++) await new Promise((resolve) => setImmediate(resolve));
  expect(check()).withContext('condition never held').toBeTrue();
}

describe('sign-in timing and throttles (issue 15: 4, low)', () => {
  let t: TestApp;
  beforeAll(() => {
    // Cost 6 for new hashes: the demo accounts' hashes stay at 4, so a decoy at 4 would not stand out here.
    t = createTestApp({ bcryptCost: 6, loginFailuresPerAccount: 3, loginSlowdownBaseMs: 1, loginSlowdownMaxMs: 4 });
  });
  afterAll(() => t.close());

  it('compares an unknown e-mail against a decoy of the same bcrypt cost as real accounts', async () => {
    const compared: string[] = [];
    const real = bcrypt.compare.bind(bcrypt);
    spyOn(bcrypt, 'compare').and.callFake(((password: string, hash: string) => {
      compared.push(hash);
      return real(password, hash);
    }) as typeof bcrypt.compare);
    const res = await request(t.app).post('/api/auth/login').send({ email: 'nobody@kestrel-vale.test', password: 'whatever-it-is' });
    expect(res.status).toBe(401);
    expect(compared.length).toBe(1);
    expect(bcrypt.getRounds(compared[0]!)).toBe(t.config.bcryptCost);
  });

  it('refuses an address after its failures for one account, but lets the right password in from elsewhere (slowed, not locked)', async () => {
    const email = DEMO_ACCOUNTS.head_coach;
    for (let i = 0; i < 3; i++) {
      const res = await request(t.app)
        .post('/api/auth/login')
        .set('X-Forwarded-For', '203.0.113.7')
        .send({ email, password: 'wrong-guess' });
      expect(res.status).toBe(401);
    }
    const sameAddress = await request(t.app)
      .post('/api/auth/login')
      .set('X-Forwarded-For', '203.0.113.7')
      .send({ email, password: DEMO_PASSWORD });
    expect(sameAddress.status).toBe(429);
    const owner = await request(t.app)
      .post('/api/auth/login')
      .set('X-Forwarded-For', '198.51.100.20')
      .send({ email, password: DEMO_PASSWORD });
    expect(owner.status).toBe(200);
  });
});

describe('reset mail timing and sessions that end (issue 15: 4, 5)', () => {
  let t: MailTestApp;
  beforeAll(async () => {
    t = await createMailTestApp();
  });
  afterAll(async () => {
    await t.mailer.flush();
    t.close();
  });

  const refresh = (token: string) => request(t.app).post('/api/auth/refresh').send({ refreshToken: token });

  it('answers forgot-password before looking the account up, the same for known and unknown e-mails', async () => {
    const before = t.db.select().from(accountTokens).all().length;
    const known = await request(t.app).post('/api/auth/forgot-password').send({ email: DEMO_ACCOUNTS.assistant_coach });
    // The answer went out; the lookup and the token come after it.
    expect(known.status).toBe(202);
    await until(() => t.db.select().from(accountTokens).all().length === before + 1);
    const unknown = await request(t.app).post('/api/auth/forgot-password').send({ email: 'nobody@kestrel-vale.test' });
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    await t.mailer.flush();
  });

  it('gives a known e-mail the same answer even when its reset mail fails, because the answer leaves first', async () => {
    // Whatever happens after the lookup (here the mail queue throws) cannot reach the answer: had the lookup
    // run before responding, this known account would answer 500 and an unknown one 202.
    const queue = spyOn(t.mailer, 'queue').and.throwError(new Error('outbox unavailable'));
    const known = await request(t.app).post('/api/auth/forgot-password').send({ email: DEMO_ACCOUNTS.guardian });
    const unknown = await request(t.app).post('/api/auth/forgot-password').send({ email: 'nobody-else@kestrel-vale.test' });
    expect(known.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    await until(() => queue.calls.count() === 1);
    queue.and.callThrough();
  });

  const tokenIn = (text: string, path: string) => new RegExp(`${path}\\?token=([A-Za-z0-9_-]+)`).exec(text)![1]!;

  it('ends every signed-in device when the password is reset', async () => {
    const phone = await signIn(t.app, DEMO_ACCOUNTS.assistant_coach);
    const laptop = await signIn(t.app, DEMO_ACCOUNTS.assistant_coach);
    await request(t.app).post('/api/auth/forgot-password').send({ email: DEMO_ACCOUNTS.assistant_coach });
    await until(() => t.db.select().from(mailOutbox).where(eq(mailOutbox.kind, 'password_reset')).all().length > 0);
    const mail = t.db.select().from(mailOutbox).where(eq(mailOutbox.kind, 'password_reset')).all().at(-1)!;
    const reset = await request(t.app)
      .post('/api/auth/reset-password')
      .send({ token: tokenIn(mail.textBody, '/reset-password'), password: 'a-brand-new-passphrase' });
    expect(reset.status).toBe(204);
    expect((await refresh(phone.refreshToken)).status).toBe(401);
    expect((await refresh(laptop.refreshToken)).status).toBe(401);
  });

  it('ends every signed-in device of a user an admin disables', async () => {
    const admin = await signIn(t.app, DEMO_ACCOUNTS.admin);
    const coach = await signIn(t.app, DEMO_ACCOUNTS.head_coach);
    const res = await request(t.app).post(`/api/admin/users/${coach.user.id}/disable`).set('Authorization', `Bearer ${admin.accessToken}`);
    expect(res.status).toBe(204);
    const live = t.db
      .select()
      .from(refreshTokens)
      .where(and(eq(refreshTokens.userId, coach.user.id), isNull(refreshTokens.revokedAt)))
      .all();
    expect(live).toEqual([]);
    expect((await refresh(coach.refreshToken)).status).toBe(401);
  });

  it('ends a sign-in 90 days after it began, however often it was rotated', async () => {
    const first = await signIn(t.app, DEMO_ACCOUNTS.player);
    const rotated = (await refresh(first.refreshToken)).body as { refreshToken: string };
    const family = t.db.select().from(refreshTokens).where(eq(refreshTokens.userId, first.user.id)).all();
    expect(family.length).toBe(2);
    const begun = Math.min(...family.map((r) => Date.parse(r.createdAt)));
    for (const token of family) {
      // Every token of the family carries the family's end, 90 days after the sign-in, and never outlives it.
      expect(token.familyExpiresAt).toBe(family[0]!.familyExpiresAt);
      expect(Math.abs(Date.parse(token.familyExpiresAt!) - begun - 90 * 24 * 3600 * 1000)).toBeLessThan(60_000);
      expect(token.expiresAt <= token.familyExpiresAt!).toBeTrue();
    }
    // Push the family's end into the past, as if 90 days had gone by with daily rotations.
    t.db.update(refreshTokens).set({ familyExpiresAt: '2000-01-01T00:00:00.000Z' }).where(eq(refreshTokens.userId, first.user.id)).run();
    const late = await refresh(rotated.refreshToken);
    expect(late.status).toBe(401);
    expect(late.body.error.message).toContain('expired');
  });
});

describe('secrets in the log (issue 15: 6)', () => {
  it('never writes bearer tokens or invite, reset and unsubscribe tokens', async () => {
    const base = createTestApp();
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk: Buffer, _enc, done) {
        lines.push(chunk.toString('utf8'));
        done();
      },
    });
    const app = createApp({ db: base.db, config: base.config, logger: createLogger({ logLevel: 'info' }, sink) });
    try {
      const session = await signIn(app, DEMO_ACCOUNTS.head_coach);
      await request(app).get('/api/me').set('Authorization', `Bearer ${session.accessToken}`);
      const secret = 'AbCdEfGhIjKlMnOpQrStUvWxYz0123456789-_secret';
      await request(app).get(`/api/auth/invite?token=${secret}`);
      await request(app).post(`/api/digests/unsubscribe?token=${secret}&x=1`).send({});
      await request(app).get(`/api/auth/invite?other=1&TOKEN=${secret}`);
      const log = lines.join('');
      expect(lines.length).toBeGreaterThan(3);
      expect(log).not.toContain(session.accessToken);
      expect(log).not.toContain(secret);
      expect(log).toContain('[redacted]');
    } finally {
      base.close();
    }
  });

  it('redacts only the secret query parameters of a URL', () => {
    expect(redactUrl('/api/auth/invite?token=abc&lang=en')).toBe('/api/auth/invite?token=[redacted]&lang=en');
    expect(redactUrl('/reset-password?Token=abc#top')).toBe('/reset-password?Token=[redacted]#top');
    expect(redactUrl('/api/squads?squadId=1')).toBe('/api/squads?squadId=1');
  });
});

describe('invites and tokens (issue 15: low)', () => {
  let t: MailTestApp;
  beforeAll(async () => {
    t = await createMailTestApp();
  });
  afterAll(async () => {
    await t.mailer.flush();
    t.close();
  });

  it('re-invites an account that never set a password, such as a guardian the roster import created', async () => {
    const admin = await signIn(t.app, DEMO_ACCOUNTS.admin);
    const roster = 'squad,name,guardian_emails\nU12 Reinvite,Tam Ashby,tam.parent@example.test\n';
    const imported = await request(t.app)
      .post('/api/imports/roster')
      .set('Authorization', `Bearer ${admin.accessToken}`)
      .attach('file', Buffer.from(roster), { filename: 'roster.csv', contentType: 'text/csv' });
    expect(imported.status).toBe(201);
    const guardian = t.db.select().from(users).where(eq(users.email, 'tam.parent@example.test')).get()!;
    const res = await request(t.app).post(`/api/admin/users/${guardian.id}/invite`).set('Authorization', `Bearer ${admin.accessToken}`);
    expect(res.status).toBe(201);
    const mail = t.db.select().from(mailOutbox).where(eq(mailOutbox.toAddress, 'tam.parent@example.test')).get()!;
    const token = /accept-invite\?token=([A-Za-z0-9_-]+)/.exec(mail.textBody)![1]!;
    const accepted = await request(t.app).post('/api/auth/accept-invite').send({ token, password: 'a-guardian-passphrase' });
    expect(accepted.status).toBe(200);
    // Once a password is set, a re-invite is refused: the owner resets it instead.
    const again = await request(t.app).post(`/api/admin/users/${guardian.id}/invite`).set('Authorization', `Bearer ${admin.accessToken}`);
    expect(again.status).toBe(400);
  });

  it('sends at most three reset mails an hour per account, leaving the last link working', async () => {
    for (let i = 0; i < 5; i++) await request(t.app).post('/api/auth/forgot-password').send({ email: DEMO_ACCOUNTS.head_coach });
    const coach = t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.head_coach)).get()!;
    await until(() => t.db.select().from(accountTokens).where(eq(accountTokens.userId, coach.id)).all().length >= 3);
    // Let the last two requests' deferred work run too.
    for (let i = 0; i < 5; i++) await new Promise((resolve) => setImmediate(resolve));
    const resets = t.db
      .select()
      .from(accountTokens)
      .where(and(eq(accountTokens.userId, coach.id), eq(accountTokens.kind, 'reset')))
      .all();
    expect(resets.length).toBe(3);
    expect(resets.filter((r) => r.usedAt === null).length).toBe(1);
  });

  it('refuses an access token without an expiry', async () => {
    const coach = t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.head_coach)).get()!;
    const forever = jwt.sign({ sub: coach.id, role: coach.role, clubId: coach.clubId, typ: 'access' }, t.config.jwtSecret, {
      algorithm: 'HS256',
      issuer: 'loftline',
    });
    const res = await request(t.app).get('/api/me').set('Authorization', `Bearer ${forever}`);
    expect(res.status).toBe(401);
  });
});
