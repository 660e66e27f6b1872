/**
 * Reach envelope: a seeded Monte Carlo of a fitted profile under given conditions — where a player's
 * kicks of one technique aimed at one distance will land, with percentiles, a covariance ellipse and the
 * hit probability of that target — plus the reach curve (reach-curve.ts) behind reliable reach and hit
 * probabilities at other distances. Plain JSON, so it can cross the worker boundary.
 */

import type { KickProfile } from './profile-types';
import { AimedSamples, curveReliableReachM, type ReachCurve } from './reach-curve';
import { checkedProfile } from './sampling';
import { type DistributionSummary, summarise } from './stats';
import type { FlightConditions, Technique } from './types';
import { requireFinite, requireInHalfOpen, requireInteger } from './validate';

export type { DistributionSummary } from './stats';

/** Covariance ellipse of landing points (x along the aim, y to the left) holding `coverage` of a bivariate normal. */
export interface LandingEllipse {
  centerXM: number;
  centerYM: number;
  /** [[var x, cov], [cov, var y]], m². */
  covarianceM2: [[number, number], [number, number]];
  semiMajorM: number;
  semiMinorM: number;
  /** Major-axis angle from the aim line toward the left, degrees. */
  angleDeg: number;
  coverage: number;
}

/** A target on the pitch relative to the kick spot and aim line. */
export interface EnvelopeTarget {
  distanceM: number;
  radiusM: number;
  lateralOffsetM?: number;
}

/** Options for `reachEnvelope`. */
export interface EnvelopeOptions {
  samples: number;
  seed: number;
  /** Report the hit probability for this target. */
  target?: EnvelopeTarget;
  /** Target radius for reliable reach (default: the target's radius, else 3 m). */
  reliableReachRadiusM?: number;
  /** Distance the sampled kicks are aimed at (default: the target's, else the profile's typical target). */
  aimDistanceM?: number;
  /** Whether to compute the reach curve behind reliable reach (default true; it uses the same samples). */
  withCurve?: boolean;
}

/** Samples of the reach curves the server caches and the client draws: both sides use this and the same seed. */
export const CURVE_SAMPLES = 1000;

/** Monte Carlo reach envelope. JSON-serialisable. */
export interface ReachEnvelope {
  technique: Technique;
  samples: number;
  seed: number;
  /** Distance the sampled kicks were aimed at, m. */
  aimDistanceM: number;
  /** Share of sampled kicks that landed within the 30 s cap. */
  landedShare: number;
  /** Carry (horizontal distance from the kick spot to landing). */
  carryM: DistributionSummary;
  /** Lateral landing offset from the aim line, + = left. */
  lateralM: DistributionSummary;
  ellipse: LandingEllipse;
  /** Every sampled landing point (x along the aim, y to the left), rounded to 1 mm. */
  cloud: { xM: number[]; yM: number[] };
  hit: (Required<EnvelopeTarget> & { probability: number }) | null;
  /** Hit probability of kicks aimed at each distance (null when asked for none). */
  curve: ReachCurve | null;
  reliableReach: { targetRadiusM: number; minProbability: number; distanceM: number | null };
}

/** Probability threshold of reliable reach, as the product defines it. */
export const RELIABLE_REACH_PROBABILITY = 0.6;
const ELLIPSE_COVERAGE = 0.9;
const DEFAULT_REACH_RADIUS_M = 3;

function ellipseOf(xs: readonly number[], ys: readonly number[]): LandingEllipse {
  const n = xs.length;
  const cm = xs.reduce((a, b) => a + b, 0) / n;
  const lm = ys.reduce((a, b) => a + b, 0) / n;
  let scc = 0;
  let scl = 0;
  let sll = 0;
  for (let i = 0; i < n; i++) {
    const dc = xs[i]! - cm;
    const dl = ys[i]! - lm;
    scc += dc * dc;
    scl += dc * dl;
    sll += dl * dl;
  }
  const d = Math.max(1, n - 1);
  const [vcc, vcl, vll] = [scc / d, scl / d, sll / d];
  const half = 0.5 * (vcc + vll);
  const root = Math.sqrt(0.25 * (vcc - vll) * (vcc - vll) + vcl * vcl);
  // Chi-square quantile with 2 degrees of freedom: k² = −2 ln(1 − coverage).
  const k = Math.sqrt(-2 * Math.log(1 - ELLIPSE_COVERAGE));
  return {
    centerXM: cm,
    centerYM: lm,
    covarianceM2: [
      [vcc, vcl],
      [vcl, vll],
    ],
    semiMajorM: k * Math.sqrt(Math.max(0, half + root)),
    semiMinorM: k * Math.sqrt(Math.max(0, half - root)),
    angleDeg: (0.5 * Math.atan2(2 * vcl, vcc - vll) * 180) / Math.PI,
    coverage: ELLIPSE_COVERAGE,
  };
}

export { sampleLaunches, type SampledLaunch } from './sampling';

/**
 * Monte Carlo reach envelope of `profile` under `conditions` ({} = defaults). Same seed → identical
 * numbers. Each sample draws speed and aim from the fitted distributions widened by the uncertainty of
 * their means (a predictive envelope), and launch angle and spin from the spreads the fit saw.
 */
export function reachEnvelope(given: KickProfile, conditions: FlightConditions, options: EnvelopeOptions): ReachEnvelope {
  if (options === null || typeof options !== 'object') throw new RangeError('options must be an object with samples and seed');
  const profile = checkedProfile(given);
  requireInteger('samples', options.samples, 1, 200000);
  const aimDistanceM = requireInHalfOpen(
    'aimDistanceM',
    options.aimDistanceM ?? options.target?.distanceM ?? profile.aimedSpeed.typicalTargetM,
    0,
    200,
    'm',
  );
  const aimed = new AimedSamples(profile, conditions ?? {}, options.samples, options.seed);
  const xs: number[] = [];
  const ys: number[] = [];
  const carry: number[] = [];
  let landed = 0;
  for (const p of aimed.flownAt(aimDistanceM)) {
    if (p.landed) landed++;
    xs.push(Math.round(p.x * 1000) / 1000);
    ys.push(Math.round(p.y * 1000) / 1000);
    carry.push(p.carryM);
  }
  const partial = {
    technique: profile.technique,
    samples: options.samples,
    seed: options.seed,
    aimDistanceM,
    landedShare: landed / options.samples,
    carryM: summarise(carry),
    lateralM: summarise(ys),
    ellipse: ellipseOf(xs, ys),
    cloud: { xM: xs, yM: ys },
  };
  let hit: ReachEnvelope['hit'] = null;
  if (options.target) {
    const t = options.target;
    const lateralOffsetM = t.lateralOffsetM ?? 0;
    hit = {
      distanceM: t.distanceM,
      radiusM: t.radiusM,
      lateralOffsetM,
      probability: hitProbability(partial, t.distanceM, t.radiusM, lateralOffsetM),
    };
  }
  const radius = options.reliableReachRadiusM ?? options.target?.radiusM ?? DEFAULT_REACH_RADIUS_M;
  const curve = options.withCurve === false ? null : aimed.curve(options.seed);
  return {
    ...partial,
    hit,
    curve,
    reliableReach: {
      targetRadiusM: radius,
      minProbability: RELIABLE_REACH_PROBABILITY,
      distanceM: curve ? reliableReachM(curve, radius) : null,
    },
  };
}

/** The part of an envelope the hit helpers read. */
export type EnvelopeCloud = Pick<ReachEnvelope, 'cloud'>;

/**
 * Predicted probability that a kick lands within `targetRadiusM` of a target `targetDistanceM` along
 * the aim and `lateralOffsetM` to the left: the share of the envelope's sampled landings inside it.
 */
export function hitProbability(envelope: EnvelopeCloud, targetDistanceM: number, targetRadiusM: number, lateralOffsetM = 0): number {
  requireFinite('targetDistanceM', targetDistanceM);
  requireInHalfOpen('targetRadiusM', targetRadiusM, 0, 100, 'm');
  requireFinite('lateralOffsetM', lateralOffsetM);
  const { xM, yM } = envelope.cloud;
  if (xM.length === 0) throw new RangeError('envelope has no samples');
  const r2 = targetRadiusM * targetRadiusM;
  let hits = 0;
  for (let i = 0; i < xM.length; i++) {
    const dx = xM[i]! - targetDistanceM;
    const dy = yM[i]! - lateralOffsetM;
    if (dx * dx + dy * dy <= r2) hits++;
  }
  return hits / xM.length;
}

/**
 * Reliable reach: the longest target distance, to 0.1 m, that kicks aimed at it hit with at least
 * `minProbability` (default 60 %) for a target of `targetRadiusM`; null if none is. Read off a reach
 * curve, because launch speed follows the target: one landing cloud cannot answer for every distance.
 */
export function reliableReachM(curve: ReachCurve, targetRadiusM: number, minProbability = RELIABLE_REACH_PROBABILITY): number | null {
  requireInHalfOpen('targetRadiusM', targetRadiusM, 0, 100, 'm');
  return curveReliableReachM(curve, targetRadiusM, minProbability);
}
