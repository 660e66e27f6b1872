import { and, eq, isNotNull, isNull } from 'drizzle-orm';
import request from 'supertest';
import { accountTokens, auditLog, capturedMail, guardianLinks, mailOutbox, players, users } from '../../api/db/schema';
import { firstNameOf } from '../../api/guardians/guardians.service';
import { CONSENT_TEXT } from '../../api/guardians/consent-text';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, demoPeriod } from '../../seed/scenario';
import { QuantityFormat } from '../../shared/quantity-format';
import { DEFAULT_DISPLAY } from '../../shared/schemas/club';
import { createMailTestApp, FIXTURE_NOW, signIn, type MailTestApp } from './fixture';

const LAST_WEEK = demoPeriod(FIXTURE_NOW).weekStarts.at(-1)!.toISOString().slice(0, 10);
/** How the demo club (metres, en-GB) writes a week's Monday in mail, e.g. "23 Nov 2026". */
const weekWords = (isoDate: string): string => new QuantityFormat(DEFAULT_DISPLAY).day(isoDate, true);

function adultOn(birthDate: string | null, day: string): boolean {
  if (!birthDate) return true;
  const b = new Date(birthDate + 'T00:00:00Z');
  return new Date(Date.UTC(b.getUTCFullYear() + 18, b.getUTCMonth(), b.getUTCDate())).toISOString().slice(0, 10) <= day;
}

describe('Family digest over SMTP', () => {
  let t: MailTestApp;
  let admin: string;
  const captured = () => t.db.select().from(capturedMail).all();
  const digestsCaptured = () =>
    captured().filter(
      (m) =>
        (JSON.parse(m.headersJson) as Record<string, string>)['list-unsubscribe-post'] &&
        m.textBody.includes(`week of ${weekWords(LAST_WEEK)}`),
    );
  let firstRun: request.Response;
  let eligible: { guardianEmail: string }[];
  let totalLinks: number;
  const clubId = () => t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.admin)).get()!.clubId;

  beforeAll(async () => {
    t = await createMailTestApp();
    admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
    const all = t.db
      .select({ link: guardianLinks, player: players, guardian: users })
      .from(guardianLinks)
      .innerJoin(players, eq(players.id, guardianLinks.playerId))
      .innerJoin(users, eq(users.id, guardianLinks.guardianUserId))
      .all();
    totalLinks = all.length;
    eligible = all
      .filter(
        (r) =>
          r.link.consentAt &&
          !r.link.consentWithdrawnAt &&
          r.link.digestOptIn &&
          !adultOn(r.player.birthDate, LAST_WEEK) &&
          !r.guardian.disabledAt,
      )
      .map((r) => ({ guardianEmail: r.guardian.email }));
    firstRun = await request(t.app).post('/api/digests/run').set('Authorization', `Bearer ${admin}`).send({ weekStart: LAST_WEEK });
  }, 30_000);
  afterAll(() => t.close());

  it('sends one digest per consenting, opted-in guardian of a minor and none to the others', async () => {
    const res = firstRun;
    expect(res.status).toBe(200);
    expect(eligible.length).toBeGreaterThan(5);
    expect(eligible.length).toBeLessThan(totalLinks);
    expect(res.body.familySent).toBe(eligible.length);
    const mails = digestsCaptured();
    expect(mails.length).toBe(eligible.length);
    const recipients = mails.flatMap((m) => JSON.parse(m.toJson) as string[]).sort();
    expect(recipients).toEqual(eligible.map((e) => e.guardianEmail).sort());
    // The demo guardian receives a digest for the demo child.
    expect(recipients).toContain(DEMO_ACCOUNTS.guardian);
  });

  it('names only that child, by first name, with an inline chart', () => {
    const everyone = t.db.select().from(players).all();
    for (const m of digestsCaptured()) {
      const to = (JSON.parse(m.toJson) as string[])[0]!;
      const guardian = t.db.select().from(users).where(eq(users.email, to)).get()!;
      const mine = t.db
        .select({ p: players })
        .from(guardianLinks)
        .innerJoin(players, eq(players.id, guardianLinks.playerId))
        .where(eq(guardianLinks.guardianUserId, guardian.id))
        .all()
        .map((r) => r.p);
      const child = mine.find((p) => m.subject.startsWith(firstNameOf(p.displayName)))!;
      expect(child).withContext(m.subject).toBeDefined();
      expect(m.textBody).toContain(firstNameOf(child.displayName));
      // Beyond the greeting (which names the guardian), the child appears by first name only.
      const surname = child.displayName.split(' ').slice(1).join(' ');
      const afterGreeting = m.textBody.slice(m.textBody.indexOf('\n'));
      expect(afterGreeting).not.toContain(surname);
      for (const other of everyone.filter((p) => p.id !== child.id && firstNameOf(p.displayName) !== firstNameOf(child.displayName))) {
        expect(afterGreeting)
          .withContext(`${m.subject} mentions ${other.displayName}`)
          .not.toMatch(new RegExp(`\\b${firstNameOf(other.displayName)}\\b`));
      }
      expect(m.htmlBody).toContain('src="cid:');
      expect(m.attachmentCount).toBe(1);
    }
  });

  it('carries the one-click unsubscribe headers of RFC 8058 and a visible link', () => {
    for (const m of digestsCaptured()) {
      const headers = JSON.parse(m.headersJson) as Record<string, string>;
      // RFC 8058 §3.1: List-Unsubscribe holds a URI in angle brackets; List-Unsubscribe-Post is exactly "List-Unsubscribe=One-Click".
      expect(headers['list-unsubscribe']).toMatch(/^<https?:\/\/[^>]+\/api\/digests\/unsubscribe\?token=[^>]+>$/);
      expect(headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
      expect(m.textBody).toMatch(/\/unsubscribe\?token=/);
      expect(m.htmlBody).toMatch(/href="[^"]*\/unsubscribe\?token=/);
    }
  });

  it('sends nothing new when the job runs again for the same week', async () => {
    const before = captured().length;
    const again = await t.digests.run({ clubId: clubId(), weekStart: LAST_WEEK });
    expect(again.familySent).toBe(0);
    expect(again.squadWeekSent).toBe(0);
    expect(captured().length).toBe(before);
    const keys = t.db
      .select({ k: mailOutbox.dedupeKey })
      .from(mailOutbox)
      .all()
      .map((r) => r.k);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('unsubscribes with one POST, stays unsubscribed on a repeat, and the next run skips that guardian', async () => {
    const mail = digestsCaptured().find((m) => (JSON.parse(m.toJson) as string[])[0] === DEMO_ACCOUNTS.guardian)!;
    const url = new URL(/^<([^>]+)>$/.exec((JSON.parse(mail.headersJson) as Record<string, string>)['list-unsubscribe']!)![1]!);
    // RFC 8058 §3.2: the client POSTs "List-Unsubscribe=One-Click" to the URI, without credentials.
    const first = await request(t.app)
      .post(url.pathname + url.search)
      .type('form')
      .send('List-Unsubscribe=One-Click');
    expect(first.status).toBe(200);
    expect(first.body.unsubscribed).toBeTrue();
    const second = await request(t.app)
      .post(url.pathname + url.search)
      .type('form')
      .send('List-Unsubscribe=One-Click');
    expect(second.status).toBe(200);
    const forged = await request(t.app).post(url.pathname + url.search.replace(/.$/, (c) => (c === 'A' ? 'B' : 'A')));
    expect(forged.status).toBe(400);
    expect(forged.body.error.code).toBe('unsubscribe_invalid');
    const guardianId = t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.guardian)).get()!.id;
    const nextWeek = new Date(Date.parse(LAST_WEEK) + 7 * 86_400_000).toISOString().slice(0, 10);
    await t.digests.run({ clubId: clubId(), weekStart: nextWeek });
    const toDemo = captured().filter((m) => (JSON.parse(m.toJson) as string[])[0] === DEMO_ACCOUNTS.guardian);
    expect(toDemo.length).toBe(1);
    expect(captured().some((m) => m.textBody.includes(`week of ${weekWords(nextWeek)}`))).toBeTrue();
    expect(
      t.db
        .select()
        .from(auditLog)
        .where(and(eq(auditLog.action, 'digest.unsubscribed'), eq(auditLog.userId, guardianId)))
        .all().length,
    ).toBe(1);
  });

  it('sends the Squad week summary to head coaches once', () => {
    const summaries = captured().filter((m) => m.subject.startsWith(`Squad week ${weekWords(LAST_WEEK)}`));
    expect(summaries.map((m) => (JSON.parse(m.toJson) as string[])[0])).toEqual([DEMO_ACCOUNTS.head_coach]);
    expect(summaries[0]!.textBody).toContain('U14');
  });

  it('lets only admins read captured mail', async () => {
    const list = await request(t.app).get('/api/dev/mail').set('Authorization', `Bearer ${admin}`);
    expect(list.status).toBe(200);
    expect(list.body.messages.length).toBe(captured().length);
    const one = await request(t.app).get(`/api/dev/mail/${list.body.messages[0].id}`).set('Authorization', `Bearer ${admin}`);
    expect(one.body.message.headers['subject']).toBeTruthy();
    const head = (await signIn(t.app, DEMO_ACCOUNTS.head_coach)).accessToken;
    expect((await request(t.app).get('/api/dev/mail').set('Authorization', `Bearer ${head}`)).status).toBe(403);
  });
});

describe('digests about adult players', () => {
  let t: MailTestApp;
  afterAll(() => t.close());

  it('sends none about a player over 18 until the player opts in themselves', async () => {
    t = await createMailTestApp();
    const adult = t.db
      .select({ p: players, u: users })
      .from(players)
      .innerJoin(users, eq(users.id, players.userId))
      .all()
      .find((r) => r.u.email !== DEMO_ACCOUNTS.player && r.u.role === 'player')!;
    expect(adultOn(adult.p.birthDate, LAST_WEEK)).toBeTrue();
    const guardian = t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.guardian)).get()!;
    t.db
      .insert(guardianLinks)
      .values({
        id: '00000000-0000-4000-8000-0000000000e1',
        guardianUserId: guardian.id,
        playerId: adult.p.id,
        consentAt: '2026-11-01T10:00:00.000Z',
        consentRecordedBy: guardian.id,
        consentTextVersion: CONSENT_TEXT.version,
        digestOptIn: true,
      })
      .run();
    const aboutAdult = () =>
      t.db
        .select()
        .from(mailOutbox)
        .all()
        .filter((m) => m.dedupeKey.startsWith('family_digest:00000000-0000-4000-8000-0000000000e1'));
    await t.digests.run({ clubId: guardian.clubId, weekStart: LAST_WEEK });
    expect(aboutAdult().length).toBe(0);
    const player = await signIn(t.app, adult.u.email);
    expect((await request(t.app).get('/api/me/digest-opt-in').set('Authorization', `Bearer ${player.accessToken}`)).body).toEqual({
      optIn: false,
    });
    const bad = await request(t.app)
      .put('/api/me/digest-opt-in')
      .set('Authorization', `Bearer ${player.accessToken}`)
      .send({ optIn: 'yes' });
    expect(bad.status).toBe(400);
    expect(
      (await request(t.app).put('/api/me/digest-opt-in').set('Authorization', `Bearer ${player.accessToken}`).send({ optIn: true })).body,
    ).toEqual({ optIn: true });
    const nextWeek = new Date(Date.parse(LAST_WEEK) + 7 * 86_400_000).toISOString().slice(0, 10);
    await t.digests.run({ clubId: guardian.clubId, weekStart: nextWeek });
    expect(aboutAdult().length).toBe(1);
  }, 60_000);
});

describe('consent and digest opt-in', () => {
  let t: MailTestApp;
  let guardian: string;
  let linkId: string;
  beforeAll(async () => {
    t = await createMailTestApp();
    guardian = (await signIn(t.app, DEMO_ACCOUNTS.guardian)).accessToken;
    const res = await request(t.app).get('/api/guardians/links').set('Authorization', `Bearer ${guardian}`);
    expect(res.body.links.length).toBe(1);
    linkId = res.body.links[0].id;
  });
  afterAll(() => t.close());
  const send = (method: 'post' | 'put', path: string, body: object) =>
    request(t.app)[method](path).set('Authorization', `Bearer ${guardian}`).send(body);

  it('withdraws consent (and with it the opt-in), refuses an opt-in without consent, and records consent with its text version', async () => {
    const withdrawn = await send('post', `/api/guardians/links/${linkId}/consent`, { consent: false });
    expect(withdrawn.status).toBe(200);
    expect(withdrawn.body.link.consentWithdrawnAt).toBeTruthy();
    expect(withdrawn.body.link.digestOptIn).toBeFalse();
    const optIn = await send('put', `/api/guardians/links/${linkId}/digest`, { optIn: true });
    expect(optIn.status).toBe(400);
    expect(optIn.body.error.code).toBe('consent_required');
    const stale = await send('post', `/api/guardians/links/${linkId}/consent`, { consent: true, textVersion: '1999-01-01' });
    expect(stale.status).toBe(400);
    expect(stale.body.error.fields[0].field).toBe('textVersion');
    const given = await send('post', `/api/guardians/links/${linkId}/consent`, { consent: true, textVersion: CONSENT_TEXT.version });
    expect(given.body.link.consentAt).toBeTruthy();
    expect(given.body.link.consentWithdrawnAt).toBeNull();
    expect(given.body.link.consentTextVersion).toBe(CONSENT_TEXT.version);
    expect(given.body.link.consentRecordedByName).toBeTruthy();
    expect((await send('put', `/api/guardians/links/${linkId}/digest`, { optIn: true })).body.link.digestOptIn).toBeTrue();
    const actions = t.db
      .select()
      .from(auditLog)
      .where(eq(auditLog.entityId, linkId))
      .all()
      .map((a) => a.action);
    expect(actions).toEqual(jasmine.arrayContaining(['consent.withdrawn', 'consent.given', 'digest.opted_in']));
  });

  it('refuses consent changes to links that are not the guardian’s own', async () => {
    const other = t.db
      .select()
      .from(guardianLinks)
      .where(isNotNull(guardianLinks.consentAt))
      .all()
      .find((l) => l.id !== linkId)!;
    expect((await send('post', `/api/guardians/links/${other.id}/consent`, { consent: false })).status).toBe(404);
    const admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
    expect(
      (await request(t.app).post(`/api/guardians/links/${linkId}/consent`).set('Authorization', `Bearer ${admin}`).send({ consent: false }))
        .status,
    ).toBe(403);
  });

  it('shows the guardian their child’s summary and nothing of other players', async () => {
    const link = (await request(t.app).get('/api/guardians/links').set('Authorization', `Bearer ${guardian}`)).body.links[0];
    const summary = await request(t.app).get(`/api/guardians/children/${link.playerId}/summary`).set('Authorization', `Bearer ${guardian}`);
    expect(summary.status).toBe(200);
    expect(summary.body.firstName).toBe(link.playerFirstName);
    const someoneElse = t.db
      .select()
      .from(players)
      .all()
      .find((p) => p.id !== link.playerId)!;
    expect(
      (await request(t.app).get(`/api/guardians/children/${someoneElse.id}/summary`).set('Authorization', `Bearer ${guardian}`)).status,
    ).toBe(404);
  });
});

describe('invite and password reset over SMTP', () => {
  let t: MailTestApp;
  let admin: string;
  const lastMailTo = (email: string) =>
    t.db
      .select()
      .from(capturedMail)
      .all()
      .filter((m) => (JSON.parse(m.toJson) as string[]).includes(email))
      .at(-1);
  const tokenIn = (text: string, path: string) => new RegExp(`${path}\\?token=([\\w-]+)`).exec(text)![1]!;

  beforeAll(async () => {
    t = await createMailTestApp();
    admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
  });
  afterAll(() => t.close());

  it('invites a coach, who follows the link, sets a password and is signed in; the link then refuses reuse', async () => {
    const squads = (await request(t.app).get('/api/squads').set('Authorization', `Bearer ${admin}`)).body.squads;
    const res = await request(t.app)
      .post('/api/admin/invites')
      .set('Authorization', `Bearer ${admin}`)
      .send({ email: 'new.coach@kestrel-vale.test', displayName: 'Nova Coach', role: 'assistant_coach', squadIds: [squads[0].id] });
    expect(res.status).toBe(201);
    await t.mailer.flush();
    const mail = lastMailTo('new.coach@kestrel-vale.test')!;
    expect(mail.subject).toContain('invited you');
    const token = tokenIn(mail.textBody, '/accept-invite');
    const who = await request(t.app).get(`/api/auth/invite?token=${token}`);
    expect(who.body).toEqual({ email: 'new.coach@kestrel-vale.test', displayName: 'Nova Coach', role: 'assistant_coach' });
    const short = await request(t.app).post('/api/auth/accept-invite').send({ token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields[0].field).toBe('password');
    const common = await request(t.app).post('/api/auth/accept-invite').send({ token, password: 'Password123' });
    expect(common.status).toBe(400);
    expect(common.body.error.fields[0].message).toContain('common');
    const accepted = await request(t.app).post('/api/auth/accept-invite').send({ token, password: 'a-long-new-password' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user.email).toBe('new.coach@kestrel-vale.test');
    const mine = await request(t.app).get('/api/squads').set('Authorization', `Bearer ${accepted.body.accessToken}`);
    expect(mine.body.squads.map((s: { id: string }) => s.id)).toEqual([squads[0].id]);
    const reuse = await request(t.app).post('/api/auth/accept-invite').send({ token, password: 'another-long-password' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.code).toBe('invite_used');
    expect(
      (await request(t.app).post('/api/auth/login').send({ email: 'new.coach@kestrel-vale.test', password: 'a-long-new-password' })).status,
    ).toBe(200);
  });

  it('refuses an expired invitation with a clear message', async () => {
    await request(t.app)
      .post('/api/admin/invites')
      .set('Authorization', `Bearer ${admin}`)
      .send({ email: 'late@kestrel-vale.test', displayName: 'Late Comer', role: 'assistant_coach' });
    await t.mailer.flush();
    const token = tokenIn(lastMailTo('late@kestrel-vale.test')!.textBody, '/accept-invite');
    t.db.update(accountTokens).set({ expiresAt: '2000-01-01T00:00:00.000Z' }).where(isNull(accountTokens.usedAt)).run();
    const res = await request(t.app).post('/api/auth/accept-invite').send({ token, password: 'a-long-new-password' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invite_expired');
    expect(res.body.error.message).toContain('expired');
  });

  it('resets a password through the mailed link without revealing which e-mails exist', async () => {
    const known = await request(t.app).post('/api/auth/forgot-password').send({ email: DEMO_ACCOUNTS.head_coach });
    const unknown = await request(t.app).post('/api/auth/forgot-password').send({ email: 'nobody@kestrel-vale.test' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    await t.mailer.flush();
    expect(lastMailTo('nobody@kestrel-vale.test')).toBeUndefined();
    const token = tokenIn(lastMailTo(DEMO_ACCOUNTS.head_coach)!.textBody, '/reset-password');
    expect((await request(t.app).post('/api/auth/reset-password').send({ token, password: 'my-brand-new-password' })).status).toBe(204);
    expect((await request(t.app).post('/api/auth/login').send({ email: DEMO_ACCOUNTS.head_coach, password: DEMO_PASSWORD })).status).toBe(
      401,
    );
    expect(
      (await request(t.app).post('/api/auth/login').send({ email: DEMO_ACCOUNTS.head_coach, password: 'my-brand-new-password' })).status,
    ).toBe(200);
    const reuse = await request(t.app).post('/api/auth/reset-password').send({ token, password: 'yet-another-password' });
    expect(reuse.body.error.code).toBe('reset_used');
  });

  it('refuses an expired reset link', async () => {
    await request(t.app).post('/api/auth/forgot-password').send({ email: DEMO_ACCOUNTS.assistant_coach });
    await t.mailer.flush();
    const token = tokenIn(lastMailTo(DEMO_ACCOUNTS.assistant_coach)!.textBody, '/reset-password');
    t.db.update(accountTokens).set({ expiresAt: '2000-01-01T00:00:00.000Z' }).where(eq(accountTokens.kind, 'reset')).run();
    const res = await request(t.app).post('/api/auth/reset-password').send({ token, password: 'my-brand-new-password' });
    expect(res.body.error.code).toBe('reset_expired');
  });
});
