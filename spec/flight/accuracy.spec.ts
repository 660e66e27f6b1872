import { PATH_SAMPLE_INTERVAL_S, simulateKick, TIGHT_SOLVER_SETTINGS, type KickInput } from '../../shared/flight';
import { SeededRandom } from '../../shared/flight/random';

function randomKicks(n: number, seed: number): KickInput[] {
  const rng = new SeededRandom(seed);
  const u = (lo: number, hi: number): number => lo + (hi - lo) * rng.uniform();
  // Wind of every kind: uniform (no height), a weather service's (10 m) and a coach's (head height), so the
  // logarithmic profile and its steep part near the grass are on the tested path.
  const heights = [undefined, 10, 1.8];
  return Array.from({ length: n }, (_, i) => ({
    speed: u(12, 36),
    elevationDeg: u(4, 55),
    azimuthDeg: u(-10, 10),
    backspinRps: u(-10, 10),
    sidespinRps: u(-8, 8),
    air: { altitudeM: u(0, 2500), temperatureC: u(-5, 35) },
    wind: { speedMs: u(0, 9), fromDeg: u(0, 360), referenceHeightM: heights[i % 3] },
  }));
}

describe('numerical accuracy at default tolerances', () => {
  it('keeps carry within 1 mm of a 1e-12 solution over 300 varied kicks', () => {
    let worst = 0;
    for (const kick of randomKicks(300, 2024)) {
      const a = simulateKick(kick);
      const b = simulateKick(kick, TIGHT_SOLVER_SETTINGS);
      worst = Math.max(worst, Math.abs(a.carryM - b.carryM));
    }
    // Requirement of the flight model (common practice for a coaching tool: carries are paced to ~0.5 m, so 1 mm is ample).
    expect(worst).toBeLessThan(1e-3);
  });

  it('reports plane crossings only for planes reached before landing, at the plane', () => {
    const f = simulateKick({ speed: 25, elevationDeg: 25, backspinRps: 5, planes: [9.15, 20, 500] });
    expect(f.crossings.map((c) => Math.round(c.x * 1e6) / 1e6)).toEqual([9.15, 20]);
    expect(f.crossings[0]!.t).toBeLessThan(f.crossings[1]!.t);
    expect(f.crossings[1]!.t).toBeLessThan(f.flightTimeS);
  });

  it('samples the path every 20 ms only when asked', () => {
    const kick = { speed: 22, elevationDeg: 30, backspinRps: 6 };
    expect(simulateKick(kick).path).toEqual([]);
    const f = simulateKick({ ...kick, path: true });
    const path = f.path;
    expect(path[0]).toEqual({ t: 0, x: 0, y: 0, z: 0 });
    for (let i = 1; i < path.length - 1; i++) expect(Math.abs(path[i]!.t - i * PATH_SAMPLE_INTERVAL_S)).toBeLessThan(1e-12);
    const last = path[path.length - 1]!;
    expect(last.t).toBe(f.flightTimeS);
    expect(last.z).toBe(0);
  });

  it('flags a kick that never comes down within the time cap', () => {
    // No drag and a constant lift coefficient of 1.5 with backspin: the Magnus force does no work and the
    // ball loops along like a charge in a magnetic field, never returning to the ground (synthetic setting).
    const f = simulateKick({
      speed: 20,
      elevationDeg: 2,
      backspinRps: 10,
      aero: { lift: { constant: 1.5 }, drag: { constant: 0 } },
    });
    expect(f.landed).toBeFalse();
    expect(f.flightTimeS).toBe(30);
    expect(Number.isFinite(f.carryM)).toBeTrue();
  });

  it('treats a launch with no upward velocity as no flight at all', () => {
    const f = simulateKick({ speed: 20, elevationDeg: -5 });
    expect(f.landed).toBeTrue();
    expect(f.carryM).toBe(0);
    expect(f.flightTimeS).toBe(0);
    expect(f.landingSpeedMs).toBeCloseTo(20, 12);
  });
});
