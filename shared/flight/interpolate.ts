/**
 * Piecewise cubic Hermite interpolation with monotone (PCHIP) tangents, after Fritsch & Carlson 1980
 * (SIAM J. Numer. Anal. 17:238), in the local harmonic-mean form of Fritsch & Butland 1984: smooth, never
 * overshoots the data, and exact for straight lines. Used for tabulated flights against ln speed.
 */

/** Index of the segment [xs[i], xs[i+1]] holding x (ascending xs, clamped to the ends). */
function segment(xs: readonly number[], x: number): number {
  let lo = 0;
  let hi = xs.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid]! <= x) lo = mid;
    else hi = mid;
  }
  return lo;
}

function secant(xs: readonly number[], ys: readonly number[], i: number): number {
  return (ys[i + 1]! - ys[i]!) / (xs[i + 1]! - xs[i]!);
}

/** PCHIP tangent at node i. */
function tangent(xs: readonly number[], ys: readonly number[], i: number): number {
  const n = xs.length;
  if (n < 3) return secant(xs, ys, 0);
  if (i === 0 || i === n - 1) {
    // One-sided three-point estimate, limited to keep the ends monotone (Moler, Numerical Computing with MATLAB, §3.4).
    const [h0, h1, d0, d1] =
      i === 0
        ? [xs[1]! - xs[0]!, xs[2]! - xs[1]!, secant(xs, ys, 0), secant(xs, ys, 1)]
        : [xs[n - 1]! - xs[n - 2]!, xs[n - 2]! - xs[n - 3]!, secant(xs, ys, n - 2), secant(xs, ys, n - 3)];
    let d = ((2 * h0 + h1) * d0 - h0 * d1) / (h0 + h1);
    if (Math.sign(d) !== Math.sign(d0)) d = 0;
    else if (Math.sign(d0) !== Math.sign(d1) && Math.abs(d) > Math.abs(3 * d0)) d = 3 * d0;
    return d;
  }
  const d0 = secant(xs, ys, i - 1);
  const d1 = secant(xs, ys, i);
  if (d0 === 0 || d1 === 0 || Math.sign(d0) !== Math.sign(d1)) return 0;
  const h0 = xs[i]! - xs[i - 1]!;
  const h1 = xs[i + 1]! - xs[i]!;
  const w0 = 2 * h1 + h0;
  const w1 = h1 + 2 * h0;
  return (w0 + w1) / (w0 / d0 + w1 / d1);
}

/** Monotone cubic interpolation of y(x) over ascending xs; clamped to the end values outside the range. */
export function pchip(xs: readonly number[], ys: readonly number[], x: number): number {
  const n = xs.length;
  if (n === 0) throw new RangeError('pchip needs at least one node');
  if (n === 1 || x <= xs[0]!) return ys[0]!;
  if (x >= xs[n - 1]!) return ys[n - 1]!;
  const i = segment(xs, x);
  const h = xs[i + 1]! - xs[i]!;
  const t = (x - xs[i]!) / h;
  const t2 = t * t;
  const t3 = t2 * t;
  return (
    (2 * t3 - 3 * t2 + 1) * ys[i]! +
    (t3 - 2 * t2 + t) * h * tangent(xs, ys, i) +
    (-2 * t3 + 3 * t2) * ys[i + 1]! +
    (t3 - t2) * h * tangent(xs, ys, i + 1)
  );
}
