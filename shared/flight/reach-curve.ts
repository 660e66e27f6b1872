/**
 * Reach curve: the predicted hit probability of a player's kicks *aimed at* each target distance, for a
 * set of target radii, under given conditions. Because launch speed follows the target (aimed-speed.ts),
 * every distance needs its own Monte Carlo; common random numbers make that cheap and smooth — each
 * sampled kick keeps its speed, aim, elevation and spin draws across distances, and landings come from a
 * table over ln speed with a quadratic in each launch deviation (see AimedSamples; the spec checks it
 * against direct flights). Plain JSON, so the server can cache it.
 */

import { CEILING_SOFTNESS, intentionConditions, softMinLog } from './aimed-speed';
import { DEFAULT_SOLVER_SETTINGS, integrateFlight } from './integrate';
import { pchip } from './interpolate';
import { buildModel, resolveConditions } from './model';
import type { KickProfile } from './profile-types';
import {
  checkedProfile,
  drawLaunchNoise,
  type LaunchNoise,
  meanLaunchOf,
  predictiveSpeedLogSd,
  type SampledLaunch,
  speedCapOf,
} from './sampling';
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

/** Points of the fine uniform ln-speed grid the tables are resampled onto (linear interpolation between them). */
const FINE_POINTS = 256;
/** Launch dimensions drawn per sample, each tabulated by a quadratic in its deviation from the mean. */
type Dim = 'elevationDeg' | 'backspinRps' | 'sidespinRps';
const DIMS: readonly Dim[] = ['elevationDeg', 'backspinRps', 'sidespinRps'];
/** Columns of the interleaved table: ln ρ, bearing, 4 per dimension, the intended ball's bearing. */
const TABLE_STRIDE = 2 + 4 * 3 + 1;
const INTENT_COLUMN = TABLE_STRIDE - 1;

/**
 * Kicks drawn from a profile that can be "aimed" at any distance. An aimed kick is meant as the
 * profile's mean launch: the speed that distance needs in intention conditions at the mean angle and
 * spin, capped by the sample's ceiling, times the fitted error, aimed off for the curl of that ball. It
 * is then struck with the sample's own elevation, backspin and sidespin (drawn with the profile's
 * spreads; sampling.ts) and its aim error: launch noise the player does not correct for, as the fit
 * assumed (profile-speed-fit.ts).
 *
 * Landings come from a table: at 14 log-spaced speeds the mean launch is flown, and each drawn dimension
 * at ±its spread, giving per speed a quadratic in each dimension's deviation (cross terms left out) for
 * ln of the landing distance and its bearing. The tables are resampled onto a fine uniform grid in ln
 * speed (256 points, monotone cubics between the 14 nodes), so a landing costs a few multiplications;
 * the spec checks the table against direct flights. A kick is rotated by its aim (exact in still air;
 * with wind the drift is turned with the kick, an error of about drift × aim error).
 */
export class AimedSamples {
  private readonly noises: LaunchNoise[];
  private readonly speedLogSd: number;
  private readonly lnCap: number;
  private readonly intentLnCarry: number[] = [];
  private readonly intentLnSpeed: number[] = [];
  private readonly lnMin = Math.log(NODE_MIN_MS);
  private readonly lnStep: number;
  /**
   * Fine tables over ln speed, interleaved per grid point (TABLE_STRIDE columns): ln ρ and bearing of the
   * mean launch, then per dimension the linear and quadratic coefficients of ln ρ and of the bearing, then
   * the bearing of the intended ball in intention conditions (its aim-off).
   */
  private tableCache: Float64Array | null = null;
  private readonly fineIntentAngle: Float64Array;
  /** Per sample: deviations of elevation, backspin, sidespin from the mean. */
  private readonly deviations: Float64Array;
  /** Per sample: ln ceiling, μ + σ z (the speed error), aim azimuth in radians. */
  private readonly lnCeilings: Float64Array;
  private readonly speedBase: Float64Array;
  private readonly azimuthRad: Float64Array;
  /** Landings of the last distance filled, in polar form: ln of the distance from the spot, and the bearing. */
  private readonly lnRhos: Float64Array;
  private readonly bearings: Float64Array;
  private readonly actual: ReturnType<typeof resolveConditions>;
  private readonly intention: ReturnType<typeof resolveConditions>;
  /** Whether the actual and the intention conditions are the same (the mean launch's flights are then shared). */
  private readonly same: boolean;
  /** ln speed of the speed nodes, and the intention flights' landing bearing (the aim-off) at each. */
  private readonly nodeLn: number[] = [];
  private readonly intentAngle: number[] = [];
  /** The intention flights at the speed nodes, reused by the landing table when conditions are the same. */
  private readonly intentFlights: { landing: { x: number; y: number } }[] = [];

  /**
   * Draws the samples and flies the mean launch at the speed nodes in intention conditions (what aiming
   * needs). The landing table behind the reach curve (seven flights per node in actual conditions) is
   * built on first use, so an envelope asked for without its curve does not pay for it.
   */
  constructor(
    private readonly profile: KickProfile,
    conditions: FlightConditions,
    samples: number,
    seed: number,
  ) {
    this.actual = resolveConditions(conditions ?? {});
    this.intention = resolveConditions(intentionConditions(conditions ?? {}));
    this.same = JSON.stringify(this.actual) === JSON.stringify(this.intention);
    this.speedLogSd = predictiveSpeedLogSd(profile);
    this.lnCap = Math.log(Math.min(NODE_MAX_MS, speedCapOf(profile)));
    this.noises = drawLaunchNoise(profile, samples, seed);
    const mean = meanLaunchOf(profile);
    this.deviations = new Float64Array(samples * 3);
    this.noises.forEach((n, i) => DIMS.forEach((d, j) => (this.deviations[3 * i + j] = n.launch[d] - mean[d])));
    const [a, b] = [Math.log(NODE_MIN_MS), Math.log(NODE_MAX_MS)];
    for (let k = 0; k < SPEED_NODES; k++) {
      const lv = a + ((b - a) * k) / (SPEED_NODES - 1);
      const fi = integrateFlight(buildModel(this.intention, { ...mean, azimuthDeg: 0, speed: Math.exp(lv) }), {
        settings: DEFAULT_SOLVER_SETTINGS,
      });
      const lnCarry = Math.log(Math.max(1e-3, fi.carryM));
      if (!this.intentLnCarry.length || lnCarry > this.intentLnCarry[this.intentLnCarry.length - 1]!) {
        this.intentLnCarry.push(lnCarry);
        this.intentLnSpeed.push(lv);
      }
      this.nodeLn.push(lv);
      this.intentAngle.push(Math.atan2(fi.landing.y, fi.landing.x));
      this.intentFlights.push(fi);
    }
    this.lnStep = (b - a) / (FINE_POINTS - 1);
    this.fineIntentAngle = this.fine(this.intentAngle);
    const a0 = profile.aimedSpeed;
    this.lnCeilings = Float64Array.from(this.noises, (n) => n.lnCeiling);
    this.speedBase = Float64Array.from(this.noises, (n) => a0.offsetLogMean + this.speedLogSd * n.zSpeed);
    this.azimuthRad = Float64Array.from(this.noises, (n) => n.launch.azimuthDeg * DEG);
    this.lnRhos = new Float64Array(samples);
    this.bearings = new Float64Array(samples);
  }

  /** A node column resampled onto the fine uniform ln-speed grid (monotone cubics between the nodes). */
  private fine(ys: readonly number[]): Float64Array {
    const out = new Float64Array(FINE_POINTS);
    for (let i = 0; i < FINE_POINTS; i++) out[i] = interpolate(this.nodeLn, ys as number[], this.lnMin + i * this.lnStep);
    return out;
  }

  /** The interleaved landing table (see `tableCache`), built on first use. */
  private get table(): Float64Array {
    if (this.tableCache === null) this.tableCache = this.buildTable();
    return this.tableCache;
  }

  /**
   * Fine tables over ln speed, interleaved per grid point (TABLE_STRIDE columns): ln ρ and bearing of the
   * mean launch, then per dimension the linear and quadratic coefficients of ln ρ and of the bearing, then
   * the bearing of the intended ball in intention conditions (its aim-off).
   */
  private buildTable(): Float64Array {
    const profile = this.profile;
    const mean = meanLaunchOf(profile);
    const spread: Record<Dim, number> = {
      elevationDeg: profile.sdElevationDeg,
      backspinRps: profile.sdBackspinRps,
      sidespinRps: profile.sdSidespinRps,
    };
    // Per quantity (ln ρ, bearing): [value, then (linear, quadratic) per dimension].
    const rhoCoef: number[][] = Array.from({ length: 1 + 2 * DIMS.length }, () => []);
    const angleCoef: number[][] = Array.from({ length: 1 + 2 * DIMS.length }, () => []);
    const fly = (launch: typeof mean, speed: number) =>
      integrateFlight(buildModel(this.actual, { ...launch, azimuthDeg: 0, speed }), { settings: DEFAULT_SOLVER_SETTINGS });
    const polar = (f: { landing: { x: number; y: number } }): [number, number] => [
      Math.log(Math.max(1e-3, Math.hypot(f.landing.x, f.landing.y))),
      Math.atan2(f.landing.y, f.landing.x),
    ];
    this.nodeLn.forEach((lv, k) => {
      const speed = Math.exp(lv);
      const [r0, g0] = polar(this.same ? this.intentFlights[k]! : fly(mean, speed));
      rhoCoef[0]!.push(r0);
      angleCoef[0]!.push(g0);
      DIMS.forEach((d, j) => {
        const h = spread[d];
        if (!(h > 0)) {
          for (const c of [rhoCoef, angleCoef]) {
            c[1 + 2 * j]!.push(0);
            c[2 + 2 * j]!.push(0);
          }
          return;
        }
        const at = (sign: number) => {
          const launch = { ...mean, [d]: mean[d] + sign * h };
          if (d === 'elevationDeg') launch.elevationDeg = Math.min(89.5, Math.max(0.5, launch.elevationDeg));
          return polar(fly(launch, speed));
        };
        const [rp, gp] = at(1);
        const [rm, gm] = at(-1);
        rhoCoef[1 + 2 * j]!.push((rp - rm) / (2 * h));
        rhoCoef[2 + 2 * j]!.push((rp - 2 * r0 + rm) / (2 * h * h));
        angleCoef[1 + 2 * j]!.push((gp - gm) / (2 * h));
        angleCoef[2 + 2 * j]!.push((gp - 2 * g0 + gm) / (2 * h * h));
      });
    });
    const columns = [rhoCoef[0]!, angleCoef[0]!];
    DIMS.forEach((_, j) => columns.push(rhoCoef[1 + 2 * j]!, rhoCoef[2 + 2 * j]!, angleCoef[1 + 2 * j]!, angleCoef[2 + 2 * j]!));
    const fineColumns = columns.map((c) => this.fine(c));
    fineColumns.push(this.fineIntentAngle);
    const table = new Float64Array(FINE_POINTS * TABLE_STRIDE);
    for (let i = 0; i < FINE_POINTS; i++) fineColumns.forEach((c, q) => (table[i * TABLE_STRIDE + q] = c[i]!));
    return table;
  }

  /** Linear interpolation of a fine table at ln speed. */
  private at(table: Float64Array, lnSpeed: number): number {
    const u = (lnSpeed - this.lnMin) / this.lnStep;
    if (u <= 0) return table[0]!;
    if (u >= FINE_POINTS - 1) return table[FINE_POINTS - 1]!;
    const i = Math.floor(u);
    const t = u - i;
    return table[i]! + t * (table[i + 1]! - table[i]!);
  }

  /** Sample i's launch speed when aimed at a distance needing ln speed `lnNeed` (mean launch, intention conditions). */
  private lnSpeedOf(i: number, lnNeed: number): number {
    const a = this.profile.aimedSpeed;
    const lnIntended = softMinLog(lnNeed, this.noises[i]!.lnCeiling);
    return Math.min(this.lnCap, lnIntended + a.offsetLogMean + this.speedLogSd * this.noises[i]!.zSpeed);
  }

  private lnNeedAt(distanceM: number): number {
    return interpolate(this.intentLnCarry, this.intentLnSpeed, Math.log(Math.max(0.05, distanceM)));
  }

  /** Every sample's launch when aimed at `distanceM`: its own elevation and spins, speed, and azimuth including the aim-off for curl. */
  launchesAt(distanceM: number): SampledLaunch[] {
    const lnNeed = this.lnNeedAt(distanceM);
    return this.noises.map((n, i) => {
      const lnSpeed = this.lnSpeedOf(i, lnNeed);
      const aimOffRad = -this.at(this.fineIntentAngle, softMinLog(lnNeed, n.lnCeiling));
      return { ...n.launch, speed: Math.exp(lnSpeed), azimuthDeg: n.launch.azimuthDeg + aimOffRad / DEG };
    });
  }

  /** Every sample's landing (x along the line to the target, y to the left) when aimed at `distanceM`, from the table. */
  landingsAt(distanceM: number): { x: number; y: number }[] {
    this.fillLandings(distanceM);
    return Array.from(this.lnRhos, (lnRho, i) => {
      const rho = Math.exp(lnRho);
      return { x: rho * Math.cos(this.bearings[i]!), y: rho * Math.sin(this.bearings[i]!) };
    });
  }

  /**
   * Writes every sample's tabulated landing when aimed at `distanceM` into `lnRhos`, `bearings`. The hot loop of the
   * reach curve (2,000 samples × ~80 distances): typed arrays, the tables interleaved per grid point, and
   * the smooth minimum with the ceiling skipped where it is exact to 1e-9.
   */
  private fillLandings(distanceM: number): void {
    const lnNeed = this.lnNeedAt(distanceM);
    const { deviations: dev, table, lnCeilings, speedBase, azimuthRad, lnRhos, bearings } = this;
    const stride = TABLE_STRIDE;
    const lnMin = this.lnMin;
    const inverseStep = 1 / this.lnStep;
    const last = FINE_POINTS - 1 - 1e-9;
    const lnCap = this.lnCap;
    const w = CEILING_SOFTNESS;
    for (let i = 0; i < lnRhos.length; i++) {
      // softMinLog(lnNeed, ln ceiling), written out: the correction vanishes 20 widths from the corner.
      const lnC = lnCeilings[i]!;
      const lo = lnNeed < lnC ? lnNeed : lnC;
      const gap = (lnNeed < lnC ? lnC - lnNeed : lnNeed - lnC) / w;
      const lnIntended = gap > 20 ? lo : lo - w * Math.log1p(Math.exp(-gap));
      let lnSpeed = lnIntended + speedBase[i]!;
      if (lnSpeed > lnCap) lnSpeed = lnCap;
      const u = clampGrid((lnSpeed - lnMin) * inverseStep, last);
      const k = Math.floor(u);
      const t = u - k;
      const a = k * stride;
      const b = a + stride;
      let lnRho = table[a]! + t * (table[b]! - table[a]!);
      let angle = table[a + 1]! + t * (table[b + 1]! - table[a + 1]!);
      for (let j = 0; j < 3; j++) {
        const d = dev[3 * i + j]!;
        if (d === 0) continue;
        const o = 2 + 4 * j;
        const r1 = table[a + o]! + t * (table[b + o]! - table[a + o]!);
        const r2 = table[a + o + 1]! + t * (table[b + o + 1]! - table[a + o + 1]!);
        const g1 = table[a + o + 2]! + t * (table[b + o + 2]! - table[a + o + 2]!);
        const g2 = table[a + o + 3]! + t * (table[b + o + 3]! - table[a + o + 3]!);
        lnRho += d * (r1 + d * r2);
        angle += d * (g1 + d * g2);
      }
      // The aim-off for the curl of the ball the player meant to strike.
      const ui = clampGrid((lnIntended - lnMin) * inverseStep, last);
      const ki = Math.floor(ui);
      const aimOff =
        table[ki * stride + INTENT_COLUMN]! + (ui - ki) * (table[(ki + 1) * stride + INTENT_COLUMN]! - table[ki * stride + INTENT_COLUMN]!);
      lnRhos[i] = lnRho;
      bearings[i] = angle + (azimuthRad[i]! - aimOff);
    }
  }

  /** Every sample aimed at `distanceM`, flown directly with its own launch (for landing clouds). */
  flownAt(distanceM: number): { x: number; y: number; carryM: number; landed: boolean }[] {
    return this.launchesAt(distanceM).map((l) => {
      const f = integrateFlight(buildModel(this.actual, l), { settings: DEFAULT_SOLVER_SETTINGS });
      return { x: f.landing.x, y: f.landing.y, carryM: f.carryM, landed: f.landed };
    });
  }

  /** The reach curve over distances out to a third beyond what the cap carries (at the sample's mean launch). */
  curve(seed: number): ReachCurve {
    const n = this.noises.length;
    const lnTop = Math.min(this.lnCap, Math.log(this.profile.aimedSpeed.ceilingMs) + 2 * this.profile.aimedSpeed.ceilingLogSe);
    const carryAtTop = Math.exp(interpolate(this.intentLnSpeed, this.intentLnCarry, lnTop));
    const maxDistance = Math.max(10, Math.min(150, Math.ceil(carryAtTop * 1.35)));
    const distancesM: number[] = [];
    for (let k = 1; k * CURVE_STEP_M <= maxDistance + 1e-9; k++) distancesM.push(Math.round(k * CURVE_STEP_M * 1000) / 1000);
    const r2 = CURVE_RADII_M.map((r) => r * r);
    const counts = new Float64Array(r2.length);
    const outer = r2[r2.length - 1]!;
    const outerRadius = CURVE_RADII_M[CURVE_RADII_M.length - 1]!;
    const probability = distancesM.map((d) => {
      counts.fill(0);
      this.fillLandings(d);
      const { lnRhos, bearings } = this;
      // A landing farther than the largest radius from the target in distance alone is a miss for every radius.
      const [lnNear, lnFar] = [d > outerRadius ? Math.log(d - outerRadius) : -Infinity, Math.log(d + outerRadius)];
      for (let i = 0; i < lnRhos.length; i++) {
        const lnRho = lnRhos[i]!;
        if (lnRho < lnNear || lnRho > lnFar) continue;
        // Law of cosines: the miss distance from the landing's polar form, one cosine per landing.
        const rho = Math.exp(lnRho);
        const miss2 = rho * rho + d * d - 2 * rho * d * Math.cos(bearings[i]!);
        if (miss2 > outer) continue;
        // Radii ascend: the first one that holds the landing holds it for every larger radius too.
        for (let j = 0; j < r2.length; j++) {
          if (miss2 <= r2[j]!) {
            counts[j]!++;
            break;
          }
        }
      }
      let cumulative = 0;
      return Array.from(counts, (c) => {
        cumulative += c;
        return Math.round((cumulative / n) * 10000) / 10000;
      });
    });
    return { samples: n, seed, distancesM, radiiM: [...CURVE_RADII_M], probability };
  }
}

/** A fine-grid coordinate clamped to [0, last]. */
function clampGrid(u: number, last: number): number {
  return u <= 0 ? 0 : u >= last ? last : u;
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
  if (curve.distancesM.length === 0) throw new RangeError('curve has no distances');
  return atRadius(curve, radiusM)(distanceM);
}

/**
 * Hit probability by distance for one target radius: monotone cubics along distance in the two tabulated
 * radii around it, linear between them (quadratic in the radius below the smallest). The columns are
 * taken once, so scanning many distances (reliable reach) costs a lookup each.
 */
function atRadius(curve: ReachCurve, radiusM: number): (distanceM: number) => number {
  const { distancesM, radiiM, probability } = curve;
  const last = distancesM[distancesM.length - 1]!;
  const column = (j: number): number[] => probability.map((row) => row[j]!);
  const along =
    (ys: number[]) =>
    (distanceM: number): number =>
      distanceM > last ? 0 : interpolate(distancesM, ys, distanceM);
  if (radiusM <= radiiM[0]!) {
    const first = along(column(0));
    return (d) => first(d) * (radiusM / radiiM[0]!) ** 2;
  }
  if (radiusM >= radiiM[radiiM.length - 1]!) return along(column(radiiM.length - 1));
  let j = 0;
  while (radiiM[j + 1]! < radiusM) j++;
  const t = (radiusM - radiiM[j]!) / (radiiM[j + 1]! - radiiM[j]!);
  const [lo, hi] = [along(column(j)), along(column(j + 1))];
  return (d) => {
    const a = lo(d);
    return a + t * (hi(d) - a);
  };
}

/**
 * Reliable reach from a curve: the longest target distance, to 0.1 m, hit with at least `minProbability`
 * for a target of `radiusM`; null when no distance is.
 */
export function curveReliableReachM(curve: ReachCurve, radiusM: number, minProbability: number): number | null {
  requireInHalfOpen('minProbability', minProbability, 0, 1);
  requireInHalfOpen('radiusM', radiusM, 0, 100, 'm');
  if (curve.distancesM.length === 0) return null;
  const probabilityAt = atRadius(curve, radiusM);
  const last = curve.distancesM[curve.distancesM.length - 1]!;
  for (let k = Math.floor(last * 10); k >= 1; k--) {
    if (probabilityAt(k / 10) >= minProbability) return k / 10;
  }
  return null;
}
