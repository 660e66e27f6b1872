/**
 * Gragg–Bulirsch–Stoer extrapolation with dense output: E. Hairer and G. Wanner's ODEX (Hairer, Nørsett
 * & Wanner, Solving Ordinary Differential Equations I, §II.9), derived from odex 2.0.4, Colin Smith's
 * TypeScript port of the Fortran ODEX.F, whose licence follows.
 *
 *   Copyright (c) 2016, Colin Smith
 *   All rights reserved.
 *
 *   Redistribution and use in source and binary forms, with or without modification, are permitted
 *   provided that the following conditions are met:
 *
 *   * Redistributions of source code must retain the above copyright notice, this list of conditions and
 *     the following disclaimer.
 *
 *   * Redistributions in binary form must reproduce the above copyright notice, this list of conditions
 *     and the following disclaimer in the documentation and/or other materials provided with the
 *     distribution.
 *
 *   THIS SOFTWARE IS PROVIDED BY THE COPYRIGHT HOLDERS AND CONTRIBUTORS "AS IS" AND ANY EXPRESS OR
 *   IMPLIED WARRANTIES, INCLUDING, BUT NOT LIMITED TO, THE IMPLIED WARRANTIES OF MERCHANTABILITY AND
 *   FITNESS FOR A PARTICULAR PURPOSE ARE DISCLAIMED. IN NO EVENT SHALL THE COPYRIGHT HOLDER OR
 *   CONTRIBUTORS BE LIABLE FOR ANY DIRECT, INDIRECT, INCIDENTAL, SPECIAL, EXEMPLARY, OR CONSEQUENTIAL
 *   DAMAGES (INCLUDING, BUT NOT LIMITED TO, PROCUREMENT OF SUBSTITUTE GOODS OR SERVICES; LOSS OF USE,
 *   DATA, OR PROFITS; OR BUSINESS INTERRUPTION) HOWEVER CAUSED AND ON ANY THEORY OF LIABILITY, WHETHER
 *   IN CONTRACT, STRICT LIABILITY, OR TORT (INCLUDING NEGLIGENCE OR OTHERWISE) ARISING IN ANY WAY OUT OF
 *   THE USE OF THIS SOFTWARE, EVEN IF ADVISED OF THE POSSIBILITY OF SUCH DAMAGE.
 *
 * Why our own copy: odex allocates its tables on every solve, a fresh array on every right-hand-side
 * call and line of the table, and a new interpolation closure on every step; on a flight of ~100
 * evaluations that was about two thirds of the time. This version keeps the same algorithm and the same
 * arithmetic in the same order (results match odex 2.0.4 bit for bit on the benchmark's kicks), but every
 * table is a Float64Array allocated once per solver and reused, the right-hand side writes into a
 * preallocated array, and the dense output is one function that reads the current step's coefficients.
 * Only the dense-output mode Loftline uses is kept (step-size sequence 4, the interpolation error
 * estimator on), with scalar tolerances. Arrays keep ODEX's 1-based indexing so the code reads against
 * the Fortran.
 */

/** Right-hand side y' = f(ctx, x, y), written into `out` (0-based, length n). */
export type GbsDerivative<C> = (ctx: C, x: number, y: Float64Array, out: Float64Array) => void;

/** Dense interpolator of the current step: component index (0-based) and x in [xOld, x]. */
export type GbsDense = (component: number, x: number) => number;

/**
 * Observer called after each accepted step (and once at the start, with `nr === 1` and no dense
 * interpolator). `y` is the solver's own array, valid until the next step. Returning `false` halts.
 */
export type GbsObserver = (nr: number, xOld: number, x: number, y: Float64Array, dense?: GbsDense) => boolean | void;

/** How `solve` ended (odex's Outcome). */
export const GBS_CONVERGED = 0;
/** `maxSteps` steps were taken without reaching xEnd. */
export const GBS_MAX_STEPS = 1;
/** The observer returned false. */
export const GBS_STOPPED = 2;

/** Solver settings (odex's names; the constants ODEX documents as defaults are fixed below). */
export interface GbsSettings {
  n: number;
  /** Components with dense output, 0-based. */
  denseComponents: readonly number[];
  relativeTolerance: number;
  absoluteTolerance: number;
  initialStepSize: number;
  /** 0 = xEnd − x. */
  maxStepSize: number;
  /** KM, ≥ 3. */
  maxExtrapolationColumns: number;
  maxSteps: number;
  /** IWORK(7), 1..6. */
  interpolationFormulaDegree: number;
  /** IWORK(4). */
  stabilityCheckCount: number;
}

const U_ROUND = 2.3e-16;
const STABILITY_CHECK_TABLE_LINES = 2;
const STEP_REDUCTION = 0.5;
const FAC1 = 0.02;
const FAC2 = 4.0;
const FAC3 = 0.8;
const FAC4 = 0.9;
const SAFE1 = 0.65;
const SAFE2 = 0.94;
/** Step-size sequence 4 (n_j = 4j − 2), the one ODEX requires for dense output. */
const N_SEQ = 4;

const START = 0;
const BASIC_STEP = 1;
const CONVERGENCE_STEP = 2;
const HOPE_FOR_CONVERGENCE = 3;
const ACCEPT = 4;
const REJECT = 5;

/** One reusable ODEX solver. Not re-entrant: one solve at a time per instance. */
export class GbsSolver<C> {
  private readonly n: number;
  private readonly km: number;
  private readonly nrd: number;
  private readonly s: GbsSettings;
  /** icom (1-based): the state index of each dense component; `slot` maps a 0-based component to it. */
  private readonly icom: Int32Array;
  private readonly slot: Int32Array;
  private readonly nj: Float64Array;
  private readonly a: Float64Array;
  private readonly iPoint: Int32Array;
  private readonly errfac: Float64Array;
  /** (n_j / n_l−1)² − 1 at [j·(km+1) + l], and (n_kk / 2)^(kmi−1) at [kk·(2km+1) + kmi]. */
  private readonly extrapFactor: Float64Array;
  private readonly midFactor: Float64Array;
  /** FAC1^(1/(2j−1)). */
  private readonly facMinOf: Float64Array;
  private readonly startOrder: number;
  private readonly y: Float64Array;
  private readonly dz: Float64Array;
  private readonly yh1: Float64Array;
  private readonly yh2: Float64Array;
  private readonly dy: Float64Array;
  private readonly scal: Float64Array;
  private readonly hh: Float64Array;
  private readonly w: Float64Array;
  /** t[j][i] at j·(n+1) + i; ySafe and fSafe likewise with stride nrd + 1. */
  private readonly t: Float64Array;
  private readonly ySafe: Float64Array;
  private readonly fSafe: Float64Array;
  private readonly dens: Float64Array;
  private readonly interpA = new Float64Array(31);
  /** 0-based views handed to the right-hand side and the observer. */
  private readonly yView: Float64Array;
  private readonly dzView: Float64Array;
  private readonly yh1View: Float64Array;
  private readonly yh2View: Float64Array;
  private readonly dyView: Float64Array;
  private readonly denseFn: GbsDense;

  // State of the current solve (ODEX's locals and COMMON blocks).
  private f!: GbsDerivative<C>;
  private ctx!: C;
  private x = 0;
  private xOld = 0;
  private h = 0;
  private hMax = 0;
  private posneg = 1;
  private k = 0;
  private kc = 0;
  private iPt = 0;
  private err = 0;
  private errOld = 0;
  private hoptde = 0;
  private atov = false;
  private reject = false;
  private xOldd = 0;
  private hhh = 0;
  private kmit = 0;
  nEval = 0;
  nStep = 0;
  nAccept = 0;
  nReject = 0;
  /** Right-hand-side calls of the last solve (including those ODEX does not count in nEval). */
  rhsCalls = 0;

  constructor(settings: Readonly<GbsSettings>) {
    const n = settings.n;
    const km = settings.maxExtrapolationColumns;
    if (km <= 2) throw new Error('maxExtrapolationColumns must be > 2');
    if (settings.maxSteps <= 0) throw new Error('maxSteps must be positive');
    if (settings.interpolationFormulaDegree <= 0 || settings.interpolationFormulaDegree >= 7)
      throw new Error('bad interpolationFormulaDegree');
    this.s = { ...settings };
    this.n = n;
    this.km = km;
    const nrd = Math.max(1, settings.denseComponents.length);
    this.nrd = nrd;
    this.icom = new Int32Array(nrd + 1);
    this.slot = new Int32Array(n).fill(0);
    settings.denseComponents.forEach((c, j) => {
      if (c < 0 || c >= n) throw new Error('bad dense component: ' + c);
      this.icom[j + 1] = c + 1;
      this.slot[c] = j + 1;
    });
    this.nj = new Float64Array(km + 1);
    for (let i = 1; i <= km; ++i) this.nj[i] = 4 * i - 2;
    this.a = new Float64Array(km + 1);
    this.a[1] = 1 + this.nj[1]!;
    for (let i = 2; i <= km; ++i) this.a[i] = this.a[i - 1]! + this.nj[i]!;
    this.iPoint = new Int32Array(km + 2);
    for (let i = 1; i <= km; ++i) {
      let njAdd = 4 * i - 2;
      if (this.nj[i]! > njAdd) ++njAdd;
      this.iPoint[i + 1] = this.iPoint[i]! + njAdd;
    }
    this.errfac = new Float64Array(2 * km + 1);
    for (let mu = 1; mu <= 2 * km; ++mu) {
      const errx = Math.sqrt(mu / (mu + 4)) * 0.5;
      let prod = (1 / (mu + 4)) ** 2;
      for (let j = 1; j <= mu; ++j) prod *= errx / j;
      this.errfac[mu] = prod;
    }
    this.extrapFactor = new Float64Array((km + 1) * (km + 1));
    for (let j = 1; j <= km; ++j)
      for (let l = 2; l <= j; ++l) this.extrapFactor[j * (km + 1) + l] = (this.nj[j]! / this.nj[l - 1]!) ** 2 - 1;
    this.midFactor = new Float64Array((km + 1) * (2 * km + 1));
    for (let kk = 1; kk <= km; ++kk)
      for (let kmi = 1; kmi <= 2 * km; ++kmi) this.midFactor[kk * (2 * km + 1) + kmi] = (this.nj[kk]! / 2) ** (kmi - 1);
    this.facMinOf = new Float64Array(km + 1);
    for (let j = 1; j <= km; ++j) this.facMinOf[j] = FAC1 ** (1 / (2 * j - 1));
    const log10 = (v: number): number => Math.log(v) / Math.LN10;
    this.startOrder = Math.max(2, Math.min(km - 1, Math.floor(-log10(settings.relativeTolerance + 1e-40) * 0.6 + 1.5)));
    this.y = new Float64Array(n + 1);
    this.dz = new Float64Array(n + 1);
    this.yh1 = new Float64Array(n + 1);
    this.yh2 = new Float64Array(n + 1);
    this.dy = new Float64Array(n + 1);
    this.scal = new Float64Array(n + 1);
    this.hh = new Float64Array(km + 1);
    this.w = new Float64Array(km + 1);
    this.t = new Float64Array((km + 1) * (n + 1));
    this.ySafe = new Float64Array((km + 1) * (nrd + 1));
    this.fSafe = new Float64Array((2 * km * km + km + 1) * (nrd + 1));
    this.dens = new Float64Array((2 * km + 5) * nrd + 1);
    this.yView = this.y.subarray(1);
    this.dzView = this.dz.subarray(1);
    this.yh1View = this.yh1.subarray(1);
    this.yh2View = this.yh2.subarray(1);
    this.dyView = this.dy.subarray(1);
    this.denseFn = (c, xx) => this.dense(c, xx);
  }

  /** The state at the end of the last solve (0-based view; overwritten by the next solve). */
  get state(): Float64Array {
    return this.yView;
  }

  /** Integrate y' = f(ctx, x, y) from x0 to xEnd; returns GBS_CONVERGED, GBS_MAX_STEPS or GBS_STOPPED. */
  solve(f: GbsDerivative<C>, ctx: C, x0: number, y0: ArrayLike<number>, xEnd: number, solOut: GbsObserver): number {
    const n = this.n;
    const s = this.s;
    this.f = f;
    this.ctx = ctx;
    for (let i = 1; i <= n; ++i) this.y[i] = y0[i - 1]!;
    // Values a fresh odex would read as undefined (NaN) if ever used before being set.
    this.hh.fill(NaN);
    this.w.fill(NaN);
    this.w[1] = 0;
    this.nEval = this.nStep = this.nAccept = this.nReject = this.rhsCalls = 0;
    this.x = x0;
    this.hMax = Math.abs(s.maxStepSize || xEnd - x0);
    for (let i = 1; i <= n; ++i) this.scal[i] = s.absoluteTolerance + s.relativeTolerance + Math.abs(this.y[i]!);
    this.posneg = xEnd - x0 >= 0 ? 1 : -1;
    this.k = this.startOrder;
    let h = Math.max(Math.abs(s.initialStepSize), 1e-4);
    this.h = this.posneg * Math.min(h, this.hMax, Math.abs(xEnd - x0) / 2);
    this.xOld = x0;
    this.iPt = 0;
    if (false === solOut(this.nAccept + 1, this.xOld, this.x, this.yView)) return GBS_STOPPED;
    this.err = 0;
    this.errOld = 1e10;
    this.hoptde = this.posneg * this.hMax;
    this.reject = false;
    let last = false;
    this.kc = 0;
    const nj = this.nj;
    const km = this.km;
    let state = START;
    for (;;) {
      switch (state) {
        case START:
          this.atov = false;
          if (0.1 * Math.abs(xEnd - this.x) <= Math.abs(this.x) * U_ROUND) return GBS_CONVERGED;
          h = this.posneg * Math.min(Math.abs(this.h), Math.abs(xEnd - this.x), this.hMax, Math.abs(this.hoptde));
          this.h = h;
          if ((this.x + 1.01 * h - xEnd) * this.posneg > 0) {
            this.h = xEnd - this.x;
            last = true;
          }
          if (this.nStep === 0) {
            this.rhsCalls++;
            f(ctx, this.x, this.yView, this.dzView);
            ++this.nEval;
          }
          if (this.nStep === 0 || last) {
            this.iPt = 0;
            ++this.nStep;
            let next = HOPE_FOR_CONVERGENCE;
            for (let j = 1; j <= this.k; ++j) {
              this.kc = j;
              this.midex(j);
              if (this.atov) {
                next = START;
                break;
              }
              if (j > 1 && this.err <= 1) {
                next = ACCEPT;
                break;
              }
            }
            state = next;
            continue;
          }
          state = BASIC_STEP;
          continue;

        case BASIC_STEP:
          this.iPt = 0;
          ++this.nStep;
          if (this.nStep >= s.maxSteps) return GBS_MAX_STEPS;
          this.kc = this.k - 1;
          state = -1;
          for (let j = 1; j <= this.kc; ++j) {
            this.midex(j);
            if (this.atov) {
              state = START;
              break;
            }
          }
          if (state === START) continue;
          // convergence monitor
          if (this.k === 2 || this.reject) state = CONVERGENCE_STEP;
          else if (this.err <= 1) state = ACCEPT;
          else if (this.err > ((nj[this.k + 1]! * nj[this.k]!) / 4) ** 2) state = REJECT;
          else state = CONVERGENCE_STEP;
          continue;

        case CONVERGENCE_STEP:
          this.midex(this.k);
          if (this.atov) {
            state = START;
            continue;
          }
          this.kc = this.k;
          state = this.err <= 1 ? ACCEPT : HOPE_FOR_CONVERGENCE;
          continue;

        case HOPE_FOR_CONVERGENCE:
          if (this.err > (nj[this.k + 1]! / 2) ** 2) {
            state = REJECT;
            continue;
          }
          this.kc = this.k + 1;
          this.midex(this.kc);
          if (this.atov) state = START;
          else if (this.err > 1) state = REJECT;
          else state = ACCEPT;
          continue;

        case ACCEPT:
          if (!this.acceptStep(solOut)) return GBS_STOPPED;
          state = START;
          continue;

        case REJECT: {
          let k = Math.min(this.k, this.kc, km - 1);
          if (k > 2 && this.w[k - 1]! < this.w[k]! * FAC3) k -= 1;
          this.k = k;
          ++this.nReject;
          this.h = this.posneg * this.hh[k]!;
          this.reject = true;
          state = BASIC_STEP;
        }
      }
    }
  }

  /** Line j of the extrapolation table (explicit midpoint rule) and the optimal step for order j (odex's midex). */
  private midex(j: number): void {
    const n = this.n;
    const nrd = this.nrd;
    const sn = n + 1;
    const sd = nrd + 1;
    const { y, dz, yh1, yh2, dy, scal, t, ySafe, fSafe, icom, nj } = this;
    const h = this.h;
    const hj = h / nj[j]!;
    // Euler starting step
    for (let i = 1; i <= n; ++i) {
      yh1[i] = y[i]!;
      yh2[i] = y[i]! + hj * dz[i]!;
    }
    // Explicit midpoint rule
    const m = nj[j]! - 1;
    const njMid = (nj[j]! / 2) | 0;
    const checks = j <= STABILITY_CHECK_TABLE_LINES ? this.s.stabilityCheckCount : 0;
    for (let mm = 1; mm <= m; ++mm) {
      if (mm === njMid) for (let i = 1; i <= nrd; ++i) ySafe[j * sd + i] = yh2[icom[i]!]!;
      this.rhsCalls++;
      this.f(this.ctx, this.x + hj * mm, this.yh2View, this.dyView);
      if (Math.abs(mm - njMid) <= 2 * j - 1) {
        const row = ++this.iPt * sd;
        for (let i = 1; i <= nrd; ++i) fSafe[row + i] = dy[icom[i]!]!;
      }
      for (let i = 1; i <= n; ++i) {
        const ys = yh1[i]!;
        yh1[i] = yh2[i]!;
        yh2[i] = ys + 2 * hj * dy[i]!;
      }
      if (mm <= checks) {
        // stability check
        let del1 = 0;
        for (let i = 1; i <= n; ++i) del1 += (dz[i]! / scal[i]!) ** 2;
        let del2 = 0;
        for (let i = 1; i <= n; ++i) del2 += ((dy[i]! - dz[i]!) / scal[i]!) ** 2;
        const quot = del2 / Math.max(U_ROUND, del1);
        if (quot > 4) {
          ++this.nEval;
          this.atov = true;
          this.h *= STEP_REDUCTION;
          this.reject = true;
          return;
        }
      }
    }
    // final smoothing step
    this.rhsCalls++;
    this.f(this.ctx, this.x + h, this.yh2View, this.dyView);
    if (njMid <= 2 * j - 1) {
      const row = ++this.iPt * sd;
      for (let i = 1; i <= nrd; ++i) fSafe[row + i] = dy[icom[i]!]!;
    }
    for (let i = 1; i <= n; ++i) t[j * sn + i] = (yh1[i]! + yh2[i]! + hj * dy[i]!) / 2;
    this.nEval += nj[j]!;
    // polynomial extrapolation
    if (j === 1) return;
    const km1 = this.km + 1;
    for (let l = j; l > 1; --l) {
      const fac = this.extrapFactor[j * km1 + l]!;
      for (let i = 1; i <= n; ++i) t[(l - 1) * sn + i] = t[l * sn + i]! + (t[l * sn + i]! - t[(l - 1) * sn + i]!) / fac;
    }
    let err = 0;
    // scaling
    const aTol = this.s.absoluteTolerance;
    const rTol = this.s.relativeTolerance;
    for (let i = 1; i <= n; ++i) {
      const t1i = Math.max(Math.abs(y[i]!), Math.abs(t[sn + i]!));
      scal[i] = aTol + rTol * t1i;
      err += ((t[sn + i]! - t[2 * sn + i]!) / scal[i]!) ** 2;
    }
    err = Math.sqrt(err / n);
    this.err = err;
    if (err * U_ROUND >= 1 || (j > 2 && err >= this.errOld)) {
      this.atov = true;
      this.h *= STEP_REDUCTION;
      this.reject = true;
      return;
    }
    this.errOld = Math.max(4 * err, 1);
    // compute optimal stepsizes
    const exp0 = 1 / (2 * j - 1);
    const facMin = this.facMinOf[j]!;
    let fac = Math.min(FAC2 / facMin, Math.max(facMin, (err / SAFE1) ** exp0 / SAFE2));
    fac = 1 / fac;
    this.hh[j] = Math.min(Math.abs(h) * fac, this.hMax);
    this.w[j] = this.a[j]! / this.hh[j]!;
  }

  /**
   * Accept the step: build the dense output, check its error, hand the step to the observer and choose
   * the next order and step (odex's acceptStep, label 60). False when the observer stopped the solve.
   */
  private acceptStep(solOut: GbsObserver): boolean {
    const n = this.n;
    const nrd = this.nrd;
    const sn = n + 1;
    const sd = nrd + 1;
    const km1 = this.km + 1;
    const mk = 2 * this.km + 1;
    const { y, dz, yh1, yh2, t, ySafe, fSafe, dens, icom, iPoint, scal } = this;
    const kc = this.kc;
    const h = this.h;
    this.xOld = this.x;
    this.x += h;
    // kmit = mu of the paper
    const kmit = 2 * kc - this.s.interpolationFormulaDegree + 1;
    this.kmit = kmit;
    for (let i = 1; i <= nrd; ++i) dens[i] = y[icom[i]!]!;
    this.xOldd = this.xOld;
    this.hhh = h;
    for (let i = 1; i <= nrd; ++i) dens[nrd + i] = h * dz[icom[i]!]!;
    const kln = 2 * nrd;
    for (let i = 1; i <= nrd; ++i) dens[kln + i] = t[sn + icom[i]!]!;
    // compute solution at mid-point
    for (let j = 2; j <= kc; ++j) {
      for (let l = j; l >= 2; --l) {
        const factor = this.extrapFactor[j * km1 + l]!;
        for (let i = 1; i <= nrd; ++i)
          ySafe[(l - 1) * sd + i] = ySafe[l * sd + i]! + (ySafe[l * sd + i]! - ySafe[(l - 1) * sd + i]!) / factor;
      }
    }
    let krn = 4 * nrd;
    for (let i = 1; i <= nrd; ++i) dens[krn + i] = ySafe[sd + i]!;
    // compute first derivative at right end
    for (let i = 1; i <= n; ++i) yh1[i] = t[sn + i]!;
    this.rhsCalls++;
    this.f(this.ctx, this.x, this.yh1View, this.yh2View);
    krn = 3 * nrd;
    for (let i = 1; i <= nrd; ++i) dens[krn + i] = yh2[icom[i]!]! * h;
    // THE LOOP
    for (let kmi = 1; kmi <= kmit; ++kmi) {
      // compute kmi-th derivative at mid-point
      const kbeg = ((kmi + 1) / 2) | 0;
      for (let kk = kbeg; kk <= kc; ++kk) {
        const facnj = this.midFactor[kk * mk + kmi]!;
        this.iPt = iPoint[kk + 1]! - 2 * kk + kmi;
        const row = this.iPt * sd;
        for (let i = 1; i <= nrd; ++i) ySafe[kk * sd + i] = fSafe[row + i]! * facnj;
      }
      for (let j = kbeg + 1; j <= kc; ++j) {
        for (let l = j; l >= kbeg + 1; --l) {
          const factor = this.extrapFactor[j * km1 + l]!;
          for (let i = 1; i <= nrd; ++i)
            ySafe[(l - 1) * sd + i] = ySafe[l * sd + i]! + (ySafe[l * sd + i]! - ySafe[(l - 1) * sd + i]!) / factor;
        }
      }
      krn = (kmi + 4) * nrd;
      for (let i = 1; i <= nrd; ++i) dens[krn + i] = ySafe[kbeg * sd + i]! * h;
      if (kmi === kmit) continue;
      // compute differences
      for (let kk = ((kmi + 2) / 2) | 0; kk <= kc; ++kk) {
        const lbeg = iPoint[kk + 1]!;
        let lend = iPoint[kk]! + kmi + 1;
        if (kmi === 1 && N_SEQ === 4) lend += 2;
        let l: number;
        for (l = lbeg; l >= lend; l -= 2) for (let i = 1; i <= nrd; ++i) fSafe[l * sd + i] = fSafe[l * sd + i]! - fSafe[(l - 2) * sd + i]!;
        if (kmi === 1 && N_SEQ === 4) {
          l = lend - 2;
          for (let i = 1; i <= nrd; ++i) fSafe[l * sd + i] = fSafe[l * sd + i]! - dz[icom[i]!]!;
        }
      }
      // compute differences
      for (let kk = ((kmi + 2) / 2) | 0; kk <= kc; ++kk) {
        const lbeg = iPoint[kk + 1]! - 1;
        const lend = iPoint[kk]! + kmi + 2;
        for (let l = lbeg; l >= lend; l -= 2)
          for (let i = 1; i <= nrd; ++i) fSafe[l * sd + i] = fSafe[l * sd + i]! - fSafe[(l - 2) * sd + i]!;
      }
    }
    this.interp(kmit);
    // estimation of interpolation error
    if (kmit >= 1) {
      let errint = 0;
      for (let i = 1; i <= nrd; ++i) errint += (dens[(kmit + 4) * nrd + i]! / scal[icom[i]!]!) ** 2;
      errint = Math.sqrt(errint / nrd) * this.errfac[kmit]!;
      this.hoptde = h / Math.max(errint ** (1 / (kmit + 4)), 0.01);
      if (errint > 10) {
        this.h = this.hoptde;
        this.x = this.xOld;
        ++this.nReject;
        this.reject = true;
        return true;
      }
    }
    for (let i = 1; i <= n; ++i) dz[i] = yh2[i]!;
    for (let i = 1; i <= n; ++i) y[i] = t[sn + i]!;
    ++this.nAccept;
    if (solOut(this.nAccept + 1, this.xOld, this.x, this.yView, this.denseFn) === false) return false;
    // compute optimal order
    const km = this.km;
    const w = this.w;
    let kopt: number;
    if (kc === 2) {
      kopt = Math.min(3, km - 1);
      if (this.reject) kopt = 2;
    } else if (kc <= this.k) {
      kopt = kc;
      if (w[kc - 1]! < w[kc]! * FAC3) kopt = kc - 1;
      if (w[kc]! < w[kc - 1]! * FAC4) kopt = Math.min(kc + 1, km - 1);
    } else {
      kopt = kc - 1;
      if (kc > 3 && w[kc - 2]! < w[kc - 1]! * FAC3) kopt = kc - 2;
      if (w[kc]! < w[kopt]! * FAC4) kopt = Math.min(kc, km - 1);
    }
    // after a rejected step
    if (this.reject) {
      this.k = Math.min(kopt, kc);
      this.h = this.posneg * Math.min(Math.abs(this.h), Math.abs(this.hh[this.k]!));
      this.reject = false;
      return true;
    }
    let hNew: number;
    if (kopt <= kc) hNew = this.hh[kopt]!;
    else if (kc < this.k && w[kc]! < w[kc - 1]! * FAC4) hNew = (this.hh[kc]! * this.a[kopt + 1]!) / this.a[kc]!;
    else hNew = (this.hh[kc]! * this.a[kopt]!) / this.a[kc]!;
    // compute stepsize for next step
    this.k = kopt;
    this.h = this.posneg * Math.abs(hNew);
    return true;
  }

  /** Coefficients of the interpolation formula in `dens` (odex's interp). */
  private interp(imit: number): void {
    const n = this.nrd;
    const y = this.dens;
    const a = this.interpA;
    // begin with Hermite interpolation
    for (let i = 1; i <= n; ++i) {
      const y0 = y[i]!;
      const y1 = y[2 * n + i]!;
      const yp0 = y[n + i]!;
      const yp1 = y[3 * n + i]!;
      const yDiff = y1 - y0;
      const aspl = -yp1 + yDiff;
      const bspl = yp0 - yDiff;
      y[n + i] = yDiff;
      y[2 * n + i] = aspl;
      y[3 * n + i] = bspl;
      if (imit < 0) continue;
      // compute the derivatives of Hermite at midpoint
      const ph0 = (y0 + y1) * 0.5 + 0.125 * (aspl + bspl);
      const ph1 = yDiff + (aspl - bspl) * 0.25;
      const ph2 = -(yp0 - yp1);
      const ph3 = 6 * (bspl - aspl);
      // compute the further coefficients
      if (imit >= 1) {
        a[1] = 16 * (y[5 * n + i]! - ph1);
        if (imit >= 3) {
          a[3] = 16 * (y[7 * n + i]! - ph3 + 3 * a[1]!);
          for (let im = 5; im <= imit; im += 2) {
            const fac1 = (im * (im - 1)) / 2;
            const fac2 = fac1 * (im - 2) * (im - 3) * 2;
            a[im] = 16 * (y[(im + 4) * n + i]! + fac1 * a[im - 2]! - fac2 * a[im - 4]!);
          }
        }
      }
      a[0] = (y[4 * n + i]! - ph0) * 16;
      if (imit >= 2) {
        a[2] = (y[n * 6 + i]! - ph2 + a[0]!) * 16;
        for (let im = 4; im <= imit; im += 2) {
          const fac1 = (im * (im - 1)) / 2;
          const fac2 = im * (im - 1) * (im - 2) * (im - 3);
          a[im] = (y[n * (im + 4) + i]! + a[im - 2]! * fac1 - a[im - 4]! * fac2) * 16;
        }
      }
      for (let im = 0; im <= imit; ++im) y[n * (im + 4) + i] = a[im]!;
    }
  }

  /** Dense output of the current step for component `c` (0-based) at `xx` (odex's contex). */
  private dense(c: number, xx: number): number {
    const i = c >= 0 && c < this.n ? this.slot[c]! : 0;
    if (i === 0) throw new Error('no dense output available for component ' + c);
    const y = this.dens;
    const nrd = this.nrd;
    const imit = this.kmit;
    const theta = (xx - this.xOldd) / this.hhh;
    const theta1 = 1 - theta;
    const phthet = y[i]! + theta * (y[nrd + i]! + theta1 * (y[2 * nrd + i]! * theta + y[3 * nrd + i]! * theta1));
    if (imit < 0) return phthet;
    const thetah = theta - 0.5;
    let ret = y[nrd * (imit + 4) + i]!;
    for (let im = imit; im >= 1; --im) ret = y[nrd * (im + 3) + i]! + (ret * thetah) / im;
    const tt = theta * theta1;
    return phthet + tt * tt * ret;
  }
}
