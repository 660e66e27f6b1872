import { randomUUID } from 'node:crypto';
import { and, eq, ne } from 'drizzle-orm';
import request from 'supertest';
import { guardianLinks, players, squadStaff, trainingGrounds, users } from '../../api/db/schema';
import { DEMO_ACCOUNTS, DEMO_SQUAD_IDS } from '../../seed/scenario';
import { createTestApp, OTHER_CLUB, signIn, type TestApp } from './fixture';
import { enumerateRoutes } from './routes';

type Caller = keyof typeof DEMO_ACCOUNTS;

/** One attempt to reach someone else's record: who asks, with which id, and why it is not theirs. */
interface Attempt {
  as: Caller;
  id: string;
  whose: string;
}

/**
 * Insecure direct object references (OWASP Top 10 2021, A01 Broken Access Control): every read route
 * with an id in its path, tried by each role that may use it with ids from another squad, another club
 * and (for guardians) a child that is not theirs. Each must answer 403 or 404, never the record.
 * Write routes with path ids get the same treatment in the bad-input corpus ("path id of another club").
 */
describe('IDOR: ids of other squads, other clubs and other children', () => {
  let t: TestApp;
  const tokens = new Map<Caller, string>();
  let attempts: Record<string, Attempt[]>;

  beforeAll(async () => {
    t = createTestApp();
    for (const role of Object.keys(DEMO_ACCOUNTS) as Caller[]) tokens.set(role, (await signIn(t.app, DEMO_ACCOUNTS[role])).accessToken);
    const userId = (email: string) => t.db.select().from(users).where(eq(users.email, email)).get()!.id;
    const staffed = new Set(
      t.db
        .select()
        .from(squadStaff)
        .where(eq(squadStaff.userId, userId(DEMO_ACCOUNTS.assistant_coach)))
        .all()
        .map((s) => s.squadId),
    );
    const unstaffed = Object.values(DEMO_SQUAD_IDS).find((id) => !staffed.has(id))!;
    const playerOf = (squadId: string) => t.db.select().from(players).where(eq(players.squadId, squadId)).get()!.id;
    const me = t.db
      .select()
      .from(players)
      .where(eq(players.userId, userId(DEMO_ACCOUNTS.player)))
      .get()!;
    const teammate = t.db
      .select()
      .from(players)
      .where(and(eq(players.squadId, me.squadId), ne(players.id, me.id)))
      .get()!.id;
    const linked = new Set(
      t.db
        .select()
        .from(guardianLinks)
        .where(eq(guardianLinks.guardianUserId, userId(DEMO_ACCOUNTS.guardian)))
        .all()
        .map((l) => l.playerId),
    );
    const notMyChild = t.db
      .select()
      .from(players)
      .all()
      .find((p) => !linked.has(p.id) && p.clubId !== OTHER_CLUB.clubId)!.id;
    const otherGround = randomUUID();
    const stamp = new Date().toISOString();
    t.db
      .insert(trainingGrounds)
      .values({
        id: otherGround,
        clubId: OTHER_CLUB.clubId,
        name: 'Harrow Fen pitch',
        altitudeM: 3,
        kickingBearingDeg: 90,
        createdAt: stamp,
        updatedAt: stamp,
      })
      .run();

    const playerRoute: Attempt[] = [
      { as: 'assistant_coach', id: playerOf(unstaffed), whose: 'a player of a squad the assistant does not staff' },
      { as: 'head_coach', id: OTHER_CLUB.playerId, whose: 'a player of another club' },
      { as: 'admin', id: OTHER_CLUB.playerId, whose: 'a player of another club' },
      { as: 'player', id: teammate, whose: 'a teammate' },
      { as: 'player', id: OTHER_CLUB.playerId, whose: 'a player of another club' },
    ];
    attempts = {
      'GET /api/players/:id': playerRoute,
      'GET /api/players/:id/progress': playerRoute,
      'GET /api/players/:id/kicks': playerRoute,
      'GET /api/players/:id/profile': playerRoute,
      'GET /api/players/:id/spin-estimates': playerRoute,
      'GET /api/exports/players/:id.json': [{ as: 'admin', id: OTHER_CLUB.playerId, whose: 'a player of another club' }],
      'GET /api/squads/:id/week': [
        { as: 'assistant_coach', id: unstaffed, whose: 'a squad the assistant does not staff' },
        { as: 'head_coach', id: OTHER_CLUB.squadId, whose: 'a squad of another club' },
        { as: 'admin', id: OTHER_CLUB.squadId, whose: 'a squad of another club' },
      ],
      'GET /api/squads/:id/profiles': [
        { as: 'assistant_coach', id: unstaffed, whose: 'a squad the assistant does not staff' },
        { as: 'head_coach', id: OTHER_CLUB.squadId, whose: 'a squad of another club' },
      ],
      'GET /api/grounds/:id/conditions': [
        { as: 'head_coach', id: otherGround, whose: 'a ground of another club' },
        { as: 'assistant_coach', id: otherGround, whose: 'a ground of another club' },
      ],
      'GET /api/guardians/children/:playerId/summary': [
        { as: 'guardian', id: notMyChild, whose: 'a child the guardian is not linked to' },
        { as: 'guardian', id: OTHER_CLUB.playerId, whose: 'a child of another club' },
      ],
    };
  }, 60_000);
  afterAll(() => t.close());

  it('has attempts for every read route with an id in its path', () => {
    const withIds = enumerateRoutes(t.app).filter((r) => r.startsWith('GET ') && r.includes('/:'));
    expect(withIds.filter((r) => !(r in attempts))).toEqual([]);
  });

  it('answers 403 or 404 to every attempt, never the record', async () => {
    const leaks: string[] = [];
    let tried = 0;
    for (const [route, list] of Object.entries(attempts)) {
      for (const a of list) {
        const path = route.split(' ')[1]!.replace(/:id|:playerId/, a.id);
        const res = await request(t.app)
          .get(path)
          .set('Authorization', `Bearer ${tokens.get(a.as)!}`);
        tried++;
        if (res.status !== 403 && res.status !== 404) leaks.push(`${route} as ${a.as} with ${a.whose} → ${res.status}`);
      }
    }
    expect(leaks).toEqual([]);
    expect(tried).toBeGreaterThan(25);
  });
});
