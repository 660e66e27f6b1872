import { and, eq, isNull, ne } from 'drizzle-orm';
import request from 'supertest';
import { drills, guardianLinks, players, trainingSessions, users } from '../../api/db/schema';
import { CONSENT_TEXT } from '../../api/guardians/consent-text';
import type { Role } from '../../shared/roles';
import type { PushResponse } from '../../shared/schemas/sync';
import { DEMO_ACCOUNTS, DEMO_GROUND_ID, DEMO_SQUAD_IDS } from '../../seed/scenario';
import { buildHttpCorpus, buildMutationCorpus, type CorpusContext, type HttpCase } from './bad-input-corpus';
import { databaseDigest, totalChanges } from './db-state';
import { createTestApp, OTHER_CLUB, signIn, type TestApp } from './fixture';
import { enumerateWriteRoutes } from './routes';

interface ErrorBody {
  error?: { code?: unknown; message?: unknown; fields?: { field: string; message: string }[] };
}

/** Fewest generated cases a write route must have, so a new route cannot slip through with a token entry. */
const MIN_CASES_PER_ROUTE = 8;

describe('bad-input corpus', () => {
  let t: TestApp;
  const tokens = new Map<Role, string>();
  let ctx: CorpusContext;

  beforeAll(async () => {
    t = createTestApp({ loginFailuresPerIp: 1e6, loginFailuresPerAccount: 1e6 });
    for (const role of Object.keys(DEMO_ACCOUNTS) as Role[]) tokens.set(role, (await signIn(t.app, DEMO_ACCOUNTS[role])).accessToken);
    const refresh = (await signIn(t.app, DEMO_ACCOUNTS.head_coach)).refreshToken;
    const guardian = t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.guardian)).get()!;
    const link = t.db.select().from(guardianLinks).where(eq(guardianLinks.guardianUserId, guardian.id)).get()!;
    const u16Player = t.db
      .select()
      .from(players)
      .where(and(eq(players.squadId, DEMO_SQUAD_IDS.u16), isNull(players.deletedAt)))
      .all()
      .find((p) => p.shirtNumber !== null)!;
    const unlinked = t.db
      .select()
      .from(players)
      .where(and(eq(players.squadId, DEMO_SQUAD_IDS.u16), ne(players.id, link.playerId)))
      .get()!;
    const erase = t.db
      .select()
      .from(players)
      .where(and(eq(players.squadId, DEMO_SQUAD_IDS.u14), ne(players.id, link.playerId)))
      .get()!;
    const u16Session = t.db.select().from(trainingSessions).where(eq(trainingSessions.squadId, DEMO_SQUAD_IDS.u16)).get()!;
    const u16Drill = t.db.select().from(drills).where(eq(drills.sessionId, u16Session.id)).get()!;
    const firstTeamSession = t.db.select().from(trainingSessions).where(eq(trainingSessions.squadId, DEMO_SQUAD_IDS.first)).get()!;
    ctx = {
      refreshToken: refresh,
      consentVersion: CONSENT_TEXT.version,
      linkId: link.id,
      guardianUserId: guardian.id,
      unlinkedPlayerId: unlinked.id,
      erasePlayer: { id: erase.id, name: erase.displayName },
      u16SquadId: DEMO_SQUAD_IDS.u16,
      u16SessionId: u16Session.id,
      u16DrillId: u16Drill.id,
      u16PlayerId: u16Player.id,
      u16Shirt: u16Player.shirtNumber!,
      unstaffedSessionId: firstTeamSession.id,
      otherClubSquadId: OTHER_CLUB.squadId,
      otherClubPlayerId: OTHER_CLUB.playerId,
      groundId: DEMO_GROUND_ID,
    };
  }, 60_000);
  afterAll(() => t.close());

  function send(c: HttpCase): request.Test {
    const [method] = c.route.split(' ') as [string];
    const verb = method.toLowerCase() as 'post' | 'put' | 'delete';
    let req = request(t.app)[verb](c.url);
    if (c.as) req = req.set('Authorization', `Bearer ${tokens.get(c.as)!}`);
    if (c.multipart) {
      const { file, fields } = c.multipart;
      for (const [name, value] of Object.entries(fields ?? {})) req = req.field(name, value);
      if (file) req = req.attach(file.field ?? 'file', file.buffer, { filename: file.name, contentType: file.type });
      if (file && c.multipart.twice)
        req = req.attach(file.field ?? 'file', file.buffer, { filename: `again-${file.name}`, contentType: file.type });
      return req;
    }
    if (!c.payload) return req;
    if ('raw' in c.payload) return req.set('Content-Type', c.payload.contentType ?? 'application/json').send(c.payload.raw);
    return req.send(c.payload.json as object);
  }

  it('covers every write route the app serves', () => {
    const corpus = buildHttpCorpus(ctx);
    const perRoute = new Map<string, number>();
    for (const c of corpus) perRoute.set(c.route, (perRoute.get(c.route) ?? 0) + 1);
    const routes = enumerateWriteRoutes(t.app);
    expect(routes.length).toBeGreaterThan(15);
    const thin = routes.filter((r) => (perRoute.get(r) ?? 0) < MIN_CASES_PER_ROUTE);
    expect(thin).withContext(`write routes with fewer than ${MIN_CASES_PER_ROUTE} malformed requests in the corpus`).toEqual([]);
    const stale = [...perRoute.keys()].filter((r) => !routes.includes(r));
    expect(stale).withContext('corpus entries for routes that no longer exist').toEqual([]);
  });

  it('answers every malformed request 4xx with a clear error, writes nothing and stays healthy', async () => {
    const corpus = buildHttpCorpus(ctx);
    const before = databaseDigest(t.db.$client);
    const failures: string[] = [];
    for (const c of corpus) {
      const written = totalChanges(t.db.$client);
      const res = await send(c);
      const body = res.body as ErrorBody;
      const what = `${c.route} — ${c.label} → ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`;
      if (res.status < 400 || res.status > 499) failures.push(`not 4xx: ${what}`);
      else if (!c.loose && res.status !== (c.status ?? 400)) failures.push(`not ${c.status ?? 400}: ${what}`);
      else if (typeof body.error?.code !== 'string' || typeof body.error.message !== 'string' || !body.error.message)
        failures.push(`no error code and message: ${what}`);
      else if (c.field && !body.error.fields?.some((f) => f.field === c.field || f.field.startsWith(`${c.field}.`)))
        failures.push(`field ${c.field} not named: ${what}`);
      if (totalChanges(t.db.$client) !== written) failures.push(`wrote to the database: ${what}`);
    }
    console.log(`bad-input corpus: ${corpus.length} malformed requests over ${new Set(corpus.map((c) => c.route)).size} write routes`);
    expect(failures).toEqual([]);
    expect(corpus.length).toBeGreaterThanOrEqual(300);
    // Row counts and a SHA-256 of every row of every table, before and after.
    expect(databaseDigest(t.db.$client)).toEqual(before);
    const health = await request(t.app).get('/api/health');
    expect(health.status).toBe(200);
    expect(health.body).toEqual({ ok: true });
  }, 60_000);

  it('rejects every malformed mutation inside a valid push, per mutation, and writes nothing', async () => {
    const corpus = buildMutationCorpus(ctx);
    const before = databaseDigest(t.db.$client);
    const failures: string[] = [];
    for (const c of corpus) {
      const written = totalChanges(t.db.$client);
      const res = await request(t.app)
        .post('/api/sync/push')
        .set('Authorization', `Bearer ${tokens.get('assistant_coach')!}`)
        .send({ deviceId: 'corpus-phone', mutations: [c.mutation] });
      const what = `${c.label} → ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`;
      // The sync contract (shared/schemas/sync.ts): invalid data answers `rejected` per mutation; the batch itself is fine.
      const result = res.status === 200 ? (res.body as PushResponse).results[0] : undefined;
      if (!result) failures.push(`no per-mutation answer: ${what}`);
      else if (result.status !== 'rejected') failures.push(`not rejected: ${what}`);
      else if (!result.error?.code || !result.error.message) failures.push(`no error code and message: ${what}`);
      else if (c.field && !result.error.fields?.some((f) => f.field === c.field || f.field.startsWith(`${c.field}.`)))
        failures.push(`field ${c.field} not named: ${what}`);
      if (totalChanges(t.db.$client) !== written) failures.push(`wrote to the database: ${what}`);
    }
    console.log(`bad-input corpus: ${corpus.length} malformed mutations inside valid pushes`);
    expect(failures).toEqual([]);
    expect(corpus.length).toBeGreaterThanOrEqual(100);
    expect(databaseDigest(t.db.$client)).toEqual(before);
  }, 60_000);
});
