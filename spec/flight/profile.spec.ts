import { DEFAULT_PRIORS, fitProfile, simulateKick, type LoggedKick } from '../../shared/flight';
import { syntheticLofted } from './support/synthetic-logs';

describe('fitProfile (interval-censored maximum likelihood with shrinkage)', () => {
  const truth = { meanSpeedMs: 24, sdSpeedMs: 2, meanAzimuthDeg: 1, sdAzimuthDeg: 2.5 };

  for (const seed of [101, 202]) {
    it(`recovers a known launch-speed distribution from censored logs within its uncertainty (seed ${seed})`, () => {
      const logs = syntheticLofted(120, seed, truth, [28, 33, 38, 43], 10);
      const p = fitProfile(logs);
      // Asymptotic normality of the maximum-likelihood estimate (Casella & Berger, Statistical Inference, 2nd ed., §10.1): within 3 SE w.p. ≈ 0.997.
      expect(Math.abs(p.meanSpeedMs - truth.meanSpeedMs)).toBeLessThan(3 * p.meanSpeedSeMs);
      expect(Math.abs(p.sdSpeedMs - truth.sdSpeedMs)).toBeLessThan(3 * p.sdSpeedSeMs);
      // Same source, for the aim distribution.
      expect(Math.abs(p.meanAzimuthDeg - truth.meanAzimuthDeg)).toBeLessThan(3 * p.meanAzimuthSeDeg);
      // The uncertainty must be informative: 108 censored repetitions pin the mean to well under 1 m/s.
      expect(p.meanSpeedSeMs).toBeGreaterThan(0.05);
      expect(p.meanSpeedSeMs).toBeLessThan(0.6);
      expect(p.repetitions).toBe(108);
      expect(p.ignoredRepetitions).toBe(12);
      expect(p.observations.speedPoints).toBe(0);
      expect(p.observations.speedIntervals + p.observations.speedBounds).toBe(108);
    });
  }

  it('shrinks toward the prior with few repetitions and less so with many', () => {
    const prior = DEFAULT_PRIORS.lofted;
    const measured = (n: number): LoggedKick[] =>
      Array.from({ length: n }, (_, i) => ({
        technique: 'lofted' as const,
        outcome: 'long' as const,
        targetDistanceM: 30,
        targetRadiusM: 3,
        backspinStep: 2 as const,
        sidespinStep: 0 as const,
        measuredSpeedMs: 29 + (i % 3) - 1,
      }));
    const few = fitProfile(measured(2));
    const many = fitProfile(measured(60));
    // Normal mean with a normal prior: the posterior mean is precision-weighted (Gelman et al., Bayesian Data Analysis, 3rd ed., §2.5).
    expect(few.meanSpeedMs).toBeGreaterThan(prior.meanSpeedMs);
    expect(few.meanSpeedMs).toBeLessThan(29);
    expect(many.meanSpeedMs).toBeGreaterThan(few.meanSpeedMs);
    expect(Math.abs(many.meanSpeedMs - 29)).toBeLessThan(0.3);
    expect(many.meanSpeedSeMs).toBeLessThan(few.meanSpeedSeMs);
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
    }));
    const p = fitProfile(logs, { ...DEFAULT_PRIORS.lofted, weightReps: 0.1 });
    expect(p.observations.speedPoints).toBe(6);
    // With a negligible prior the MLE of a normal mean is the sample mean (Casella & Berger, §7.2).
    const sampleMean = speeds.reduce((a, b) => a + b, 0) / speeds.length;
    expect(Math.abs(p.meanSpeedMs - sampleMean)).toBeLessThan(0.05);
  });

  it('returns a plain JSON-serialisable object', () => {
    const p = fitProfile(syntheticLofted(20, 7, truth, [30, 36]));
    expect(JSON.parse(JSON.stringify(p))).toEqual(p);
    for (const v of Object.values(p)) if (typeof v === 'number') expect(Number.isFinite(v)).toBeTrue();
  });

  it('falls back to the prior with no repetitions', () => {
    const p = fitProfile([], { ...DEFAULT_PRIORS.chipped, technique: 'chipped' });
    expect(p.repetitions).toBe(0);
    expect(p.meanSpeedMs).toBeCloseTo(DEFAULT_PRIORS.chipped.meanSpeedMs, 6);
    expect(p.sdSpeedMs).toBeCloseTo(DEFAULT_PRIORS.chipped.sdSpeedMs, 6);
    // Normal prior worth n₀ repetitions: SE of the mean σ₀/√n₀ (Gelman et al., BDA, §2.5).
    expect(p.meanSpeedSeMs).toBeCloseTo(
      DEFAULT_PRIORS.chipped.sdSpeedMs / Math.sqrt(DEFAULT_PRIORS.chipped.weightReps),
      3,
    );
    expect(p.elevationDeg).toBe(48);
  });
});
