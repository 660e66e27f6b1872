import { simulateKick, STANDARD_GRAVITY_MS2 } from '../../shared/flight';

const g = STANDARD_GRAVITY_MS2;
const DEG = Math.PI / 180;
const vacuum = { aero: { drag: { constant: 0 }, lift: { constant: 0 } } } as const;

describe('flight in a vacuum (drag 0, lift 0)', () => {
  const launches = [
    { speed: 20, elevationDeg: 45 },
    { speed: 27, elevationDeg: 12 },
    { speed: 15, elevationDeg: 70 },
    { speed: 31, elevationDeg: 30, backspinRps: 10, sidespinRps: -8 },
  ];

  for (const launch of launches) {
    it(`matches the projectile formulas at ${launch.speed} m/s, ${launch.elevationDeg}°`, () => {
      const f = simulateKick({ ...launch, ...vacuum });
      const th = launch.elevationDeg * DEG;
      const v = launch.speed;
      // Closed-form projectile motion without air (Halliday, Resnick & Walker, Fundamentals of Physics, ch. 4): R = v² sin 2θ / g.
      expect(Math.abs(f.carryM - (v * v * Math.sin(2 * th)) / g)).toBeLessThan(1e-4);
      // Same source: time of flight T = 2 v sin θ / g.
      expect(Math.abs(f.flightTimeS - (2 * v * Math.sin(th)) / g)).toBeLessThan(1e-6);
      // Same source: maximum height H = v² sin² θ / (2g).
      expect(Math.abs(f.apexM - (v * v * Math.sin(th) ** 2) / (2 * g))).toBeLessThan(1e-4);
      // Same source: the apex is at half the range, R/2.
      expect(Math.abs(f.apexXM - (v * v * Math.sin(2 * th)) / (2 * g))).toBeLessThan(1e-4);
      // Same source: energy conservation, the ball lands at its launch speed.
      expect(Math.abs(f.landingSpeedMs - v)).toBeLessThan(1e-5);
      // Same source: no lateral force, so no lateral drift.
      expect(Math.abs(f.landing.y)).toBeLessThan(1e-9);
    });
  }
});
