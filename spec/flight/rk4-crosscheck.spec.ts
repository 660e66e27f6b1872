import { simulateKick, type KickInput } from '../../shared/flight';
import { modelFromKick } from '../../shared/flight/model';
import { rk4Reference } from './support/rk4-reference';

// Kicks with drag (Goff & Carré fits), Magnus lift, spin decay and wind all on.
const kicks: KickInput[] = [
  { speed: 26, elevationDeg: 28, backspinRps: 6, sidespinRps: 4, wind: { speedMs: 5, fromDeg: 30 } },
  { speed: 31, elevationDeg: 14, backspinRps: -6, sidespinRps: -8, wind: { speedMs: 7, fromDeg: 200 } },
  { speed: 18, elevationDeg: 50, backspinRps: 10, wind: { speedMs: 3, fromDeg: 90 }, air: { altitudeM: 1500 } },
  {
    speed: 34,
    elevationDeg: 22,
    azimuthDeg: -6,
    backspinRps: 3,
    sidespinRps: 8,
    wind: { speedMs: 8, fromDeg: 0 },
    aero: { lift: 'saturating' },
  },
  {
    speed: 23,
    elevationDeg: 35,
    azimuthDeg: 4,
    backspinRps: 1.2,
    sidespinRps: -0.4,
    wind: { speedMs: 2, fromDeg: 300 },
    air: { temperatureC: 28, relativeHumidityPct: 80 },
  },
];

describe('odex path against an independent fixed-step RK4 (h = 1 ms)', () => {
  for (const [i, kick] of kicks.entries()) {
    it(`agrees to 1 mm in carry, path and plane crossing for kick ${i}`, () => {
      const f = simulateKick({ ...kick, path: true, planes: [9.15] });
      // Reference: classical RK4 at a 1 ms step (Hairer, Nørsett & Wanner, Solving ODEs I, §II.1), global error ~1e-10 m here.
      const ref = rk4Reference(modelFromKick(kick), 1e-3, 0.02, 9.15);
      expect(Math.abs(f.carryM - ref.carryM)).toBeLessThan(1e-3);
      expect(Math.abs(f.landing.x - ref.landingX)).toBeLessThan(1e-3);
      expect(Math.abs(f.landing.y - ref.landingY)).toBeLessThan(1e-3);
      expect(Math.abs(f.flightTimeS - ref.flightTimeS)).toBeLessThan(1e-4);
      // Path samples every 20 ms are dense-output values; compare each with the RK4 state at the same time.
      const n = Math.min(ref.samples.length, f.path.length - 1);
      expect(n).toBeGreaterThan(10);
      for (let j = 0; j < n; j++) {
        const p = f.path[j]!;
        const r = ref.samples[j]!;
        expect(Math.abs(p.t - r.t)).toBeLessThan(1e-12);
        expect(Math.hypot(p.x - r.x, p.y - r.y, p.z - r.z)).toBeLessThan(1e-3);
      }
      expect(f.crossings.length).toBe(1);
      expect(ref.crossing).not.toBeNull();
      expect(Math.abs(f.crossings[0]!.z - ref.crossing!.z)).toBeLessThan(1e-3);
      expect(Math.abs(f.crossings[0]!.y - ref.crossing!.y)).toBeLessThan(1e-3);
      expect(Math.abs(f.crossings[0]!.t - ref.crossing!.t)).toBeLessThan(1e-4);
    });
  }
});
