/**
 * Small numerical statistics toolkit for the profile fit and envelopes: log normal CDF and interval
 * probabilities that stay finite far in the tails, Nelder–Mead minimisation, a finite-difference
 * Hessian for standard errors, and percentiles.
 */

const LOG_HALF = Math.log(0.5);
const SQRT1_2 = Math.SQRT1_2;
const LOG_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);

/**
 * ln erfc(z) for z ≥ 0 from the Chebyshev-fitted erfc of Numerical Recipes (Press et al., 2nd ed.,
 * §6.2, fractional error < 1.2e-7); written in log form so it never underflows in the tails.
 */
function logErfcNonNegative(z: number): number {
  const t = 1 / (1 + 0.5 * z);
  const poly =
    -1.26551223 +
    t *
      (1.00002368 +
        t *
          (0.37409196 +
            t *
              (0.09678418 +
                t * (-0.18628806 + t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277))))))));
  return Math.log(t) - z * z + poly;
}

/** ln Φ(x), the log of the standard normal CDF, finite for any finite x. */
export function logNormalCdf(x: number): number {
  if (x === Number.NEGATIVE_INFINITY) return Number.NEGATIVE_INFINITY;
  if (x === Number.POSITIVE_INFINITY) return 0;
  if (x < 0) return LOG_HALF + logErfcNonNegative(-x * SQRT1_2);
  return Math.log1p(-0.5 * Math.exp(logErfcNonNegative(x * SQRT1_2)));
}

/** Φ(x), the standard normal CDF. */
export function normalCdf(x: number): number {
  return Math.exp(logNormalCdf(x));
}

/** ln φ(x), the log of the standard normal density. */
export function logNormalPdf(x: number): number {
  return -0.5 * x * x - LOG_SQRT_2PI;
}

/**
 * ln(Φ(b) − Φ(a)) for a < b (either may be infinite), computed in the tail where it is small so that
 * censored observations far from the mean still pull the fit smoothly.
 */
export function logNormalIntervalProbability(a: number, b: number): number {
  if (!(b > a)) return Number.NEGATIVE_INFINITY;
  let result: number;
  if (b <= 0) {
    const lb = logNormalCdf(b);
    result = lb + Math.log1p(-Math.exp(logNormalCdf(a) - lb));
  } else if (a >= 0) {
    const la = logNormalCdf(-a);
    result = la + Math.log1p(-Math.exp(logNormalCdf(-b) - la));
  } else {
    result = Math.log1p(-Math.exp(logNormalCdf(-b)) - Math.exp(logNormalCdf(a)));
  }
  if (!Number.isFinite(result) && Number.isFinite(a) && Number.isFinite(b)) {
    // A degenerate interval: fall back to density × width.
    return logNormalPdf(0.5 * (a + b)) + Math.log(b - a);
  }
  return result;
}

/** Nelder–Mead minimisation (Lagarias et al. 1998 coefficients) of a function of a few variables. */
export function nelderMead(
  f: (x: number[]) => number,
  start: number[],
  steps: number[],
  options: { tolerance?: number; maxIterations?: number } = {},
): { x: number[]; value: number } {
  const n = start.length;
  const tolerance = options.tolerance ?? 1e-10;
  const maxIterations = options.maxIterations ?? 400 * n;
  const simplex: number[][] = [start.slice()];
  for (let i = 0; i < n; i++) {
    const p = start.slice();
    p[i]! += steps[i]!;
    simplex.push(p);
  }
  const values = simplex.map(f);
  const order = simplex.map((_, i) => i);
  for (let iter = 0; iter < maxIterations; iter++) {
    order.sort((i, j) => values[i]! - values[j]!);
    const best = order[0]!;
    const worst = order[n]!;
    const second = order[n - 1]!;
    if (Math.abs(values[worst]! - values[best]!) <= tolerance * (Math.abs(values[best]!) + tolerance)) break;
    const centroid = new Array<number>(n).fill(0);
    for (const i of order.slice(0, n)) for (let k = 0; k < n; k++) centroid[k]! += simplex[i]![k]! / n;
    const along = (coef: number): number[] => centroid.map((c, k) => c + coef * (simplex[worst]![k]! - c));
    const reflected = along(-1);
    const fr = f(reflected);
    if (fr < values[best]!) {
      const expanded = along(-2);
      const fe = f(expanded);
      if (fe < fr) {
        simplex[worst] = expanded;
        values[worst] = fe;
      } else {
        simplex[worst] = reflected;
        values[worst] = fr;
      }
      continue;
    }
    if (fr < values[second]!) {
      simplex[worst] = reflected;
      values[worst] = fr;
      continue;
    }
    const contracted = fr < values[worst]! ? along(-0.5) : along(0.5);
    const fc = f(contracted);
    if (fc < Math.min(fr, values[worst]!)) {
      simplex[worst] = contracted;
      values[worst] = fc;
      continue;
    }
    for (const i of order.slice(1)) {
      simplex[i] = simplex[i]!.map((v, k) => simplex[best]![k]! + 0.5 * (v - simplex[best]![k]!));
      values[i] = f(simplex[i]!);
    }
  }
  let bestIndex = 0;
  for (let i = 1; i <= n; i++) if (values[i]! < values[bestIndex]!) bestIndex = i;
  return { x: simplex[bestIndex]!, value: values[bestIndex]! };
}

/**
 * Inverse of the finite-difference Hessian of a 2-variable function at x (the asymptotic covariance of
 * a maximum-likelihood estimate when f is the negative log-likelihood). Falls back to the inverse
 * diagonal, floored, when the Hessian is not positive definite there.
 */
export function inverseHessian2(f: (x: number[]) => number, x: number[], h: [number, number]): [[number, number], [number, number]] {
  const [x0, x1] = [x[0]!, x[1]!];
  const [h0, h1] = h;
  const fx = f(x);
  const h00 = (f([x0 + h0, x1]) - 2 * fx + f([x0 - h0, x1])) / (h0 * h0);
  const h11 = (f([x0, x1 + h1]) - 2 * fx + f([x0, x1 - h1])) / (h1 * h1);
  const h01 = (f([x0 + h0, x1 + h1]) - f([x0 + h0, x1 - h1]) - f([x0 - h0, x1 + h1]) + f([x0 - h0, x1 - h1])) / (4 * h0 * h1);
  const det = h00 * h11 - h01 * h01;
  if (h00 > 0 && h11 > 0 && det > 0) {
    return [
      [h11 / det, -h01 / det],
      [-h01 / det, h00 / det],
    ];
  }
  const floor = 1e-6;
  return [
    [1 / Math.max(h00, floor), 0],
    [0, 1 / Math.max(h11, floor)],
  ];
}

/**
 * Inverse of the finite-difference Hessian of an n-variable function at x (Gauss–Jordan with partial
 * pivoting). Falls back to the inverse diagonal, floored, when the Hessian is not positive definite.
 */
export function inverseHessian(f: (x: number[]) => number, x: readonly number[], h: readonly number[]): number[][] {
  const n = x.length;
  const at = (d: number[]): number => f(x.map((v, i) => v + d[i]!));
  const fx = f(x.slice());
  const H: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    const e = (k: number, s: number): number[] => x.map((_, j) => (j === k ? s * h[k]! : 0));
    H[i]![i] = (at(e(i, 1)) - 2 * fx + at(e(i, -1))) / (h[i]! * h[i]!);
    for (let j = 0; j < i; j++) {
      const d = (si: number, sj: number): number[] => x.map((_, k) => (k === i ? si * h[i]! : k === j ? sj * h[j]! : 0));
      const v = (at(d(1, 1)) - at(d(1, -1)) - at(d(-1, 1)) + at(d(-1, -1))) / (4 * h[i]! * h[j]!);
      H[i]![j] = v;
      H[j]![i] = v;
    }
  }
  const inverse = invertPositiveDefinite(H);
  if (inverse) return inverse;
  return H.map((row, i) => row.map((_, j) => (i === j ? 1 / Math.max(H[i]![i]!, 1e-6) : 0)));
}

/** Inverse of a symmetric matrix when it is positive definite (all pivots positive), else null. */
function invertPositiveDefinite(m: readonly number[][]): number[][] | null {
  const n = m.length;
  const a = m.map((row, i) => [...row, ...row.map((_, j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < n; c++) {
    const pivot = a[c]![c]!;
    if (!(pivot > 0) || !Number.isFinite(pivot)) return null;
    for (let k = 0; k < 2 * n; k++) a[c]![k]! /= pivot;
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const factor = a[r]![c]!;
      for (let k = 0; k < 2 * n; k++) a[r]![k]! -= factor * a[c]![k]!;
    }
  }
  return a.map((row) => row.slice(n));
}

/** Percentile p ∈ [0, 100] of ascending-sorted values, linear interpolation (Hyndman & Fan 1996, type 7). */
export function percentileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) throw new RangeError('percentile of an empty sample');
  const h = ((n - 1) * p) / 100;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

/** Percentiles 10/50/90, mean and sample standard deviation of a set of values, metres. */
export interface DistributionSummary {
  p10: number;
  p50: number;
  p90: number;
  mean: number;
  sd: number;
}

/** Summarise a non-empty sample (envelopes and set-piece checks report these). */
export function summarise(values: readonly number[]): DistributionSummary {
  const sorted = values.slice().sort((a, b) => a - b);
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  const variance = values.length > 1 ? values.reduce((a, v) => a + (v - mean) * (v - mean), 0) / (values.length - 1) : 0;
  return {
    p10: percentileSorted(sorted, 10),
    p50: percentileSorted(sorted, 50),
    p90: percentileSorted(sorted, 90),
    mean,
    sd: Math.sqrt(variance),
  };
}

/**
 * Φ⁻¹(p), the standard normal quantile, by Acklam's rational approximation (relative error < 1.2e-9 over
 * (0, 1); P. J. Acklam, "An algorithm for computing the inverse normal cumulative distribution function",
 * 2003) without the refinement step. Used to draw from truncated normals by inversion.
 */
export function normalQuantile(p: number): number {
  if (!(p > 0)) return Number.NEGATIVE_INFINITY;
  if (!(p < 1)) return Number.POSITIVE_INFINITY;
  const a = [-39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716, 2.506628277459239];
  const b = [-54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572];
  const c = [-0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416];
  const low = 0.02425;
  if (p < low) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (
      (((((c[0]! * q + c[1]!) * q + c[2]!) * q + c[3]!) * q + c[4]!) * q + c[5]!) /
      ((((d[0]! * q + d[1]!) * q + d[2]!) * q + d[3]!) * q + 1)
    );
  }
  if (p > 1 - low) {
    const q = Math.sqrt(-2 * Math.log(1 - p));
    return (
      -(((((c[0]! * q + c[1]!) * q + c[2]!) * q + c[3]!) * q + c[4]!) * q + c[5]!) /
      ((((d[0]! * q + d[1]!) * q + d[2]!) * q + d[3]!) * q + 1)
    );
  }
  const q = p - 0.5;
  const r = q * q;
  return (
    ((((((a[0]! * r + a[1]!) * r + a[2]!) * r + a[3]!) * r + a[4]!) * r + a[5]!) * q) /
    (((((b[0]! * r + b[1]!) * r + b[2]!) * r + b[3]!) * r + b[4]!) * r + 1)
  );
}
