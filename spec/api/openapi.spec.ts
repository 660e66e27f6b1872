import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type * as z from 'zod';
import { openApiPath } from '../../api/openapi/document';
import { OPERATIONS } from '../../api/openapi/operations';
import { anyObjectSchema } from '../../api/openapi/responses';
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
    const detailed = OPERATIONS.filter((op) => op.method === 'GET' && op.answer && op.answer !== anyObjectSchema && !op.path.includes(':'));

    it('covers the detailed GET answers', () => {
      expect(detailed.map((op) => op.path)).toEqual(
        jasmine.arrayContaining([
          '/api/health',
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

    for (const op of OPERATIONS.filter((o) => o.method === 'GET' && o.answer && o.answer !== anyObjectSchema && !o.path.includes(':'))) {
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
        expect(op.answer).withContext(documented).not.toBe(anyObjectSchema);
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
        expect(op.answer).withContext(documented).not.toBe(anyObjectSchema);
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

    it('POST /api/auth/login', async () => {
      const res = await request(t.app).post('/api/auth/login').send({ email: DEMO_ACCOUNTS.assistant_coach, password: DEMO_PASSWORD });
      const login = OPERATIONS.find((op) => op.path === '/api/auth/login')!;
      expect((login.answer as z.ZodType).safeParse(res.body).success).toBeTrue();
    });
  });
});
