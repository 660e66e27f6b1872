import type { Express } from 'express';
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { guardianLinks, players, users } from '../../api/db/schema';
import { DEMO_ACCOUNTS, DEMO_GROUND_ID, DEMO_SQUAD_IDS } from '../../seed/scenario';
import { createTestApp, OTHER_CLUB, signIn, type TestApp } from './fixture';
import { enumerateRoutes } from './routes';

type Who = 'public' | 'admin' | 'head_coach' | 'assistant_coach' | 'player' | 'guardian';
const ROLES: Who[] = ['admin', 'head_coach', 'assistant_coach', 'player', 'guardian'];
const STAFF: Who[] = ['admin', 'head_coach', 'assistant_coach'];
const ALL: Who[] = [...ROLES];

/**
 * Who may use each route (with the ids chosen below: the U16 squad, the player account's own
 * player row, the demo guardian's link). A route missing here fails the first spec.
 */
const MATRIX: Record<string, Who[] | 'public'> = {
  'GET /api/health': 'public',
  'GET /api/openapi.json': 'public',
  'GET /api/reference': 'public',
  'GET /api/reference.js': 'public',
  'GET /api/ready': 'public',
  'POST /api/auth/login': 'public',
  'POST /api/auth/refresh': 'public',
  'POST /api/auth/logout': 'public',
  'GET /api/auth/invite': 'public',
  'POST /api/auth/accept-invite': 'public',
  'POST /api/auth/forgot-password': 'public',
  'POST /api/auth/reset-password': 'public',
  'POST /api/digests/unsubscribe': 'public',
  'GET /api/me': ALL,
  'GET /api/me/digest-opt-in': ['player'],
  'PUT /api/me/digest-opt-in': ['player'],
  'GET /api/club/settings': ALL,
  'PUT /api/club/settings': ['admin'],
  'GET /api/squads': ALL,
  'GET /api/squads/:id/week': STAFF,
  'GET /api/squads/:id/profiles': STAFF,
  'GET /api/players': ALL,
  'GET /api/players/:id': [...STAFF, 'player'],
  'GET /api/players/:id/progress': [...STAFF, 'player'],
  'GET /api/players/:id/kicks': [...STAFF, 'player'],
  'GET /api/players/:id/profile': [...STAFF, 'player'],
  'GET /api/players/:id/spin-estimates': [...STAFF, 'player'],
  'POST /api/sync/push': STAFF,
  'GET /api/grounds': STAFF,
  'POST /api/grounds': ['admin'],
  'PUT /api/grounds/:id': ['admin'],
  'GET /api/grounds/:id/conditions': STAFF,
  'GET /api/sync/pull': [...STAFF, 'player'],
  'GET /api/guardians/consent-text': ALL,
  'GET /api/guardians/links': ['admin', 'guardian'],
  'POST /api/guardians/links': ['admin'],
  'DELETE /api/guardians/links/:id': ['admin'],
  'POST /api/guardians/links/:id/consent': ['guardian'],
  'PUT /api/guardians/links/:id/digest': ['guardian'],
  'GET /api/guardians/children/:playerId/summary': ['guardian'],
  'POST /api/admin/players/:id/erase': ['admin'],
  'GET /api/admin/users': ['admin'],
  'POST /api/admin/invites': ['admin'],
  'POST /api/admin/users/:id/invite': ['admin'],
  'POST /api/admin/users/:id/disable': ['admin'],
  'GET /api/admin/outbox': ['admin'],
  'POST /api/imports/roster': ['admin'],
  'POST /api/imports/kicks': STAFF,
  'GET /api/exports/kicks.csv': STAFF,
  'GET /api/exports/players/:id.json': ['admin'],
  'POST /api/digests/run': ['admin', 'head_coach'],
};

describe('route × role security matrix', () => {
  let t: TestApp;
  const tokens = new Map<string, string>();
  let ids: Record<string, string>;

  beforeAll(async () => {
    t = createTestApp();
    for (const role of ROLES) tokens.set(role, (await signIn(t.app, DEMO_ACCOUNTS[role as keyof typeof DEMO_ACCOUNTS])).accessToken);
    tokens.set('other_club', (await signIn(t.app, OTHER_CLUB.coachEmail)).accessToken);
    const playerUser = t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.player)).get()!;
    const own = t.db.select().from(players).where(eq(players.userId, playerUser.id)).get()!;
    const guardianUser = t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.guardian)).get()!;
    const link = t.db.select().from(guardianLinks).where(eq(guardianLinks.guardianUserId, guardianUser.id)).get()!;
    ids = { squad: DEMO_SQUAD_IDS.u16, player: own.id, link: link.id, child: link.playerId };
  }, 60_000);
  afterAll(() => t.close());

  function pathFor(route: string): string {
    const path = route.split(' ')[1]!;
    if (path.startsWith('/api/squads/:id')) return path.replace(':id', ids['squad']!);
    if (path.startsWith('/api/grounds/:id')) return path.replace(':id', DEMO_GROUND_ID);
    if (path.startsWith('/api/guardians/links/:id')) return path.replace(':id', ids['link']!);
    if (path.includes(':playerId')) return path.replace(':playerId', ids['child']!);
    // Erasure is tried on an id that does not exist, so allowed roles get 404 and nothing is erased.
    if (path.startsWith('/api/admin/players/:id')) return path.replace(':id', randomUUID());
    // So are re-invite and disable: nobody is mailed or locked out.
    if (path.startsWith('/api/admin/users/:id')) return path.replace(':id', randomUUID());
    return path.replace(':id', ids['player']!);
  }

  async function call(app: Express, route: string, token: string | null): Promise<number> {
    const method = route.split(' ')[0]!.toLowerCase() as 'get' | 'post' | 'put' | 'delete';
    let req = request(app)[method](pathFor(route));
    if (token) req = req.set('Authorization', `Bearer ${token}`);
    // Harmless bodies: enough to pass authorisation, never enough to change anything.
    if (route === 'DELETE /api/guardians/links/:id')
      req = request(app)
        .delete(`/api/guardians/links/${randomUUID()}`)
        .set('Authorization', `Bearer ${token ?? ''}`);
    const res = method === 'get' || method === 'delete' ? await req : await req.send({ unexpected: true });
    return res.status;
  }

  it('has an entry for every route the app serves, and no stale entries', () => {
    const routes = enumerateRoutes(t.app);
    expect(routes.length).toBeGreaterThan(30);
    const missing = routes.filter((r) => !(r in MATRIX));
    expect(missing).withContext('routes without an entry in the security matrix').toEqual([]);
    const stale = Object.keys(MATRIX).filter((r) => !routes.includes(r));
    expect(stale).withContext('matrix entries for routes that no longer exist').toEqual([]);
  });

  it('lets each role in exactly where the matrix says, and keeps the signed-out and other clubs out', async () => {
    for (const route of enumerateRoutes(t.app)) {
      const allowed = MATRIX[route];
      if (allowed === undefined) continue;
      if (allowed === 'public') {
        const status = await call(t.app, route, null);
        expect([401, 403]).withContext(`${route} signed out → ${status}`).not.toContain(status);
        continue;
      }
      const signedOut = await call(t.app, route, null);
      expect(signedOut).withContext(`${route} signed out`).toBe(401);
      for (const role of ROLES) {
        const status = await call(t.app, route, tokens.get(role)!);
        if (allowed.includes(role)) expect([401, 403]).withContext(`${route} as ${role} → ${status}`).not.toContain(status);
        else expect([401, 403, 404]).withContext(`${route} as ${role} → ${status}`).toContain(status);
      }
      if (route.includes(':')) {
        const status = await call(t.app, route, tokens.get('other_club')!);
        expect([401, 403, 404]).withContext(`${route} as another club's coach → ${status}`).toContain(status);
      }
    }
  }, 120_000);
});
