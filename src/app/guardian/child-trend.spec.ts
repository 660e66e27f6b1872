import { describeTrend } from './child-trend';

describe('describeTrend', () => {
  it('says when nothing is recorded yet', () => {
    expect(describeTrend('Nia', [])).toBe('No training repetitions are recorded for Nia yet.');
  });

  it('sums the reps and compares the first and the latest week that have a hit rate', () => {
    const weeks = [
      { weekStart: '2026-10-05', reps: 20, hitRate: 0.4 },
      { weekStart: '2026-10-12', reps: 0, hitRate: null },
      { weekStart: '2026-10-19', reps: 25, hitRate: 0.56 },
    ];
    expect(describeTrend('Nia', weeks)).toBe(
      'Nia logged 45 repetitions over 3 weeks. Hit rate 40 % at first, 56 % in the latest week (up 16 points).',
    );
  });

  it('words a fall and a single week', () => {
    expect(
      describeTrend('Bo', [
        { weekStart: '2026-10-05', reps: 10, hitRate: 0.5 },
        { weekStart: '2026-10-12', reps: 12, hitRate: 0.49 },
      ]),
    ).toBe('Bo logged 22 repetitions over 2 weeks. Hit rate 50 % at first, 49 % in the latest week (down 1 point).');
    expect(describeTrend('Bo', [{ weekStart: '2026-10-05', reps: 1, hitRate: 1 }])).toBe(
      'Bo logged 1 repetition in 1 week. Hit rate 100 %.',
    );
  });
});
