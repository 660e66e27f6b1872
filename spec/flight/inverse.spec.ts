import { simulateKick, solveLaunchSpeed, type KickInput } from '../../shared/flight';

describe('solveLaunchSpeed (Brent on the forward model)', () => {
  const kicks: KickInput[] = [
    { speed: 24, elevationDeg: 32, backspinRps: 6 },
    { speed: 29, elevationDeg: 12, backspinRps: 3, sidespinRps: -4, wind: { speedMs: 4, fromDeg: 10 } },
    { speed: 16, elevationDeg: 48, backspinRps: 10, air: { altitudeM: 1200 } },
    { speed: 33, elevationDeg: 20, backspinRps: -3, sidespinRps: 8, wind: { speedMs: 6, fromDeg: 160 } },
    { speed: 11, elevationDeg: 40 },
  ];
  for (const kick of kicks) {
    it(`round-trips simulateKick to 1 mm (${kick.speed} m/s at ${kick.elevationDeg}°)`, () => {
      const { speed, ...rest } = kick;
      const carryM = simulateKick(kick).carryM;
      const solved = solveLaunchSpeed({ ...rest, carryM });
      expect(solved).not.toBeNull();
      // The round trip is the requirement itself: the solved speed must reproduce the carry to 1 mm.
      expect(Math.abs(simulateKick({ ...kick, speed: solved! }).carryM - carryM)).toBeLessThan(1e-3);
      expect(Math.abs(solved! - speed)).toBeLessThan(1e-3);
    });
  }

  it('returns null when no launch speed up to 60 m/s reaches the carry', () => {
    expect(solveLaunchSpeed({ carryM: 400, elevationDeg: 30 })).toBeNull();
  });
});
