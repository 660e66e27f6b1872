import jwt from 'jsonwebtoken';
import request from 'supertest';
import { count, eq } from 'drizzle-orm';
import { refreshTokens, users } from '../../api/db/schema';
import { DEMO_PASSWORD } from '../../seed/scenario';
import { createTestApp, signIn, type TestApp } from './fixture';

const HEAD = 'head.coach@kestrel-vale.test';

describe('auth', () => {
  let t: TestApp;
  beforeEach(() => {
    t = createTestApp();
  });
  afterEach(() => t.close());

  it('gives tokens and the user for the right password', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: HEAD, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.accessToken).toMatch(/^[\w-]+\.[\w-]+\.[\w-]+$/);
    expect(res.body.refreshToken.length).toBeGreaterThanOrEqual(40);
    expect(res.body.user).toEqual(jasmine.objectContaining({ email: HEAD, role: 'head_coach' }));
    expect(Object.keys(res.body.user).sort()).toEqual(['clubId', 'displayName', 'email', 'id', 'role']);
    const me = await request(t.app).get('/api/me').set('Authorization', `Bearer ${res.body.accessToken}`);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(HEAD);
    expect(me.body.club.name).toBe('Kestrel Vale Athletic Academy');
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: '  Head.Coach@Kestrel-Vale.TEST ', password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('answers 401 with one clear message for a wrong password or an unknown account', async () => {
    const wrong = await request(t.app).post('/api/auth/login').send({ email: HEAD, password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(wrong.body.error.code).toBe('invalid_credentials');
    expect(wrong.body.error.message).toBe('E-mail or password is wrong');
    const unknown = await request(t.app).post('/api/auth/login').send({ email: 'nobody@kestrel-vale.test', password: 'x' });
    expect(unknown.status).toBe(401);
    expect(unknown.body.error.message).toBe(wrong.body.error.message);
  });

  it('stores passwords as bcrypt hashes, never in clear', () => {
    const row = t.db.select().from(users).where(eq(users.email, HEAD)).get();
    // bcrypt modular crypt format: $2a$/$2b$, cost, 53 characters of salt and hash (Provos & Mazières 1999).
    expect(row?.passwordHash).toMatch(/^\$2[aby]\$\d\d\$[./A-Za-z0-9]{53}$/);
    expect(row?.passwordHash).not.toContain(DEMO_PASSWORD);
  });

  it('rotates the refresh token and stores only its hash', async () => {
    const first = await signIn(t.app, HEAD);
    const res = await request(t.app).post('/api/auth/refresh').send({ refreshToken: first.refreshToken });
    expect(res.status).toBe(200);
    expect(res.body.refreshToken).not.toBe(first.refreshToken);
    expect(res.body.accessToken).toBeTruthy();
    const stored = t.db.select().from(refreshTokens).all();
    expect(stored.some((r) => r.tokenHash === first.refreshToken || r.tokenHash === res.body.refreshToken)).toBeFalse();
    const again = await request(t.app).post('/api/auth/refresh').send({ refreshToken: res.body.refreshToken });
    expect(again.status).toBe(200);
  });

  it('revokes the whole family when a rotated refresh token is reused', async () => {
    const first = await signIn(t.app, HEAD);
    const second = (await request(t.app).post('/api/auth/refresh').send({ refreshToken: first.refreshToken })).body;
    const reuse = await request(t.app).post('/api/auth/refresh').send({ refreshToken: first.refreshToken });
    expect(reuse.status).toBe(401);
    expect(reuse.body.error.code).toBe('invalid_refresh_token');
    // The legitimate newest token of that family is dead too.
    const newest = await request(t.app).post('/api/auth/refresh').send({ refreshToken: second.refreshToken });
    expect(newest.status).toBe(401);
    // Another device's sign-in (another family) is untouched.
    const other = await signIn(t.app, HEAD);
    expect((await request(t.app).post('/api/auth/refresh').send({ refreshToken: other.refreshToken })).status).toBe(200);
  });

  it('ends the sign-in on logout', async () => {
    const s = await signIn(t.app, HEAD);
    expect((await request(t.app).post('/api/auth/logout').send({ refreshToken: s.refreshToken })).status).toBe(204);
    expect((await request(t.app).post('/api/auth/refresh').send({ refreshToken: s.refreshToken })).status).toBe(401);
  });

  it('refuses an expired access token with 401', async () => {
    const s = await signIn(t.app, HEAD);
    const expired = jwt.sign({ sub: s.user.id, role: s.user.role, clubId: s.user.clubId, typ: 'access' }, t.config.jwtSecret, {
      algorithm: 'HS256',
      expiresIn: -10,
      issuer: 'loftline',
    });
    const res = await request(t.app).get('/api/me').set('Authorization', `Bearer ${expired}`);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_token');
  });

  it('issues access tokens that expire after 15 minutes', async () => {
    const s = await signIn(t.app, HEAD);
    const claims = jwt.decode(s.accessToken) as { iat: number; exp: number };
    expect(claims.exp - claims.iat).toBe(15 * 60);
  });

  it('refuses a tampered or foreign-signed token with 401', async () => {
    const s = await signIn(t.app, 'player@kestrel-vale.test');
    const [header, payload, signature] = s.accessToken.split('.');
    const claims = JSON.parse(Buffer.from(payload, 'base64url').toString()) as Record<string, unknown>;
    const forged = Buffer.from(JSON.stringify({ ...claims, role: 'admin' })).toString('base64url');
    expect((await request(t.app).get('/api/squads').set('Authorization', `Bearer ${header}.${forged}.${signature}`)).status).toBe(401);
    const foreign = jwt.sign({ ...claims }, 'some-other-secret-0123456789-0123456789', { algorithm: 'HS256' });
    expect((await request(t.app).get('/api/squads').set('Authorization', `Bearer ${foreign}`)).status).toBe(401);
    const none = `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${payload}.`;
    expect((await request(t.app).get('/api/squads').set('Authorization', `Bearer ${none}`)).status).toBe(401);
    expect((await request(t.app).get('/api/squads')).status).toBe(401);
  });

  it('refuses a disabled account even with a valid token', async () => {
    const s = await signIn(t.app, HEAD);
    t.db.update(users).set({ disabledAt: new Date().toISOString() }).where(eq(users.email, HEAD)).run();
    expect((await request(t.app).get('/api/me').set('Authorization', `Bearer ${s.accessToken}`)).status).toBe(401);
    expect((await request(t.app).post('/api/auth/login').send({ email: HEAD, password: DEMO_PASSWORD })).status).toBe(401);
  });

  it('rate-limits failed sign-ins per account', async () => {
    for (let i = 0; i < t.config.loginFailuresPerAccount; i++) {
      expect((await request(t.app).post('/api/auth/login').send({ email: HEAD, password: 'wrong' })).status).toBe(401);
    }
    const limited = await request(t.app).post('/api/auth/login').send({ email: HEAD, password: DEMO_PASSWORD });
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
    // Another account from the same address is not locked out by this one.
    expect((await request(t.app).post('/api/auth/login').send({ email: 'admin@kestrel-vale.test', password: DEMO_PASSWORD })).status).toBe(
      200,
    );
  });

  it('rate-limits failed sign-ins per IP address', async () => {
    const small = createTestApp({ loginFailuresPerIp: 3, loginFailuresPerAccount: 100 });
    try {
      for (let i = 0; i < 3; i++) {
        await request(small.app)
          .post('/api/auth/login')
          .send({ email: `user${i}@kestrel-vale.test`, password: 'wrong' });
      }
      const limited = await request(small.app).post('/api/auth/login').send({ email: HEAD, password: DEMO_PASSWORD });
      expect(limited.status).toBe(429);
    } finally {
      small.close();
    }
  });

  it('keeps exactly one refresh row per sign-in plus one per rotation', async () => {
    const before = t.db.select({ n: count() }).from(refreshTokens).get()?.n ?? 0;
    const s = await signIn(t.app, HEAD);
    await request(t.app).post('/api/auth/refresh').send({ refreshToken: s.refreshToken });
    expect((t.db.select({ n: count() }).from(refreshTokens).get()?.n ?? 0) - before).toBe(2);
  });
});
