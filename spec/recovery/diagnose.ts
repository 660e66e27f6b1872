/**
 * Recovery diagnostic (a script, not a spec): for each sampled player-technique with at least 40
 * repetitions, prints the fitted parameters beside the truth's at the player's mean moment (speed offset
 * μ and spread σ, ceiling, elevation, spins, aim), and the fitted reliable reach with one group of
 * parameters at a time swapped for the truth's — which parameter moves the reach toward the truth is the
 * one to look at. `node --import tsx spec/recovery/diagnose.ts` (TECH=lofted,chipped and NP=4 narrow it).
 */
import { fitProfile, type KickProfile, type Technique } from '../../shared/flight/index';
import { reachCurve } from '../../shared/flight/reach-curve';
import { reliableReachM } from '../../shared/flight/envelope';
import { PLAYERS } from '../../seed/roster';
import { kickingAt } from '../../seed/truth';
import { standardConditionsOf, trueReliableReachM, truthAsProfile } from '../../seed/truth-reach';
import { seedDemoUnderTest } from './recovery-harness';

const demo = seedDemoUnderTest();
const techs = (process.env['TECH'] ?? 'driven,lofted,chipped,curled').split(',') as Technique[];
const players = PLAYERS.filter((_, i) => i % 4 === 0).slice(0, Number(process.env['NP'] ?? 12));
const f = (x: number | null | undefined, d = 2) => (x === null || x === undefined ? 'null' : x.toFixed(d));
for (const technique of techs) {
  for (const pl of players) {
    const reps = demo.repetitions(pl.key, technique);
    if (reps.length < 40) continue;
    const ball = demo.ballSize(pl.squad);
    const truth = demo.truths.get(pl.key)!.techniques[technique];
    const meanProg = reps.reduce((a, r) => a + r.moment.progress, 0) / reps.length;
    const k = kickingAt(truth, meanProg, false);
    const p = fitProfile(
      reps.map((r) => r.kick),
      undefined,
      { ballSize: ball },
    );
    const radius = demo.reachRadiusM(pl.key, technique);
    const cond = standardConditionsOf(ball);
    const reachOf = (q: KickProfile) => reliableReachM(reachCurve(q, cond, { samples: 1000, seed: 1 }), radius);
    const trueM = trueReliableReachM(
      truth,
      ball,
      reps.map((r) => r.moment),
      radius,
      { samples: 400, seed: 'd', startM: 30 },
    );
    const tp = truthAsProfile(technique, truth, meanProg, ball, p.aimedSpeed.typicalTargetM);
    const a = p.aimedSpeed;
    console.log(`${pl.key} ${technique} n=${reps.length} r=${radius} λ=${f(p.launchNoiseScale)}`);
    console.log(
      `  μ fit ${f(a.offsetLogMean, 3)} true ${f(k.offsetLogMean, 3)} | σ fit ${f(a.offsetLogSd, 3)}(se ${f(a.offsetLogMeanSe, 3)}) true ${f(k.offsetLogSd, 3)} | ceil fit ${f(a.ceilingMs)}±${f(a.ceilingLogSe)} floor ${f(a.ceilingFloorMs)} true ${f(k.ceilingMs)}`,
    );
    console.log(
      `  elev fit ${f(p.elevationDeg)}±${f(p.sdElevationDeg)} true ${f(k.elevationDeg)}±${f(k.sdElevationDeg)} | back ${f(p.backspinRps)}±${f(p.sdBackspinRps)} true ${f(k.backspinRps)}±${f(k.sdBackspinRps)} | side ${f(p.sidespinRps)}±${f(p.sdSidespinRps)} true ${f(k.sidespinRps)}±${f(k.sdSidespinRps)} | aim ${f(p.meanAzimuthDeg)}±${f(p.sdAzimuthDeg)} true ${f(k.aimBiasDeg)}±${f(k.sdAimDeg)}`,
    );
    const swaps: [string, Partial<KickProfile>][] = [
      ['elevSd', { sdElevationDeg: k.sdElevationDeg }],
      ['spinSd', { sdBackspinRps: k.sdBackspinRps, sdSidespinRps: k.sdSidespinRps }],
      ['aimSd', { sdAzimuthDeg: k.sdAimDeg, meanAzimuthSeDeg: 0 }],
      ['ceil', { aimedSpeed: { ...a, ceilingMs: k.ceilingMs, ceilingLogSe: 0 } }],
      ['σ', { aimedSpeed: { ...a, offsetLogSd: k.offsetLogSd, offsetLogMeanSe: 0 } }],
    ];
    const parts = swaps.map(([n, s]) => `${n}→${f(reachOf({ ...p, ...s }), 1)}`);
    const all = {
      ...p,
      ...Object.assign({}, ...swaps.map((s) => s[1])),
      aimedSpeed: { ...a, ceilingMs: k.ceilingMs, ceilingLogSe: 0, offsetLogSd: k.offsetLogSd, offsetLogMeanSe: 0 },
    };
    console.log(
      `  reach fit ${f(reachOf(p), 1)} truth ${f(trueM, 1)} truthProfile ${f(reachOf(tp), 1)} | ${parts.join(' ')} allSpreads→${f(reachOf(all), 1)}`,
    );
  }
}
demo.close();
