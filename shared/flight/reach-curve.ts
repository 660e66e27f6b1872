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
  /** Fine tables over ln speed: aim-off bearing of the intended ball, and per quantity the quadratic coefficients. */
  private readonly fineIntentAngle: Float64Array;
  private readonly fineRho: Float64Array[];
  private readonly fineAngle: Float64Array[];
  /** Per sample: deviations of elevation, backspin, sidespin from the mean. */
  private readonly deviations: Float64Array;
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
    this.lnCap = Math.log(Math.min(NODE_MAX_MS, speedCapOf(profile)));
    this.noises = drawLaunchNoise(profile, samples, seed);
    const mean = meanLaunchOf(profile);
    const spread: Record<Dim, number> = {
      elevationDeg: profile.sdElevationDeg,
      backspinRps: profile.sdBackspinRps,
      sidespinRps: profile.sdSidespinRps,
    };
    this.deviations = new Float64Array(samples * 3);
    this.noises.forEach((n, i) => DIMS.forEach((d, j) => (this.deviations[3 * i + j] = n.launch[d] - mean[d])));
    const [a, b] = [Math.log(NODE_MIN_MS), Math.log(NODE_MAX_MS)];
    const nodeLn: number[] = [];
    const intentAngle: number[] = [];
    // Per quantity (ln ρ, bearing): [value, then (linear, quadratic) per dimension].
    const rhoCoef: number[][] = Array.from({ length: 1 + 2 * DIMS.length }, () => []);
    const angleCoef: number[][] = Array.from({ length: 1 + 2 * DIMS.length }, () => []);
    const fly = (launch: typeof mean, speed: number) =>
      integrateFlight(buildModel(this.actual, { ...launch, azimuthDeg: 0, speed }), { settings: DEFAULT_SOLVER_SETTINGS });
    const polar = (f: { landing: { x: number; y: number } }): [number, number] => [
      Math.log(Math.max(1e-3, Math.hypot(f.landing.x, f.landing.y))),
      Math.atan2(f.landing.y, f.landing.x),
    ];
    for (let k = 0; k < SPEED_NODES; k++) {
      const lv = a + ((b - a) * k) / (SPEED_NODES - 1);
      const speed = Math.exp(lv);
      const fi = integrateFlight(buildModel(intention, { ...mean, azimuthDeg: 0, speed }), { settings: DEFAULT_SOLVER_SETTINGS });
      const fa = same ? fi : fly(mean, speed);
      const lnCarry = Math.log(Math.max(1e-3, fi.carryM));
      if (!this.intentLnCarry.length || lnCarry > this.intentLnCarry[this.intentLnCarry.length - 1]!) {
        this.intentLnCarry.push(lnCarry);
        this.intentLnSpeed.push(lv);
      }
      nodeLn.push(lv);
      intentAngle.push(Math.atan2(fi.landing.y, fi.landing.x));
      const [r0, g0] = polar(fa);
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
    }
    this.lnStep = (b - a) / (FINE_POINTS - 1);
    const fine = (ys: number[]): Float64Array => {
      const out = new Float64Array(FINE_POINTS);
      for (let i = 0; i < FINE_POINTS; i++) out[i] = interpolate(nodeLn, ys, a + i * this.lnStep);
      return out;
    };
    this.fineIntentAngle = fine(intentAngle);
    this.fineRho = rhoCoef.map(fine);
    this.fineAngle = angleCoef.map(fine);
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
    const out: { x: number; y: number }[] = [];
    this.forEachLanding(distanceM, (x, y) => out.push({ x, y }));
    return out;
  }

  /** Calls `visit` with every sample's tabulated landing when aimed at `distanceM` (no allocation per sample). */
  private forEachLanding(distanceM: number, visit: (x: number, y: number) => void): void {
    const lnNeed = this.lnNeedAt(distanceM);
    const dev = this.deviations;
    const nd = DIMS.length;
    const u0 = this.lnMin;
    const step = this.lnStep;
    for (let i = 0; i < this.noises.length; i++) {
      const n = this.noises[i]!;
      const lnSpeed = this.lnSpeedOf(i, lnNeed);
      let u = (lnSpeed - u0) / step;
      u = u <= 0 ? 0 : u >= FINE_POINTS - 1 ? FINE_POINTS - 1 - 1e-9 : u;
      const k = Math.floor(u);
      const t = u - k;
      const lerp = (tab: Float64Array): number => tab[k]! + t * (tab[k + 1]! - tab[k]!);
      let lnRho = lerp(this.fineRho[0]!);
      let angle = lerp(this.fineAngle[0]!);
      for (let j = 0; j < nd; j++) {
        const d = dev[3 * i + j]!;
        if (d === 0) continue;
        lnRho += d * (lerp(this.fineRho[1 + 2 * j]!) + d * lerp(this.fineRho[2 + 2 * j]!));
        angle += d * (lerp(this.fineAngle[1 + 2 * j]!) + d * lerp(this.fineAngle[2 + 2 * j]!));
      }
      const aimOff = -lerp2(this.fineIntentAngle, softMinLog(lnNeed, n.lnCeiling), u0, step);
      angle += aimOff + n.launch.azimuthDeg * DEG;
      const rho = Math.exp(lnRho);
      visit(rho * Math.cos(angle), rho * Math.sin(angle));
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
    const probability = distancesM.map((d) => {
      counts.fill(0);
      this.forEachLanding(d, (x, y) => {
        const miss2 = (x - d) * (x - d) + y * y;
        // Radii ascend: the first one that holds the landing holds it for every larger radius too.
        for (let j = 0; j < r2.length; j++) {
          if (miss2 <= r2[j]!) {
            counts[j]!++;
            break;
          }
        }
      });
      let cumulative = 0;
      return Array.from(counts, (c) => {
        cumulative += c;
        return Math.round((cumulative / n) * 10000) / 10000;
      });
    });
    return { samples: n, seed, distancesM, radiiM: [...CURVE_RADII_M], probability };
  }
}

/** Linear interpolation of a fine table at ln speed (module-level, for the hot loop). */
function lerp2(table: Float64Array, lnSpeed: number, lnMin: number, step: number): number {
  const u = (lnSpeed - lnMin) / step;
  if (u <= 0) return table[0]!;
  if (u >= FINE_POINTS - 1) return table[FINE_POINTS - 1]!;
  const i = Math.floor(u);
  return table[i]! + (u - i) * (table[i + 1]! - table[i]!);
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
