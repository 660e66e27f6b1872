/**
 * Drag and lift coefficients of a football (DESIGN §6). Published values disagree, so the model is a
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
 * The paper's two fits are piecewise (the spinning fit replaces the non-spinning one above 12.19 m/s
 * and S > 0.05), which makes C_D jump at the crisis. An integrator that must hit 1 mm, and a carry that
 * must vary smoothly with launch speed for the inverse, need a continuous right-hand side, so we blend
 * with the crisis sigmoid σ(Re): C_D = σ·0.501 + (1 − σ)·max(0.155, 0.4127 S^0.3056). With no spin this
 * is exactly the non-spinning fit; well above the crisis (σ < 1 % beyond ~18 m/s) it is the spinning fit
 * for S > 0.05; between 0.041 < S < 0.05 it differs from the piecewise rule by at most 0.01.
 */
export function goffCarreCd(reynolds: number, spinParameter: number): number {
  const arg = (reynolds - GOFF_CARRE_RE_CENTRE) / GOFF_CARRE_RE_WIDTH;
  // exp(36) > 4e15: σ below 3e-16, exactly negligible; skipping it saves an exp per evaluation.
  const sigma = arg > 36 ? 0 : 1 / (1 + Math.exp(arg));
  let supercritical = GC_CD_SUPERCRITICAL;
  if (spinParameter > 0) {
    const spinCd = GC_SPIN_COEFF * Math.pow(spinParameter, GC_SPIN_EXPONENT);
    if (spinCd > supercritical) supercritical = spinCd;
  }
  return sigma * GOFF_CARRE_CD_SUBCRITICAL + (1 - sigma) * supercritical;
}

// Carré et al. 2002 (Sports Engineering 5:193) wind-tunnel data, power fit C_L = 0.385 S^0.25.
const POWER_LIFT_COEFF = 0.385;

/** Lift coefficient, power fit C_L = 0.385 S^0.25 to the wind-tunnel data of Carré et al. 2002. */
export function powerLiftCl(spinParameter: number): number {
  return POWER_LIFT_COEFF * Math.sqrt(Math.sqrt(spinParameter));
}

/** Lift coefficient, saturating form C_L = S / (1 + 2S): the alternative when the power fit overshoots at high S. */
export function saturatingLiftCl(spinParameter: number): number {
  return spinParameter / (1 + 2 * spinParameter);
}
