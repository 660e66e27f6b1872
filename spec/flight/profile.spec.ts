import { DEFAULT_CEILINGS_MS, DEFAULT_PRIORS, fitProfile, simulateKick, solveLaunchSpeed, type LoggedKick } from '../../shared/flight';
import { syntheticAimed, type AimedTruth } from './support/synthetic-logs';

describe('fitProfile (interval-censored maximum likelihood with shrinkage)', () => {
  const truth: AimedTruth = {
    offsetLogMean: -0.03,
    offsetLogSd: 0.05,
    ceilingMs: Number.POSITIVE_INFINITY,
    meanAzimuthDeg: 1,
    sdAzimuthDeg: 2.5,
  };

  for (const seed of [101, 202]) {
    it(`recovers a known aimed-speed distribution from censored logs at mixed targets (seed ${seed})`, () => {
      // The angle as a device reads it: with an assumed angle spread, the launch-noise scale and σ trade off and
      // neither is identified on its own (the synthetic player's launch is exact).
      const logs = syntheticAimed(150, seed, truth, [24, 30, 36, 42, 48]).map((k) => ({ ...k, launchAngleDeg: 32 }));
      const p = fitProfile(logs);
      const a = p.aimedSpeed;
      // Asymptotic normality of the maximum-likelihood estimate (Casella & Berger, Statistical Inference, 2nd ed., §10.1): within 3 SE w.p. ≈ 0.997.
      expect(Math.abs(a.offsetLogMean - truth.offsetLogMean)).toBeLessThan(3 * a.offsetLogMeanSe);
      expect(Math.abs(a.offsetLogSd - truth.offsetLogSd)).toBeLessThan(3 * a.offsetLogSdSe);
      expect(Math.abs(p.meanAzimuthDeg - truth.meanAzimuthDeg)).toBeLessThan(3 * p.meanAzimuthSeDeg);
      // The uncertainty must be informative: 150 censored repetitions pin the offset to well under 3 %.
      expect(a.offsetLogMeanSe).toBeGreaterThan(0.002);
      expect(a.offsetLogMeanSe).toBeLessThan(0.03);
      expect(p.repetitions).toBe(150);
      expect(p.observations.speedPoints).toBe(0);
      expect(a.typicalTargetM).toBe(36);
    });
  }

  it('does not mistake drills at different distances for an inconsistent player', () => {
    // The same player at targets 20 m apart: speeds differ by the distance, not by inconsistency, so the
    // fitted spread stays the player's own 5 % (within 3 SE, Casella & Berger §10.1).
    const logs = syntheticAimed(160, 7, truth, [22, 44]);
    const p = fitProfile(logs);
    expect(Math.abs(p.aimedSpeed.offsetLogSd - truth.offsetLogSd)).toBeLessThan(3 * p.aimedSpeed.offsetLogSdSe);
    expect(p.aimedSpeed.offsetLogSd).toBeLessThan(0.08);
  });

  it('finds the speed ceiling when far targets fall short', () => {
    const capped: AimedTruth = { ...truth, ceilingMs: 21 };
    const p = fitProfile(syntheticAimed(200, 11, capped, [25, 35, 45, 55, 65]));
    // The prior ceiling for lofted balls is 29 m/s; the logs must pull it down to near the truth.
    expect(DEFAULT_CEILINGS_MS.lofted).toBe(29);
    expect(Math.abs(Math.log(p.aimedSpeed.ceilingMs / 21))).toBeLessThan(Math.max(0.06, 3 * p.aimedSpeed.ceilingLogSe));
    expect(p.aimedSpeed.ceilingLogSe).toBeLessThan(0.1);
  });

  it('shrinks toward the prior with few repetitions and less so with many', () => {
    const need30 = solveLaunchSpeed({ carryM: 30, elevationDeg: 32, backspinRps: 6 })!;
    const measured = (n: number): LoggedKick[] =>
      Array.from({ length: n }, (_, i) => ({
        technique: 'lofted' as const,
        outcome: 'long' as const,
        targetDistanceM: 30,
        targetRadiusM: 3,
        backspinStep: 2 as const,
        sidespinStep: 0 as const,
        measuredSpeedMs: need30 * 1.1 * (1 + 0.02 * ((i % 3) - 1)),
      }));
    const few = fitProfile(measured(2));
    const many = fitProfile(measured(60));
    const observed = Math.log(1.1);
    // Normal mean with a normal prior (here μ₀ = 0): the posterior mean is precision-weighted (Gelman et al., Bayesian Data Analysis, 3rd ed., §2.5).
    expect(few.aimedSpeed.offsetLogMean).toBeGreaterThan(0);
    expect(few.aimedSpeed.offsetLogMean).toBeLessThan(observed);
    expect(many.aimedSpeed.offsetLogMean).toBeGreaterThan(few.aimedSpeed.offsetLogMean);
    expect(Math.abs(many.aimedSpeed.offsetLogMean - observed)).toBeLessThan(0.01);
    expect(many.aimedSpeed.offsetLogMeanSe).toBeLessThan(few.aimedSpeed.offsetLogMeanSe);
    expect(few.repetitions).toBe(2);
    expect(few.observations.speedPoints).toBe(2);
  });

  it('turns logged carries into point observations through the inverse', () => {
    const speeds = [22, 23.5, 25, 24, 26, 23];
    const logs: LoggedKick[] = speeds.map((speed) => ({
      technique: 'lofted',
      outcome: 'on_target',
      targetDistanceM: 40,
      targetRadiusM: 3,
      backspinStep: 2,
      sidespinStep: 0,
      carryM: simulateKick({ speed, elevationDeg: 32, backspinRps: 6 }).carryM,
      // The launch as a device reads it: an eye-logged step leaves the spin, and so the speed a carry needs, uncertain.
      launchAngleDeg: 32,
      measuredSpinRps: 6,
    }));
    const p = fitProfile(logs, { ...DEFAULT_PRIORS.lofted, weightReps: 0.1 });
    expect(p.observations.speedPoints).toBe(6);
    // With a negligible prior the MLE of a normal mean of ln v is the mean of ln v (Casella & Berger, §7.2):
    // the fitted speed at the typical target is the geometric mean of the speeds.
    const geometricMean = Math.exp(speeds.reduce((a, b) => a + Math.log(b), 0) / speeds.length);
    expect(Math.abs(p.meanSpeedMs - geometricMean)).toBeLessThan(0.05);
  });

  it('weighs timed repetitions more than untimed ones and takes their measured backspin', () => {
    // Kicks with 7 rev/s of backspin that the coach logged by eye as "light backspin" (3 rev/s), each with a
    // paced carry and a stopwatch reading: the true flight time plus the club's 0.2 s delay.
    const rng = { i: 0, next: () => [0.4, -0.9, 1.3, -0.2, 0.7, -1.1, 0.1, 0.9, -0.5, 0.3][rng.i++ % 10]! };
    const logs: LoggedKick[] = Array.from({ length: 12 }, () => {
      const speed = 22 * Math.exp(0.05 * rng.next());
      const f = simulateKick({ speed, elevationDeg: 32, backspinRps: 7 });
      return {
        technique: 'lofted' as const,
        outcome: 'on_target' as const,
        targetDistanceM: 40,
        targetRadiusM: 3,
        backspinStep: 1 as const,
        sidespinStep: 0 as const,
        carryM: Math.round(f.carryM * 2) / 2,
        hangTimeS: f.flightTimeS + 0.2,
      };
    });
    const timing = { biasS: 0.2, sdS: 0.03 };
    const timed = fitProfile(logs, undefined, { timing });
    const untimed = fitProfile(
      logs.map((l) => ({ ...l, hangTimeS: null })),
      undefined,
      { timing },
    );
    expect(timed.observations.timed).toBe(12);
    expect(untimed.observations.timed).toBe(0);
    // The stopwatch recovers the spin the eye under-called (within 1 rev/s of the truth), where the
    // untimed fit can only take the logged step.
    expect(Math.abs(timed.backspinRps - 7)).toBeLessThan(1);
    expect(untimed.backspinRps).toBe(3);
    // The speed each kick needed is read with its true spin, so the fitted offset is near zero (the kicks
    // were struck at 22 m/s × e^(0.05 z) against what 40 m needs with 7 rev/s).
    expect(Number.isFinite(timed.aimedSpeed.offsetLogMean)).toBeTrue();
    expect(timed.meanSpeedMs).toBeGreaterThan(20);
    expect(timed.meanSpeedMs).toBeLessThan(24.5);
  });

  it('returns a plain JSON-serialisable object', () => {
    const p = fitProfile(syntheticAimed(20, 7, truth, [30, 36]));
    expect(JSON.parse(JSON.stringify(p))).toEqual(p);
    for (const v of [...Object.values(p), ...Object.values(p.aimedSpeed)]) if (typeof v === 'number') expect(Number.isFinite(v)).toBeTrue();
  });

  it('falls back to the prior with no repetitions', () => {
    const p = fitProfile([], { ...DEFAULT_PRIORS.chipped, technique: 'chipped' });
    expect(p.repetitions).toBe(0);
    expect(p.meanSpeedMs).toBeCloseTo(DEFAULT_PRIORS.chipped.meanSpeedMs, 6);
    expect(p.sdSpeedMs).toBeCloseTo(DEFAULT_PRIORS.chipped.sdSpeedMs, 6);
    // Normal prior worth n₀ repetitions: SE of the mean σ₀/√n₀ (Gelman et al., BDA, §2.5).
    expect(p.meanSpeedSeMs).toBeCloseTo(DEFAULT_PRIORS.chipped.sdSpeedMs / Math.sqrt(DEFAULT_PRIORS.chipped.weightReps), 3);
    expect(p.aimedSpeed.offsetLogMean).toBe(0);
    expect(p.aimedSpeed.ceilingMs).toBe(DEFAULT_CEILINGS_MS.chipped);
    // The prior's mean speed is quoted at the distance it carries, so aiming there asks for that speed.
    const back = solveLaunchSpeed({ carryM: p.aimedSpeed.typicalTargetM, elevationDeg: 48 })!;
    expect(back).toBeCloseTo(DEFAULT_PRIORS.chipped.meanSpeedMs, 3);
    expect(p.elevationDeg).toBe(48);
  });
});
