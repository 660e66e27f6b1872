import { randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import { kickUpsert, sessionUpsert } from './mutations';
import request from 'supertest';
import { conditionsOf } from '../../api/analysis/flight-inputs';
import { kicks, players } from '../../api/db/schema';
import { DEMO_ACCOUNTS, DEMO_SQUAD_IDS } from '../../seed/scenario';
import { DEFAULT_ELEVATION_DEG, SPIN_STEP_RPS, simulateKick } from '../../shared/flight';
import type { PlayerKicksResponse, SpinEstimatesResponse } from '../../shared/schemas/analysis';
import { DEFAULT_DRAG_CRISIS_RE } from '../../shared/schemas/club';
import type { PullResponse, PushResponse } from '../../shared/schemas/sync';
import { createTestApp, signIn, type TestApp } from './fixture';

describe('hang-time stopwatch: kicks, club timing settings and spin estimates', () => {
  let t: TestApp;
  let coach: string;
  let admin: string;
  let playerId: string;
  const session = {
    temperatureC: 12,
    altitudeM: null,
    relativeHumidityPct: null,
    pressureHpa: null,
    windSpeedMs: null,
    windFromDeg: null,
    ballSize: 5,
  };

  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
  const push = (mutations: unknown[]) => request(t.app).post('/api/sync/push').set(auth(coach)).send({ deviceId: 'phone-sw', mutations });
  const sessionMutation = (id: string) =>
    sessionUpsert(id, DEMO_SQUAD_IDS.u16, '2026-11-20T18:30:00Z', { temperatureC: session.temperatureC });
  const kickMutation = (sessionId: string, extra: Record<string, unknown>) =>
    kickUpsert(sessionId, playerId, { backspinStep: 2, outcome: 'short', ...extra });

  beforeAll(async () => {
    t = createTestApp();
    coach = (await signIn(t.app, DEMO_ACCOUNTS.assistant_coach)).accessToken;
    admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
    // A U16 player without an account of their own, so the player account must not see them.
    playerId = t.db
      .select()
      .from(players)
      .where(and(eq(players.squadId, DEMO_SQUAD_IDS.u16), isNull(players.deletedAt), isNull(players.userId)))
      .all()[0]!.id;
  });
  afterAll(() => t.close());

  it('stores, lists and pulls a timed repetition, and clears the time on an edit', async () => {
    const sessionId = randomUUID();
    const kick = kickMutation(sessionId, { hangTimeS: 2.48, carryM: 31 });
    const res = await push([sessionMutation(sessionId), kick]);
    expect((res.body as PushResponse).results.map((r) => r.status)).toEqual(['applied', 'applied']);
    expect(t.db.select().from(kicks).where(eq(kicks.id, kick.data.id)).get()!.hangTimeS).toBe(2.48);
    const list = (await request(t.app).get(`/api/players/${playerId}/kicks?technique=lofted`).set(auth(coach))).body as PlayerKicksResponse;
    expect(list.kicks.find((k) => k.id === kick.data.id)!.hangTimeS).toBe(2.48);
    // The push made two changes (session, kick), the last of them at the cursor it answered with.
    const since = (res.body as PushResponse).cursor - 2;
    const pulled = (await request(t.app).get(`/api/sync/pull?since=${since}`).set(auth(coach))).body as PullResponse;
    expect(pulled.changes.find((c) => c.data.id === kick.data.id)!.data['hangTimeS']).toBe(2.48);
    const edit = { ...kick, id: randomUUID(), data: { ...kick.data, hangTimeS: null }, baseVersion: 1 };
    expect((await push([edit])).body.results[0].status).toBe('applied');
    expect(t.db.select().from(kicks).where(eq(kicks.id, kick.data.id)).get()!.hangTimeS).toBeNull();
  });

  it('rejects a stopwatch reading outside 0.2–10 s naming data.hangTimeS', async () => {
    const sessionId = randomUUID();
    const res = await push([
      sessionMutation(sessionId),
      kickMutation(sessionId, { hangTimeS: 0.05 }),
      kickMutation(sessionId, { hangTimeS: 'fast' }),
    ]);
    const [, tooShort, notNumber] = (res.body as PushResponse).results;
    expect(tooShort!.status).toBe('rejected');
    expect(tooShort!.error!.fields!.map((f) => f.field)).toContain('data.hangTimeS');
    expect(tooShort!.error!.message).toContain('at least 0.2 s');
    expect(notNumber!.error!.fields!.map((f) => f.field)).toContain('data.hangTimeS');
  });

  it('serves the club timing calibration to staff and lets only the admin change it, within bounds', async () => {
    const initial = await request(t.app).get('/api/club/settings').set(auth(coach));
    expect(initial.status).toBe(200);
    // Product defaults (common practice): 0.2 s bias, 0.08 s spread (migration 0004).
    expect(initial.body).toEqual({
      timingBiasS: 0.2,
      timingSdS: 0.08,
      dragCrisisRe: DEFAULT_DRAG_CRISIS_RE,
      distanceUnit: 'm',
      locale: 'en-GB',
      repLimitPerSession: 40,
    });
    expect((await request(t.app).put('/api/club/settings').set(auth(coach)).send({ timingBiasS: 0.1, timingSdS: 0.05 })).status).toBe(403);
    const bad = await request(t.app).put('/api/club/settings').set(auth(admin)).send({ timingBiasS: 0.1, timingSdS: 0.9 });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain('timingSdS');
    expect(JSON.stringify(bad.body)).toContain('at most 0.5 s');
    const missing = await request(t.app).put('/api/club/settings').set(auth(admin)).send({ timingSdS: 0.05 });
    expect(missing.status).toBe(400);
    expect(JSON.stringify(missing.body)).toContain('timingBiasS');
    const ok = await request(t.app).put('/api/club/settings').set(auth(admin)).send({ timingBiasS: 0.15, timingSdS: 0.05 });
    expect(ok.status).toBe(200);
    expect((await request(t.app).get('/api/club/settings').set(auth(coach))).body).toEqual({
      timingBiasS: 0.15,
      timingSdS: 0.05,
      dragCrisisRe: DEFAULT_DRAG_CRISIS_RE,
      distanceUnit: 'm',
      locale: 'en-GB',
      repLimitPerSession: 40,
    });
    await request(t.app).put('/api/club/settings').set(auth(admin)).send({ timingBiasS: 0.2, timingSdS: 0.08 });
  });

  it('infers the spin of timed repetitions per technique, with its uncertainty and the counts', async () => {
    const sessionId = randomUUID();
    const elevationDeg = DEFAULT_ELEVATION_DEG.lofted;
    const trueSpinRps = 5;
    const biasS = 0.2;
    const mutations: unknown[] = [sessionMutation(sessionId)];
    for (const speed of [20, 22, 24]) {
      const flight = simulateKick({ speed, elevationDeg, backspinRps: trueSpinRps, ...conditionsOf(session) });
      // A reading runs long by the club's bias: tapped = true flight time + bias.
      const carryM = Math.round(flight.carryM * 100) / 100;
      mutations.push(kickMutation(sessionId, { carryM, hangTimeS: Math.round((flight.flightTimeS + biasS) * 1000) / 1000 }));
    }
    mutations.push(kickMutation(sessionId, { hangTimeS: 2.5 })); // timed but no carry, and not on target
    mutations.push(kickMutation(sessionId, { carryM: 30, hangTimeS: 9 })); // far too long for 30 m at 32°
    mutations.push(kickMutation(sessionId, { technique: 'driven', outcome: 'on_target', targetDistanceM: 30, hangTimeS: 1.95 }));
    const res = await push(mutations);
    expect((res.body as PushResponse).results.every((r) => r.status === 'applied')).toBeTrue();

    const body = (await request(t.app).get(`/api/players/${playerId}/spin-estimates`).set(auth(coach))).body as SpinEstimatesResponse;
    expect(body.timing).toEqual({ biasS: 0.2, sdS: 0.08 });
    const lofted = body.techniques.find((e) => e.technique === 'lofted')!;
    // 3 solvable + 1 without a carry + 1 impossible; the first spec's timed kick had its time cleared.
    expect(lofted.timedCount).toBe(5);
    expect(lofted.solvedCount).toBe(3);
    expect(lofted.skipped.no_carry).toBe(1);
    expect(lofted.skipped.time_too_long).toBe(1);
    expect(Math.abs(lofted.backspinRps! - trueSpinRps)).toBeLessThan(0.3);
    expect(lofted.backspinUncertaintyRps!).toBeGreaterThan(0.2);
    expect(lofted.backspinUncertaintyRps!).toBeLessThan(3);
    expect(lofted.eyeBackspinRps).toBe(SPIN_STEP_RPS[2]);
    expect(lofted.speedMs!).toBeGreaterThan(20);
    expect(lofted.speedMs!).toBeLessThan(24);
    const driven = body.techniques.find((e) => e.technique === 'driven')!;
    expect(driven.timedCount).toBe(1);
    expect(driven.solvedCount + driven.skipped.time_too_long + driven.skipped.time_too_short).toBe(1);
  });

  it('keeps a player to their own spin estimates', async () => {
    const own = await signIn(t.app, DEMO_ACCOUNTS.player);
    const res = await request(t.app).get(`/api/players/${playerId}/spin-estimates`).set(auth(own.accessToken));
    expect(res.status).toBe(404);
    expect((await request(t.app).get('/api/players/not-a-uuid/spin-estimates').set(auth(coach))).status).toBe(400);
  });
});
