import { hitProbability } from '../../../shared/flight';
import { NEXT_TARGET_BAND, bestTarget, describeNextTarget, drillLink, nextTarget } from './next-target';

/** A cloud of landings on the aim line at the given carries. */
function lineCloud(carries: number[]): { cloud: { xM: number[]; yM: number[] } } {
  return { cloud: { xM: carries, yM: carries.map(() => 0) } };
}

/** n carries spread evenly over [from, to]. */
function spread(from: number, to: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => from + ((to - from) * i) / (n - 1));
}

describe('nextTarget', () => {
  it('picks the far-side distance whose hit probability is nearest 55 %, on the 0.5 m grid', () => {
    // 1000 carries evenly over 20–40 m: with a 3 m target the probability is 6/20 = 30 % in the
    // middle, so use a 7 m radius: 14/20 = 70 % in the middle, falling off linearly past 33 m.
    const envelope = lineCloud(spread(20, 40, 1000));
    const result = nextTarget(envelope, 7);
    expect(result.kind).toBe('target');
    if (result.kind !== 'target') return;
    expect(result.distanceM * 2).toBe(Math.round(result.distanceM * 2));
    expect(result.probability).toBeGreaterThanOrEqual(NEXT_TARGET_BAND.min);
    expect(result.probability).toBeLessThanOrEqual(NEXT_TARGET_BAND.max);
    // Beyond the plateau (27–33 m), not before it.
    expect(result.distanceM).toBeGreaterThan(33);
    // p(d) = (40 − (d − 7)) / 20 for d in 33–47 m, so 55 % sits at d = 36; the grid holds 36.0.
    expect(result.distanceM).toBe(36);
    expect(result.probability).toBeCloseTo(hitProbability(envelope, 36, 7), 10);
  });

  it('says when no distance reaches 50 %, with the best probability', () => {
    const envelope = lineCloud(spread(0, 100, 1000));
    const result = nextTarget(envelope, 3);
    expect(result.kind).toBe('none');
    if (result.kind !== 'none') return;
    expect(result.peakProbability).toBeLessThan(0.1);
    expect(describeNextTarget(result)).toContain('Try a larger target');
  });

  it('reports the nearest far-side distance when the probability jumps over the band', () => {
    // All landings at exactly 30 m: 100 % up to 33 m, 0 % beyond — nothing in 50–60 %.
    const result = nextTarget(lineCloud(Array.from({ length: 200 }, () => 30)), 3);
    expect(result.kind).toBe('none');
    if (result.kind !== 'none') return;
    expect(result.peakProbability).toBe(1);
    expect(describeNextTarget(result)).toContain('None in the 50–60 % band');
  });

  it('refuses an empty envelope', () => {
    expect(() => nextTarget(lineCloud([]), 3)).toThrowError(RangeError);
  });
});

describe('bestTarget', () => {
  it('finds the distance most likely to be hit', () => {
    // Landings evenly over 20–40 m; with a 7 m target every distance from 27 to 33 m gives 70 %: the first is reported.
    const best = bestTarget(lineCloud(spread(20, 40, 1000)), 7);
    expect(best.distanceM).toBe(27);
    expect(best.probability).toBeCloseTo(0.7, 2);
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
