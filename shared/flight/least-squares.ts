/**
 * Levenberg–Marquardt for small nonlinear least-squares problems (a handful of parameters, a few dozen
 * residuals), with a central-difference Jacobian because the residuals come from integrating the flight
 * model. Method: Levenberg 1944 / Marquardt 1963 with the parameter scaling of Moré 1978 ("The
 * Levenberg–Marquardt algorithm: implementation and theory", Springer LNM 630) — the
 * damping acts on D² with D the running maximum of the Jacobian's column norms, so the step does not
 * depend on the parameters' units — and the damping update of Nielsen 1999 as given in Madsen, Nielsen &
 * Tingleff 2004, *Methods for Non-Linear Least Squares Problems* (IMM, DTU), §3.2 (gain ratio ρ;
 * λ ← λ·max(1/3, 1 − (2ρ − 1)³) on success, λ ← λν, ν ← 2ν on failure).
 */

/** Residual function: the residual vector at `p`, or null where the model cannot be evaluated. */
export type ResidualFunction = (p: readonly number[]) => Float64Array | null;

/** Settings of one fit. */
export interface LeastSquaresOptions {
  /** Central-difference step per parameter (in the parameter's own unit). */
  steps: readonly number[];
  lower: readonly number[];
  upper: readonly number[];
  /** Most iterations (default 60). */
  maxIterations?: number;
}

/** Outcome of a fit. */
export interface LeastSquaresResult {
  p: number[];
  /** ½ Σ r² at `p`. */
  cost: number;
  residuals: Float64Array;
  /** Covariance of `p` for unit residual variance, (JᵀJ)⁻¹ at `p`; null when JᵀJ is singular. */
  unitCovariance: number[][] | null;
  iterations: number;
  /** Residual-function calls, Jacobians included. */
  evaluations: number;
}

const halfSumSq = (r: Float64Array): number => {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i]! * r[i]!;
  return 0.5 * s;
};

function clampInto(p: number[], lower: readonly number[], upper: readonly number[]): number[] {
  return p.map((v, j) => Math.min(upper[j]!, Math.max(lower[j]!, v)));
}

/** Solve the symmetric positive-definite system A x = b by Cholesky; null when A is not positive definite. */
export function choleskySolve(a: readonly (readonly number[])[], b: readonly number[]): number[] | null {
  const n = b.length;
  const l: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i]![j]!;
      for (let k = 0; k < j; k++) s -= l[i]![k]! * l[j]![k]!;
      if (i === j) {
        if (!(s > 0)) return null;
        l[i]![i] = Math.sqrt(s);
      } else {
        l[i]![j] = s / l[j]![j]!;
      }
    }
  }
  const y = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) {
    let s = b[i]!;
    for (let k = 0; k < i; k++) s -= l[i]![k]! * y[k]!;
    y[i] = s / l[i]![i]!;
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i]!;
    for (let k = i + 1; k < n; k++) s -= l[k]![i]! * x[k]!;
    x[i] = s / l[i]![i]!;
  }
  return x;
}

/** Inverse of a symmetric positive-definite matrix (column by column through Cholesky); null when singular. */
export function spdInverse(a: readonly (readonly number[])[]): number[][] | null {
  const n = a.length;
  const columns: number[][] = [];
  for (let j = 0; j < n; j++) {
    const e = new Array<number>(n).fill(0);
    e[j] = 1;
    const x = choleskySolve(a, e);
    if (x === null) return null;
    columns.push(x);
  }
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => columns[j]![i]!));
}

interface Linearisation {
  jtj: number[][];
  jtr: number[];
  columnNorms: number[];
}

/**
 * Central-difference Jacobian products at `p` (forward or backward at a bound). Null when the model
 * cannot be evaluated on either side of some parameter.
 */
function linearise(
  f: ResidualFunction,
  p: readonly number[],
  r: Float64Array,
  options: LeastSquaresOptions,
  count: () => void,
): Linearisation | null {
  const n = p.length;
  const m = r.length;
  const columns: Float64Array[] = [];
  for (let j = 0; j < n; j++) {
    const h = options.steps[j]!;
    const up = p.slice();
    const down = p.slice();
    up[j] = Math.min(options.upper[j]!, p[j]! + h);
    down[j] = Math.max(options.lower[j]!, p[j]! - h);
    count();
    const rUp = f(up);
    count();
    const rDown = f(down);
    const span = up[j]! - down[j]!;
    if (rUp === null || rDown === null || !(span > 0)) return null;
    const column = new Float64Array(m);
    for (let i = 0; i < m; i++) column[i] = (rUp[i]! - rDown[i]!) / span;
    columns.push(column);
  }
  const jtj = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const jtr = new Array<number>(n).fill(0);
  for (let a = 0; a < n; a++) {
    const ca = columns[a]!;
    for (let i = 0; i < m; i++) jtr[a]! += ca[i]! * r[i]!;
    for (let b = 0; b <= a; b++) {
      const cb = columns[b]!;
      let s = 0;
      for (let i = 0; i < m; i++) s += ca[i]! * cb[i]!;
      jtj[a]![b] = s;
      jtj[b]![a] = s;
    }
  }
  return { jtj, jtr, columnNorms: jtj.map((row, j) => Math.sqrt(row[j]!)) };
}

/** (JᵀJ)⁻¹ at `p` by central differences: the covariance of `p` for unit residual variance; null when singular. */
export function unitCovarianceAt(f: ResidualFunction, p: readonly number[], options: LeastSquaresOptions): number[][] | null {
  const r = f(p);
  if (r === null) return null;
  const lin = linearise(f, p, r, options, () => undefined);
  return lin === null ? null : spdInverse(lin.jtj);
}

/**
 * Minimise ½ Σ r(p)² from `p0` within box bounds (steps are projected onto the box). Returns null when
 * the residuals cannot be evaluated at the start.
 */
export function levenbergMarquardt(f: ResidualFunction, p0: readonly number[], options: LeastSquaresOptions): LeastSquaresResult | null {
  const n = p0.length;
  const maxIterations = options.maxIterations ?? 60;
  let evaluations = 0;
  const count = (): void => {
    evaluations++;
  };
  let p = clampInto(p0.slice(), options.lower, options.upper);
  count();
  let r = f(p);
  if (r === null) return null;
  let cost = halfSumSq(r);
  let lin = linearise(f, p, r, options, count);
  if (lin === null) return null;
  // Moré 1978: D is the running maximum of the Jacobian's column norms.
  const d = lin.columnNorms.map((v) => (v > 0 ? v : 1));
  let lambda = 1e-3 * Math.max(...lin.jtj.map((row, j) => row[j]! / (d[j]! * d[j]!)));
  let nu = 2;
  let iterations = 0;
  while (iterations < maxIterations) {
    iterations++;
    const { jtj, jtr } = lin;
    const damped = jtj.map((row, i) => row.map((v, j) => (i === j ? v + lambda * d[i]! * d[i]! : v)));
    const step = choleskySolve(
      damped,
      jtr.map((g) => -g),
    );
    if (step === null) {
      lambda *= nu;
      nu *= 2;
      continue;
    }
    const candidate = clampInto(
      p.map((v, j) => v + step[j]!),
      options.lower,
      options.upper,
    );
    const h = candidate.map((v, j) => v - p[j]!);
    const stepScaled = Math.sqrt(h.reduce((s, v, j) => s + (d[j]! * v) ** 2, 0));
    const pScaled = Math.sqrt(p.reduce((s, v, j) => s + (d[j]! * v) ** 2, 0));
    // Predicted decrease of the linear model: −hᵀJᵀr − ½ hᵀJᵀJh.
    let predicted = 0;
    for (let i = 0; i < n; i++) {
      predicted -= h[i]! * jtr[i]!;
      for (let j = 0; j < n; j++) predicted -= 0.5 * h[i]! * jtj[i]![j]! * h[j]!;
    }
    count();
    const rNew = f(candidate);
    const costNew = rNew === null ? Infinity : halfSumSq(rNew);
    const rho = predicted > 0 ? (cost - costNew) / predicted : -1;
    if (rNew !== null && rho > 0) {
      const relativeDecrease = (cost - costNew) / Math.max(cost, 1e-300);
      p = candidate;
      r = rNew;
      cost = costNew;
      lambda *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
      nu = 2;
      const next = linearise(f, p, r, options, count);
      if (next === null) break;
      lin = next;
      for (let j = 0; j < n; j++) d[j] = Math.max(d[j]!, lin.columnNorms[j]!);
      // Converged: the step is tiny against the parameters, or the cost no longer moves.
      if (stepScaled <= 1e-8 * (pScaled + 1e-8) || relativeDecrease < 1e-10) break;
    } else {
      lambda *= nu;
      nu *= 2;
      if (lambda > 1e16) break;
    }
  }
  return { p, cost, residuals: r, unitCovariance: spdInverse(lin.jtj), iterations, evaluations };
}
