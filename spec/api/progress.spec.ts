import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { nextChangeSeq } from '../../api/db/client';
import { guardianLinks, kicks, players, trainingSessions, users } from '../../api/db/schema';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { createTestApp, OTHER_CLUB, signIn, type TestApp } from './fixture';

/** Hand-made kicks for the other club's player, with every expected figure worked out by hand below. */
function insertFixture(t: TestApp): void {
  const sessionId = randomUUID();
  t.db
    .insert(trainingSessions)
    .values({
      id: sessionId,
      clubId: OTHER_CLUB.clubId,
      squadId: OTHER_CLUB.squadId,
      startedAt: '2026-11-03T18:00:00Z',
      ballSize: 5,
      changeSeq: nextChangeSeq(t.db),
    })
    .run();
  const kick = (
    recordedAt: string,
    technique: 'lofted' | 'driven',
    outcome: string,
    carryM: number | null,
    deletedAt: string | null = null,
  ) => ({
    id: randomUUID(),
    clubId: OTHER_CLUB.clubId,
    sessionId,
    playerId: OTHER_CLUB.playerId,
    technique,
    foot: 'right' as const,
    targetDistanceM: 34,
    targetRadiusM: 2,
    outcome: outcome as 'on_target',
    carryM,
    recordedAt,
    deletedAt,
    changeSeq: nextChangeSeq(t.db),
  });
  t.db
    .insert(kicks)
    .values([
      // ISO week starting Monday 2026-11-02.
      kick('2026-11-02T00:00:00.000Z', 'lofted', 'short', 30),
      kick('2026-11-03T18:10:00.000Z', 'lofted', 'short', 32),
      kick('2026-11-03T18:11:00.000Z', 'lofted', 'on_target', 35),
      kick('2026-11-05T18:12:00.000Z', 'lofted', 'on_target', 36),
      kick('2026-11-08T23:59:59.000Z', 'lofted', 'long', null),
      kick('2026-11-04T18:13:00.000Z', 'lofted', 'on_target', 50, '2026-11-04T19:00:00.000Z'), // voided: ignored
      // ISO week starting Monday 2026-11-09 (Sunday 23:30 still belongs to it).
      kick('2026-11-09T10:00:00.000Z', 'lofted', 'on_target', 34),
      kick('2026-11-10T10:00:00.000Z', 'lofted', 'on_target', 35),
      kick('2026-11-15T23:30:00.000Z', 'driven', 'left', 25),
    ])
    .run();
}

describe('player progress', () => {
  let t: TestApp;
  let coach: string;
  beforeAll(async () => {
    t = createTestApp();
    insertFixture(t);
    coach = (await signIn(t.app, OTHER_CLUB.coachEmail)).accessToken;
  });
  afterAll(() => t.close());

  const progress = (tok: string, id: string, query = '') =>
    request(t.app).get(`/api/players/${id}/progress${query}`).set('Authorization', `Bearer ${tok}`);

  it('aggregates per ISO week and technique with exact figures', async () => {
    const res = await progress(coach, OTHER_CLUB.playerId);
    expect(res.status).toBe(200);
    const weeks = res.body.weeks;
    expect(weeks.map((w: { weekStart: string; technique: string }) => `${w.weekStart} ${w.technique}`)).toEqual([
      '2026-11-02 lofted',
      '2026-11-09 driven',
      '2026-11-09 lofted',
    ]);
    const [w1, d2, w2] = weeks;
    expect(w1.reps).toBe(5);
    expect(w1.hitRate).toBeCloseTo(0.4, 12);
    expect(w1.outcomeShare).toEqual({ on_target: 0.4, short: 0.4, long: 0.2, left: 0, right: 0, blocked: 0, over: 0 });
    expect(w1.carryCount).toBe(4);
    // Carries 30, 32, 35, 36: median (32 + 35) / 2; nearest-rank quartiles ranks ceil(0.25·4) = 1 and ceil(0.75·4) = 3.
    expect(w1.medianCarryM).toBe(33.5);
    expect(w1.carryP25M).toBe(30);
    expect(w1.carryP75M).toBe(35);
    // Population SD: mean 33.25, squared deviations sum 22.75, / 4 = 5.6875.
    expect(w1.carrySdM).toBeCloseTo(Math.sqrt(5.6875), 9);
    expect(w2.reps).toBe(2);
    expect(w2.hitRate).toBe(1);
    expect(w2.medianCarryM).toBe(34.5);
    expect(w2.carryP25M).toBe(34);
    expect(w2.carryP75M).toBe(35);
    expect(w2.carrySdM).toBeCloseTo(0.5, 9);
    expect(d2.reps).toBe(1);
    expect(d2.hitRate).toBe(0);
    expect(d2.outcomeShare.left).toBe(1);
    expect(d2.medianCarryM).toBe(25);
  });

  it('filters by date range and technique', async () => {
    const later = (await progress(coach, OTHER_CLUB.playerId, '?from=2026-11-09')).body.weeks;
    expect(later.map((w: { weekStart: string }) => w.weekStart)).toEqual(['2026-11-09', '2026-11-09']);
    const upTo = (await progress(coach, OTHER_CLUB.playerId, '?to=2026-11-08')).body.weeks;
    expect(upTo.length).toBe(1);
    expect(upTo[0].reps).toBe(5);
    const driven = (await progress(coach, OTHER_CLUB.playerId, '?technique=driven')).body.weeks;
    expect(driven.length).toBe(1);
    expect(driven[0].technique).toBe('driven');
  });

  it('refuses bad queries naming the field', async () => {
    const bad = await progress(coach, OTHER_CLUB.playerId, '?from=2026-13-01&technique=volley');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { field: string }) => f.field).sort()).toEqual(['from', 'technique']);
    const reversed = await progress(coach, OTHER_CLUB.playerId, '?from=2026-11-10&to=2026-11-01');
    expect(reversed.status).toBe(400);
  });

  it('lets a player read only their own progress, and a guardian none (the child summary instead)', async () => {
    const p = await signIn(t.app, DEMO_ACCOUNTS.player);
    const own = t.db.select().from(players).where(eq(players.userId, p.user.id)).get()!;
    const own200 = await progress(p.accessToken, own.id);
    expect(own200.status).toBe(200);
    expect(own200.body.weeks.length).toBeGreaterThan(0);
    const teammate = t.db
      .select()
      .from(players)
      .where(and(eq(players.squadId, own.squadId)))
      .all()
      .find((x) => x.id !== own.id)!;
    expect((await progress(p.accessToken, teammate.id)).status).toBe(404);
    const g = await signIn(t.app, DEMO_ACCOUNTS.guardian);
    const guardianId = t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.guardian)).get()!.id;
    const child = t.db.select().from(guardianLinks).where(eq(guardianLinks.guardianUserId, guardianId)).get()!;
    // README "Security and data": a guardian sees their child's summary, not raw progress.
    expect((await progress(g.accessToken, child.playerId)).status).toBe(403);
    expect((await progress(g.accessToken, own.id)).status).toBe(403);
    // Nothing crosses clubs.
    expect((await progress(coach, own.id)).status).toBe(404);
  });
});
