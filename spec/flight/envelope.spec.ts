import {
  curveHitProbability,
  DEFAULT_PRIORS,
  fitProfile,
  hitProbability,
  reachCurve,
  reachEnvelope,
  reliableReachM,
  type KickProfile,
  type ReachEnvelope,
} from '../../shared/flight';

/** A lofted profile with a speed error of `speedSdPct` % around what the target needs and a 29 m/s ceiling. */
function loftedProfile(speedSdPct: number, ceilingMs = 29): KickProfile {
  const base = fitProfile([], { ...DEFAULT_PRIORS.lofted, technique: 'lofted' });
  return {
    ...base,
    meanAzimuthDeg: 0.5,
    sdAzimuthDeg: 2,
    meanAzimuthSeDeg: 0.3,
    backspinRps: 6,
    sdBackspinRps: 1,
    aimedSpeed: {
      offsetLogMean: 0,
      offsetLogSd: speedSdPct / 100,
      offsetLogMeanSe: 0.005,
      offsetLogSdSe: 0.005,
      ceilingMs,
      ceilingLogSe: 0.02,
      typicalTargetM: 40,
    },
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
    expect(reachEnvelope(loftedProfile(2), conditions, { samples: 400, seed: 42, target: { distanceM: 40, radiusM: 3 } })).toEqual(env);
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
    // Aimed at 40 m, the median kick lands near 40 m: the 10 °C air and the light wind move it a little.
    expect(env.aimDistanceM).toBe(40);
    expect(env.carryM.p50).toBeGreaterThan(36);
    expect(env.carryM.p50).toBeLessThan(44);
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
    const tight = reachEnvelope(loftedProfile(2), conditions, { samples: 400, seed: 5, withCurve: false });
    const loose = reachEnvelope(loftedProfile(7), conditions, { samples: 400, seed: 5, withCurve: false });
    // Both are aimed at 40 m; the wind moves both medians alike, so compare at the tight median.
    const target = tight.carryM.p50;
    expect(hitProbability(loose, target, 3)).toBeLessThan(hitProbability(tight, target, 3));
  });

  it('finds reliable reach as the longest target hit at least 60 % of the time', () => {
    const curve = env.curve!;
    const reach = reliableReachM(curve, 5);
    expect(reach).not.toBeNull();
    // The definition itself: P(hit) ≥ 0.6 at the reach, and below 0.6 for every longer target on the 0.1 m grid.
    expect(curveHitProbability(curve, reach!, 5)).toBeGreaterThanOrEqual(0.6);
    for (let d = reach! + 0.1; d < curve.distancesM.at(-1)!; d += 0.1)
      expect(curveHitProbability(curve, Math.round(d * 10) / 10, 5)).toBeLessThan(0.6);
    expect(reliableReachM(curve, 0.2)).toBeNull();
    expect(env.reliableReach).toEqual({ targetRadiusM: 3, minProbability: 0.6, distanceM: reliableReachM(curve, 3) });
  });
});

describe('reach curve (kicks aimed at each distance)', () => {
  const still = {};

  it('lands kicks aimed at a distance on it, to within the interpolation error', () => {
    // With no spread at all, every kick is struck with exactly the speed its target needs in still ISA air,
    // so it must land on the target: the tabulated-and-interpolated landing is checked against the inverse.
    const exact: KickProfile = {
      ...loftedProfile(0),
      sdAzimuthDeg: 0,
      meanAzimuthDeg: 0,
      meanAzimuthSeDeg: 0,
      sdBackspinRps: 0,
      sdSidespinRps: 0,
      sdElevationDeg: 0,
      aimedSpeed: { ...loftedProfile(0).aimedSpeed, offsetLogSd: 0, offsetLogMeanSe: 0, ceilingLogSe: 0, ceilingMs: 60 },
    };
    for (const d of [12, 25, 38, 51]) {
      const env = reachEnvelope(exact, still, { samples: 3, seed: 1, aimDistanceM: d, withCurve: false });
      // Common practice: 0.5 % of the distance is well inside any target radius.
      expect(Math.abs(env.carryM.p50 - d)).toBeLessThan(0.005 * d);
      expect(Math.abs(env.lateralM.p50)).toBeLessThan(0.01);
    }
  });

  it('falls short of targets beyond the ceiling', () => {
    const capped = loftedProfile(3, 20);
    const curve = reachCurve(capped, still, { samples: 200, seed: 3 });
    const within = reachEnvelope(capped, still, { samples: 200, seed: 3, aimDistanceM: 25, withCurve: false });
    const beyond = reachEnvelope(capped, still, { samples: 200, seed: 3, aimDistanceM: 60, withCurve: false });
    expect(Math.abs(within.carryM.p50 - 25)).toBeLessThan(1.5);
    expect(beyond.carryM.p90).toBeLessThan(50);
    expect(curveHitProbability(curve, 60, 3)).toBe(0);
    expect(curveHitProbability(curve, 20, 3)).toBeGreaterThan(0.6);
  });

  it('falls with distance for a player whose error is a share of the speed, and rises with the radius', () => {
    const curve = reachCurve(loftedProfile(4), still, { samples: 300, seed: 9 });
    // A proportional speed error spreads landings more at longer distances (common practice, no source).
    expect(curveHitProbability(curve, 15, 3)).toBeGreaterThan(curveHitProbability(curve, 40, 3));
    expect(curveHitProbability(curve, 40, 5)).toBeGreaterThan(curveHitProbability(curve, 40, 2));
    // The envelope aimed at 40 m flies the same kicks (same samples and seed) that the curve interpolates:
    // they may differ only where the interpolation error moves a landing across the target's edge.
    const env = reachEnvelope(loftedProfile(4), still, { samples: 300, seed: 9, target: { distanceM: 40, radiusM: 3 } });
    expect(Math.abs(env.hit!.probability - curveHitProbability(curve, 40, 3))).toBeLessThan(0.02);
    expect(JSON.parse(JSON.stringify(curve))).toEqual(curve);
  });
});
