/**
 * Reach curve: the predicted hit probability of a player's kicks *aimed at* each target distance, for a
 * set of target radii, under given conditions. Because launch speed follows the target (aimed-speed.ts),
 * every distance needs its own Monte Carlo; common random numbers make that cheap and smooth — each
 * sampled kick keeps its speed and aim errors across distances, and the mean launch's landing against
 * launch speed is tabulated once (14 nodes) and interpolated in ln speed by monotone cubics (the spec
 * checks the interpolation against direct flights). Plain JSON, so the server can cache it.
 */

import { intentionConditions, softMinLog } from './aimed-speed';
import { DEFAULT_SOLVER_SETTINGS, integrateFlight } from './integrate';
import { pchip } from './interpolate';
import { buildModel, resolveConditions } from './model';
import type { KickProfile } from './profile-types';
import { checkedProfile, drawLaunchNoise, type LaunchNoise, meanLaunchOf, predictiveSpeedLogSd } from './sampling';
import type { FlightConditions } from './types';
import { requireInHalfOpen, requireInteger } from './validate';

/** Radii (m) at which the curve is tabulated; others interpolate linearly (common drill sizes). */
export const CURVE_RADII_M: readonly number[] = [1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6, 7, 8, 10];
/** Spacing of the tabulated distances, m. */
export const CURVE_STEP_M = 1;
/** Speed nodes of the mean launch's table, log-spaced over [NODE_MIN_MS, NODE_MAX_MS]. */
const SPEED_NODES = 14;
const NODE_MIN_MS = 3;
const NODE_MAX_MS = 60;
const DEG = Math.PI / 180;

/** Hit probability by distance (rows) and radius (columns). */
export interface ReachCurve {
  samples: number;
  seed: number;
  /** Target distances, m: CURVE_STEP_M, 2·CURVE_STEP_M, … */
  distancesM: number[];
  radiiM: number[];
  /** probability[i][j]: distance i, radius j; rounded to 1e-4. */
  probability: number[][];
}

/** Options for `reachCurve`. */
export interface CurveOptions {
  samples: number;
  seed: number;
}

const interpolate = pchip;

/**
 * Kicks drawn from a profile that can be "aimed" at any distance. An aimed kick is struck with the
 * profile's mean launch angle and spin (the fit measured speed errors against what each repetition's own
 * angle and spin needed, so a player's choice of angle is not counted as error): the speed that distance needs in
 * intention conditions, capped by the ceiling, times the fitted error, aimed off for the curl of the
 * ball the player meant to hit, plus the aim error. The mean launch is flown once at 14 speeds; every
 * kick is then an interpolation in ln speed and a rotation by its aim (exact in still air; with wind the
 * drift is turned with the kick, an error of about drift × aim error).
 */
export class AimedSamples {
  private readonly noises: LaunchNoise[];
  private readonly speedLogSd: number;
  private readonly nodeLn: number[] = [];
  private readonly intentLnCarry: number[] = [];
  private readonly intentLnSpeed: number[] = [];
  private readonly intentAngle: number[] = [];
  private readonly lnRho: number[] = [];
  private readonly angle: number[] = [];
  private readonly actual: ReturnType<typeof resolveConditions>;

  constructor(
    private readonly profile: KickProfile,
    conditions: FlightConditions,
    samples: number,
    seed: number,
  ) {
    this.actual = resolveConditions(conditions ?? {});
    const intention = resolveConditions(intentionConditions(conditions ?? {}));
    const same = JSON.stringify(this.actual) === JSON.stringify(intention);
    this.speedLogSd = predictiveSpeedLogSd(profile);
    this.noises = drawLaunchNoise(profile, samples, seed);
    const launch = { ...meanLaunchOf(profile), azimuthDeg: 0 };
    const [a, b] = [Math.log(NODE_MIN_MS), Math.log(NODE_MAX_MS)];
    for (let k = 0; k < SPEED_NODES; k++) {
      const lv = a + ((b - a) * k) / (SPEED_NODES - 1);
      const speed = Math.exp(lv);
      const fi = integrateFlight(buildModel(intention, { ...launch, speed }), { settings: DEFAULT_SOLVER_SETTINGS });
      const fa = same ? fi : integrateFlight(buildModel(this.actual, { ...launch, speed }), { settings: DEFAULT_SOLVER_SETTINGS });
      const lnCarry = Math.log(Math.max(1e-3, fi.carryM));
      if (!this.intentLnCarry.length || lnCarry > this.intentLnCarry[this.intentLnCarry.length - 1]!) {
        this.intentLnCarry.push(lnCarry);
        this.intentLnSpeed.push(lv);
      }
      this.nodeLn.push(lv);
      this.intentAngle.push(Math.atan2(fi.landing.y, fi.landing.x));
      this.lnRho.push(Math.log(Math.max(1e-3, Math.hypot(fa.landing.x, fa.landing.y))));
      this.angle.push(Math.atan2(fa.landing.y, fa.landing.x));
    }
  }

  /** Every sample's launch when aimed at `distanceM`: speed, and azimuth including the aim-off for curl. */
  launchesAt(distanceM: number): { speed: number; azimuthDeg: number; lnSpeed: number; aimOffRad: number }[] {
    const a = this.profile.aimedSpeed;
    const lnNeed = interpolate(this.intentLnCarry, this.intentLnSpeed, Math.log(Math.max(0.05, distanceM)));
    return this.noises.map((n) => {
      const lnCeiling = Math.log(a.ceilingMs) + a.ceilingLogSe * n.zCeiling;
      const lnIntended = softMinLog(lnNeed, lnCeiling);
      const lnSpeed = Math.min(Math.log(NODE_MAX_MS), lnIntended + a.offsetLogMean + this.speedLogSd * n.zSpeed);
      const aimOffRad = -interpolate(this.nodeLn, this.intentAngle, lnIntended);
      return { speed: Math.exp(lnSpeed), lnSpeed, aimOffRad, azimuthDeg: n.launch.azimuthDeg + aimOffRad / DEG };
    });
  }

  /** Every sample's landing (x along the line to the target, y to the left) when aimed at `distanceM`, from the table. */
  landingsAt(distanceM: number): { x: number; y: number }[] {
    return this.launchesAt(distanceM).map((l) => {
      const rho = Math.exp(interpolate(this.nodeLn, this.lnRho, l.lnSpeed));
      const angle = interpolate(this.nodeLn, this.angle, l.lnSpeed) + l.azimuthDeg * DEG;
      return { x: rho * Math.cos(angle), y: rho * Math.sin(angle) };
    });
  }

  /** Every sample aimed at `distanceM`, flown directly (for landing clouds). */
  flownAt(distanceM: number): { x: number; y: number; carryM: number; landed: boolean }[] {
    const launch = meanLaunchOf(this.profile);
    return this.launchesAt(distanceM).map((l) => {
      const f = integrateFlight(buildModel(this.actual, { ...launch, speed: l.speed, azimuthDeg: l.azimuthDeg }), {
        settings: DEFAULT_SOLVER_SETTINGS,
      });
      return { x: f.landing.x, y: f.landing.y, carryM: f.carryM, landed: f.landed };
    });
  }

  /** The reach curve over distances out to a third beyond what the ceiling carries. */
  curve(seed: number): ReachCurve {
    const n = this.noises.length;
    const lnCeiling = Math.log(this.profile.aimedSpeed.ceilingMs);
    const carryAtCeiling = Math.exp(interpolate(this.intentLnSpeed, this.intentLnCarry, lnCeiling));
    const maxDistance = Math.max(10, Math.min(150, Math.ceil(carryAtCeiling * 1.35)));
    const distancesM: number[] = [];
    for (let k = 1; k * CURVE_STEP_M <= maxDistance + 1e-9; k++) distancesM.push(Math.round(k * CURVE_STEP_M * 1000) / 1000);
    const r2 = CURVE_RADII_M.map((r) => r * r);
    const probability = distancesM.map((d) => {
      const row = new Array<number>(CURVE_RADII_M.length).fill(0);
      for (const p of this.landingsAt(d)) {
        const miss2 = (p.x - d) * (p.x - d) + p.y * p.y;
        for (let j = 0; j < r2.length; j++) if (miss2 <= r2[j]!) row[j]!++;
      }
      return row.map((h) => Math.round((h / n) * 10000) / 10000);
    });
    return { samples: n, seed, distancesM, radiiM: [...CURVE_RADII_M], probability };
  }
}

/** The reach curve of `profile` under `conditions`. Same profile, conditions and seed → identical numbers. */
export function reachCurve(given: KickProfile, conditions: FlightConditions, options: CurveOptions): ReachCurve {
  const profile = checkedProfile(given);
  if (options === null || typeof options !== 'object') throw new RangeError('options must be an object with samples and seed');
  const samples = requireInteger('samples', options.samples, 1, 20000);
  return new AimedSamples(profile, conditions, samples, options.seed).curve(options.seed);
}

/** Predicted hit probability for a kick aimed at `distanceM` with a target of `radiusM` (bilinear in the curve). */
export function curveHitProbability(curve: ReachCurve, distanceM: number, radiusM: number): number {
  requireInHalfOpen('distanceM', distanceM, 0, 1000, 'm');
  requireInHalfOpen('radiusM', radiusM, 0, 100, 'm');
  const { distancesM, radiiM, probability } = curve;
  if (distancesM.length === 0) throw new RangeError('curve has no distances');
  const column = (j: number): number[] => probability.map((row) => row[j]!);
  const atRadius = (j: number): number => {
    const last = distancesM[distancesM.length - 1]!;
    if (distanceM > last) return 0;
    return interpolate(distancesM, column(j), distanceM);
  };
  if (radiusM <= radiiM[0]!) return atRadius(0) * (radiusM / radiiM[0]!) ** 2;
  if (radiusM >= radiiM[radiiM.length - 1]!) return atRadius(radiiM.length - 1);
  let j = 0;
  while (radiiM[j + 1]! < radiusM) j++;
  const t = (radiusM - radiiM[j]!) / (radiiM[j + 1]! - radiiM[j]!);
  return atRadius(j) + t * (atRadius(j + 1) - atRadius(j));
}

/**
 * Reliable reach from a curve: the longest target distance, to 0.1 m, hit with at least `minProbability`
 * for a target of `radiusM`; null when no distance is.
 */
export function curveReliableReachM(curve: ReachCurve, radiusM: number, minProbability: number): number | null {
  requireInHalfOpen('minProbability', minProbability, 0, 1);
  const last = curve.distancesM[curve.distancesM.length - 1] ?? 0;
  for (let k = Math.floor(last * 10); k >= 1; k--) {
    if (curveHitProbability(curve, k / 10, radiusM) >= minProbability) return k / 10;
  }
  return null;
}
