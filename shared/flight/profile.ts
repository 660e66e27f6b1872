/**
 * Profile fit: from a player's repetitions of one technique, a normal launch-speed
 * distribution and a normal aim distribution, fitted to interval-censored observations by maximum
 * likelihood with shrinkage toward a prior (a maximum a posteriori fit in which the prior is worth
 * `weightReps` repetitions). Reports how many repetitions it used and the uncertainty of the mean.
 */

import { DEFAULT_ELEVATION_DEG } from './constants';
import {
  aimObservation,
  type Censored,
  prepareKick,
  type PreparedKick,
  SpeedBounds,
  speedObservation,
} from './profile-observations';
import { DEFAULT_PRIORS, type KickProfile, type LoggedKick, type ProfilePrior } from './profile-types';
import { inverseHessian2, logNormalIntervalProbability, logNormalPdf, nelderMead } from './stats';
import type { Technique } from './types';
import { requireInHalfOpen, requireInRange } from './validate';

const LOG_SD_MIN = Math.log(0.05);
const LOG_SD_MAX = Math.log(30);

interface NormalFit {
  mean: number;
  sd: number;
  meanSe: number;
  sdSe: number;
}

/**
 * Negative log-posterior of (μ, ln σ): censored normal likelihood plus a prior worth n₀ repetitions,
 * μ ~ N(μ₀, σ₀²/n₀) and ln σ ~ N(ln σ₀, 1/(2n₀)) (the sampling variance of ln σ̂ from n₀ normal draws).
 */
function negativeLogPosterior(obs: readonly Censored[], prior: { mean: number; sd: number; weight: number }) {
  return (theta: number[]): number => {
    const mu = theta[0]!;
    const logSd = theta[1]!;
    if (logSd < LOG_SD_MIN || logSd > LOG_SD_MAX) return 1e12 * (1 + Math.abs(logSd));
    const sd = Math.exp(logSd);
    let nlp = 0;
    for (const o of obs) {
      if (o.lo === o.hi) nlp -= logNormalPdf((o.lo - mu) / sd) - logSd;
      else nlp -= logNormalIntervalProbability((o.lo - mu) / sd, (o.hi - mu) / sd);
    }
    const dm = (mu - prior.mean) / prior.sd;
    const ds = logSd - Math.log(prior.sd);
    return nlp + prior.weight * (0.5 * dm * dm + ds * ds);
  };
}

function fitNormal(obs: readonly Censored[], prior: { mean: number; sd: number; weight: number }): NormalFit {
  const f = negativeLogPosterior(obs, prior);
  // Start from the prior pulled toward the observations' centres, which keeps Nelder–Mead in the basin.
  const centres = obs.map((o) =>
    Number.isFinite(o.lo) && Number.isFinite(o.hi) ? 0.5 * (o.lo + o.hi) : Number.isFinite(o.lo) ? o.lo : o.hi,
  );
  const start =
    centres.length > 0
      ? (prior.mean * prior.weight + centres.reduce((a, b) => a + b, 0)) / (prior.weight + centres.length)
      : prior.mean;
  let best = nelderMead(f, [start, Math.log(prior.sd)], [0.5 * prior.sd, 0.3], { tolerance: 1e-12 });
  // One restart from the optimum guards against a collapsed simplex.
  best = nelderMead(f, best.x, [0.1 * prior.sd, 0.1], { tolerance: 1e-13 });
  const [mu, logSd] = [best.x[0]!, best.x[1]!];
  const cov = inverseHessian2(f, best.x, [1e-3 * prior.sd, 1e-3]);
  const sd = Math.exp(logSd);
  return { mean: mu, sd, meanSe: Math.sqrt(cov[0][0]), sdSe: sd * Math.sqrt(cov[1][1]) };
}

function validatePrior(prior: ProfilePrior): ProfilePrior {
  if (prior === null || typeof prior !== 'object') throw new RangeError('prior must be an object');
  return {
    meanSpeedMs: requireInHalfOpen('prior.meanSpeedMs', prior.meanSpeedMs, 0, 60, 'm/s'),
    sdSpeedMs: requireInRange('prior.sdSpeedMs', prior.sdSpeedMs, 0.05, 30, 'm/s'),
    meanAzimuthDeg: requireInRange('prior.meanAzimuthDeg', prior.meanAzimuthDeg, -45, 45, '°'),
    sdAzimuthDeg: requireInRange('prior.sdAzimuthDeg', prior.sdAzimuthDeg, 0.05, 30, '°'),
    weightReps: requireInRange('prior.weightReps', prior.weightReps, 0.1, 1000),
  };
}

function mean(values: readonly number[]): number {
  return values.reduce((a, b) => a + b, 0) / values.length;
}

function sampleSd(values: readonly number[]): number {
  const m = mean(values);
  return Math.sqrt(values.reduce((a, v) => a + (v - m) * (v - m), 0) / (values.length - 1));
}

/**
 * Fit a player's launch profile for one technique from logged repetitions. All kicks must share one
 * technique; with no kicks the prior is returned as the profile (repetitions 0). The default prior is
 * the technique's entry in DEFAULT_PRIORS.
 */
export function fitProfile(
  kicks: readonly LoggedKick[],
  prior?: ProfilePrior & { technique?: Technique },
): KickProfile {
  if (!Array.isArray(kicks)) throw new RangeError('kicks must be an array');
  const prepared = kicks.map((k, i) => prepareKick(k, i));
  const technique = prepared[0]?.technique ?? prior?.technique;
  if (technique === undefined) throw new RangeError('kicks is empty and the prior names no technique');
  prepared.forEach((k) => {
    if (k.technique !== technique)
      throw new RangeError(`kicks[${k.index}].technique must be ${technique} like the others (got ${k.technique})`);
  });
  const usedPrior = validatePrior(prior ?? DEFAULT_PRIORS[technique]);

  const bounds = new SpeedBounds();
  const speedObs: (Censored | null)[] = prepared.map((k) => speedObservation(k, bounds));
  const speedList = speedObs.filter((o): o is Censored => o !== null);
  const speed = fitNormal(speedList, {
    mean: usedPrior.meanSpeedMs,
    sd: usedPrior.sdSpeedMs,
    weight: usedPrior.weightReps,
  });

  const aimObs = prepared.map((k, i) => {
    const s = speedObs[i];
    const representative = s ? Math.min(Math.max(speed.mean, s.lo), s.hi) : speed.mean;
    return aimObservation(k, Math.min(60, Math.max(1, representative)));
  });
  const aimList = aimObs.filter((o): o is Censored => o !== null);
  const aim = fitNormal(aimList, {
    mean: usedPrior.meanAzimuthDeg,
    sd: usedPrior.sdAzimuthDeg,
    weight: usedPrior.weightReps,
  });

  const used = prepared.filter((_, i) => speedObs[i] !== null || aimObs[i] !== null).length;
  const count = (list: readonly (Censored | null)[], kind: 'point' | 'interval' | 'bound'): number =>
    list.filter((o) => {
      if (o === null) return false;
      if (o.lo === o.hi) return kind === 'point';
      return Number.isFinite(o.lo) && Number.isFinite(o.hi) ? kind === 'interval' : kind === 'bound';
    }).length;

  return {
    technique,
    repetitions: used,
    ignoredRepetitions: prepared.length - used,
    meanSpeedMs: speed.mean,
    sdSpeedMs: speed.sd,
    meanSpeedSeMs: speed.meanSe,
    sdSpeedSeMs: speed.sdSe,
    meanAzimuthDeg: aim.mean,
    sdAzimuthDeg: aim.sd,
    meanAzimuthSeDeg: aim.meanSe,
    ...launchSummary(prepared, technique),
    observations: {
      speedPoints: count(speedObs, 'point'),
      speedIntervals: count(speedObs, 'interval'),
      speedBounds: count(speedObs, 'bound'),
      aimPoints: count(aimObs, 'point'),
      aimIntervals: count(aimObs, 'interval'),
      aimBounds: count(aimObs, 'bound'),
    },
    prior: usedPrior,
  };
}

function launchSummary(
  prepared: readonly PreparedKick[],
  technique: Technique,
): Pick<
  KickProfile,
  'elevationDeg' | 'sdElevationDeg' | 'backspinRps' | 'sidespinRps' | 'sdBackspinRps' | 'sdSidespinRps'
> {
  if (prepared.length === 0) {
    return {
      elevationDeg: DEFAULT_ELEVATION_DEG[technique],
      sdElevationDeg: 0,
      backspinRps: 0,
      sidespinRps: 0,
      sdBackspinRps: 0,
      sdSidespinRps: 0,
    };
  }
  const spread = (values: number[]): number => (values.length >= 3 ? sampleSd(values) : 0);
  const elevations = prepared.map((k) => k.elevationDeg);
  const back = prepared.map((k) => k.backspinRps);
  const side = prepared.map((k) => k.sidespinRps);
  return {
    elevationDeg: mean(elevations),
    sdElevationDeg: spread(elevations),
    backspinRps: mean(back),
    sidespinRps: mean(side),
    sdBackspinRps: spread(back),
    sdSidespinRps: spread(side),
  };
}
