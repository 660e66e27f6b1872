/**
 * The speed part of the profile fit: a maximum a posteriori fit of the aimed-speed model (aimed-speed.ts)
 * to every repetition's censored ln-speed evidence, with the repetition's unknown launch integrated out.
 *
 * A repetition logged without a measured angle was kicked at *some* angle near the technique's default,
 * and its real backspin is known only about its best guess from the eye-logged step (profile-spin.ts).
 * Its speed evidence, read at that launch, is then off by Δ = ln V(actual) − ln V(assumed)
 * (profile-observations.ts, launchShift), so with ln v ~ N(c, σ²) the evidence is
 * ln v − Δ ~ N(c − λ²·E[Δₑ] − E[Δₛ], σ² + λ²·Var[Δₑ] + Var[Δₛ]): the censoring interval is widened by the
 * launch uncertainty. λ (the launch-noise scale) multiplies the assumed elevation spread and is fitted
 * with a weak prior centred on 1, so a tight record on a small target can say the launches were tighter
 * than assumed, and wild logs cannot be blamed on inconsistency alone; the spin part Δₛ is the player's
 * own, estimated from the logs, and is not scaled. The speed each repetition needed is that of the
 * player's usual launch: they strike for the ball they mean, and this one's launch moves where it lands.
 *
 * The ceiling is bounded by the physiological speed cap (profile-priors.ts): the fit may not explain a
 * log with a kick no one strikes.
 */

import { type AimLaunch, type AimedSpeedFit, NeededSpeeds, softMinLog } from './aimed-speed';
import {
  type Censored,
  evidenceCarryM,
  launchShift,
  type LaunchShift,
  type LaunchUnknowns,
  type PreparedKick,
  SpeedBounds,
} from './profile-observations';
import { CEILING_PRIOR_LOG_SD, type ProfilePrior } from './profile-types';
import { inverseHessian, logNormalIntervalProbability, logNormalPdf, nelderMead } from './stats';

/** Bounds of ln σ of the aimed-speed offset: 0.5 % … 100 % speed spread. */
const LOG_SD_MIN_AIMED = Math.log(0.005);
const LOG_SD_MAX_AIMED = Math.log(1);
/** Bounds of the launch-noise scale λ. */
const LOG_LAMBDA_MIN = Math.log(0.05);
const LOG_LAMBDA_MAX = Math.log(2);
/**
 * Prior on ln λ: N(0, 1), the assumed spreads right within a factor of about e (common practice): they
 * are guesses, and a record tighter than they allow must be believed.
 */
const LOG_LAMBDA_PRIOR_SD = 1;

/** One repetition's speed evidence as the fit reads it (ln speed). */
export interface SpeedEvidence {
  index: number;
  lo: number;
  hi: number;
  /** ln of the speed the repetition's target needed, at its assumed launch, in intention conditions. */
  lnNeed: number;
  /** A point's own measurement spread (a timed repetition), ln units. */
  relSd: number;
  shift: LaunchShift;
}

/** Result of the speed fit. */
export interface SpeedFit {
  fit: AimedSpeedFit;
  /** λ: share of the assumed launch uncertainty the logs support. */
  launchNoiseScale: number;
  /**
   * How surprising each evidence is under the fit: the probability of the interval, or for a point the
   * two-sided tail probability of its standardised distance (for the contradiction check).
   */
  evidenceProbability: number[];
}

/** Ln of a speed bound; non-positive or infinite bounds stay open. */
function logBound(v: number): number {
  if (v === Number.POSITIVE_INFINITY) return v;
  return v > 0 ? Math.log(v) : Number.NEGATIVE_INFINITY;
}

/** The speed evidence of every repetition that has some, with its launch shift. */
export function speedEvidence(
  prepared: readonly PreparedKick[],
  speedObs: readonly (Censored | null)[],
  unknownsOf: (k: PreparedKick) => LaunchUnknowns,
  bounds: SpeedBounds,
  needs: NeededSpeeds,
  intended: AimLaunch,
): SpeedEvidence[] {
  const out: SpeedEvidence[] = [];
  prepared.forEach((k, i) => {
    const o = speedObs[i];
    if (!o) return;
    const carry = o.relSd !== undefined ? null : evidenceCarryM(k);
    out.push({
      index: i,
      lo: logBound(o.lo),
      hi: logBound(o.hi),
      // The player strikes for the ball they mean (their usual launch); this one's own launch moves where it lands.
      lnNeed: Math.log(needs.neededMs(k.targetDistanceM, intended, k.conditions)),
      relSd: o.relSd ?? 0,
      shift: carry === null ? { meanLog: 0, varLog: 0, spin: { meanLog: 0, varLog: 0 } } : launchShift(k, carry, unknownsOf(k), bounds),
    });
  });
  return out;
}

/** See SpeedFit.evidenceProbability. */
function surprise(o: SpeedEvidence, centre: number, sd: number, lambda2: number): number {
  const c = centre - lambda2 * o.shift.meanLog - o.shift.spin.meanLog;
  const s2 = sd * sd + lambda2 * o.shift.varLog + o.shift.spin.varLog;
  if (o.lo === o.hi) {
    const z = Math.abs(o.lo - c) / Math.sqrt(s2 + o.relSd * o.relSd);
    return 2 * Math.exp(logNormalIntervalProbability(Number.NEGATIVE_INFINITY, -z));
  }
  const s = Math.sqrt(s2);
  return Math.exp(logNormalIntervalProbability((o.lo - c) / s, (o.hi - c) / s));
}

function logProbability(o: SpeedEvidence, centre: number, sd: number, lambda2: number): number {
  const c = centre - lambda2 * o.shift.meanLog - o.shift.spin.meanLog;
  const s2 = sd * sd + lambda2 * o.shift.varLog + o.shift.spin.varLog;
  if (o.lo === o.hi) {
    const s = Math.sqrt(s2 + o.relSd * o.relSd);
    return logNormalPdf((o.lo - c) / s) - Math.log(s);
  }
  const s = Math.sqrt(s2);
  return logNormalIntervalProbability((o.lo - c) / s, (o.hi - c) / s);
}

/**
 * MAP fit of (μ, ln σ, ln ceiling, ln λ). Priors: μ ~ N(0, σ₀²/n₀) (players aim at the target),
 * ln σ ~ N(ln σ₀, 1/(2n₀)), ln ceiling ~ N(ln c₀, CEILING_PRIOR_LOG_SD²) with ceiling ≤ `capMs`,
 * ln λ ~ N(0, 1).
 */
export function fitAimedSpeed(
  evidence: readonly SpeedEvidence[],
  prior: ProfilePrior,
  ceilingPriorMs: number,
  capMs: number,
  typicalTargetM: number,
): SpeedFit {
  const sd0 = prior.sdSpeedMs / prior.meanSpeedMs;
  const n0 = prior.weightReps;
  const lnCap = Math.log(capMs);
  const lnC0 = Math.min(Math.log(ceilingPriorMs), lnCap);
  const anyShift = evidence.some((o) => o.shift.varLog > 0);
  const f = (theta: number[]): number => {
    const [mu, logSd, logCeiling, logLambda] = [theta[0]!, theta[1]!, theta[2]!, theta[3]!];
    if (logSd < LOG_SD_MIN_AIMED || logSd > LOG_SD_MAX_AIMED) return 1e12 * (1 + Math.abs(logSd));
    if (logCeiling < Math.log(3) || logCeiling > lnCap) return 1e12 * (1 + Math.abs(logCeiling));
    if (logLambda < LOG_LAMBDA_MIN || logLambda > LOG_LAMBDA_MAX) return 1e12 * (1 + Math.abs(logLambda));
    const sd = Math.exp(logSd);
    const lambda2 = anyShift ? Math.exp(2 * logLambda) : 0;
    let nlp = 0;
    for (const o of evidence) nlp -= logProbability(o, softMinLog(o.lnNeed, logCeiling) + mu, sd, lambda2);
    const dm = mu / sd0;
    const ds = logSd - Math.log(sd0);
    const dc = (logCeiling - Math.log(ceilingPriorMs)) / CEILING_PRIOR_LOG_SD;
    const dl = logLambda / LOG_LAMBDA_PRIOR_SD;
    return nlp + n0 * (0.5 * dm * dm + ds * ds) + 0.5 * dc * dc + 0.5 * dl * dl;
  };
  // Start from the median residual at the prior ceiling, which keeps Nelder–Mead in the basin.
  const residuals = evidence
    .map((o) => {
      const c = Number.isFinite(o.lo) && Number.isFinite(o.hi) ? 0.5 * (o.lo + o.hi) : Number.isFinite(o.lo) ? o.lo : o.hi;
      return c - softMinLog(o.lnNeed, lnC0);
    })
    .sort((a, b) => a - b);
  const mu0 = residuals.length ? residuals[Math.floor(residuals.length / 2)]! * (residuals.length / (residuals.length + n0)) : 0;
  const start = [mu0, Math.log(sd0), Math.min(lnC0, lnCap - 0.01), 0];
  let best = nelderMead(f, start, [0.5 * sd0, 0.3, 0.1, anyShift ? 0.3 : 0], { tolerance: 1e-12 });
  best = nelderMead(f, best.x, [0.1 * sd0, 0.1, 0.05, anyShift ? 0.1 : 0], { tolerance: 1e-13 });
  const [mu, logSd, logCeiling, logLambda] = [best.x[0]!, best.x[1]!, best.x[2]!, anyShift ? best.x[3]! : 0];
  // Standard errors from the curvature in (μ, ln σ, ln ceiling) at the fitted λ.
  const f3 = (t: number[]): number => f([t[0]!, t[1]!, t[2]!, logLambda]);
  const at = [mu, logSd, Math.min(logCeiling, lnCap - 2e-3)];
  const cov = inverseHessian(f3, at, [1e-3 * sd0, 1e-3, 1e-3]);
  const sd = Math.exp(logSd);
  const lambda2 = anyShift ? Math.exp(2 * logLambda) : 0;
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
    launchNoiseScale: Math.exp(logLambda),
    evidenceProbability: evidence.map((o) => surprise(o, softMinLog(o.lnNeed, logCeiling) + mu, sd, lambda2)),
  };
}
