import {
  DEFAULT_PRIORS,
  fitProfile,
  hitProbability,
  reachEnvelope,
  reliableReachM,
  type KickProfile,
  type ReachEnvelope,
} from '../../shared/flight';

function loftedProfile(sdSpeedMs: number): KickProfile {
  const base = fitProfile([], { ...DEFAULT_PRIORS.lofted, technique: 'lofted' });
  return {
    ...base,
    meanSpeedMs: 24,
    sdSpeedMs,
    meanSpeedSeMs: 0.2,
    meanAzimuthDeg: 0.5,
    sdAzimuthDeg: 2,
    meanAzimuthSeDeg: 0.3,
    backspinRps: 6,
    sdBackspinRps: 1,
  };
}

describe('reachEnvelope (seeded Monte Carlo)', () => {
  const conditions = { air: { temperatureC: 10 }, wind: { speedMs: 3, fromDeg: 30 } };
  let env: ReachEnvelope;
  beforeAll(() => {
    env = reachEnvelope(loftedProfile(2), conditions, {
      samples: 400,
      seed: 42,
      target: { distanceM: 40, radiusM: 3 },
    });
  });

  it('is reproducible for a seed and differs for another seed', () => {
    // Seeded Monte Carlo is deterministic by construction (xoshiro128**, Blackman & Vigna 2018).
    expect(
      reachEnvelope(loftedProfile(2), conditions, { samples: 400, seed: 42, target: { distanceM: 40, radiusM: 3 } }),
    ).toEqual(env);
    const other = reachEnvelope(loftedProfile(2), conditions, {
      samples: 400,
      seed: 43,
      target: { distanceM: 40, radiusM: 3 },
    });
    expect(other.carryM.p50).not.toBe(env.carryM.p50);
  });

  it('summarises the cloud consistently', () => {
    expect(env.cloud.xM.length).toBe(400);
    expect(env.landedShare).toBe(1);
    // Percentiles are ordered by definition (Hyndman & Fan 1996, type 7).
    expect(env.carryM.p10).toBeLessThan(env.carryM.p50);
    expect(env.carryM.p50).toBeLessThan(env.carryM.p90);
    expect(env.lateralM.p10).toBeLessThan(env.lateralM.p90);
    expect(env.ellipse.semiMajorM).toBeGreaterThanOrEqual(env.ellipse.semiMinorM);
    expect(env.ellipse.semiMinorM).toBeGreaterThan(0);
    // Common practice (no source): a 24 m/s lofted pass at 32° carries roughly 35–50 m.
    expect(env.carryM.p50).toBeGreaterThan(35);
    expect(env.carryM.p50).toBeLessThan(50);
  });

  it('gives hit probabilities within [0, 1], also from the JSON result', () => {
    const json = JSON.parse(JSON.stringify(env)) as ReachEnvelope;
    expect(env.hit!.probability).toBe(hitProbability(json, 40, 3));
    for (const d of [10, 30, 38, 42, 45, 80]) {
      for (const r of [1, 3, 8]) {
        const p = hitProbability(json, d, r, 0.5);
        expect(p).toBeGreaterThanOrEqual(0);
        expect(p).toBeLessThanOrEqual(1);
      }
    }
    expect(hitProbability(json, 400, 3)).toBe(0);
    expect(hitProbability(json, env.carryM.p50, 60)).toBe(1);
  });

  it('predicts a lower hit probability when the player is less consistent', () => {
    // Common practice (no source): more spread, fewer hits. Same seed, so only the spread differs.
    const tight = reachEnvelope(loftedProfile(1), conditions, { samples: 400, seed: 5 });
    const loose = reachEnvelope(loftedProfile(3.5), conditions, { samples: 400, seed: 5 });
    const target = tight.carryM.p50;
    expect(hitProbability(loose, target, 3)).toBeLessThan(hitProbability(tight, target, 3));
  });

  it('finds reliable reach as the longest target hit at least 60 % of the time', () => {
    const reach = reliableReachM(env, 5);
    expect(reach).not.toBeNull();
    // The definition itself: P(hit) ≥ 0.6 at the reach, and below 0.6 for every longer target on the 0.1 m grid.
    expect(hitProbability(env, reach!, 5)).toBeGreaterThanOrEqual(0.6);
    for (let d = reach! + 0.1; d < env.carryM.p90 + 10; d += 0.1)
      expect(hitProbability(env, Math.round(d * 10) / 10, 5)).toBeLessThan(0.6);
    expect(reliableReachM(env, 0.5)).toBeNull();
    expect(env.reliableReach).toEqual({ targetRadiusM: 3, minProbability: 0.6, distanceM: reliableReachM(env, 3) });
  });
});
