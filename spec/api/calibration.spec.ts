import { heldOutCalibration } from '../../api/analysis/calibration';
import { ProfileCache } from '../../api/analysis/profile-cache';
import { demoPeriod } from '../../seed/scenario';
import type { Technique } from '../../shared/schemas/sync';
import { createTestApp, FIXTURE_NOW, type TestApp } from './fixture';

const TIMING = { biasS: 0.2, sdS: 0.08 };

describe('held-out calibration (Squad week)', () => {
  let t: TestApp;
  let weekStart: string;
  let subject: { playerId: string; technique: Technique };
  beforeAll(() => {
    t = createTestApp();
    weekStart = demoPeriod(FIXTURE_NOW).weekStarts.at(-1)!.toISOString().slice(0, 10);
    // A demo player with repetitions of one technique both in the judged week and before it.
    subject = t.db.$client
      .prepare(
        `SELECT player_id AS playerId, technique FROM kicks WHERE deleted_at IS NULL GROUP BY player_id, technique
          HAVING SUM(recorded_at >= @w) >= 5 AND SUM(recorded_at < @w) >= 10 ORDER BY player_id, technique LIMIT 1`,
      )
      .get({ w: weekStart }) as { playerId: string; technique: Technique };
  });
  afterAll(() => t.close());

  it('predicts the week from the repetitions before it: changing the week’s outcomes changes no prediction', () => {
    const before = heldOutCalibration(t.db, subject.playerId, subject.technique, weekStart, TIMING);
    expect(before.reps).toBeGreaterThanOrEqual(5);
    expect(before.predictedHits).not.toBeNull();
    expect(before.predictedHits!).toBeGreaterThanOrEqual(0);
    expect(before.predictedHits!).toBeLessThanOrEqual(before.reps);
    // Out of sample (held out): the judged week's outcomes must not move its own prediction.
    t.db.$client
      .prepare(`UPDATE kicks SET outcome = 'short', carry_m = NULL WHERE player_id = ? AND technique = ? AND recorded_at >= ?`)
      .run(subject.playerId, subject.technique, weekStart);
    const after = heldOutCalibration(t.db, subject.playerId, subject.technique, weekStart, TIMING);
    expect(after.hits).toBe(0);
    expect(after.predictedHits).toBeCloseTo(before.predictedHits!, 9);
  });

  it('predicts each repetition in its own session’s conditions', () => {
    const calm = heldOutCalibration(t.db, subject.playerId, subject.technique, weekStart, TIMING);
    // A gale across the week's sessions scatters the kicks (first principles: drift grows with the wind speed).
    t.db.$client
      .prepare(
        `UPDATE training_sessions SET wind_speed_ms = 14, wind_from_deg = 90
          WHERE id IN (SELECT session_id FROM kicks WHERE player_id = ? AND technique = ? AND recorded_at >= ?)`,
      )
      .run(subject.playerId, subject.technique, weekStart);
    const windy = heldOutCalibration(t.db, subject.playerId, subject.technique, weekStart, TIMING);
    expect(windy.predictedHits!).toBeLessThan(calm.predictedHits!);
  });

  it('is computed by the refresher and served from the cache until the kicks change', () => {
    const cache = new ProfileCache(t.db);
    expect(cache.calibration(subject.playerId, subject.technique, weekStart)).toBe('pending');
    expect(cache.queued).toBe(1);
    cache.storeCalibration(cache.computeCalibration(subject.playerId, subject.technique, weekStart));
    const served = cache.calibration(subject.playerId, subject.technique, weekStart);
    expect(served).not.toBe('pending');
    t.db.$client
      .prepare(`UPDATE kicks SET change_seq = change_seq + 100000 WHERE player_id = ? AND technique = ? AND recorded_at >= ? `)
      .run(subject.playerId, subject.technique, weekStart);
    expect(cache.calibration(subject.playerId, subject.technique, weekStart)).toBe('pending');
  });
});
