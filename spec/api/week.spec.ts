import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { nextChangeSeq } from '../../api/db/client';
import { kicks, players, trainingSessions } from '../../api/db/schema';
import { isoWeekStart } from '../../api/squads/week.service';
import { DEMO_ACCOUNTS, DEMO_SQUAD_IDS } from '../../seed/scenario';
import { createTestApp, OTHER_CLUB, signIn, type TestApp } from './fixture';

const SECOND_PLAYER = '00000000-0000-4000-8000-0000000000d1';

/** Two weeks of hand-made kicks in the other club; the expected figures are worked out beside each spec. */
function insertFixture(t: TestApp): void {
  t.db
    .insert(players)
    .values({ id: SECOND_PLAYER, clubId: OTHER_CLUB.clubId, squadId: OTHER_CLUB.squadId, displayName: 'Second Player', shirtNumber: 11 })
    .run();
  const session = (startedAt: string) => {
    const id = randomUUID();
    t.db
      .insert(trainingSessions)
      .values({ id, clubId: OTHER_CLUB.clubId, squadId: OTHER_CLUB.squadId, startedAt, ballSize: 5, changeSeq: nextChangeSeq(t.db) })
      .run();
    return id;
  };
  const prev = session('2026-11-04T18:00:00Z');
  const now = session('2026-11-11T18:00:00Z');
  const rows: (typeof kicks.$inferInsert)[] = [];
  const add = (
    sessionId: string,
    playerId: string,
    day: string,
    technique: 'lofted' | 'driven',
    outcome: 'on_target' | 'short',
    n: number,
  ) => {
    for (let i = 0; i < n; i++) {
      rows.push({
        id: randomUUID(),
        clubId: OTHER_CLUB.clubId,
        sessionId,
        playerId,
        technique,
        foot: 'right',
        targetDistanceM: 30,
        targetRadiusM: 3,
        outcome,
        recordedAt: `${day}T18:${String(10 + (i % 50)).padStart(2, '0')}:00.000Z`,
        changeSeq: nextChangeSeq(t.db),
      });
    }
  };
  // Previous week: player 1 — 10 lofted, 2 hits.
  add(prev, OTHER_CLUB.playerId, '2026-11-04', 'lofted', 'on_target', 2);
  add(prev, OTHER_CLUB.playerId, '2026-11-04', 'lofted', 'short', 8);
  // This week: player 1 — 30 lofted (15 hits) + 12 driven (9 hits) = 42 reps in one session (> limit 40).
  add(now, OTHER_CLUB.playerId, '2026-11-11', 'lofted', 'on_target', 15);
  add(now, OTHER_CLUB.playerId, '2026-11-11', 'lofted', 'short', 15);
  add(now, OTHER_CLUB.playerId, '2026-11-11', 'driven', 'on_target', 9);
  add(now, OTHER_CLUB.playerId, '2026-11-11', 'driven', 'short', 3);
  // This week: player 2 — 4 driven, all hits (too few to be a "best technique").
  add(now, SECOND_PLAYER, '2026-11-11', 'driven', 'on_target', 4);
  t.db.insert(kicks).values(rows).run();
}

describe('squad week', () => {
  let t: TestApp;
  let coach: string;
  beforeAll(async () => {
    t = createTestApp();
    insertFixture(t);
    coach = (await signIn(t.app, OTHER_CLUB.coachEmail)).accessToken;
  });
  afterAll(() => t.close());

  const week = (tok: string, squadId: string, start: string) =>
    request(t.app).get(`/api/squads/${squadId}/week?start=${start}`).set('Authorization', `Bearer ${tok}`);

  it('finds the Monday of an ISO week', () => {
    // ISO 8601: weeks start on Monday; 2026-11-15 is a Sunday, 2026-11-09 a Monday.
    expect(isoWeekStart('2026-11-15')).toBe('2026-11-09');
    expect(isoWeekStart('2026-11-09')).toBe('2026-11-09');
    expect(isoWeekStart('2027-01-01')).toBe('2026-12-28');
  });

  it('gives each player reps, hit rate, week-on-week change, best technique and load flags', async () => {
    const res = await week(coach, OTHER_CLUB.squadId, '2026-11-12');
    expect(res.status).toBe(200);
    expect(res.body.weekStart).toBe('2026-11-09');
    expect(res.body.previousWeekStart).toBe('2026-11-02');
    const [p1, p2] = res.body.players;
    expect(p1.playerId).toBe(OTHER_CLUB.playerId);
    expect(p1.reps).toBe(42);
    // (15 + 9) / 42 this week, 2 / 10 last week.
    expect(p1.hitRate).toBeCloseTo(24 / 42, 12);
    expect(p1.previousReps).toBe(10);
    expect(p1.previousHitRate).toBeCloseTo(0.2, 12);
    expect(p1.hitRateChange).toBeCloseTo(24 / 42 - 0.2, 12);
    // Driven 9/12 = 0.75 beats lofted 15/30 = 0.5.
    expect(p1.bestTechnique).toBe('driven');
    expect(p1.loadFlags.length).toBe(1);
    expect(p1.loadFlags[0].reps).toBe(42);
    expect(p1.loadFlags[0].limit).toBe(40);
    expect(p2.reps).toBe(4);
    expect(p2.hitRate).toBe(1);
    expect(p2.previousHitRate).toBeNull();
    expect(p2.hitRateChange).toBeNull();
    expect(p2.bestTechnique).toBeNull();
    expect(p2.loadFlags).toEqual([]);
  });

  it('is for the squad’s staff only', async () => {
    const player = await signIn(t.app, DEMO_ACCOUNTS.player);
    expect((await week(player.accessToken, DEMO_SQUAD_IDS.u16, '2026-11-09')).status).toBe(403);
    const assistant = await signIn(t.app, DEMO_ACCOUNTS.assistant_coach);
    expect((await week(assistant.accessToken, DEMO_SQUAD_IDS.first, '2026-11-09')).status).toBe(404);
    expect((await week(assistant.accessToken, DEMO_SQUAD_IDS.u16, '2026-11-09')).status).toBe(200);
    expect((await week(coach, DEMO_SQUAD_IDS.u16, '2026-11-09')).status).toBe(404);
    const bad = await week(coach, OTHER_CLUB.squadId, '9 Nov');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].field).toBe('start');
  });
});
