/**
 * Profile fit: from a player's repetitions of one technique, a normal launch-speed
 * distribution and a normal aim distribution, fitted to interval-censored observations by maximum
 * likelihood with shrinkage toward a prior (a maximum a posteriori fit in which the prior is worth
 * `weightReps` repetitions). Reports how many repetitions it used and the uncertainty of the mean.
 */

import { type AimLaunch, type AimedSpeedFit, intendedLog, intentionConditions, NeededSpeeds, softMinLog } from './aimed-speed';
import { DEFAULT_ELEVATION_DEG } from './constants';
import { DEFAULT_SOLVER_SETTINGS, integrateFlight } from './integrate';
import { buildModel, resolveConditions, validateLaunch } from './model';
import { aimObservation, type Censored, prepareKick, type PreparedKick, SpeedBounds, speedObservation } from './profile-observations';
import {
  CEILING_PRIOR_LOG_SD,
  DEFAULT_CEILINGS_MS,
  DEFAULT_PRIORS,
  type FitOptions,
  type KickProfile,
  type LoggedKick,
  type ProfilePrior,
} from './profile-types';
import { timedEvidence } from './profile-timed';
import { inverseHessian, inverseHessian2, logNormalIntervalProbability, logNormalPdf, nelderMead } from './stats';
import type { FlightConditions, Technique } from './types';
import { requireInHalfOpen, requireInRange } from './validate';

const LOG_SD_MIN = Math.log(0.05);
const LOG_SD_MAX = Math.log(30);
/** Bounds of ln σ of the aimed-speed offset: 0.5 % … 100 % speed spread. */
const LOG_SD_MIN_AIMED = Math.log(0.005);
const LOG_SD_MAX_AIMED = Math.log(1);

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

/** Ln of a speed bound; non-positive or infinite bounds stay open. */
function logBound(v: number): number {
  if (v === Number.POSITIVE_INFINITY) return v;
  return v > 0 ? Math.log(v) : Number.NEGATIVE_INFINITY;
}

interface AimedFit {
  fit: AimedSpeedFit;
  /** ln of each repetition's intended speed at the fitted ceiling (NaN where it gave no speed). */
  intendedLogs: number[];
}

/**
 * Maximum a posteriori fit of (μ, ln σ, ln ceiling) of the aimed-speed model (aimed-speed.ts) to the
 * repetitions' censored ln-speed observations. The speed each target needs is taken for the repetition's
 * own launch angle and spin: a player who lifts a long driven ball higher, or puts more backspin on it,
 * needs less speed for it, and that choice is not inconsistency. Priors: μ ~ N(0, σ₀²/n₀) (players aim at the target),
 * ln σ ~ N(ln σ₀, 1/(2n₀)), ln ceiling ~ N(ln c₀, CEILING_PRIOR_LOG_SD²).
 */
function fitAimedSpeed(
  prepared: readonly PreparedKick[],
  speedObs: readonly (Censored | null)[],
  prior: ProfilePrior,
  ceilingPriorMs: number,
  typicalTargetM: number,
): AimedFit {
  const sd0 = prior.sdSpeedMs / prior.meanSpeedMs;
  const n0 = prior.weightReps;
  const lnC0 = Math.log(ceilingPriorMs);
  const needs = new NeededSpeeds();
  const obs: { lo: number; hi: number; need: number; relSd: number }[] = [];
  prepared.forEach((k, i) => {
    const o = speedObs[i];
    if (!o) return;
    obs.push({ lo: logBound(o.lo), hi: logBound(o.hi), need: needs.neededMs(k.targetDistanceM, k, k.conditions), relSd: o.relSd ?? 0 });
  });
  const f = (theta: number[]): number => {
    const [mu, logSd, logCeiling] = [theta[0]!, theta[1]!, theta[2]!];
    if (logSd < LOG_SD_MIN_AIMED || logSd > LOG_SD_MAX_AIMED) return 1e12 * (1 + Math.abs(logSd));
    if (logCeiling < Math.log(3) || logCeiling > Math.log(70)) return 1e12 * (1 + Math.abs(logCeiling));
    const sd = Math.exp(logSd);
    let nlp = 0;
    for (const o of obs) {
      const centre = softMinLog(Math.log(o.need), logCeiling) + mu;
      if (o.lo === o.hi) {
        // A point with its own measurement spread (a timed repetition): the spreads add in quadrature.
        const s = o.relSd > 0 ? Math.sqrt(sd * sd + o.relSd * o.relSd) : sd;
        nlp -= logNormalPdf((o.lo - centre) / s) - Math.log(s);
      } else nlp -= logNormalIntervalProbability((o.lo - centre) / sd, (o.hi - centre) / sd);
    }
    const dm = mu / sd0;
    const ds = logSd - Math.log(sd0);
    const dc = (logCeiling - lnC0) / CEILING_PRIOR_LOG_SD;
    return nlp + n0 * (0.5 * dm * dm + ds * ds) + 0.5 * dc * dc;
  };
  // Start from the median residual at the prior ceiling, which keeps Nelder–Mead in the basin.
  const residuals = obs
    .map((o) => {
      const c = Number.isFinite(o.lo) && Number.isFinite(o.hi) ? 0.5 * (o.lo + o.hi) : Number.isFinite(o.lo) ? o.lo : o.hi;
      return c - softMinLog(Math.log(o.need), lnC0);
    })
    .sort((a, b) => a - b);
  const mu0 = residuals.length ? residuals[Math.floor(residuals.length / 2)]! * (residuals.length / (residuals.length + n0)) : 0;
  let best = nelderMead(f, [mu0, Math.log(sd0), lnC0], [0.5 * sd0, 0.3, 0.1], { tolerance: 1e-12 });
  best = nelderMead(f, best.x, [0.1 * sd0, 0.1, 0.05], { tolerance: 1e-13 });
  const [mu, logSd, logCeiling] = [best.x[0]!, best.x[1]!, best.x[2]!];
  const cov = inverseHessian(f, best.x, [1e-3 * sd0, 1e-3, 1e-3]);
  const sd = Math.exp(logSd);
  const intendedLogs = prepared.map((k) => softMinLog(Math.log(needs.neededMs(k.targetDistanceM, k, k.conditions)), logCeiling));
  return {
    fit: {
      offsetLogMean: mu,
      offsetLogSd: sd,
      offsetLogMeanSe: Math.sqrt(cov[0]![0]!),
      offsetLogSdSe: sd * Math.sqrt(cov[1]![1]!),
      ceilingMs: Math.exp(logCeiling),
      ceilingLogSe: Math.min(CEILING_PRIOR_LOG_SD, Math.sqrt(cov[2]![2]!)),
      typicalTargetM,
    },
    intendedLogs,
  };
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const n = sorted.length;
  return n % 2 ? sorted[(n - 1) / 2]! : 0.5 * (sorted[n / 2 - 1]! + sorted[n / 2]!);
}

/**
 * Fit a player's launch profile for one technique from logged repetitions. All kicks must share one
 * technique; with no kicks the prior is returned as the profile (repetitions 0). The default prior is
 * the technique's entry in DEFAULT_PRIORS. Launch speed is fitted relative to the speed each
 * repetition's target needed, with a ceiling (aimed-speed.ts), so drills at different distances
 * do not inflate the spread.
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
  const prepared = given.map((k, i) => (timed[i] ? { ...k, backspinRps: timed[i].backspinRps } : k));
  const technique = prepared[0]?.technique ?? prior?.technique;
  if (technique === undefined) throw new RangeError('kicks is empty and the prior names no technique');
  prepared.forEach((k) => {
    if (k.technique !== technique)
      throw new RangeError(`kicks[${k.index}].technique must be ${technique} like the others (got ${k.technique})`);
  });
  const usedPrior = validatePrior(prior ?? DEFAULT_PRIORS[technique]);
  const ceilingPriorMs = usedPrior.ceilingMs ?? DEFAULT_CEILINGS_MS[technique];
  const launch = launchSummary(prepared, technique);

  const bounds = new SpeedBounds();
  const speedObs: (Censored | null)[] = prepared.map((k, i) => {
    const t = timed[i];
    return t ? { lo: t.speedMs, hi: t.speedMs, relSd: t.speedSdMs / t.speedMs } : speedObservation(k, bounds);
  });
  const speedCount = speedObs.filter((o) => o !== null).length;
  const meanLaunch = { elevationDeg: launch.elevationDeg, backspinRps: launch.backspinRps, sidespinRps: launch.sidespinRps };
  const conditions0 = prepared[0]?.conditions ?? {};
  let aimed: AimedSpeedFit;
  let intendedLogs: number[];
  let described: NormalFit;
  if (speedCount === 0) {
    // Nothing about speed: the prior, quoted at the distance its mean speed carries.
    const typical = referenceCarry(usedPrior.meanSpeedMs, meanLaunch, conditions0);
    const sd0 = usedPrior.sdSpeedMs / usedPrior.meanSpeedMs;
    aimed = {
      offsetLogMean: 0,
      offsetLogSd: sd0,
      offsetLogMeanSe: sd0 / Math.sqrt(usedPrior.weightReps),
      offsetLogSdSe: sd0 * Math.sqrt(1 / (2 * usedPrior.weightReps)),
      ceilingMs: ceilingPriorMs,
      ceilingLogSe: CEILING_PRIOR_LOG_SD,
      typicalTargetM: typical,
    };
    intendedLogs = prepared.map(() => Math.log(usedPrior.meanSpeedMs));
    described = {
      mean: usedPrior.meanSpeedMs,
      sd: usedPrior.sdSpeedMs,
      meanSe: usedPrior.sdSpeedMs / Math.sqrt(usedPrior.weightReps),
      sdSe: usedPrior.sdSpeedMs * Math.sqrt(1 / (2 * usedPrior.weightReps)),
    };
  } else {
    const typicalTargetM = median(prepared.map((k) => k.targetDistanceM));
    const result = fitAimedSpeed(prepared, speedObs, usedPrior, ceilingPriorMs, typicalTargetM);
    aimed = result.fit;
    intendedLogs = result.intendedLogs;
    const needTypical = new NeededSpeeds().neededMs(typicalTargetM, meanLaunch, conditions0);
    const meanAtTypical = Math.exp(intendedLog(needTypical, aimed.ceilingMs) + aimed.offsetLogMean);
    described = {
      mean: meanAtTypical,
      sd: meanAtTypical * aimed.offsetLogSd,
      meanSe: meanAtTypical * aimed.offsetLogMeanSe,
      sdSe: meanAtTypical * aimed.offsetLogSdSe,
    };
  }

  const aimObs = prepared.map((k, i) => {
    const s = speedObs[i];
    const expected = Math.exp(intendedLogs[i]! + aimed.offsetLogMean);
    const representative = s ? Math.min(Math.max(expected, s.lo), s.hi) : expected;
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
    meanSpeedMs: described.mean,
    sdSpeedMs: described.sd,
    meanSpeedSeMs: described.meanSe,
    sdSpeedSeMs: described.sdSe,
    aimedSpeed: aimed,
    meanAzimuthDeg: aim.mean,
    sdAzimuthDeg: aim.sd,
    meanAzimuthSeDeg: aim.meanSe,
    ...launch,
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

/** Carry of a launch at `speedMs` in the intention conditions (still air, ISA sea level). */
function referenceCarry(speedMs: number, launch: AimLaunch, conditions: FlightConditions): number {
  const model = buildModel(resolveConditions(intentionConditions(conditions)), validateLaunch({ speed: speedMs, ...launch }));
  return integrateFlight(model, { settings: DEFAULT_SOLVER_SETTINGS }).carryM;
}

function launchSummary(
  prepared: readonly PreparedKick[],
  technique: Technique,
): Pick<KickProfile, 'elevationDeg' | 'sdElevationDeg' | 'backspinRps' | 'sidespinRps' | 'sdBackspinRps' | 'sdSidespinRps'> {
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
