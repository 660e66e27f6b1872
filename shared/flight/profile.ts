/**
 * Profile fit (model version 3): from a player's repetitions of one technique, the aimed-speed model —
 * launch speed relative to the speed each repetition's target needed, under a ceiling bounded by the
 * physiological cap, with each repetition integrated over the launch angle and spin it may have had
 * (profile-speed-fit.ts) — and a normal aim distribution, both fitted to interval-censored observations
 * with shrinkage toward a prior by ball size (maximum a posteriori; the prior is worth `weightReps`
 * repetitions). The profile carries the launch spreads sampling draws, a one-sided ceiling posterior,
 * standard errors and warnings (profile-warnings.ts).
 */

import { type AimLaunch, type AimedSpeedFit, intendedLog, intentionConditions, NeededSpeeds } from './aimed-speed';
import { DEFAULT_ELEVATION_DEG } from './constants';
import { DEFAULT_SOLVER_SETTINGS, integrateFlight } from './integrate';
import { buildModel, resolveConditions, validateLaunch } from './model';
import {
  aimObservation,
  type Censored,
  type LaunchUnknowns,
  prepareKick,
  type PreparedKick,
  SpeedBounds,
  speedObservation,
} from './profile-observations';
import { ballSizeOf, CEILINGS_BY_BALL_MS, ELEVATION_SD_PRIOR_DEG, LAUNCH_SPEED_CAP_MS, PRIORS_BY_BALL } from './profile-priors';
import { playerSpin } from './profile-spin';
import { fitAimedSpeed, type SpeedEvidence, speedEvidence } from './profile-speed-fit';
import { CEILING_PRIOR_LOG_SD, type FitOptions, type KickProfile, type LoggedKick, type ProfilePrior } from './profile-types';
import { fitWarnings } from './profile-warnings';
import { timedEvidence } from './profile-timed';
import { inverseHessian2, logNormalIntervalProbability, logNormalPdf, nelderMead } from './stats';
import type { FlightConditions, Technique } from './types';
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
 * Negative log-posterior of (μ, ln σ): censored normal likelihood (an observation's own `extraVar` added
 * to σ²) plus a prior worth n₀ repetitions,
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
      const s = o.extraVar ? Math.sqrt(sd * sd + o.extraVar) : sd;
      if (o.lo === o.hi) nlp -= logNormalPdf((o.lo - mu) / s) - Math.log(s);
      else nlp -= logNormalIntervalProbability((o.lo - mu) / s, (o.hi - mu) / s);
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
    centres.length > 0 ? (prior.mean * prior.weight + centres.reduce((a, b) => a + b, 0)) / (prior.weight + centres.length) : prior.mean;
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
    ...(prior.ceilingMs === undefined ? {} : { ceilingMs: requireInRange('prior.ceilingMs', prior.ceilingMs, 3, 60, 'm/s') }),
  };
}

function mean(values: readonly number[]): number {
  return values.reduce((a, b) => a + b, 0) / values.length;
}

function sampleSd(values: readonly number[]): number {
  const m = mean(values);
  return Math.sqrt(values.reduce((a, v) => a + (v - m) * (v - m), 0) / (values.length - 1));
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const n = sorted.length;
  return n % 2 ? sorted[(n - 1) / 2]! : 0.5 * (sorted[n / 2 - 1]! + sorted[n / 2]!);
}

/**
 * Fit a player's launch profile for one technique from logged repetitions. All kicks must share one
 * technique; with no kicks the prior is returned as the profile (repetitions 0). The default prior is
 * the technique's entry for the squad's ball size (profile-priors.ts). Launch speed is fitted relative to
 * the speed each repetition's target needed, with a ceiling under the physiological cap (aimed-speed.ts,
 * profile-speed-fit.ts), each repetition integrated over the launch angle and spin it may have had; the
 * profile carries the launch spreads to draw and warnings (profile-warnings.ts).
 */
export function fitProfile(
  kicks: readonly LoggedKick[],
  prior?: ProfilePrior & { technique?: Technique },
  options: FitOptions = {},
): KickProfile {
  if (!Array.isArray(kicks)) throw new RangeError('kicks must be an array');
  const given = kicks.map((k, i) => prepareKick(k, i));
  const timed = timedEvidence(given, options);
  // A solved stopwatch reading replaces the backspin guessed by eye with the measured one.
  const prepared = given.map((k, i) => (timed[i] ? { ...k, backspinRps: timed[i].backspinRps, spinMeasured: true } : k));
  const technique = prepared[0]?.technique ?? prior?.technique;
  if (technique === undefined) throw new RangeError('kicks is empty and the prior names no technique');
  prepared.forEach((k) => {
    if (k.technique !== technique)
      throw new RangeError(`kicks[${k.index}].technique must be ${technique} like the others (got ${k.technique})`);
  });
  const ballSize = options.ballSize ?? ballSizeOf(prepared[0]?.conditions.ball);
  const capMs = LAUNCH_SPEED_CAP_MS[ballSize];
  const usedPrior = validatePrior(prior ?? PRIORS_BY_BALL[ballSize][technique]);
  const ceilingPriorMs = Math.min(capMs, usedPrior.ceilingMs ?? CEILINGS_BY_BALL_MS[ballSize][technique]);
  const launch = launchSummary(prepared, technique);
  // The player's own spin with the coach's eye taken out; each repetition is read at its best-guess spin.
  const spin = playerSpin(prepared);
  const readAt = prepared.map((k, i) => ({ ...k, backspinRps: spin.back.best[i]!, sidespinRps: spin.side.best[i]! }));
  const unknownsOf = (k: PreparedKick): LaunchUnknowns => ({
    elevationSdDeg: k.angleMeasured ? 0 : ELEVATION_SD_PRIOR_DEG[technique],
    backspinSdRps: spin.back.postSd[k.index] ?? 0,
  });
  const meanLaunch = { elevationDeg: launch.elevationDeg, backspinRps: launch.backspinRps, sidespinRps: launch.sidespinRps };

  const bounds = new SpeedBounds();
  const needs = new NeededSpeeds();
  const speedObs: (Censored | null)[] = readAt.map((k, i) => {
    const t = timed[i];
    return t ? { lo: t.speedMs, hi: t.speedMs, relSd: t.speedSdMs / t.speedMs } : speedObservation(k, bounds);
  });
  const evidence = speedEvidence(readAt, speedObs, unknownsOf, bounds, needs, meanLaunch);
  const conditions0 = prepared[0]?.conditions ?? {};
  const sd0 = usedPrior.sdSpeedMs / usedPrior.meanSpeedMs;
  let aimed: AimedSpeedFit;
  let lambda = 1;
  let evidenceProbability: number[] = [];
  let described: NormalFit;
  let priorShare = 1;
  if (evidence.length === 0) {
    // Nothing about speed: the prior, quoted at the distance its mean speed carries.
    const typical = referenceCarry(Math.min(capMs, usedPrior.meanSpeedMs), meanLaunch, conditions0);
    aimed = {
      offsetLogMean: 0,
      offsetLogSd: sd0,
      offsetLogMeanSe: sd0 / Math.sqrt(usedPrior.weightReps),
      offsetLogSdSe: sd0 * Math.sqrt(1 / (2 * usedPrior.weightReps)),
      ceilingMs: ceilingPriorMs,
      ceilingLogSe: CEILING_PRIOR_LOG_SD,
      ceilingFloorMs: 0,
      typicalTargetM: typical,
    };
    const meanMs = Math.min(capMs, usedPrior.meanSpeedMs);
    described = {
      mean: meanMs,
      sd: usedPrior.sdSpeedMs,
      meanSe: usedPrior.sdSpeedMs / Math.sqrt(usedPrior.weightReps),
      sdSe: usedPrior.sdSpeedMs * Math.sqrt(1 / (2 * usedPrior.weightReps)),
    };
  } else {
    const typicalTargetM = median(prepared.map((k) => k.targetDistanceM));
    const result = fitAimedSpeed(evidence, usedPrior, ceilingPriorMs, capMs, typicalTargetM);
    lambda = result.launchNoiseScale;
    evidenceProbability = result.evidenceProbability;
    aimed = { ...result.fit, ceilingFloorMs: ceilingFloorMs(evidence, result.fit) };
    const priorPrecision = usedPrior.weightReps / (sd0 * sd0);
    priorShare = Math.min(1, priorPrecision * aimed.offsetLogMeanSe * aimed.offsetLogMeanSe);
    const needTypical = needs.neededMs(typicalTargetM, meanLaunch, conditions0);
    const meanAtTypical = Math.min(capMs, Math.exp(intendedLog(needTypical, aimed.ceilingMs) + aimed.offsetLogMean));
    described = {
      mean: meanAtTypical,
      sd: meanAtTypical * aimed.offsetLogSd,
      meanSe: meanAtTypical * aimed.offsetLogMeanSe,
      sdSe: meanAtTypical * aimed.offsetLogSdSe,
    };
  }
  const intendedLogs = prepared.map((k) =>
    evidence.length === 0
      ? Math.log(described.mean)
      : intendedLog(needs.neededMs(k.targetDistanceM, meanLaunch, k.conditions), aimed.ceilingMs),
  );

  const aimObs = readAt.map((k, i) => {
    const s = speedObs[i];
    const expected = Math.exp(intendedLogs[i]! + aimed.offsetLogMean);
    const representative = s ? Math.min(Math.max(expected, s.lo), s.hi) : expected;
    const unknowns = {
      elevationSdDeg: k.angleMeasured ? 0 : lambda * ELEVATION_SD_PRIOR_DEG[technique],
      backspinSdRps: spin.back.postSd[i]!,
      sidespinSdRps: spin.side.postSd[i]!,
    };
    return aimObservation(k, Math.min(60, Math.max(1, representative)), meanLaunch, unknowns, bounds);
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
  const spreads = launchSpreads(prepared, technique, lambda, spin);

  return {
    technique,
    repetitions: used,
    ignoredRepetitions: prepared.length - used,
    meanSpeedMs: described.mean,
    sdSpeedMs: described.sd,
    meanSpeedSeMs: described.meanSe,
    sdSpeedSeMs: described.sdSe,
    aimedSpeed: aimed,
    meanAzimuthDeg: aim.mean,
    sdAzimuthDeg: aim.sd,
    meanAzimuthSeDeg: aim.meanSe,
    elevationDeg: launch.elevationDeg,
    backspinRps: launch.backspinRps,
    sidespinRps: launch.sidespinRps,
    ...spreads,
    launchNoiseScale: lambda,
    speedCapMs: capMs,
    longestTargetM: prepared.reduce((m, k) => Math.max(m, k.targetDistanceM), 0),
    warnings: fitWarnings({
      repetitions: used,
      prepared,
      evidenceLo: evidence.map((o) => o.lo),
      evidenceProbability,
      capMs,
      priorShare,
    }),
    observations: {
      speedPoints: count(speedObs, 'point'),
      speedIntervals: count(speedObs, 'interval'),
      speedBounds: count(speedObs, 'bound'),
      aimPoints: count(aimObs, 'point'),
      aimIntervals: count(aimObs, 'interval'),
      aimBounds: count(aimObs, 'bound'),
      timed: timed.filter((t) => t !== null).length,
    },
    prior: usedPrior,
  };
}

/**
 * The speed a player has demonstrably reached, m/s: of the repetitions that got at least to their target
 * (an interval or a lower bound, or a point), the upper quartile of their evidence centres, less one
 * fitted spread (a lucky strike is not a ceiling), never above the fitted ceiling. The sampled ceiling is
 * truncated below it: a player has at least reached what they hit.
 */
function ceilingFloorMs(evidence: readonly SpeedEvidence[], fit: AimedSpeedFit): number {
  const reached = evidence
    .filter((o) => Number.isFinite(o.lo))
    .map((o) => (Number.isFinite(o.hi) ? 0.5 * (o.lo + o.hi) : o.lo))
    .sort((a, b) => a - b);
  if (reached.length === 0) return 0;
  const upper = reached[Math.min(reached.length - 1, Math.floor(0.75 * reached.length))]!;
  return Math.min(fit.ceilingMs, Math.exp(upper - fit.offsetLogSd));
}

/** Carry of a launch at `speedMs` in the intention conditions (still air, ISA sea level). */
function referenceCarry(speedMs: number, launch: AimLaunch, conditions: FlightConditions): number {
  const model = buildModel(resolveConditions(intentionConditions(conditions)), validateLaunch({ speed: speedMs, ...launch }));
  return integrateFlight(model, { settings: DEFAULT_SOLVER_SETTINGS }).carryM;
}

function launchSummary(
  prepared: readonly PreparedKick[],
  technique: Technique,
): Pick<KickProfile, 'elevationDeg' | 'backspinRps' | 'sidespinRps'> {
  if (prepared.length === 0) return { elevationDeg: DEFAULT_ELEVATION_DEG[technique], backspinRps: 0, sidespinRps: 0 };
  return {
    elevationDeg: mean(prepared.map((k) => k.elevationDeg)),
    backspinRps: mean(prepared.map((k) => k.backspinRps)),
    sidespinRps: mean(prepared.map((k) => k.sidespinRps)),
  };
}

/**
 * The launch spreads sampling draws (see KickProfile.sdElevationDeg and sdBackspinRps): measured angles
 * (three or more) give the elevation spread, else the technique's prior scaled by λ; each spin spread is
 * the player's own, with the coach's eye taken out (profile-spin.ts) — the logged steps' own scatter
 * would count the eye's error twice, once in the spin drawn and once in the speed and aim it blurred.
 */
function launchSpreads(
  prepared: readonly PreparedKick[],
  technique: Technique,
  lambda: number,
  spin: ReturnType<typeof playerSpin>,
): Pick<KickProfile, 'sdElevationDeg' | 'elevationSdSource' | 'sdBackspinRps' | 'sdSidespinRps'> {
  const measured = prepared.filter((k) => k.angleMeasured).map((k) => k.elevationDeg);
  const fromLogs = measured.length >= 3;
  return {
    sdElevationDeg: fromLogs ? sampleSd(measured) : lambda * ELEVATION_SD_PRIOR_DEG[technique],
    elevationSdSource: fromLogs ? 'logged' : 'prior',
    sdBackspinRps: spin.back.sd,
    sdSidespinRps: spin.side.sd,
  };
}
