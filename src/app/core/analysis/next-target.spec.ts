import { curveHitProbability, type ReachCurve } from '../../../../shared/flight';
import { NEXT_TARGET_BAND, bestTarget, describeNextTarget, drillLink, hitCurve, nextTarget } from './next-target';

/** A reach curve (1 m steps to `lastM`) whose probability at every radius is `p(d)`. */
function curveOf(lastM: number, p: (d: number) => number): ReachCurve {
  const distancesM = Array.from({ length: lastM }, (_, i) => i + 1);
  const radiiM = [1, 3, 5];
  return { samples: 1000, seed: 1, distancesM, radiiM, probability: distancesM.map((d) => radiiM.map(() => p(d))) };
}

describe('nextTarget', () => {
  it('picks the far-side distance whose hit probability is nearest 55 %, on the 0.5 m grid', () => {
    // p falls linearly from 90 % at 10 m to 10 % at 50 m: p(d) = 0.9 − 0.02 (d − 10), so 55 % sits at d = 27.5 m.
    const curve = curveOf(60, (d) => Math.max(0, Math.min(0.9, 0.9 - 0.02 * (d - 10))));
    const result = nextTarget(curve, 3);
    expect(result.kind).toBe('target');
    if (result.kind !== 'target') return;
    expect(result.distanceM * 2).toBe(Math.round(result.distanceM * 2));
    expect(result.probability).toBeGreaterThanOrEqual(NEXT_TARGET_BAND.min);
    expect(result.probability).toBeLessThanOrEqual(NEXT_TARGET_BAND.max);
    expect(result.distanceM).toBe(27.5);
    expect(result.probability).toBeCloseTo(curveHitProbability(curve, 27.5, 3), 10);
  });

  it('looks only beyond the most reliable distance', () => {
    // Rising to 95 % at 20 m and falling after: 55 % is met at 12 m on the way up and at 28 m beyond the peak.
    const curve = curveOf(50, (d) => Math.max(0, d <= 20 ? 0.95 - 0.05 * (20 - d) : 0.95 - 0.05 * (d - 20)));
    const result = nextTarget(curve, 3);
    expect(result.kind === 'target' && result.distanceM).toBe(28);
  });

  it('says when no distance reaches 50 %, with the best probability', () => {
    const result = nextTarget(
      curveOf(40, () => 0.08),
      3,
    );
    expect(result.kind).toBe('none');
    if (result.kind !== 'none') return;
    expect(result.peakProbability).toBeCloseTo(0.08, 10);
    expect(describeNextTarget(result)).toContain('Try a larger target');
  });

  it('reports the nearest far-side distance when the probability jumps over the band', () => {
    // 70 % up to 30 m, 20 % from 31 m: the grid point between interpolates to 45 %, outside the band.
    const result = nextTarget(
      curveOf(40, (d) => (d <= 30 ? 0.7 : 0.2)),
      3,
    );
    expect(result.kind).toBe('none');
    if (result.kind !== 'none') return;
    expect(result.peakProbability).toBeCloseTo(0.7, 10);
    expect(describeNextTarget(result)).toContain('None in the 50–60 % band');
  });

  it('refuses an empty curve', () => {
    expect(() => hitCurve({ samples: 1, seed: 1, distancesM: [], radiiM: [3], probability: [] }, 3)).toThrowError(RangeError);
  });
});

describe('bestTarget', () => {
  it('finds the distance most likely to be hit', () => {
    // A plateau of 70 % from 10 to 16 m: the first grid point on it is reported.
    const best = bestTarget(
      curveOf(40, (d) => (d >= 10 && d <= 16 ? 0.7 : 0.3)),
      3,
    );
    expect(best.distanceM).toBe(10);
    expect(best.probability).toBeCloseTo(0.7, 10);
  });
});

describe('drillLink', () => {
  it('opens Pitchside with the drill in the query parameters', () => {
    expect(drillLink('lofted', 36.5, 3)).toEqual({
      path: '/pitchside',
      queryParams: { drillTechnique: 'lofted', drillTargetM: 36.5, drillRadiusM: 3 },
    });
  });
});
