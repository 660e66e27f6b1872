/**
 * `/api/grounds`: the club's training grounds, and the conditions measured at them through the local
 * fake weather service over real HTTP — cache, timeout and error modes, and the session that stores them.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { backfillStillAirCarry } from '../../api/analysis/still-air';
import { conditionsOf, stillAirCarryM } from '../../api/analysis/flight-inputs';
import { groundConditions, kicks, trainingGrounds, trainingSessions } from '../../api/db/schema';
import { startFakeWeather, type FakeWeather } from '../../api/weather/fake-weather';
import { resolveAir } from '../../shared/flight/atmosphere';
import type { GroundConditions, MeasuredConditions } from '../../shared/schemas/grounds';
import { DEMO_ACCOUNTS, DEMO_GROUND_ID, DEMO_SQUAD_IDS } from '../../seed/scenario';
import { createTestApp, OTHER_CLUB, signIn, type TestApp } from './fixture';

// The demo ground (seed/scenario.ts).
const GROUND = { latitude: 52.7713, longitude: -1.5528, altitudeM: 88, kickingBearingDeg: 205 };

describe('/api/grounds', () => {
  let fake: FakeWeather;
  let t: TestApp;
  let admin = '';
  let coach = '';
  let player = '';
  let otherCoach = '';
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    fake = await startFakeWeather(0);
    t = createTestApp({ weatherUrl: fake.url });
    admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
    coach = (await signIn(t.app, DEMO_ACCOUNTS.assistant_coach)).accessToken;
    player = (await signIn(t.app, DEMO_ACCOUNTS.player)).accessToken;
    otherCoach = (await signIn(t.app, OTHER_CLUB.coachEmail)).accessToken;
  }, 60_000);
  afterAll(async () => {
    t.close();
    await fake.close();
  });
  beforeEach(() => {
    fake.setMode('normal');
    fake.clearPins();
    t.db.delete(groundConditions).run();
  });

  const conditions = async (token = coach, id = DEMO_GROUND_ID): Promise<GroundConditions> => {
    const res = await request(t.app).get(`/api/grounds/${id}/conditions`).set(auth(token));
    expect(res.status).withContext(JSON.stringify(res.body)).toBe(200);
    return res.body as GroundConditions;
  };

  describe('grounds', () => {
    it('lists the club’s grounds for staff, not for players or other clubs', async () => {
      const res = await request(t.app).get('/api/grounds').set(auth(coach));
      expect(res.status).toBe(200);
      expect(res.body.grounds).toEqual([
        jasmine.objectContaining({ id: DEMO_GROUND_ID, name: 'Longmere Lane Training Centre', ...GROUND }),
      ]);
      expect((await request(t.app).get('/api/grounds').set(auth(player))).status).toBe(403);
      expect((await request(t.app).get('/api/grounds').set(auth(otherCoach))).body.grounds).toEqual([]);
      expect((await request(t.app).get(`/api/grounds/${DEMO_GROUND_ID}/conditions`).set(auth(otherCoach))).status).toBe(404);
    });

    it('lets admins add and correct a ground, and names each bad field', async () => {
      const created = await request(t.app)
        .post('/api/grounds')
        .set(auth(admin))
        .send({ name: 'Hollin Moor', latitude: 53.5, longitude: -2.1, altitudeM: 240, kickingBearingDeg: 90 });
      expect(created.status).toBe(201);
      const id = created.body.id as string;
      const updated = await request(t.app)
        .put(`/api/grounds/${id}`)
        .set(auth(admin))
        .send({ name: 'Hollin Moor (top pitch)', latitude: 53.5, longitude: -2.1, altitudeM: 245, kickingBearingDeg: 270 });
      expect(updated.status).toBe(200);
      expect(updated.body).toEqual({
        id,
        name: 'Hollin Moor (top pitch)',
        latitude: 53.5,
        longitude: -2.1,
        altitudeM: 245,
        kickingBearingDeg: 270,
      });

      const bad = await request(t.app)
        .post('/api/grounds')
        .set(auth(admin))
        .send({ name: '', latitude: 95, longitude: -2.1, altitudeM: 240, kickingBearingDeg: 360 });
      expect(bad.status).toBe(400);
      const fields = (bad.body.error.fields as { field: string; message: string }[]).map((f) => f.field).sort();
      expect(fields).toEqual(['kickingBearingDeg', 'latitude', 'name']);
      expect(bad.body.error.message).toContain('latitude: latitude must be at most 90°');

      expect((await request(t.app).post('/api/grounds').set(auth(coach)).send({})).status).toBe(403);
      const foreign = await request(t.app)
        .put(`/api/grounds/${randomUUID()}`)
        .set(auth(admin))
        .send({ name: 'Elsewhere', latitude: 53.5, longitude: -2.1, altitudeM: 245, kickingBearingDeg: 270 });
      expect(foreign.status).toBe(404);
      t.db.delete(trainingGrounds).where(eq(trainingGrounds.id, id)).run();
    });

    it('gives each squad its ground with the kicking bearing', async () => {
      const res = await request(t.app).get('/api/squads').set(auth(coach));
      const u16 = (res.body.squads as { id: string; ground: unknown }[]).find((s) => s.id === DEMO_SQUAD_IDS.u16);
      expect(u16?.ground).toEqual({ id: DEMO_GROUND_ID, name: 'Longmere Lane Training Centre', altitudeM: 88, kickingBearingDeg: 205 });
    });
  });

  describe('conditions', () => {
    it('turns a wind from the kicking direction into a headwind, in m/s', async () => {
      // 21.6 km/h = 6 m/s exactly (SI), from the ground's own kicking bearing (WMO from-direction).
      fake.pin({
        ...GROUND,
        windSpeedKmh: 21.6,
        windFromDeg: GROUND.kickingBearingDeg,
        temperatureC: 9.5,
        relativeHumidityPct: 82,
        surfacePressureHpa: 1001.4,
      });
      const c = (await conditions()) as MeasuredConditions;
      expect(c).toEqual(
        jasmine.objectContaining({
          source: 'weather',
          groundId: DEMO_GROUND_ID,
          windSpeedMs: 6,
          windFromDeg: 0,
          windFromBearingDeg: 205,
          temperatureC: 9.5,
          relativeHumidityPct: 82,
          pressureHpa: 1001.4,
          altitudeM: 88,
        }),
      );
      expect(Date.parse(c.observedAt)).toBeLessThanOrEqual(Date.parse(c.fetchedAt));
    });

    it('turns a north wind on a pitch kicked south-south-west into a following wind from the right', async () => {
      // Kicking 205°, wind from 0°: relative (205 − 0) = 205°, i.e. behind and to the right of the kicker.
      fake.pin({ ...GROUND, windSpeedKmh: 36, windFromDeg: 0 });
      const c = (await conditions()) as MeasuredConditions;
      expect([c.windSpeedMs, c.windFromDeg]).toEqual([10, 205]);
    });

    it('asks the service once for two requests within ten minutes, and again after', async () => {
      const before = fake.calls;
      const first = await conditions();
      const second = await conditions(admin);
      expect(fake.calls - before).toBe(1);
      expect(second).toEqual(first);
      // Eleven minutes later the cached answer is stale.
      t.db
        .update(groundConditions)
        .set({ fetchedAt: new Date(Date.now() - 11 * 60_000).toISOString() })
        .run();
      await conditions();
      expect(fake.calls - before).toBe(2);
    });

    it('shares one call between simultaneous requests', async () => {
      const before = fake.calls;
      const both = await Promise.all([conditions(), conditions(admin)]);
      expect(fake.calls - before).toBe(1);
      expect(both[1]).toEqual(both[0]);
    });

    it('asks again when the ground’s coordinates were corrected', async () => {
      const before = fake.calls;
      await conditions();
      t.db.update(trainingGrounds).set({ latitude: 52.7714 }).where(eq(trainingGrounds.id, DEMO_GROUND_ID)).run();
      try {
        await conditions();
        expect(fake.calls - before).toBe(2);
      } finally {
        t.db.update(trainingGrounds).set({ latitude: GROUND.latitude }).where(eq(trainingGrounds.id, DEMO_GROUND_ID)).run();
      }
    });

    it('answers "unavailable" within about 2 s when the service hangs, and a session still starts', async () => {
      fake.setMode('timeout');
      const started = Date.now();
      const c = await conditions();
      const tookMs = Date.now() - started;
      expect(c).toEqual({ source: 'unavailable', groundId: DEMO_GROUND_ID, reason: 'The weather service did not answer within 2 s' });
      // The server's own timeout is 2 s; a little slack for the request itself.
      expect(tookMs).toBeGreaterThanOrEqual(1900);
      expect(tookMs).toBeLessThan(2600);
      expect(t.db.select().from(groundConditions).all()).toEqual([]);
      await pushManualSession();
    });

    it('answers "unavailable" with the reason when the service fails, and a session still starts', async () => {
      fake.setMode('error');
      const started = Date.now();
      const c = await conditions();
      expect(Date.now() - started).toBeLessThan(2000);
      expect(c.source).toBe('unavailable');
      expect((c as { reason: string }).reason).toContain('500');
      await pushManualSession();
    });

    it('answers "unavailable" without a configured service', async () => {
      const bare = createTestApp();
      try {
        const token = (await signIn(bare.app, DEMO_ACCOUNTS.assistant_coach)).accessToken;
        const res = await request(bare.app).get(`/api/grounds/${DEMO_GROUND_ID}/conditions`).set(auth(token));
        expect(res.body).toEqual({
          source: 'unavailable',
          groundId: DEMO_GROUND_ID,
          reason: 'No weather service is configured on this server',
        });
      } finally {
        bare.close();
      }
    });

    it('refuses a ground id that is not a UUID', async () => {
      const res = await request(t.app).get('/api/grounds/nope/conditions').set(auth(coach));
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toEqual([{ field: 'body', message: 'id must be a UUID' }]);
    });
  });

  /** Pushes a session whose conditions are the coach's taps (what the phone does when the weather is unavailable). */
  async function pushManualSession(): Promise<void> {
    const id = randomUUID();
    const res = await request(t.app)
      .post('/api/sync/push')
      .set(auth(coach))
      .send({
        deviceId: 'spec',
        mutations: [
          {
            id: randomUUID(),
            entity: 'training_session',
            op: 'upsert',
            data: {
              id,
              squadId: DEMO_SQUAD_IDS.u16,
              groundId: DEMO_GROUND_ID,
              startedAt: new Date().toISOString(),
              temperatureC: 12,
              windSpeedMs: 3,
              windFromDeg: 0,
              ballSize: 5,
              conditionsSource: { temperatureC: 'coach', windSpeedMs: 'coach', windFromDeg: 'coach' },
            },
          },
        ],
      });
    expect(res.body.results[0].status).toBe('applied');
    expect(t.db.select().from(trainingSessions).where(eq(trainingSessions.id, id)).get()?.windSpeedMs).toBe(3);
  }

  describe('a session with measured conditions', () => {
    it('stores values, sources and the observation time, and the flight model uses them', async () => {
      fake.pin({
        ...GROUND,
        windSpeedKmh: 21.6,
        windFromDeg: GROUND.kickingBearingDeg,
        temperatureC: 24,
        relativeHumidityPct: 90,
        surfacePressureHpa: 985,
      });
      const c = (await conditions()) as MeasuredConditions;
      const sessionId = randomUUID();
      const session = {
        id: sessionId,
        squadId: DEMO_SQUAD_IDS.u16,
        groundId: DEMO_GROUND_ID,
        startedAt: new Date().toISOString(),
        temperatureC: c.temperatureC,
        relativeHumidityPct: c.relativeHumidityPct,
        pressureHpa: c.pressureHpa,
        altitudeM: c.altitudeM,
        windSpeedMs: c.windSpeedMs,
        windFromDeg: c.windFromDeg,
        ballSize: 5,
        conditionsSource: {
          temperatureC: 'weather',
          relativeHumidityPct: 'weather',
          pressureHpa: 'weather',
          windSpeedMs: 'weather',
          windFromDeg: 'weather',
          altitudeM: 'ground',
          ballSize: 'default',
        },
        conditionsObservedAt: c.observedAt,
      };
      const kick = {
        id: randomUUID(),
        sessionId,
        playerId: await u16PlayerId(),
        technique: 'lofted',
        foot: 'right',
        backspinStep: 2,
        sidespinStep: 0,
        targetDistanceM: 35,
        targetRadiusM: 3,
        outcome: 'on_target',
        carryM: 34,
        recordedAt: new Date().toISOString(),
      };
      const res = await request(t.app)
        .post('/api/sync/push')
        .set(auth(coach))
        .send({
          deviceId: 'spec',
          mutations: [
            { id: randomUUID(), entity: 'training_session', op: 'upsert', data: session },
            { id: randomUUID(), entity: 'kick', op: 'upsert', data: kick },
          ],
        });
      expect(res.body.results.map((r: { status: string }) => r.status)).toEqual(['applied', 'applied']);
      const row = t.db.select().from(trainingSessions).where(eq(trainingSessions.id, sessionId)).get()!;
      expect(row).toEqual(
        jasmine.objectContaining({
          groundId: DEMO_GROUND_ID,
          windSpeedMs: 6,
          windFromDeg: 0,
          pressureHpa: 985,
          relativeHumidityPct: 90,
          conditionsObservedAt: c.observedAt,
        }),
      );
      expect(JSON.parse(row.conditionsSourceJson ?? '{}')).toEqual(session.conditionsSource);

      // The model reads humidity and pressure: warm, humid, low-pressure air is thinner than ISA.
      const air = conditionsOf(row).air;
      expect(air).toEqual({ temperatureC: 24, altitudeM: 88, relativeHumidityPct: 90, pressureHpa: 985 });
      expect(resolveAir(air).densityKgM3).toBeLessThan(resolveAir({ altitudeM: 88 }).densityKgM3 - 0.05);
      // A 34 m carry into a 6 m/s headwind is worth more than 34 m in still ISA air.
      backfillStillAirCarry(t.db);
      const stored = t.db.select().from(kicks).where(eq(kicks.id, kick.id)).get()!;
      expect(stored.stillAirCarryM).toBe(stillAirCarryM(stored, row));
      expect(stored.stillAirCarryM!).toBeGreaterThan(34);

      // An older client's edit (no groundId, no observation time) keeps what the server has.
      const pulled = await request(t.app)
        .get(`/api/sync/pull?since=${Number(res.body.cursor) - 2}`)
        .set(auth(coach));
      const synced = (
        pulled.body.changes as { data: { id: string; groundId: string; conditionsObservedAt: string; version: number } }[]
      ).find((ch) => ch.data.id === sessionId)!;
      expect([synced.data.groundId, synced.data.conditionsObservedAt]).toEqual([DEMO_GROUND_ID, c.observedAt]);
      const { groundId: _g, conditionsObservedAt: _o, ...older } = session;
      const edit = await request(t.app)
        .post('/api/sync/push')
        .set(auth(coach))
        .send({
          deviceId: 'spec',
          mutations: [
            {
              id: randomUUID(),
              entity: 'training_session',
              op: 'upsert',
              baseVersion: synced.data.version,
              data: { ...older, notes: 'gusty' },
            },
          ],
        });
      expect(edit.body.results[0].status).toBe('applied');
      const after = t.db.select().from(trainingSessions).where(eq(trainingSessions.id, sessionId)).get()!;
      expect([after.groundId, after.conditionsObservedAt, after.notes]).toEqual([DEMO_GROUND_ID, c.observedAt, 'gusty']);
    });

    it('rejects a session on another club’s or an unknown ground, naming the field', async () => {
      const res = await request(t.app)
        .post('/api/sync/push')
        .set(auth(coach))
        .send({
          deviceId: 'spec',
          mutations: [
            {
              id: randomUUID(),
              entity: 'training_session',
              op: 'upsert',
              data: {
                id: randomUUID(),
                squadId: DEMO_SQUAD_IDS.u16,
                groundId: randomUUID(),
                startedAt: new Date().toISOString(),
                ballSize: 5,
              },
            },
          ],
        });
      expect(res.body.results[0]).toEqual(jasmine.objectContaining({ status: 'rejected' }));
      expect(res.body.results[0].error.fields).toEqual([{ field: 'data.groundId', message: 'Unknown training ground' }]);
    });
  });

  async function u16PlayerId(): Promise<string> {
    const res = await request(t.app).get(`/api/players?squadId=${DEMO_SQUAD_IDS.u16}`).set(auth(coach));
    return (res.body.players as { id: string }[])[0]!.id;
  }
});
