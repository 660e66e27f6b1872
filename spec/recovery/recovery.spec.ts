/**
 * Recovery: the demo academy's repetitions are flown from each player's hidden truth (seed/truth.ts), so
 * fitting the logs must give the truth back. Three checks, each through the product's own path:
 *
 * - reliable reach (ProfileCache: the fit and the standard-conditions reach curve the Player file shows)
 *   within ±2 m of the truth's, flown directly, for every player-technique with at least 40 repetitions;
 * - out-of-sample calibration: fitted on alternate weeks, each held-out repetition predicted in its own
 *   session's conditions; predicted and observed hit rates within 5 points per technique;
 * - the Set-piece planner's ranking of the first team's free-kick takers agrees with the ranking of
 *   their truths through the same check (Spearman ≥ 0.8).
 *
 * Not part of `npm test` yet. On profile model 5 the ranking passes at its threshold (Spearman 0.80; two
 * takers 0.1 points apart in the planner); calibration passes for driven (28.3 % predicted vs 27.9 %
 * observed), lofted (31.8 vs 33.2) and curled (41.1 vs 38.7) but not chipped (35.1 vs 40.3: underconfident,
 * mostly at short targets and in wind); reliable reach is within ±2 m for 21 of 41 player-techniques
 * (mean error driven +0.4 m, curled −0.1, chipped −2.2, lofted −1.8: lofted and chipped read short). The
 * truth's reach is taken from 2,000 kicks: from 400 it moved by about ±1 m with its seed (its hit
 * probability falls only 2–3 points a metre there); the product's curve, stratified, moves by about ±0.4 m.
 * See DEVELOPERS.md, "Recovery". Run it with `npm run check:recovery` while fixing the fit; move it back
 * under spec/seed/ when it passes.
 *
 * Run time: the players are a fixed systematic sample — every fourth entry of the roster (12 of 45,
 * four per squad), chosen before any result was seen — plus the free-kick takers for the ranking. Set
 * LOFTLINE_RECOVERY_ALL=1 to take every player, and LOFTLINE_RECOVERY_REPORT=1 to print the tables.
 */
import { ProfileCache, PROFILE_MODEL_VERSION } from '../../api/analysis/profile-cache';
import { fitProfile, setPieceCheck, type KickProfile, type Technique } from '../../shared/flight/index';
import { AimedSamples } from '../../shared/flight/reach-curve';
import { PLAYERS } from '../../seed/roster';
import { demoPlayerId } from '../../seed/scenario';
import { FREE_KICK_TAKERS, TECHNIQUES } from '../../seed/truth';
import { standardConditionsOf, trueReliableReachM, truthAsProfile } from '../../seed/truth-reach';
import { seedDemoUnderTest, spearman, type DemoUnderTest, type Repetition } from './recovery-harness';

/** Acceptance figures: the model's trust targets (docs/design.md §6). */
const REACH_TOLERANCE_M = 2;
const MIN_REPS_FOR_REACH = 40;
const CALIBRATION_TOLERANCE_POINTS = 5;
const MIN_SPEARMAN = 0.8;

const everyone = process.env['LOFTLINE_RECOVERY_ALL'] === '1';
const report = process.env['LOFTLINE_RECOVERY_REPORT'] === '1';
const SAMPLE = PLAYERS.filter((_, i) => everyone || i % 4 === 0);

/** Monte Carlo sizes: the truth's reach (common random numbers across distances) and each held-out prediction. */
const TRUTH_SAMPLES = 2000;
const PREDICTION_SAMPLES = 400;

/** A central free kick 24 m out with a 2 m wall (the planner’s default wall), first-team ball: far enough that the takers differ. */
const FREE_KICK = { ballX: 24, ballY: 0, wallHeightM: 2, samples: 1000, seed: 14 };

/** Fails with every figure outside its tolerance named (thresholds of issue 14: never loosened to pass). */
function judge(failures: readonly string[], what: string): void {
  expect(failures).withContext(what).toEqual([]);
}

describe('recovery of the demo truth (seed/truth.ts) by the profile fit', () => {
  let demo: DemoUnderTest;

  beforeAll(() => {
    demo = seedDemoUnderTest();
  }, 120_000);

  afterAll(() => demo.close());

  it('recovers reliable reach within ±2 m for every sampled player-technique with at least 40 repetitions', () => {
    const cache = new ProfileCache(demo.db);
    const failures: string[] = [];
    const lines: string[] = [];
    let judged = 0;
    for (const player of SAMPLE) {
      const truth = demo.truths.get(player.key)!;
      for (const technique of TECHNIQUES) {
        const reps = demo.repetitions(player.key, technique);
        if (reps.length < MIN_REPS_FOR_REACH) continue;
        judged++;
        const entry = cache.get(demoPlayerId(player.key), technique);
        const trueM = trueReliableReachM(
          truth.techniques[technique],
          demo.ballSize(player.squad),
          reps.map((r) => r.moment),
          entry.reachRadiusM,
          { samples: TRUTH_SAMPLES, seed: `recovery:${player.key}:${technique}`, startM: entry.reliableReachM ?? 20 },
        );
        const errorM = (entry.reliableReachM ?? 0) - (trueM ?? 0);
        const line = `${player.key} ${technique} (${reps.length} reps, r ${entry.reachRadiusM} m): fitted ${entry.reliableReachM} m, truth ${trueM} m, error ${errorM.toFixed(1)} m`;
        lines.push(line);
        if (Math.abs(errorM) > REACH_TOLERANCE_M || (entry.reliableReachM === null) !== (trueM === null)) failures.push(line);
      }
    }
    if (report) console.log(`\nReliable reach, fitted vs truth (model v${PROFILE_MODEL_VERSION}):\n  ${lines.join('\n  ')}`);
    expect(judged).toBeGreaterThan(20);
    judge(failures, `${failures.length} of ${judged} player-techniques outside ±${REACH_TOLERANCE_M} m`);
  }, 240_000);

  it('is calibrated out of sample: predicted and observed hit rates within 5 points per technique', () => {
    const table = new Map<Technique, { n: number; predicted: number; observed: number }>();
    for (const player of SAMPLE) {
      for (const technique of TECHNIQUES) {
        const reps = demo.repetitions(player.key, technique);
        // Two folds by alternate weeks: each repetition is predicted by a fit that never saw its week.
        for (const fold of [0, 1]) {
          const train = reps.filter((r) => r.weekIndex % 2 !== fold).map((r) => r.kick);
          const test = reps.filter((r) => r.weekIndex % 2 === fold);
          if (train.length === 0 || test.length === 0) continue;
          const profile = fitProfile(train, undefined, { ballSize: demo.ballSize(player.squad) });
          const row = table.get(technique) ?? { n: 0, predicted: 0, observed: 0 };
          for (const r of test) row.observed += r.kick.outcome === 'on_target' ? 1 : 0;
          row.n += test.length;
          row.predicted += predictedHits(profile, test);
          table.set(technique, row);
        }
      }
    }
    const failures: string[] = [];
    const lines: string[] = [];
    for (const [technique, row] of table) {
      const predictedPct = (100 * row.predicted) / row.n;
      const observedPct = (100 * row.observed) / row.n;
      const line = `${technique}: predicted ${predictedPct.toFixed(1)} %, observed ${observedPct.toFixed(1)} % (${row.n} repetitions)`;
      lines.push(line);
      if (Math.abs(predictedPct - observedPct) > CALIBRATION_TOLERANCE_POINTS) failures.push(line);
    }
    if (report) console.log(`\nOut-of-sample calibration (model v${PROFILE_MODEL_VERSION}):\n  ${lines.join('\n  ')}`);
    expect(table.size).toBe(TECHNIQUES.length);
    judge(failures, 'calibration');
  }, 240_000);

  it('ranks the free-kick takers as their truths rank them (Spearman ≥ 0.8)', () => {
    const fitted: number[] = [];
    const truths: number[] = [];
    const lines: string[] = [];
    const conditions = standardConditionsOf(5);
    for (const key of FREE_KICK_TAKERS) {
      const reps = demo.repetitions(key, 'curled');
      const profile = fitProfile(
        reps.map((r) => r.kick),
        undefined,
        { ballSize: 5 },
      );
      const truth = truthAsProfile('curled', demo.truths.get(key)!.techniques.curled, 0.5, 5, profile.aimedSpeed.typicalTargetM);
      const a = setPieceCheck({ ...FREE_KICK, profile, conditions }).shares.onTarget;
      const b = setPieceCheck({ ...FREE_KICK, profile: truth, conditions }).shares.onTarget;
      fitted.push(a);
      truths.push(b);
      lines.push(`${key} (${reps.length} curled reps): planner ${(100 * a).toFixed(1)} %, truth ${(100 * b).toFixed(1)} %`);
    }
    const rho = spearman(fitted, truths);
    if (report)
      console.log(
        `\nFree-kick takers, on target from 24 m central (model v${PROFILE_MODEL_VERSION}), Spearman ${rho.toFixed(2)}:\n  ${lines.join('\n  ')}`,
      );
    // The truth itself must give a clear ranking, or the comparison says nothing.
    const sorted = [...truths].sort((x, y) => y - x);
    for (let i = 1; i < sorted.length; i++)
      expect(sorted[i - 1]! - sorted[i]!)
        .withContext('gap between takers in truth')
        .toBeGreaterThan(0.02);
    judge(rho >= MIN_SPEARMAN ? [] : [`Spearman ${rho.toFixed(2)} (${lines.join('; ')})`], 'free-kick ranking');
  }, 240_000);
});

/**
 * Expected hits among held-out repetitions: each predicted in its own session's conditions by the
 * product's aimed-kick sampler (the machinery behind reach curves), at its own target.
 */
function predictedHits(profile: KickProfile, test: readonly Repetition[]): number {
  const bySession = new Map<string, Repetition[]>();
  for (const r of test) bySession.set(r.sessionId, [...(bySession.get(r.sessionId) ?? []), r]);
  let sum = 0;
  for (const group of bySession.values()) {
    const aimed = new AimedSamples(profile, group[0]!.kick.conditions ?? {}, PREDICTION_SAMPLES, 7);
    const memo = new Map<string, number>();
    for (const r of group) {
      const { targetDistanceM: d, targetRadiusM: radius } = r.kick;
      const key = `${d}|${radius}`;
      let p = memo.get(key);
      if (p === undefined) {
        const landings = aimed.landingsAt(d);
        p = landings.filter((q) => (q.x - d) ** 2 + q.y ** 2 <= radius * radius).length / landings.length;
        memo.set(key, p);
      }
      sum += p;
    }
  }
  return sum;
}
