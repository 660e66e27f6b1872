/**
 * Benchmark baseline: an allocation-free classical fixed-step RK4 (Runge–Kutta 4th order; e.g. Hairer,
 * Nørsett & Wanner, Solving ODEs I, §II.1) on the same right-hand side as the odex path, with ground
 * contact from the cubic Hermite interpolant of the last step. On a smooth problem like this it is close
 * to the arithmetic floor, which makes it a fair yardstick for odex's overhead.
 */

import { FLIGHT_TIME_CAP_S } from '../../shared/flight/constants';
import { derivative, type FlightModel } from '../../shared/flight/model';

/** Reusable RK4 integrator: all scratch storage is allocated once, in the constructor. */
export class Rk4Baseline {
  private readonly s = new Float64Array(6);
  private readonly k1 = new Float64Array(6);
  private readonly k2 = new Float64Array(6);
  private readonly k3 = new Float64Array(6);
  private readonly k4 = new Float64Array(6);
  private readonly tmp = new Float64Array(6);
  /** Right-hand-side evaluations of the last run. */
  evaluations = 0;

  /** Carry (m) of `model` integrated with step `stepS`; NaN if the ball is still up at the time cap. */
  carry(model: FlightModel, stepS: number): number {
    const { s, k1, k2, k3, k4, tmp } = this;
    const init = model.initialState;
    for (let i = 0; i < 6; i++) s[i] = init[i]!;
    this.evaluations = 0;
    if (!(s[5]! > 0)) return 0;
    const h = stepS;
    let t = 0;
    while (t < FLIGHT_TIME_CAP_S) {
      const x0 = s[0]!,
        y0 = s[1]!,
        z0 = s[2]!,
        vx0 = s[3]!,
        vy0 = s[4]!,
        vz0 = s[5]!;
      derivative(model, t, s, k1);
      for (let i = 0; i < 6; i++) tmp[i] = s[i]! + 0.5 * h * k1[i]!;
      derivative(model, t + 0.5 * h, tmp, k2);
      for (let i = 0; i < 6; i++) tmp[i] = s[i]! + 0.5 * h * k2[i]!;
      derivative(model, t + 0.5 * h, tmp, k3);
      for (let i = 0; i < 6; i++) tmp[i] = s[i]! + h * k3[i]!;
      derivative(model, t + h, tmp, k4);
      for (let i = 0; i < 6; i++) s[i] = s[i]! + (h / 6) * (k1[i]! + 2 * k2[i]! + 2 * k3[i]! + k4[i]!);
      this.evaluations += 4;
      t += h;
      if (s[2]! <= 0) {
        const theta = hermiteRoot(z0, h * vz0, s[2]!, h * s[5]!);
        const x = hermite(theta, x0, h * vx0, s[0]!, h * s[3]!);
        const y = hermite(theta, y0, h * vy0, s[1]!, h * s[4]!);
        return Math.hypot(x, y);
      }
    }
    return Number.NaN;
  }
}

/** Cubic Hermite interpolant on [0, 1] from end values p0, p1 and scaled end slopes m0, m1. */
function hermite(u: number, p0: number, m0: number, p1: number, m1: number): number {
  const u2 = u * u;
  const u3 = u2 * u;
  return (2 * u3 - 3 * u2 + 1) * p0 + (u3 - 2 * u2 + u) * m0 + (-2 * u3 + 3 * u2) * p1 + (u3 - u2) * m1;
}

function hermiteSlope(u: number, p0: number, m0: number, p1: number, m1: number): number {
  const u2 = u * u;
  return (6 * u2 - 6 * u) * p0 + (3 * u2 - 4 * u + 1) * m0 + (-6 * u2 + 6 * u) * p1 + (3 * u2 - 2 * u) * m1;
}

/** Root in (0, 1] of the Hermite cubic for z (z0 > 0 ≥ z1): safeguarded Newton from the secant guess. */
function hermiteRoot(z0: number, m0: number, z1: number, m1: number): number {
  let lo = 0;
  let hi = 1;
  let u = z0 / (z0 - z1);
  for (let i = 0; i < 30; i++) {
    const f = hermite(u, z0, m0, z1, m1);
    if (f > 0) lo = u;
    else hi = u;
    const d = hermiteSlope(u, z0, m0, z1, m1);
    let next = d !== 0 ? u - f / d : 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - u) < 1e-14) return next;
    u = next;
  }
  return u;
}
