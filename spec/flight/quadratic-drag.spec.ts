import { simulateKick, STANDARD_GRAVITY_MS2 } from '../../shared/flight';

describe('vertical launch with quadratic drag, constant C_D, no spin', () => {
  const g = STANDARD_GRAVITY_MS2;
  const massKg = 0.43;
  const radiusM = 0.11;
  const densityKgM3 = 1.2;
  const cd = 0.25;
  // m dv/dt = −mg − ½ρAC_D v|v|, so k = ρAC_D/(2m) and the terminal speed is v_t = √(g/k).
  const k = (densityKgM3 * Math.PI * radiusM * radiusM * cd) / (2 * massKg);
  const vt = Math.sqrt(g / k);

  for (const v0 of [12, 25, 34]) {
    it(`matches the closed-form rise and fall for v0 = ${v0} m/s`, () => {
      const f = simulateKick({
        speed: v0,
        elevationDeg: 90,
        ball: { massKg, radiusM },
        air: { densityKgM3 },
        aero: { drag: { constant: cd } },
      });
      // J. R. Taylor, Classical Mechanics (2005), §2.4, quadratic drag, vertical motion (from memory): rise time t_up = (v_t/g) arctan(v0/v_t).
      const riseS = (vt / g) * Math.atan(v0 / vt);
      // Same source: apex height H = (v_t²/2g) ln(1 + v0²/v_t²).
      const apexM = ((vt * vt) / (2 * g)) * Math.log(1 + (v0 * v0) / (vt * vt));
      // Same source: fall from rest through H takes (v_t/g) arccosh(exp(gH/v_t²)).
      const fallS = (vt / g) * Math.acosh(Math.exp((g * apexM) / (vt * vt)));
      // Same source: speed after falling H from rest is v_t √(1 − exp(−2gH/v_t²)).
      const landingMs = vt * Math.sqrt(1 - Math.exp((-2 * g * apexM) / (vt * vt)));
      // Taylor §2.4 rise time. The apex time is the root of the dense-output vz, which the default
      // tolerances (tuned for 1 mm of carry) resolve to ~1e-4 s; the apex height is insensitive to it.
      expect(Math.abs(f.apexTimeS - riseS)).toBeLessThan(2e-4);
      // Taylor §2.4 apex height.
      expect(Math.abs(f.apexM - apexM)).toBeLessThan(1e-3);
      // Taylor §2.4 rise plus fall time.
      expect(Math.abs(f.flightTimeS - (riseS + fallS))).toBeLessThan(1e-5);
      // Taylor §2.4 speed after the fall.
      expect(Math.abs(f.landingSpeedMs - landingMs)).toBeLessThan(1e-4);
    });
  }
});
