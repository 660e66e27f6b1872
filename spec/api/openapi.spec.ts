import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type * as z from 'zod';
import { openApiPath } from '../../api/openapi/document';
import { OPERATIONS } from '../../api/openapi/operations';
import { unsubscribeToken } from '../../api/digests/unsubscribe-token';
import { capturedMail } from '../../api/db/schema';
import { demoPeriod } from '../../seed/calendar';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../seed/scenario';
import { createMailTestApp, createTestApp, signIn, type MailTestApp } from './fixture';
import { enumerateRoutes } from './routes';

type Json = Record<string, Record<string, Record<string, unknown>>>;

describe('OpenAPI document', () => {
  let t: MailTestApp;
  let doc: { openapi: string; paths: Json };
  const tokens = new Map<string, string>();

  beforeAll(async () => {
    // The mail test app mounts every router, the development mail viewer included.
    t = await createMailTestApp();
    doc = (await request(t.app).get('/api/openapi.json')).body;
    for (const role of ['admin', 'head_coach', 'player'] as const) tokens.set(role, (await signIn(t.app, DEMO_ACCOUNTS[role])).accessToken);
  }, 30_000);
  afterAll(() => t.close());

  it('is OpenAPI 3.1 and documents every route Express has, and nothing it lacks', () => {
    expect(doc.openapi).toBe('3.1.0');
    const documented = Object.entries(doc.paths).flatMap(([path, item]) => Object.keys(item).map((m) => `${m.toUpperCase()} ${path}`));
    const actual = enumerateRoutes(t.app).map((r) => {
      const [method, path] = r.split(' ') as [string, string];
      return `${method} ${openApiPath(path)}`;
    });
    expect(actual.filter((r) => !documented.includes(r)))
      .withContext('routes missing from the document')
      .toEqual([]);
    expect(documented.filter((r) => !actual.includes(r)))
      .withContext('documented routes Express lacks')
      .toEqual([]);
  });

  it('renders request bodies and queries from the zod schemas the routers parse with', () => {
    const login = doc.paths['/api/auth/login']!['post']!;
    expect(JSON.stringify(login['requestBody'])).toContain('"password"');
    const settings = doc.paths['/api/club/settings']!['put']!;
    expect(JSON.stringify(settings['requestBody'])).toContain('"yd"');
    const week = doc.paths['/api/squads/{id}/week']!['get']!;
    expect((week['parameters'] as { name: string }[]).map((p) => p.name)).toEqual(['id', 'start', 'carry']);
  });

  it('serves a readable reference page whose script comes from this server', async () => {
    const page = await request(t.app).get('/api/reference');
    expect(page.status).toBe(200);
    expect(page.type).toBe('text/html');
    expect(page.text).toContain('<script src="/api/reference.js"');
    expect(page.text).not.toMatch(/https?:\/\//);
    expect((await request(t.app).get('/api/reference.js')).status).toBe(200);
  });

  it('in production answers only a signed-in admin', async () => {
    const prod = createTestApp({ env: 'production' });
    try {
      expect((await request(prod.app).get('/api/openapi.json')).status).toBe(401);
      expect((await request(prod.app).get('/api/reference')).status).toBe(401);
      const player = (await signIn(prod.app, DEMO_ACCOUNTS.player)).accessToken;
      expect((await request(prod.app).get('/api/openapi.json').set('Authorization', `Bearer ${player}`)).status).toBe(403);
      const admin = (await signIn(prod.app, DEMO_ACCOUNTS.admin)).accessToken;
      expect((await request(prod.app).get('/api/openapi.json').set('Authorization', `Bearer ${admin}`)).status).toBe(200);
    } finally {
      prod.close();
    }
  });

  describe('real answers match the documented answer schemas', () => {
    /** GETs without a path id that answer without any setup (an invitation's lookup needs a token from a mail: below). */
    const needsSetup = ['/api/auth/invite'];
    const plainGets = OPERATIONS.filter(
      (op) => op.method === 'GET' && op.answer && !op.path.includes(':') && !needsSetup.includes(op.path),
    );

    /**
     * There is no "any JSON object" answer any more: every operation names its success — a JSON answer with its
     * schema, a non-JSON content type, or 204 without a body. (The type says so too; this catches a cast.)
     */
    it('every operation documents its answer: a schema, a content type, or no content', () => {
      const undocumented = OPERATIONS.filter((op) => !op.answer && !op.produces && !op.noContent).map((op) => `${op.method} ${op.path}`);
      expect(undocumented).toEqual([]);
      const loose = Object.entries(doc.paths).flatMap(([path, item]) =>
        Object.entries(item).flatMap(([method, o]) => {
          const json = JSON.stringify(
            (o['responses'] as Record<string, unknown>)['200'] ?? (o['responses'] as Record<string, unknown>)['201'] ?? {},
          );
          return /"schema":\{"type":"object"(,"properties":\{\})?(,"additionalProperties":\{\})?\}/.test(json)
            ? [`${method.toUpperCase()} ${path}`]
            : [];
        }),
      );
      expect(loose).withContext('answers documented only as a bare object').toEqual([]);
    });

    it('covers the detailed GET answers', () => {
      expect(plainGets.map((op) => op.path)).toEqual(
        jasmine.arrayContaining([
          '/api/ready',
          '/api/health',
          '/api/openapi.json',
          '/api/guardians/consent-text',
          '/api/admin/users',
          '/api/me',
          '/api/club/settings',
          '/api/squads',
          '/api/players',
          '/api/grounds',
          '/api/guardians/links',
          '/api/admin/outbox',
          '/api/dev/mail',
        ]),
      );
    });

    for (const op of plainGets) {
      it(`GET ${op.path}`, async () => {
        const role = op.access === 'public' ? null : op.access.includes('admin') ? 'admin' : op.access[0]!;
        const req = request(t.app).get(op.path);
        const res =
          role === null
            ? await req
            : await req.set('Authorization', `Bearer ${tokens.get(role) ?? (await signIn(t.app, DEMO_ACCOUNTS[role])).accessToken}`);
        expect(res.status).toBe(200);
        const parsed = (op.answer as z.ZodType).safeParse(res.body);
        expect(parsed.success ? [] : parsed.error.issues).toEqual([]);
      });
    }

    /** A real answer for each documented answer of a route with an id, from the demo club's own squads and players. */
    it('GET answers of one squad and one player, and both sync answers', async () => {
      const coach = tokens.get('head_coach') ?? (await signIn(t.app, DEMO_ACCOUNTS.head_coach)).accessToken;
      const get = (path: string) => request(t.app).get(path).set('Authorization', `Bearer ${coach}`);
      const squadId = ((await get('/api/squads')).body as { squads: { id: string }[] }).squads[0]!.id;
      const playerId = ((await get('/api/players')).body as { players: { id: string }[] }).players[0]!.id;
      const weekStart = demoPeriod(new Date()).weekStarts.at(-1)!.toISOString().slice(0, 10);
      const calls: [string, string][] = [
        ['/api/squads/:id/week', `/api/squads/${squadId}/week?start=${weekStart}`],
        ['/api/squads/:id/profiles', `/api/squads/${squadId}/profiles?technique=lofted`],
        ['/api/players/:id', `/api/players/${playerId}`],
        ['/api/players/:id/progress', `/api/players/${playerId}/progress`],
        ['/api/players/:id/kicks', `/api/players/${playerId}/kicks`],
        ['/api/players/:id/profile', `/api/players/${playerId}/profile?technique=lofted`],
        ['/api/players/:id/spin-estimates', `/api/players/${playerId}/spin-estimates`],
        ['/api/sync/pull', '/api/sync/pull?since=0'],
      ];
      for (const [documented, path] of calls) {
        const op = OPERATIONS.find((o) => o.method === 'GET' && o.path === documented)!;
        expect(op.answer).withContext(documented).toBeDefined();
        const res = await get(path);
        expect(res.status).withContext(path).toBe(200);
        const parsed = (op.answer as z.ZodType).safeParse(res.body);
        expect(parsed.success ? [] : parsed.error.issues.slice(0, 3))
          .withContext(path)
          .toEqual([]);
      }
      // A push with one refused mutation: the answer carries the per-mutation error.
      const push = await request(t.app)
        .post('/api/sync/push')
        .set('Authorization', `Bearer ${coach}`)
        .send({ deviceId: 'openapi-spec', mutations: [{ id: randomUUID(), entity: 'kick', op: 'upsert', data: {} }] });
      expect(push.status).toBe(200);
      expect((push.body as { results: { status: string }[] }).results[0]?.status).toBe('rejected');
      const pushOp = OPERATIONS.find((o) => o.method === 'POST' && o.path === '/api/sync/push')!;
      const parsed = (pushOp.answer as z.ZodType).safeParse(push.body);
      expect(parsed.success ? [] : parsed.error.issues).toEqual([]);
    });

    it('GET answers of a ground’s conditions and a guardian’s child summary', async () => {
      const admin = tokens.get('admin')!;
      const groundId = (
        (await request(t.app).get('/api/grounds').set('Authorization', `Bearer ${admin}`)).body as { grounds: { id: string }[] }
      ).grounds[0]!.id;
      const guardian = (await signIn(t.app, DEMO_ACCOUNTS.guardian)).accessToken;
      const childId = (
        (await request(t.app).get('/api/me').set('Authorization', `Bearer ${guardian}`)).body as { childPlayerIds: string[] }
      ).childPlayerIds[0]!;
      const calls: [string, string, string][] = [
        ['/api/grounds/:id/conditions', `/api/grounds/${groundId}/conditions`, admin],
        ['/api/guardians/children/:playerId/summary', `/api/guardians/children/${childId}/summary`, guardian],
      ];
      for (const [documented, path, token] of calls) {
        const op = OPERATIONS.find((o) => o.method === 'GET' && o.path === documented)!;
        expect(op.answer).withContext(documented).toBeDefined();
        const res = await request(t.app).get(path).set('Authorization', `Bearer ${token}`);
        expect(res.status).withContext(path).toBe(200);
        const parsed = (op.answer as z.ZodType).safeParse(res.body);
        expect(parsed.success ? [] : parsed.error.issues.slice(0, 3))
          .withContext(path)
          .toEqual([]);
      }
    });

    it('references payloads defined once in shared/ from components.schemas', () => {
      const components = (doc as unknown as { components: { schemas: Record<string, unknown> } }).components.schemas;
      for (const id of [
        'SquadWeek',
        'SquadWeekPlayer',
        'PlayerKicks',
        'ProfileEntry',
        'PushResponse',
        'PullResponse',
        'SquadSummary',
        'Error',
      ]) {
        expect(components[id]).withContext(id).toBeDefined();
      }
      const week = JSON.stringify(doc.paths['/api/squads/{id}/week']!['get']!['responses']);
      expect(week).toContain('"$ref":"#/components/schemas/SquadWeek"');
      // Every reference resolves.
      const refs = [...JSON.stringify(doc).matchAll(/"#\/components\/schemas\/([^"]+)"/g)].map((m) => m[1]!);
      expect(refs.filter((id) => !(id in components))).toEqual([]);
    });

    /** Parses a real answer with the schema its operation documents, after checking the documented status. */
    const expectDocumented = (method: string, documented: string, res: request.Response, status = 200) => {
      const op = OPERATIONS.find((o) => o.method === method && o.path === documented);
      expect(op?.answer).withContext(`${method} ${documented}`).toBeDefined();
      expect(res.status)
        .withContext(`${method} ${documented}: ${JSON.stringify(res.body).slice(0, 200)}`)
        .toBe(status);
      const parsed = (op!.answer as z.ZodType).safeParse(res.body);
      expect(parsed.success ? [] : parsed.error.issues.slice(0, 3))
        .withContext(`${method} ${documented}`)
        .toEqual([]);
    };

    it('account answers: an invitation sent, renewed, looked up and accepted, and a password-reset request', async () => {
      const admin = tokens.get('admin')!;
      const email = 'openapi.coach@kestrel-vale.test';
      const squadId = (
        (await request(t.app).get('/api/squads').set('Authorization', `Bearer ${admin}`)).body as { squads: { id: string }[] }
      ).squads[0]!.id;
      const invited = await request(t.app)
        .post('/api/admin/invites')
        .set('Authorization', `Bearer ${admin}`)
        .send({ email, displayName: 'Ola Reference', role: 'assistant_coach', squadIds: [squadId] });
      expectDocumented('POST', '/api/admin/invites', invited, 201);
      const userId = (invited.body as { userId: string }).userId;
      /** The invitation links mailed to the new account so far. */
      const tokensMailed = async () => {
        await t.mailer.flush();
        return t.db
          .select()
          .from(capturedMail)
          .all()
          .filter((m) => (JSON.parse(m.toJson) as string[]).includes(email))
          .map((m) => /\/accept-invite\?token=([\w-]+)/.exec(m.textBody)![1]!);
      };
      const [first] = await tokensMailed();
      expectDocumented('GET', '/api/auth/invite', await request(t.app).get(`/api/auth/invite?token=${first!}`));
      // Inviting again replaces the first link; the new one is accepted.
      expectDocumented(
        'POST',
        '/api/admin/users/:id/invite',
        await request(t.app).post(`/api/admin/users/${userId}/invite`).set('Authorization', `Bearer ${admin}`),
        201,
      );
      const token = (await tokensMailed()).find((tk) => tk !== first)!;
      expectDocumented(
        'POST',
        '/api/auth/accept-invite',
        await request(t.app).post('/api/auth/accept-invite').send({ token, password: 'a-long-reference-password' }),
      );
      expectDocumented('POST', '/api/auth/forgot-password', await request(t.app).post('/api/auth/forgot-password').send({ email }), 202);
    });

    it('a one-click unsubscribe from a real signed link', async () => {
      const links = (
        await request(t.app)
          .get('/api/guardians/links')
          .set('Authorization', `Bearer ${tokens.get('admin')!}`)
      ).body as {
        links: { id: string }[];
      };
      const token = unsubscribeToken(t.config.jwtSecret, links.links[0]!.id);
      expectDocumented('POST', '/api/digests/unsubscribe', await request(t.app).post(`/api/digests/unsubscribe?token=${token}`));
    });

    it('import previews and a commit, a player’s data export and an erasure', async () => {
      const admin = tokens.get('admin')!;
      const head = tokens.get('head_coach')!;
      const roster =
        'squad,name,shirt_number,birth_year,foot,guardian_emails\r\n' +
        'OpenAPI Check,"Reference, Rui",4,2012,left,rui.parent@example.test\r\n';
      const upload = (path: string, token: string, csv: string) =>
        request(t.app).post(path).set('Authorization', `Bearer ${token}`).attach('file', Buffer.from(csv), 'upload.csv');
      expectDocumented('POST', '/api/imports/roster', await upload('/api/imports/roster?dryRun=true', admin, roster));
      expectDocumented('POST', '/api/imports/roster', await upload('/api/imports/roster?dryRun=false', admin, roster), 201);
      // A device file whose only shirt is in no squad: the preview answers the row's error.
      const squadId = (
        (await request(t.app).get('/api/squads').set('Authorization', `Bearer ${head}`)).body as { squads: { id: string }[] }
      ).squads[0]!.id;
      const mapping = {
        squadId,
        technique: 'lofted',
        targetDistanceM: 30,
        targetRadiusM: 3,
        columns: { player: 'Shirt', speed: 'Speed' },
        units: { speed: 'm/s', spin: 'rev/s', distance: 'm' },
      };
      const kicks = await upload('/api/imports/kicks?dryRun=true', head, 'Shirt,Speed\r\n99,25\r\n').field(
        'mapping',
        JSON.stringify(mapping),
      );
      expectDocumented('POST', '/api/imports/kicks', kicks);
      expect((kicks.body as { errors: unknown[] }).errors.length).toBeGreaterThan(0);
      const players = (
        (await request(t.app).get('/api/players').set('Authorization', `Bearer ${admin}`)).body as {
          players: { id: string; displayName: string }[];
        }
      ).players;
      expectDocumented(
        'GET',
        '/api/exports/players/:id.json',
        await request(t.app).get(`/api/exports/players/${players[0]!.id}.json`).set('Authorization', `Bearer ${admin}`),
      );
      // Erase only the player this spec imported, so the demo club's players stay for the other answers.
      const imported = players.find((p) => p.displayName === 'Reference, Rui')!;
      const erased = await request(t.app)
        .post(`/api/admin/players/${imported.id}/erase`)
        .set('Authorization', `Bearer ${admin}`)
        .send({ mode: 'anonymise', confirmName: imported.displayName });
      expectDocumented('POST', '/api/admin/players/:id/erase', erased);
    });

    it('POST /api/auth/login', async () => {
      const res = await request(t.app).post('/api/auth/login').send({ email: DEMO_ACCOUNTS.assistant_coach, password: DEMO_PASSWORD });
      const login = OPERATIONS.find((op) => op.path === '/api/auth/login')!;
      expect((login.answer as z.ZodType).safeParse(res.body).success).toBeTrue();
    });
  });
});
