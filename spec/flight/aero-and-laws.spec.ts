import {
  BALL_SIZES,
  DEFAULT_ELEVATION_DEG,
  GOAL_HEIGHT_M,
  GOAL_WIDTH_M,
  GOFF_CARRE_RE_CENTRE,
  goffCarreCd,
  goffCarreNoSpinCd,
  goffCarreSpinCd,
  powerLiftCl,
  saturatingLiftCl,
  SIDESPIN_STEP_RPS,
  SPIN_STEP_RPS,
  WALL_DISTANCE_M,
} from '../../shared/flight';
import { ISA_SEA_LEVEL_KINEMATIC_VISCOSITY_M2S } from '../../shared/flight/atmosphere';

describe('aerodynamic coefficients', () => {
  const handValues: [number, number][] = [
    // Goff & Carré 2010 (Eur. J. Phys. 31:775) non-spinning fit C_D = 0.155 + 0.346/(1 + exp((v − 12.19)/1.309)), evaluated on a calculator.
    [5, 0.499582],
    [12.19, 0.328],
    [15, 0.191206],
    [20, 0.155885],
    [30, 0.155],
  ];
  for (const [v, cd] of handValues) {
    it(`reproduces the Goff & Carré non-spinning fit at ${v} m/s`, () => {
      // Goff & Carré 2010 non-spinning fit, calculator value in the table above.
      expect(Math.abs(goffCarreNoSpinCd(v) - cd)).toBeLessThan(1e-6);
      // The Reynolds-number form equals the published fit at its reference conditions (size-5 ball, ISA sea level).
      const re = (v * 2 * BALL_SIZES[5].radiusM) / ISA_SEA_LEVEL_KINEMATIC_VISCOSITY_M2S;
      expect(Math.abs(goffCarreCd(re, 0) - goffCarreNoSpinCd(v))).toBeLessThan(1e-12);
    });
  }

  it('puts the crisis at a Reynolds number consistent with football wind-tunnel data', () => {
    // Asai et al. 2007 (Sports Engineering 10:101): critical Re of footballs 2.2–3.0e5; the fit's drop is centred just below.
    expect(GOFF_CARRE_RE_CENTRE).toBeGreaterThan(1.6e5);
    // Same source: the centre lies below the 2.2e5 lower end.
    expect(GOFF_CARRE_RE_CENTRE).toBeLessThan(2.2e5);
    // …and 90 % of the drop from 0.501 to 0.155 is done by Re = 2.3e5.
    expect(goffCarreCd(2.3e5, 0)).toBeLessThan(0.155 + 0.1 * 0.346);
  });

  it('follows the Goff & Carré spinning fit above the crisis', () => {
    // Goff & Carré 2010 spinning fit C_D = 0.4127 S^0.3056, on a calculator: S = 0.2 → 0.252365, S = 0.5 → 0.333918.
    expect(Math.abs(goffCarreSpinCd(0.2) - 0.252365)).toBeLessThan(1e-6);
    // Same source and calculator, S = 0.5.
    expect(Math.abs(goffCarreSpinCd(0.5) - 0.333918)).toBeLessThan(1e-6);
    // Same source: well above the crisis (30 m/s) the blended C_D is the spinning fit for S = 0.2 …
    const supercritical = (30 * 2 * BALL_SIZES[5].radiusM) / ISA_SEA_LEVEL_KINEMATIC_VISCOSITY_M2S;
    expect(Math.abs(goffCarreCd(supercritical, 0.2) - goffCarreSpinCd(0.2))).toBeLessThan(1e-4);
    // … and the supercritical plateau 0.155 of the non-spinning fit for S = 0.02 (below the fit's S > 0.05 range).
    expect(Math.abs(goffCarreCd(supercritical, 0.02) - 0.155)).toBeLessThan(1e-4);
  });

  it('gives the lift fits', () => {
    // Power fit to Carré et al. 2002 (Sports Engineering 5:193) data, C_L = 0.385 S^0.25, on a calculator at S = 0.2: 0.257465.
    expect(Math.abs(powerLiftCl(0.2) - 0.257465)).toBeLessThan(1e-6);
    // Saturating form C_L = S/(1 + 2S), by hand at S = 0.2: 1/7.
    expect(saturatingLiftCl(0.2)).toBeCloseTo(1 / 7, 12);
  });
});

describe('Laws of the Game and product scales', () => {
  it('uses Law 2 ranges for a size-5 ball', () => {
    // IFAB Laws of the Game, Law 2: circumference 68–70 cm, mass 410–450 g.
    expect(BALL_SIZES[5].circumferenceRangeM).toEqual([0.68, 0.7]);
    // IFAB Laws of the Game, Law 2: mass 410–450 g.
    expect(BALL_SIZES[5].massRangeKg).toEqual([0.41, 0.45]);
    // Default radius from the midpoint circumference, r = C/2π.
    expect(BALL_SIZES[5].radiusM).toBeCloseTo(0.69 / (2 * Math.PI), 12);
  });

  it('uses common-practice ranges for sizes 3 and 4', () => {
    // Common practice (no standard): size 4 63.5–66 cm, 350–390 g; size 3 58.5–61 cm, 300–320 g.
    expect(BALL_SIZES[4].circumferenceRangeM).toEqual([0.635, 0.66]);
    expect(BALL_SIZES[4].massRangeKg).toEqual([0.35, 0.39]);
    expect(BALL_SIZES[3].circumferenceRangeM).toEqual([0.585, 0.61]);
    expect(BALL_SIZES[3].massRangeKg).toEqual([0.3, 0.32]);
  });

  it('uses the Law 1 goal and the Law 13 wall distance', () => {
    // IFAB Laws of the Game, Law 1: 7.32 m between the posts, 2.44 m to the crossbar.
    expect(GOAL_WIDTH_M).toBe(7.32);
    // IFAB Laws of the Game, Law 1: 2.44 m from the lower edge of the crossbar to the ground.
    expect(GOAL_HEIGHT_M).toBe(2.44);
    // IFAB Laws of the Game, Law 13: opponents at least 9.15 m from the ball.
    expect(WALL_DISTANCE_M).toBe(9.15);
  });

  it('maps spin steps and techniques to the product defaults', () => {
    // Product defaults (common practice), within measured free-kick spins of 8–17 rev/s (Barber & Carré 2010, Sports Engineering 13:47).
    expect([-3, -2, -1, 0, 1, 2, 3].map((s) => SPIN_STEP_RPS[s as -3])).toEqual([-10, -6, -3, 0, 3, 6, 10]);
    // Product defaults (common practice).
    expect([-2, -1, 0, 1, 2].map((s) => SIDESPIN_STEP_RPS[s as -2])).toEqual([-8, -4, 0, 4, 8]);
    // Common coaching practice (no source).
    expect(DEFAULT_ELEVATION_DEG).toEqual({ driven: 12, curled: 18, lofted: 32, chipped: 48 });
  });
});
