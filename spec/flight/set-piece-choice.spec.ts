import {
  choiceRangeOf,
  DEFAULT_PRIORS,
  fitProfile,
  setPieceCheck,
  type KickProfile,
  type LoggedKick,
  type SetPieceResult,
} from '../../shared/flight';

/** Twenty curled repetitions, all on a 2 m target at `distanceM` (a perfect record). */
function perfectCurler(distanceM: number, sidespinStep: 1 | -1 = 1): KickProfile {
  const kicks: LoggedKick[] = Array.from({ length: 20 }, () => ({
    technique: 'curled',
    outcome: 'on_target',
    targetDistanceM: distanceM,
    targetRadiusM: 2,
    backspinStep: 0,
    sidespinStep,
  }));
  return fitProfile(kicks, { ...DEFAULT_PRIORS.curled, technique: 'curled' });
}

const centralTwenty = (profile: KickProfile, seed = 91_505): SetPieceResult =>
  setPieceCheck({ ballX: 20, ballY: 0, profile, conditions: {}, samples: 400, seed });

describe('set pieces aimed for the kick at hand', () => {
  const byDrill = [20, 25, 30].map((d) => centralTwenty(perfectCurler(d)));

  it('gives players with the same perfect record nearly the same share whatever distance they drilled at', () => {
    // First principles: skill, not drill geometry, decides a free kick. Three players 20/20 on 2 m targets at
    // 20, 25 and 30 m; flying each one's usual ball gave 1 %, 82 % and 14 % from the same central 20 m kick.
    // What remains is what the drills prove: a 2 m target at 20 m bounds the aim spread less tightly than one
    // at 30 m, and a player who only drilled at 20 m has shown a ceiling of only ~19.4 m/s (profile model 3's
    // one-sided ceiling), so their share is a few points lower — honestly, not by geometry.
    const shares = byDrill.map((r) => r.shares.onTarget);
    expect(Math.max(...shares) - Math.min(...shares)).toBeLessThan(0.08);
    // A perfect record over a 2 m wall from 20 m should put most of them in.
    for (const s of shares) expect(s).toBeGreaterThan(0.85);
  });

  it('chooses a kick inside the technique’s range and under the player’s ceiling', () => {
    for (const [i, d] of [20, 25, 30].entries()) {
      const profile = perfectCurler(d);
      const range = choiceRangeOf(profile);
      const k = byDrill[i]!.kick;
      expect(byDrill[i]!.kickChosen).toBeTrue();
      expect(k.elevationDeg).toBeGreaterThanOrEqual(range.elevationDeg[0]);
      expect(k.elevationDeg).toBeLessThanOrEqual(range.elevationDeg[1]);
      expect(k.sidespinRps).toBeGreaterThanOrEqual(range.sidespinRps[0]);
      expect(k.sidespinRps).toBeLessThanOrEqual(range.sidespinRps[1]);
      expect(k.backspinRps).toBeGreaterThanOrEqual(range.backspinRps[0]);
      expect(k.backspinRps).toBeLessThanOrEqual(range.backspinRps[1]);
      expect(k.speedMs).toBeLessThanOrEqual(profile.aimedSpeed.ceilingMs + 1e-3);
      // First principles: a ball curling left must be launched right of the aim to come back to it.
      expect(k.aimOffDeg).toBeLessThan(0);
    }
  });

  it('does at least as well as flying the player’s usual ball', () => {
    // First principles: the usual ball is one of the kicks the player could choose.
    const profile = perfectCurler(30);
    const usual = setPieceCheck({
      ballX: 20,
      ballY: 0,
      profile,
      conditions: {},
      samples: 400,
      seed: 91_505,
      kick: {
        speedMs: profile.meanSpeedMs,
        elevationDeg: profile.elevationDeg,
        backspinRps: profile.backspinRps,
        sidespinRps: profile.sidespinRps,
        aimOffDeg: byDrill[2]!.kick.aimOffDeg,
      },
    });
    expect(byDrill[2]!.shares.onTarget).toBeGreaterThanOrEqual(usual.shares.onTarget);
  });

  it('ranks a less accurate player below a more accurate one', () => {
    // First principles: a wider aim and speed spread puts fewer of the same chosen kicks in.
    const tight = perfectCurler(25);
    const loose: KickProfile = {
      ...tight,
      sdAzimuthDeg: 3 * tight.sdAzimuthDeg,
      aimedSpeed: { ...tight.aimedSpeed, offsetLogSd: 3 * tight.aimedSpeed.offsetLogSd },
    };
    expect(centralTwenty(loose).shares.onTarget).toBeLessThan(byDrill[1]!.shares.onTarget - 0.1);
  });

  it('keeps a curler’s own curl direction', () => {
    // Common practice: a player curls the way their kicking foot does; the choice does not swap feet.
    const r = centralTwenty(perfectCurler(25, -1));
    expect(r.kick.sidespinRps).toBeLessThan(0);
    expect(r.kick.aimOffDeg).toBeGreaterThan(0);
  });

  it('is reproducible and bounded in work', () => {
    const again = centralTwenty(perfectCurler(20));
    expect(again).toEqual(byDrill[0]!);
    // Work bound of the grid-then-compass search (planner budget): well under 6,000 flights per player.
    expect(again.searchFlights).toBeLessThan(6000);
  });

  it('scores the choice on draws independent of the search’s own', () => {
    // First principles: judging a choice on the noise it was tuned to flatters it; another seed gives a share
    // within Monte Carlo error (3 binomial standard deviations of 400 samples at ~90 %: 0.045).
    const other = centralTwenty(perfectCurler(20), 7);
    expect(Math.abs(other.shares.onTarget - byDrill[0]!.shares.onTarget)).toBeLessThan(0.06);
  });
});
