/**
 * Reach envelope: a seeded Monte Carlo of a fitted profile under given conditions —
 * where a player's kicks of one technique will land, with percentiles, a covariance ellipse, hit
 * probabilities and reliable reach. The result is plain JSON so it can cross the worker boundary and
 * `hitProbability` / `reliableReachM` can be evaluated on it later for any target.
 */

import { DEFAULT_SOLVER_SETTINGS, integrateFlight } from './integrate';
import { buildModel, resolveConditions } from './model';
import type { KickProfile } from './profile-types';
import { SeededRandom } from './random';
import { type DistributionSummary, summarise } from './stats';
import type { FlightConditions, Technique } from './types';
import { requireFinite, requireInHalfOpen, requireInRange, requireInteger } from './validate';

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
}

/** Monte Carlo reach envelope. JSON-serialisable. */
export interface ReachEnvelope {
  technique: Technique;
  samples: number;
  seed: number;
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

/** Validate the parts of a profile the Monte Carlo uses (it may have come through JSON). */
function checkProfile(p: KickProfile): void {
  if (p === null || typeof p !== 'object') throw new RangeError('profile must be an object');
  requireInHalfOpen('profile.meanSpeedMs', p.meanSpeedMs, 0, 60, 'm/s');
  requireInRange('profile.sdSpeedMs', p.sdSpeedMs, 0, 30, 'm/s');
  requireInRange('profile.meanSpeedSeMs', p.meanSpeedSeMs, 0, 30, 'm/s');
  requireInRange('profile.meanAzimuthDeg', p.meanAzimuthDeg, -45, 45, '°');
  requireInRange('profile.sdAzimuthDeg', p.sdAzimuthDeg, 0, 30, '°');
  requireInRange('profile.meanAzimuthSeDeg', p.meanAzimuthSeDeg, 0, 30, '°');
  requireInHalfOpen('profile.elevationDeg', p.elevationDeg, 0, 90, '°');
  requireInRange('profile.sdElevationDeg', p.sdElevationDeg, 0, 30, '°');
  requireInRange('profile.backspinRps', p.backspinRps, -30, 30, 'rev/s');
  requireInRange('profile.sidespinRps', p.sidespinRps, -30, 30, 'rev/s');
  requireInRange('profile.sdBackspinRps', p.sdBackspinRps, 0, 30, 'rev/s');
  requireInRange('profile.sdSidespinRps', p.sdSidespinRps, 0, 30, 'rev/s');
}

function clamp(v: number, lo: number, hi: number): number {
  return v < lo ? lo : v > hi ? hi : v;
}

/** One sampled launch: predictive draws (parameter uncertainty included) for speed and aim. */
export interface SampledLaunch {
  speed: number;
  elevationDeg: number;
  azimuthDeg: number;
  backspinRps: number;
  sidespinRps: number;
}

/** Draw `samples` launches from a profile with a seeded stream; shared by envelopes and set-piece checks. */
export function sampleLaunches(p: KickProfile, samples: number, seed: number): SampledLaunch[] {
  checkProfile(p);
  requireInteger('samples', samples, 1, 200000);
  const rng = new SeededRandom(seed);
  const sdSpeed = Math.hypot(p.sdSpeedMs, p.meanSpeedSeMs);
  const sdAim = Math.hypot(p.sdAzimuthDeg, p.meanAzimuthSeDeg);
  const out: SampledLaunch[] = [];
  for (let i = 0; i < samples; i++) {
    out.push({
      speed: clamp(p.meanSpeedMs + sdSpeed * rng.normal(), 1, 60),
      elevationDeg: clamp(p.elevationDeg + p.sdElevationDeg * rng.normal(), 0.5, 89.5),
      azimuthDeg: clamp(p.meanAzimuthDeg + sdAim * rng.normal(), -45, 45),
      backspinRps: clamp(p.backspinRps + p.sdBackspinRps * rng.normal(), -30, 30),
      sidespinRps: clamp(p.sidespinRps + p.sdSidespinRps * rng.normal(), -30, 30),
    });
  }
  return out;
}

/**
 * Monte Carlo reach envelope of `profile` under `conditions` ({} = defaults). Same seed → identical
 * numbers. Each sample draws speed and aim from the fitted distributions widened by the uncertainty of
 * their means (a predictive envelope), and launch angle and spin from the spreads the fit saw.
 */
export function reachEnvelope(
  profile: KickProfile,
  conditions: FlightConditions,
  options: EnvelopeOptions,
): ReachEnvelope {
  if (options === null || typeof options !== 'object')
    throw new RangeError('options must be an object with samples and seed');
  const launches = sampleLaunches(profile, options.samples, options.seed);
  const resolved = resolveConditions(conditions ?? {});
  const xs: number[] = [];
  const ys: number[] = [];
  const carry: number[] = [];
  let landed = 0;
  for (const launch of launches) {
    const f = integrateFlight(buildModel(resolved, launch), { settings: DEFAULT_SOLVER_SETTINGS });
    if (f.landed) landed++;
    xs.push(Math.round(f.landing.x * 1000) / 1000);
    ys.push(Math.round(f.landing.y * 1000) / 1000);
    carry.push(f.carryM);
  }
  const partial = {
    technique: profile.technique,
    samples: options.samples,
    seed: options.seed,
    landedShare: landed / launches.length,
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
  return {
    ...partial,
    hit,
    reliableReach: {
      targetRadiusM: radius,
      minProbability: RELIABLE_REACH_PROBABILITY,
      distanceM: reliableReachM(partial, radius),
    },
  };
}

/** The part of an envelope the hit helpers read. */
export type EnvelopeCloud = Pick<ReachEnvelope, 'cloud'>;

/**
 * Predicted probability that a kick lands within `targetRadiusM` of a target `targetDistanceM` along
 * the aim and `lateralOffsetM` to the left: the share of the envelope's sampled landings inside it.
 */
export function hitProbability(
  envelope: EnvelopeCloud,
  targetDistanceM: number,
  targetRadiusM: number,
  lateralOffsetM = 0,
): number {
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
 * Reliable reach: the longest target distance on the aim line, on a 0.1 m grid, hit with
 * at least `minProbability` (default 60 %) for a target of `targetRadiusM`; null if none is.
 */
export function reliableReachM(
  envelope: EnvelopeCloud,
  targetRadiusM: number,
  minProbability = RELIABLE_REACH_PROBABILITY,
): number | null {
  requireInHalfOpen('targetRadiusM', targetRadiusM, 0, 100, 'm');
  requireInHalfOpen('minProbability', minProbability, 0, 1);
  const { xM, yM } = envelope.cloud;
  const n = xM.length;
  if (n === 0) throw new RangeError('envelope has no samples');
  const order = xM.map((_, i) => i).sort((a, b) => xM[a]! - xM[b]!);
  const sortedX = order.map((i) => xM[i]!);
  const lowerBound = (x: number): number => {
    let lo = 0;
    let hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (sortedX[mid]! < x) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };
  const r2 = targetRadiusM * targetRadiusM;
  const needed = Math.ceil(minProbability * n - 1e-9);
  for (let k = Math.ceil((sortedX[n - 1]! + targetRadiusM) * 10); k >= 1; k--) {
    const d = k / 10;
    let hits = 0;
    for (let j = lowerBound(d - targetRadiusM); j < n && sortedX[j]! <= d + targetRadiusM; j++) {
      const dc = sortedX[j]! - d;
      const dl = yM[order[j]!]!;
      if (dc * dc + dl * dl <= r2) hits++;
    }
    if (hits >= needed) return d;
  }
  return null;
}
