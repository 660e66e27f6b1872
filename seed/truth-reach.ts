/**
 * What the hidden truth says a coach should see — computed straight from the truth by flying kicks, never
 * through the profile fit or its reach curves, so the recovery specs compare the product against an
 * independent answer. For tests only.
 */
import { softMinLog } from '../shared/flight/aimed-speed';
import { BALL_SIZES, LAUNCH_SPEED_CAP_MS, type FlightConditions, type KickProfile } from '../shared/flight/index';
import { flyRepetition, Intentions } from './kick-physics';
import { Prng } from './prng';
import { kickingAt, type Technique, type TrueTechnique } from './truth';

/** Which of the player's repetitions the truth is taken over: when (0…1 of the period) and with which foot. */
export interface RepetitionMoment {
  progress: number;
  weakFoot: boolean;
}

/** Standard conditions of reliable reach: still air at ISA sea level, 15 °C, the squad's ball (as the product quotes it). */
export function standardConditionsOf(ballSize: 3 | 4 | 5): FlightConditions {
  const b = BALL_SIZES[ballSize];
  return { ball: { massKg: b.massKg, radiusM: b.radiusM }, air: { altitudeM: 0, temperatureC: 15 } };
}

/**
 * Hit probability of the truth's kicks aimed at `distanceM` for a target of `radiusM`, in standard
 * conditions: `samples` kicks flown directly, each at one of the player's own repetition moments in
 * turn, with common random numbers (the same `seed` gives the same kicks at every distance).
 */
export function trueHitProbability(
  truth: TrueTechnique,
  ballSize: 3 | 4 | 5,
  moments: readonly RepetitionMoment[],
  distanceM: number,
  radiusM: number,
  samples: number,
  seed: string,
  intentions: Intentions = new Intentions(),
): number {
  const prng = Prng.fromLabel(seed);
  const conditions = standardConditionsOf(ballSize);
  let hits = 0;
  for (let i = 0; i < samples; i++) {
    const m = moments[i % moments.length]!;
    const rep = flyRepetition(prng, intentions, {
      key: seed,
      truth,
      progress: m.progress,
      weakFoot: m.weakFoot,
      targetDistanceM: distanceM,
      ballSize,
      conditions,
      freeKick: false,
    });
    if (Math.hypot(rep.landing.x - distanceM, rep.landing.y) <= radiusM) hits++;
  }
  return hits / samples;
}

/**
 * The truth's reliable reach: the longest target distance, to 0.1 m, hit with at least `minProbability`
 * (the product's 60 %) — bracketed in 2 m steps from `startM`, then bisected. Null when even 2 m is not
 * reliable.
 */
export function trueReliableReachM(
  truth: TrueTechnique,
  ballSize: 3 | 4 | 5,
  moments: readonly RepetitionMoment[],
  radiusM: number,
  options: { samples: number; seed: string; minProbability?: number; startM?: number },
): number | null {
  const min = options.minProbability ?? 0.6;
  const intentions = new Intentions();
  const p = (d: number): number => trueHitProbability(truth, ballSize, moments, d, radiusM, options.samples, options.seed, intentions);
  // Bracket from the starting guess in 2 m steps (up while reliable, else down), then bisect.
  let lo = options.startM ?? 30;
  let hi = lo + 2;
  if (p(lo) >= min) {
    while (hi < 150 && p(hi) >= min) [lo, hi] = [hi, hi + 2];
  } else {
    [lo, hi] = [lo - 2, lo];
    while (lo >= 2 && p(lo) < min) [lo, hi] = [lo - 2, lo];
    if (lo < 2) return null;
  }
  while (hi - lo > 0.1) {
    const mid = (lo + hi) / 2;
    if (p(mid) >= min) lo = mid;
    else hi = mid;
  }
  return Math.round(lo * 10) / 10;
}

/**
 * The truth written as a fitted profile would be (exact values, no uncertainty), so the Set-piece
 * planner can rank takers by their truth exactly as it ranks them by their fits. Taken at one moment with
 * the dominant foot; `typicalTargetM` is where the usual-ball figures are quoted.
 */
export function truthAsProfile(
  technique: Technique,
  truth: TrueTechnique,
  progress: number,
  ballSize: 3 | 4 | 5,
  typicalTargetM: number,
): KickProfile {
  const k = kickingAt(truth, progress, false);
  const intentions = new Intentions();
  const lnIntended = softMinLog(intentions.of('profile', k, ballSize).lnNeedFor(typicalTargetM), Math.log(k.ceilingMs));
  const meanSpeedMs = Math.exp(lnIntended + k.offsetLogMean);
  return {
    technique,
    repetitions: 1000,
    ignoredRepetitions: 0,
    meanSpeedMs,
    sdSpeedMs: meanSpeedMs * k.offsetLogSd,
    meanSpeedSeMs: 0,
    sdSpeedSeMs: 0,
    aimedSpeed: {
      offsetLogMean: k.offsetLogMean,
      offsetLogSd: k.offsetLogSd,
      offsetLogMeanSe: 0,
      offsetLogSdSe: 0,
      ceilingMs: k.ceilingMs,
      ceilingLogSe: 0,
      typicalTargetM,
    },
    meanAzimuthDeg: k.aimBiasDeg,
    sdAzimuthDeg: k.sdAimDeg,
    meanAzimuthSeDeg: 0,
    elevationDeg: k.elevationDeg,
    sdElevationDeg: k.sdElevationDeg,
    elevationSdSource: 'logged',
    backspinRps: k.backspinRps,
    sidespinRps: k.sidespinRps,
    sdBackspinRps: k.sdBackspinRps,
    sdSidespinRps: k.sdSidespinRps,
    launchNoiseScale: 1,
    speedCapMs: LAUNCH_SPEED_CAP_MS[ballSize],
    longestTargetM: typicalTargetM,
    warnings: [],
    observations: { speedPoints: 0, speedIntervals: 0, speedBounds: 0, aimPoints: 0, aimIntervals: 0, aimBounds: 0 },
    prior: { meanSpeedMs, sdSpeedMs: meanSpeedMs * k.offsetLogSd, meanAzimuthDeg: 0, sdAzimuthDeg: k.sdAimDeg, weightReps: 0.1 },
  };
}
