import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { kicks, players } from '../../api/db/schema';
import { DEMO_ACCOUNTS, DEMO_SQUAD_IDS } from '../../seed/scenario';
import { prepareKick } from '../../shared/flight/profile-observations';
import type { PullResponse, PushResponse, VideoTrack } from '../../shared/schemas/sync';
import { createTestApp, signIn, type TestApp } from './fixture';

/** A plausible video track: five taps and two ground marks 20 m apart, solved to 2.5 rev/s of topspin. */
function track(overrides: Partial<VideoTrack> = {}): VideoTrack {
  return {
    frameWidthPx: 1280,
    frameHeightPx: 720,
    points: [0.1, 0.15, 0.2, 0.25, 0.3].map((tS, i) => ({ tS, xPx: 200 + 60 * i, yPx: 600 - 40 * i })),
    calibration: { a: { xPx: 150, yPx: 640, alongM: 0 }, b: { xPx: 1150, yPx: 640, alongM: 20 } },
    backspinRps: -2.5,
    contactTimeS: 0.08,
    rmsResidualPx: 1.4,
    uncertainty: { speedMs: 0.3, elevationDeg: 0.4, backspinRps: 1.1 },
    ...overrides,
  };
}

describe('video measurements of kicks through sync', () => {
  let t: TestApp;
  let token: string;
  let sessionId: string;
  let playerId: string;

  const push = (mutations: unknown[]) =>
    request(t.app).post('/api/sync/push').set('Authorization', `Bearer ${token}`).send({ deviceId: 'video-phone', mutations });
  const kickUpsert = (data: Record<string, unknown>, baseVersion?: number) => ({
    id: randomUUID(),
    entity: 'kick',
    op: 'upsert',
    ...(baseVersion ? { baseVersion } : {}),
    data: {
      sessionId,
      playerId,
      technique: 'driven',
      foot: 'left',
      backspinStep: -1,
      sidespinStep: 0,
      targetDistanceM: 25,
      targetRadiusM: 2,
      outcome: 'long',
      recordedAt: '2026-11-21T10:00:00.000Z',
      ...data,
    },
  });
  const measured = { measuredSource: 'video', measuredSpeedMs: 24.2, launchAngleDeg: 11.5, measuredSpinRps: 2.5, videoTrack: track() };

  beforeAll(async () => {
    t = createTestApp();
    token = (await signIn(t.app, DEMO_ACCOUNTS.assistant_coach)).accessToken;
    playerId = t.db.select().from(players).where(eq(players.squadId, DEMO_SQUAD_IDS.u16)).all()[0]!.id;
    sessionId = randomUUID();
    const res = await push([
      {
        id: randomUUID(),
        entity: 'training_session',
        op: 'upsert',
        data: { id: sessionId, squadId: DEMO_SQUAD_IDS.u16, startedAt: '2026-11-21T09:45:00Z', ballSize: 5 },
      },
    ]);
    expect((res.body as PushResponse).results[0]!.status).toBe('applied');
  });
  afterAll(() => t.close());

  it('stores a video measurement with its source and track, and pulls it back unchanged', async () => {
    const id = randomUUID();
    const res = await push([kickUpsert({ id, ...measured })]);
    expect((res.body as PushResponse).results.map((r) => r.status)).toEqual(['applied']);
    const row = t.db.select().from(kicks).where(eq(kicks.id, id)).get()!;
    expect(row.measuredSource).toBe('video');
    expect(row.measuredSpeedMs).toBe(24.2);
    expect(JSON.parse(row.videoTrackJson!)).toEqual(track());
    // The push answered with the club's latest change: pull from just before it.
    const cursor = (res.body as PushResponse).cursor;
    const pulled = await request(t.app)
      .get(`/api/sync/pull?since=${cursor - 1}`)
      .set('Authorization', `Bearer ${token}`);
    const change = (pulled.body as PullResponse).changes.find((c) => c.data.id === id)!;
    expect(change.data['measuredSource']).toBe('video');
    expect(change.data['videoTrack']).toEqual(track());
  });

  it('keeps the measurement when an older client edits the kick without the new fields, and clears it on null', async () => {
    const id = randomUUID();
    await push([kickUpsert({ id, ...measured })]);
    const older = await push([
      kickUpsert({ id, outcome: 'on_target', measuredSpeedMs: 24.2, launchAngleDeg: 11.5, measuredSpinRps: 2.5 }, 1),
    ]);
    expect((older.body as PushResponse).results[0]!.status).toBe('applied');
    let row = t.db.select().from(kicks).where(eq(kicks.id, id)).get()!;
    expect(row.outcome).toBe('on_target');
    expect(row.measuredSource).toBe('video');
    expect(row.videoTrackJson).not.toBeNull();
    const cleared = await push([
      kickUpsert({ id, measuredSource: null, videoTrack: null, measuredSpeedMs: null, launchAngleDeg: null, measuredSpinRps: null }, 2),
    ]);
    expect((cleared.body as PushResponse).results[0]!.status).toBe('applied');
    row = t.db.select().from(kicks).where(eq(kicks.id, id)).get()!;
    expect(row.measuredSource).toBeNull();
    expect(row.videoTrackJson).toBeNull();
  });

  it('rejects inconsistent or out-of-bounds video measurements naming the field, and stores nothing', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ ...measured, videoTrack: undefined }, 'data.videoTrack'],
      [{ ...measured, measuredSpeedMs: undefined }, 'data.measuredSpeedMs'],
      [{ ...measured, measuredSource: 'device' }, 'data.measuredSource'],
      [{ ...measured, measuredSource: 'radar' }, 'data.measuredSource'],
      [{ ...measured, measuredSpinRps: 6 }, 'data.measuredSpinRps'],
      [{ ...measured, videoTrack: track({ points: track().points.slice(0, 3) }) }, 'data.videoTrack.points'],
      [{ ...measured, videoTrack: track({ frameWidthPx: 100000 }) }, 'data.videoTrack.frameWidthPx'],
      [{ ...measured, videoTrack: track({ backspinRps: -40 }) }, 'data.videoTrack.backspinRps'],
      [{ ...measured, videoTrack: { ...track(), videoFile: 'clip.mp4' } }, 'data.videoTrack'],
      [{ ...measured, measuredSpeedMs: 60 }, 'data.measuredSpeedMs'],
    ];
    for (const [data, field] of cases) {
      const id = randomUUID();
      const res = await push([kickUpsert({ id, ...data })]);
      const result = (res.body as PushResponse).results[0]!;
      expect(result.status).withContext(field).toBe('rejected');
      expect(result.error?.fields?.some((f) => f.field.startsWith(field)))
        .withContext(`${field}: ${JSON.stringify(result.error?.fields)}`)
        .toBeTrue();
      expect(t.db.select().from(kicks).where(eq(kicks.id, id)).get()).toBeUndefined();
    }
  });
});

describe('the profile fit reading a video-measured launch', () => {
  const base = { technique: 'driven', outcome: 'long', targetDistanceM: 25, targetRadiusM: 2, sidespinStep: 1 } as const;

  it('takes the video spin as the backspin component, signed by the logged step, and keeps the logged sidespin', () => {
    const top = prepareKick({ ...base, backspinStep: -1, measuredSpinRps: 2.5, launchAngleDeg: 11.5, measuredSource: 'video' }, 0);
    expect(top.backspinRps).toBe(-2.5);
    // Default sidespin step 1 = 4 rev/s (docs/design.md §6 spin steps).
    expect(top.sidespinRps).toBe(4);
    expect(top.angleMeasured).toBeTrue();
    expect(top.spinMeasured).toBeTrue();
    // A device's total rate is shared out over the logged directions instead.
    const device = prepareKick({ ...base, backspinStep: -1, measuredSpinRps: 5, measuredSource: 'device' }, 0);
    expect(Math.hypot(device.backspinRps, device.sidespinRps)).toBeCloseTo(5, 9);
  });
});
