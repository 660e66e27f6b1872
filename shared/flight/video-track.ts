/**
 * Launch speed, elevation and backspin from a ball tracked in a side-on phone video. The coach taps the
 * ball's centre in a few frames and marks two points on the ground; the flight model itself is fitted
 * to the taps — its path, projected into the image by the camera model of `video-camera.ts`, against
 * the tapped pixels — by Levenberg–Marquardt (`least-squares.ts`) over four parameters: launch speed,
 * elevation, backspin and the moment of foot contact (which falls between frames). The uncertainty is
 * the fit's covariance, σ²(JᵀJ)⁻¹ with σ² the residual variance: the Gauss–Newton linearisation at the
 * optimum (Nocedal & Wright, *Numerical Optimization*, 2nd ed. 2006, §10.3; the asymptotic covariance
 * of nonlinear least squares, Seber & Wild 1989, *Nonlinear Regression*, §2.1 — from memory).
 *
 * What the measurement assumes: the ball flies in the vertical plane of the kick line (no sidespin, no
 * crosswind drift that would take it towards or away from the camera), the camera is side-on and still,
 * and the ball starts from the kick spot at 0 m along the line. The backspin is the rate the model's
 * lift law needs to bend the path that way; published lift coefficients disagree by up to ±50 %, so it
 * is a model-based measurement, not a direct one.
 */

import { BALL_SIZES } from './constants';
import { levenbergMarquardt, unitCovarianceAt } from './least-squares';
import { simulateKick } from './simulate';
import type { BallSpec, FlightConditions, PathPoint } from './types';
import { LIMITS, requireFinite, requireInRange } from './validate';
import { planeCamera, type ImagePoint, type PlaneCamera, type TrackCalibration } from './video-camera';

export type { GroundMark, TrackCalibration } from './video-camera';

/** The ball's centre as tapped in one frame: the frame's time in the video, s, and its pixel (y downward). */
export interface TrackPoint {
  tS: number;
  xPx: number;
  yPx: number;
}

/** What `solveLaunchFromTrack` needs. */
export interface LaunchTrackInput {
  points: TrackPoint[];
  calibration: TrackCalibration;
  /** Air, wind and aerodynamic settings of the session, as for `simulateKick` (`{}` = defaults). */
  conditions?: FlightConditions;
  /** The ball (wins over `conditions.ball`); default a size 5. */
  ball?: BallSpec;
}

/** Stable codes of unusable input, for screens and logs. */
export type LaunchTrackRefusal =
  'too_few_points' | 'times_not_increasing' | 'calibration_too_close' | 'calibration_not_level' | 'no_kick_fits' | 'speed_out_of_range';

/** A track that cannot be measured, with a message a coach can act on. */
export interface LaunchTrackFailure {
  ok: false;
  code: LaunchTrackRefusal;
  message: string;
}

/** A measured launch: the fit, its one-standard-deviation uncertainty and the fitted path for drawing. */
export interface LaunchTrackFit {
  ok: true;
  speedMs: number;
  elevationDeg: number;
  backspinRps: number;
  /** Moment of foot contact on the video's clock, s. */
  contactTimeS: number;
  /** Root-mean-square distance between the taps and the fitted path at the taps' times, px. */
  rmsResidualPx: number;
  /** One standard deviation from the fit's covariance. */
  uncertainty: { speedMs: number; elevationDeg: number; backspinRps: number; contactTimeS: number };
  /** The fitted flight in image pixels every 1/60 s from contact to landing, for drawing over the frames. */
  pathPx: TrackPoint[];
  /** Levenberg–Marquardt iterations and flight simulations spent (all starts). */
  iterations: number;
  evaluations: number;
}

/** Result of `solveLaunchFromTrack`. */
export type LaunchTrackResult = LaunchTrackFit | LaunchTrackFailure;

/** Fewest taps: four parameters need more than two points' worth of pixels, and five leave a check. */
export const MIN_TRACK_POINTS = 5;
/** Most taps one fit takes (a 240 fps video of a 5 s flight has 1,200 frames; a few dozen taps suffice). */
export const MAX_TRACK_POINTS = 400;
/**
 * Measured speeds outside this range are refused: nothing slower than 5 m/s leaves the ground as a kick
 * worth measuring, and maximal instep kicks reach about 35 m/s (Andersen & Dörge 2011, Scand. J. Med.
 * Sci. Sports 21:79); 40 m/s leaves headroom for the fit's spread.
 */
export const VIDEO_SPEED_RANGE_MS: readonly [number, number] = [5, 40];
/** Calibration marks must be this far apart on screen (px) and along the line (m) to fix a scale. */
export const MIN_CALIBRATION_PX = 40;
export const MIN_CALIBRATION_M = 2;
/** A ground line steeper than this is not a side-on, level phone (the phones tilt up to ~10°). */
export const MAX_CALIBRATION_TILT_DEG = 30;

const DEG = Math.PI / 180;
const PATH_DRAW_INTERVAL_S = 1 / 60;
/** Backspin starts tried (rev/s): the fit has a shallow valley in spin, so it starts from both sides of it. */
const SPIN_STARTS_RPS = [-6, -2, 0, 2, 5, 9];
/** Free fits run from the best few of those starts. */
const FREE_FITS = 2;

const fail = (code: LaunchTrackRefusal, message: string): LaunchTrackFailure => ({ ok: false, code, message });

/** Position at time `tS` after contact, by cubic interpolation of the 20 ms path (clamped at its ends). */
function positionAt(path: readonly PathPoint[], tS: number): { x: number; z: number } {
  const last = path.length - 1;
  if (tS <= 0) return { x: 0, z: 0 };
  if (tS >= path[last]!.t) return { x: path[last]!.x, z: Math.max(0, path[last]!.z) };
  let i = Math.min(last - 1, Math.floor(tS / (path[1]!.t - path[0]!.t)));
  while (i > 0 && path[i]!.t > tS) i--;
  while (i < last - 1 && path[i + 1]!.t < tS) i++;
  const p0 = path[Math.max(0, i - 1)]!;
  const p1 = path[i]!;
  const p2 = path[i + 1]!;
  const p3 = path[Math.min(last, i + 2)]!;
  // Cubic Hermite with finite-difference (Catmull–Rom style, non-uniform) tangents: C¹, so the fit's
  // finite-difference Jacobian stays smooth; error ~h⁴ (≪ 1 mm at 20 ms).
  const h = p2.t - p1.t;
  const s = (tS - p1.t) / h;
  const tangent = (a: PathPoint, b: PathPoint, key: 'x' | 'z'): number => (b[key] - a[key]) / (b.t - a.t);
  const h00 = 2 * s ** 3 - 3 * s ** 2 + 1;
  const h10 = s ** 3 - 2 * s ** 2 + s;
  const h01 = -2 * s ** 3 + 3 * s ** 2;
  const h11 = s ** 3 - s ** 2;
  const at = (key: 'x' | 'z'): number => {
    const m1 = tangent(p0 === p1 ? p1 : p0, p2, key);
    const m2 = tangent(p1, p3 === p2 ? p2 : p3, key);
    return h00 * p1[key] + h10 * h * m1 + h01 * p2[key] + h11 * h * m2;
  };
  return { x: at('x'), z: at('z') };
}

function validatePoints(points: unknown): TrackPoint[] {
  if (!Array.isArray(points)) throw new RangeError('points must be an array');
  if (points.length > MAX_TRACK_POINTS) throw new RangeError(`points must hold at most ${MAX_TRACK_POINTS} taps`);
  return points.map((p: unknown, i) => {
    if (p === null || typeof p !== 'object') throw new RangeError(`points[${i}] must be an object`);
    const q = p as Record<string, unknown>;
    return {
      tS: requireFinite(`points[${i}].tS`, q['tS']),
      xPx: requireFinite(`points[${i}].xPx`, q['xPx']),
      yPx: requireFinite(`points[${i}].yPx`, q['yPx']),
    };
  });
}

function validateCalibration(c: unknown): TrackCalibration {
  if (c === null || typeof c !== 'object') throw new RangeError('calibration must be an object');
  const mark = (name: 'a' | 'b') => {
    const m = (c as Record<string, unknown>)[name];
    if (m === null || typeof m !== 'object') throw new RangeError(`calibration.${name} must be an object`);
    const q = m as Record<string, unknown>;
    return {
      xPx: requireFinite(`calibration.${name}.xPx`, q['xPx']),
      yPx: requireFinite(`calibration.${name}.yPx`, q['yPx']),
      alongM: requireInRange(`calibration.${name}.alongM`, q['alongM'], -50, 200, 'm'),
    };
  };
  return { a: mark('a'), b: mark('b') };
}

/** Starting launch from the first half of the taps: quadratics in time through the unprojected points. */
function initialLaunch(
  camera: PlaneCamera,
  points: readonly TrackPoint[],
  radiusM: number,
): { speedMs: number; elevationDeg: number; contactTimeS: number } | null {
  const n = Math.max(MIN_TRACK_POINTS, Math.ceil(points.length / 2));
  const used = points.slice(0, n);
  const t0 = used[0]!.tS;
  const plane = used.map((p) => camera.unproject(p));
  const fitQuadratic = (values: number[]): [number, number, number] | null => {
    // Normal equations of y = c0 + c1 t + c2 t² (3×3).
    const s = new Array<number>(5).fill(0);
    const b = [0, 0, 0];
    used.forEach((p, i) => {
      const t = p.tS - t0;
      for (let k = 0; k < 5; k++) s[k]! += t ** k;
      for (let k = 0; k < 3; k++) b[k]! += values[i]! * t ** k;
    });
    const a = [
      [s[0]!, s[1]!, s[2]!],
      [s[1]!, s[2]!, s[3]!],
      [s[2]!, s[3]!, s[4]!],
    ];
    const det = (m: number[][]): number =>
      m[0]![0]! * (m[1]![1]! * m[2]![2]! - m[1]![2]! * m[2]![1]!) -
      m[0]![1]! * (m[1]![0]! * m[2]![2]! - m[1]![2]! * m[2]![0]!) +
      m[0]![2]! * (m[1]![0]! * m[2]![1]! - m[1]![1]! * m[2]![0]!);
    const d = det(a);
    if (!(Math.abs(d) > 1e-300)) return null;
    const coef = [0, 1, 2].map((k) => det(a.map((row, i) => row.map((v, j) => (j === k ? b[i]! : v)))) / d);
    return [coef[0]!, coef[1]!, coef[2]!];
  };
  const xq = fitQuadratic(plane.map((p) => p.alongM));
  const zq = fitQuadratic(plane.map((p) => p.heightM - radiusM));
  if (xq === null || zq === null) return null;
  // Contact: where the along-line fit passes the kick spot, just before the first tap.
  let tc = 0;
  if (Math.abs(xq[2]) < 1e-9) tc = -xq[0] / xq[1];
  else {
    const disc = xq[1] * xq[1] - 4 * xq[2] * xq[0];
    if (disc >= 0) {
      const roots = [(-xq[1] + Math.sqrt(disc)) / (2 * xq[2]), (-xq[1] - Math.sqrt(disc)) / (2 * xq[2])];
      tc = roots.reduce((best, r) => (Math.abs(r) < Math.abs(best) ? r : best), Infinity);
    } else tc = -xq[0] / xq[1];
  }
  if (!Number.isFinite(tc)) return null;
  const span = used[used.length - 1]!.tS - t0;
  tc = Math.min(0, Math.max(-Math.max(0.5, span), tc));
  const vx = xq[1] + 2 * xq[2] * tc;
  const vz = zq[1] + 2 * zq[2] * tc;
  if (!(vx > 0)) return null;
  return {
    speedMs: Math.min(VIDEO_SPEED_RANGE_MS[1], Math.max(VIDEO_SPEED_RANGE_MS[0], Math.hypot(vx, vz))),
    elevationDeg: Math.min(70, Math.max(1, Math.atan2(vz, vx) / DEG)),
    contactTimeS: t0 + tc,
  };
}

/**
 * Fit launch speed (m/s), elevation (°), backspin (rev/s, negative = topspin) and the contact time to a
 * tapped track. Never throws for a track that no kick explains — it answers `{ ok: false, code }` — only
 * for malformed input (RangeError naming the field).
 */
export function solveLaunchFromTrack(input: LaunchTrackInput): LaunchTrackResult {
  if (input === null || typeof input !== 'object') throw new RangeError('input must be an object');
  const points = validatePoints(input.points);
  const calibration = validateCalibration(input.calibration);
  const conditions: FlightConditions = { ...(input.conditions ?? {}) };
  if (input.ball !== undefined) conditions.ball = input.ball;
  const radiusM = conditions.ball
    ? requireInRange('ball.radiusM', conditions.ball.radiusM, LIMITS.radiusM[0], LIMITS.radiusM[1], 'm')
    : BALL_SIZES[5].radiusM;

  if (points.length < MIN_TRACK_POINTS)
    return fail('too_few_points', `Tap the ball in at least ${MIN_TRACK_POINTS} frames (${points.length} so far).`);
  for (let i = 1; i < points.length; i++) {
    if (!(points[i]!.tS > points[i - 1]!.tS))
      return fail('times_not_increasing', `Tap ${i + 1} is not later than tap ${i}: each tap needs its own, later frame.`);
  }
  const { a, b } = calibration;
  const apartPx = Math.hypot(b.xPx - a.xPx, b.yPx - a.yPx);
  const apartM = Math.abs(b.alongM - a.alongM);
  if (apartPx < MIN_CALIBRATION_PX || apartM < MIN_CALIBRATION_M) {
    return fail(
      'calibration_too_close',
      `The two ground points must be at least ${MIN_CALIBRATION_M} m and ${MIN_CALIBRATION_PX} px apart (they are ${apartM.toFixed(1)} m and ${apartPx.toFixed(0)} px apart).`,
    );
  }
  const camera = planeCamera(calibration);
  if (Math.abs(camera.tiltDeg) > MAX_CALIBRATION_TILT_DEG) {
    return fail(
      'calibration_not_level',
      `The ground line leans ${Math.abs(camera.tiltDeg).toFixed(0)}° on screen; film side-on with the phone level (at most ${MAX_CALIBRATION_TILT_DEG}°).`,
    );
  }

  const start = initialLaunch(camera, points, radiusM);
  if (start === null)
    return fail('no_kick_fits', 'The taps do not move away from the kick spot along the ground line, so no kick fits them.');

  const lastT = points[points.length - 1]!.tS;
  const firstT = points[0]!.tS;
  let simulations = 0;
  // The contact time only shifts the taps along one flight, so the last few flights are kept: a
  // finite difference in contact time (and the partial fits' restarts) costs no new simulation.
  const recent: { key: string; flight: ReturnType<typeof simulateKick> }[] = [];
  const flightOf = (p: readonly number[]) => {
    const key = `${p[0]}|${p[1]}|${p[2]}`;
    const hit = recent.find((e) => e.key === key);
    if (hit) return hit.flight;
    simulations++;
    const flight = simulateKick({ ...conditions, speed: p[0]!, elevationDeg: p[1]!, backspinRps: p[2]!, path: true });
    recent.unshift({ key, flight });
    if (recent.length > 4) recent.pop();
    return flight;
  };
  const residuals = (p: readonly number[]): Float64Array | null => {
    const flight = flightOf(p);
    if (flight.path.length < 2) return null;
    const r = new Float64Array(2 * points.length);
    points.forEach((pt, i) => {
      const pos = positionAt(flight.path, pt.tS - p[3]!);
      const px = camera.project({ alongM: pos.x, heightM: pos.z + radiusM });
      r[2 * i] = px.xPx - pt.xPx;
      r[2 * i + 1] = px.yPx - pt.yPx;
    });
    return r;
  };
  const options = {
    steps: [0.05, 0.05, 0.1, 0.002],
    lower: [1, 0.5, LIMITS.spinRps[0], firstT - 5],
    upper: [55, 85, LIMITS.spinRps[1], lastT],
  };
  // Each start first fits speed, elevation and contact at a fixed backspin, then frees all four: the
  // default lift law rises steeply from zero spin, so the cost has a kink there that a free start at
  // one side of it may not cross.
  const fixedSpin = (spin: number) => (q: readonly number[]) => residuals([q[0]!, q[1]!, spin, q[2]!]);
  const without = (v: readonly number[]) => [v[0]!, v[1]!, v[3]!];
  const fixedOptions = { steps: without(options.steps), lower: without(options.lower), upper: without(options.upper) };
  let best: { p: number[]; cost: number; residuals: Float64Array } | null = null;
  let iterations = 0;
  const partials: { p: number[]; cost: number; residuals: Float64Array }[] = [];
  for (const spin of SPIN_STARTS_RPS) {
    const partial = levenbergMarquardt(fixedSpin(spin), [start.speedMs, start.elevationDeg, start.contactTimeS], {
      ...fixedOptions,
      maxIterations: 20,
    });
    if (partial === null) continue;
    iterations += partial.iterations;
    partials.push({ p: [partial.p[0]!, partial.p[1]!, spin, partial.p[2]!], cost: partial.cost, residuals: partial.residuals });
  }
  partials.sort((x, y) => x.cost - y.cost);
  for (const partial of partials.slice(0, FREE_FITS)) {
    if (best === null || partial.cost < best.cost) best = partial;
    const fit = levenbergMarquardt(residuals, partial.p, options);
    if (fit === null) continue;
    iterations += fit.iterations;
    if (fit.cost < best.cost) best = fit;
  }
  if (best === null) return fail('no_kick_fits', 'No kick of the flight model passes through these taps.');
  const unitCovariance = unitCovarianceAt(residuals, best.p, options);

  const m = best.residuals.length;
  const rmsResidualPx = Math.sqrt((2 * best.cost) / (m / 2));
  const ballPx = 2 * radiusM * camera.pxPerM;
  const allowedPx = Math.max(6, ballPx);
  if (!(rmsResidualPx <= allowedPx)) {
    return fail(
      'no_kick_fits',
      `The best kick misses the taps by ${rmsResidualPx.toFixed(1)} px on average (more than ${allowedPx.toFixed(0)} px): check the taps and the ground points.`,
    );
  }
  const [speedMs, elevationDeg, backspinRps, contactTimeS] = best.p as [number, number, number, number];
  if (speedMs < VIDEO_SPEED_RANGE_MS[0] || speedMs > VIDEO_SPEED_RANGE_MS[1]) {
    return fail(
      'speed_out_of_range',
      `The fit gives ${speedMs.toFixed(1)} m/s, outside what a kick reaches (${VIDEO_SPEED_RANGE_MS[0]}–${VIDEO_SPEED_RANGE_MS[1]} m/s): check the ground points' distances.`,
    );
  }
  // σ² from the residuals (2 per tap, 4 parameters), times (JᵀJ)⁻¹.
  const dof = Math.max(1, m - 4);
  const variance = (2 * best.cost) / dof;
  const sd = (j: number): number => (unitCovariance ? Math.sqrt(Math.max(0, variance * unitCovariance[j]![j]!)) : Infinity);

  const flight = flightOf(best.p);
  const pathPx: TrackPoint[] = [];
  for (let t = 0; t <= flight.flightTimeS + 1e-9; t += PATH_DRAW_INTERVAL_S) {
    const pos = positionAt(flight.path, t);
    const px: ImagePoint = camera.project({ alongM: pos.x, heightM: pos.z + radiusM });
    pathPx.push({ tS: contactTimeS + t, xPx: px.xPx, yPx: px.yPx });
  }
  return {
    ok: true,
    speedMs,
    elevationDeg,
    backspinRps,
    contactTimeS,
    rmsResidualPx,
    uncertainty: { speedMs: sd(0), elevationDeg: sd(1), backspinRps: sd(2), contactTimeS: sd(3) },
    pathPx,
    iterations,
    evaluations: simulations,
  };
}
