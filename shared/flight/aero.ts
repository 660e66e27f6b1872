/**
 * Drag and lift coefficients of a football. Published values disagree, so the model is a
 * setting; these are the defaults with their sources.
 */

import { ISA_SEA_LEVEL_KINEMATIC_VISCOSITY_M2S } from './atmosphere';
import { BALL_SIZES } from './constants';

// Goff & Carré 2010 (European Journal of Physics 31:775), non-spinning fit
// C_D(v) = 0.155 + 0.346 / (1 + exp((v − 12.19)/1.309)).
const GC_CD_SUPERCRITICAL = 0.155;
const GC_CD_DROP = 0.346;
const GC_CRISIS_SPEED_MS = 12.19;
const GC_CRISIS_WIDTH_MS = 1.309;
// Goff & Carré 2010, spinning fit for S > 0.05 above the crisis: C_D = 0.4127 S^0.3056.
const GC_SPIN_COEFF = 0.4127;
const GC_SPIN_EXPONENT = 0.3056;
// Smooth hand-over to the spinning fit around the paper's threshold S = 0.05 (our choice, see goffCarreCd).
const SPIN_BLEND_CENTRE = 0.045;
const SPIN_BLEND_WIDTH = 0.005;

/** Subcritical drag coefficient of the Goff & Carré fit (its plateau below the crisis), 0.501. */
export const GOFF_CARRE_CD_SUBCRITICAL = GC_CD_SUPERCRITICAL + GC_CD_DROP;

/**
 * Reynolds-number scale of the fit. The fit is in speed; to let density, temperature and ball size move
 * the crisis we read it at its reference conditions — a size-5 ball of 0.69 m circumference in ISA
 * sea-level air (our assumption about the tunnel) — so Re = v·d/ν. The centre then falls at
 * Re ≈ 1.83 × 10⁵ and the drop is ~90 % complete by Re ≈ 2.2 × 10⁵, the low end of the critical range
 * 2.2–3.0 × 10⁵ reported for footballs (Asai et al. 2007, Sports Engineering 10:101).
 */
const GC_REFERENCE_RE_PER_MS = (2 * BALL_SIZES[5].radiusM) / ISA_SEA_LEVEL_KINEMATIC_VISCOSITY_M2S;

/** Reynolds number at the centre of the drag crisis of the Goff & Carré fit. */
export const GOFF_CARRE_RE_CENTRE = GC_CRISIS_SPEED_MS * GC_REFERENCE_RE_PER_MS;

/** Width (1/slope) of the crisis sigmoid in Reynolds number. */
export const GOFF_CARRE_RE_WIDTH = GC_CRISIS_WIDTH_MS * GC_REFERENCE_RE_PER_MS;

/**
 * The published non-spinning fit of Goff & Carré 2010 in speed, at its reference conditions. Kept as
 * the literal formula so tests and calibration screens can compare against the paper.
 */
export function goffCarreNoSpinCd(speedMs: number): number {
  return GC_CD_SUPERCRITICAL + GC_CD_DROP / (1 + Math.exp((speedMs - GC_CRISIS_SPEED_MS) / GC_CRISIS_WIDTH_MS));
}

/** The published spinning fit of Goff & Carré 2010, C_D = 0.4127 S^0.3056 (valid for S > 0.05, v above the crisis). */
export function goffCarreSpinCd(spinParameter: number): number {
  return GC_SPIN_COEFF * Math.pow(spinParameter, GC_SPIN_EXPONENT);
}

/**
 * Drag coefficient from Reynolds number and spin parameter S = r|ω|/|u| (Goff & Carré 2010 fits).
 *
 * The paper's two fits are piecewise: the spinning fit replaces the non-spinning one above 12.19 m/s
 * and for S > 0.05. Taken literally C_D jumps at the crisis and has corners near S = 0.05; an
 * extrapolation integrator that must hit 1 mm, and an inverse that needs carry to vary smoothly with
 * launch speed, both need a smooth right-hand side. So we blend smoothly:
 *
 *   C_D = σ(Re)·0.501 + (1 − σ(Re))·C_sup(S),   C_sup = 0.155 + w(S)·(0.4127 S^0.3056 − 0.155),
 *
 * with σ the crisis sigmoid of the non-spinning fit and w = ½(1 + tanh((S − 0.045)/0.005)). With no
 * spin this is exactly the non-spinning fit; well above the crisis (σ < 1 % beyond ~18 m/s) it is within
 * 1e-4 of the spinning fit for S ≥ 0.06 and of 0.155 for S ≤ 0.03, and within 0.005 of the piecewise
 * rule in between.
 */
export function goffCarreCd(reynolds: number, spinParameter: number): number {
  const arg = (reynolds - GOFF_CARRE_RE_CENTRE) / GOFF_CARRE_RE_WIDTH;
  // exp(36) > 4e15: σ below 3e-16, exactly negligible; skipping it saves an exp per evaluation.
  const sigma = arg > 36 ? 0 : 1 / (1 + Math.exp(arg));
  let supercritical = GC_CD_SUPERCRITICAL;
  if (spinParameter > 0) {
    const x = (spinParameter - SPIN_BLEND_CENTRE) / SPIN_BLEND_WIDTH;
    // tanh written as a logistic; beyond |x| = 12 the weight is 0 or 1 to 4e-11.
    const w = x > 12 ? 1 : x < -12 ? 0 : 1 / (1 + Math.exp(-2 * x));
    if (w > 0) {
      // exp(p·ln S) rather than Math.pow: identical to rounding and about twice as fast in V8.
      const spinCd = GC_SPIN_COEFF * Math.exp(GC_SPIN_EXPONENT * Math.log(spinParameter));
      supercritical += w * (spinCd - GC_CD_SUPERCRITICAL);
    }
  }
  return sigma * GOFF_CARRE_CD_SUBCRITICAL + (1 - sigma) * supercritical;
}

// Carré et al. 2002 (Sports Engineering 5:193) wind-tunnel data, power fit C_L = 0.385 S^0.25.
const POWER_LIFT_COEFF = 0.385;

/**
 * Spin parameter around which the default lift law hands over from its linear start to the power fit.
 * Below it the power fit has no data behind it (its S^0.25 gives C_L ≈ 0.09 at S = 0.003, a turn every
 * ten seconds on a 25 m/s ball) and breaks symmetry: lift must vanish with spin.
 */
export const LIFT_ONSET_S = 0.07;

/**
 * Slope dC_L/dS of the default law at S = 0, 0.385 / 0.07^0.75 ≈ 2.83. Close to the mean slope of the
 * measured curve between S = 0 and 0.1 (C_L ≈ 0.2 at S ≈ 0.1: Carré et al. 2002; Asai et al. 2007,
 * Sports Engineering 10:101) and of the order of the small-S baseball law C_L = 1.5 S (Sawicki, Hubbard &
 * Stronge 2003, Am. J. Phys. 71:1152, from memory).
 */
export const LIFT_ONSET_SLOPE = POWER_LIFT_COEFF / Math.pow(LIFT_ONSET_S, 0.75);

const LIFT_ONSET_S4 = LIFT_ONSET_S ** 4;

/** Lift coefficient, power fit C_L = 0.385 S^0.25 to the wind-tunnel data of Carré et al. 2002. */
export function powerLiftCl(spinParameter: number): number {
  return POWER_LIFT_COEFF * Math.sqrt(Math.sqrt(spinParameter));
}

/**
 * Default lift law: linear through zero at small spin, the measured curve above S ≈ 0.1.
 *
 *   C_L(S) = 0.385 S / (S⁴ + S₀⁴)^(3/16),   S₀ = 0.07.
 *
 * For S ≫ S₀ this is the power fit 0.385 S^0.25 to the wind-tunnel data of Carré et al. 2002 (Sports
 * Engineering 5:193), which gives C_L ≈ 0.2–0.3 over S ≈ 0.1–0.3 as those data, the tunnel data of Asai
 * et al. 2007 (Sports Engineering 10:101) and the trajectory analysis of Goff & Carré 2010 (Eur. J. Phys.
 * 31:775) do; within 4 % of it at S = 0.1 and 1 % from S = 0.15. For S ≪ S₀ it is 2.83 S: zero lift
 * without spin (symmetry), and lift proportional to spin where the flow hardly feels it. The quartic
 * blend is our choice: smooth (an extrapolating integrator needs a smooth right-hand side), monotone,
 * and evaluated with four square roots (no exp or log in the hot path).
 */
export function onsetLiftCl(spinParameter: number): number {
  if (spinParameter <= 0) return 0;
  const s2 = spinParameter * spinParameter;
  // (S⁴ + S₀⁴)^(1/16) by four square roots, then cubed.
  const q = Math.sqrt(Math.sqrt(Math.sqrt(Math.sqrt(s2 * s2 + LIFT_ONSET_S4))));
  return (POWER_LIFT_COEFF * spinParameter) / (q * q * q);
}

/** Lift coefficient, saturating form C_L = S / (1 + 2S): the alternative when the power fit overshoots at high S. */
export function saturatingLiftCl(spinParameter: number): number {
  return spinParameter / (1 + 2 * spinParameter);
}
