import { kick, progressWeek } from '../core/analysis/spec-fixtures';
import { busiestTechnique, drillTargets, outcomeWeeks, progressPoints, weeksOf, wilsonInterval } from './player-file-view';

describe('wilsonInterval', () => {
  it('matches the Wilson score interval for 5 of 10 and 0 of 10', () => {
    // Wilson 1927 (J. Am. Stat. Assoc. 22:209); 95 % values as tabulated by Newcombe 1998 (Stat. Med. 17:857), method 3.
    const half = wilsonInterval(5, 10);
    expect(half.low).toBeCloseTo(0.2366, 4);
    expect(half.high).toBeCloseTo(0.7634, 4);
    const none = wilsonInterval(0, 10);
    expect(none.low).toBeCloseTo(0, 10);
    expect(none.high).toBeCloseTo(0.2775, 4);
  });

  it('is the whole range without trials', () => {
    expect(wilsonInterval(0, 0)).toEqual({ low: 0, high: 1 });
  });
});

describe('progress shaping', () => {
  const weeks = [
    progressWeek('2025-02-24', 'lofted', 20, 0.5, 27),
    progressWeek('2025-02-10', 'lofted', 10, 0.4, null),
    progressWeek('2025-03-03', 'lofted', 30, 0.6, 29),
    progressWeek('2025-03-03', 'driven', 8, 0.25, 18),
    progressWeek('2025-02-17', 'lofted', 0, 0, null),
  ];

  it('keeps one technique, oldest first, without empty weeks', () => {
    expect(weeksOf(weeks, 'lofted').map((w) => w.weekStart)).toEqual(['2025-02-10', '2025-02-24', '2025-03-03']);
  });

  it('draws median carry with its quartiles and leaves out weeks without a carry', () => {
    expect(progressPoints(weeks, 'lofted', 'carry')).toEqual([
      { weekStart: '2025-02-24', value: 27, low: 25, high: 29, reps: 20 },
      { weekStart: '2025-03-03', value: 29, low: 27, high: 31, reps: 30 },
    ]);
  });

  it('draws hit rate with its Wilson band for every week with reps', () => {
    const points = progressPoints(weeks, 'lofted', 'hitRate');
    expect(points.map((p) => p.value)).toEqual([0.4, 0.5, 0.6]);
    expect(points[1]!.low).toBeCloseTo(wilsonInterval(10, 20).low, 10);
  });

  it('gives the outcome mix per week', () => {
    const mix = outcomeWeeks(weeks, 'driven');
    expect(mix.length).toBe(1);
    expect(mix[0]!.share.on_target).toBe(0.25);
  });

  it('names the most practised technique', () => {
    expect(busiestTechnique(weeks)).toBe('lofted');
    expect(busiestTechnique([])).toBeNull();
  });
});

describe('drillTargets', () => {
  it('lists the targets of one technique, most used first', () => {
    const kicks = [
      kick(1, 'lofted', 'on_target', 30, 30),
      kick(2, 'lofted', 'short', 26, 35),
      kick(3, 'lofted', 'long', 38, 35),
      kick(4, 'driven', 'long', 20, 20),
    ];
    expect(drillTargets(kicks, 'lofted')).toEqual([
      { distanceM: 35, radiusM: 3, reps: 2 },
      { distanceM: 30, radiusM: 3, reps: 1 },
    ]);
  });
});
