/**
 * Independent reference integrator for the specs: classical fixed-step RK4 (Hairer, Nørsett & Wanner,
 * Solving Ordinary Differential Equations I, §II.1) at a small step on the model's right-hand side,
 * with ground contact and plane crossings from cubic Hermite interpolation inside the last step. It
 * shares only the equations of motion with the odex path, not the integrator or the root finding.
 */

import { derivative, type FlightModel } from '../../../shared/flight/model';

/** Result of a reference integration. */
export interface ReferenceFlight {
  carryM: number;
  landingX: number;
  landingY: number;
  flightTimeS: number;
  /** State (t, x, y, z) every `sampleEveryS`, as long as the ball is up. */
  samples: { t: number; x: number; y: number; z: number }[];
  /** First crossing of x = planeX: (t, y, z). */
  crossing: { t: number; y: number; z: number } | null;
}

function hermite(u: number, p0: number, m0: number, p1: number, m1: number): number {
  const u2 = u * u;
  const u3 = u2 * u;
  return (2 * u3 - 3 * u2 + 1) * p0 + (u3 - 2 * u2 + u) * m0 + (-2 * u3 + 3 * u2) * p1 + (u3 - u2) * m1;
}

/** Root by bisection (60 halvings) of the Hermite cubic through (p0, m0) → (p1, m1) with p0 > 0 ≥ p1. */
function hermiteRoot(p0: number, m0: number, p1: number, m1: number, target: number): number {
  let lo = 0;
  let hi = 1;
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (hermite(mid, p0, m0, p1, m1) > target === p0 > target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Integrate `model` with RK4 at step `stepS` until the ball comes down. */
export function rk4Reference(model: FlightModel, stepS: number, sampleEveryS = 0.02, planeX: number | null = null): ReferenceFlight {
  let s = model.initialState.slice();
  const samples: ReferenceFlight['samples'] = [{ t: 0, x: 0, y: 0, z: 0 }];
  const sampleStride = Math.round(sampleEveryS / stepS);
  let crossing: ReferenceFlight['crossing'] = null;
  const k = (t: number, y: number[]): number[] => {
    const out = [0, 0, 0, 0, 0, 0];
    derivative(model, t, y, out);
    return out;
  };
  for (let i = 0; i < 1e6; i++) {
    const t = i * stepS;
    const h = stepS;
    const k1 = k(t, s);
    const k2 = k(
      t + h / 2,
      s.map((v, j) => v + (h / 2) * k1[j]!),
    );
    const k3 = k(
      t + h / 2,
      s.map((v, j) => v + (h / 2) * k2[j]!),
    );
    const k4 = k(
      t + h,
      s.map((v, j) => v + h * k3[j]!),
    );
    const next = s.map((v, j) => v + (h / 6) * (k1[j]! + 2 * k2[j]! + 2 * k3[j]! + k4[j]!));
    if (planeX !== null && crossing === null && s[0]! < planeX && next[0]! >= planeX) {
      const u = hermiteRoot(s[0]!, h * s[3]!, next[0]!, h * next[3]!, planeX);
      crossing = {
        t: t + u * h,
        y: hermite(u, s[1]!, h * s[4]!, next[1]!, h * next[4]!),
        z: hermite(u, s[2]!, h * s[5]!, next[2]!, h * next[5]!),
      };
    }
    if (next[2]! <= 0) {
      const u = hermiteRoot(s[2]!, h * s[5]!, next[2]!, h * next[5]!, 0);
      const landingX = hermite(u, s[0]!, h * s[3]!, next[0]!, h * next[3]!);
      const landingY = hermite(u, s[1]!, h * s[4]!, next[1]!, h * next[4]!);
      return { carryM: Math.hypot(landingX, landingY), landingX, landingY, flightTimeS: t + u * h, samples, crossing };
    }
    s = next;
    if ((i + 1) % sampleStride === 0) samples.push({ t: (i + 1) * stepS, x: s[0]!, y: s[1]!, z: s[2]! });
  }
  throw new Error('reference flight did not land');
}
