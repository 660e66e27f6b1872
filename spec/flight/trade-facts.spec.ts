import { simulateKick, type KickInput } from '../../shared/flight';

// Trade facts of kicking a ball (common practice, no source): what any coach expects the model to do.
describe('trade facts', () => {
  const base: KickInput = { speed: 25, elevationDeg: 25 };

  it('keeps a ball with backspin in the air longer and carries it further than one without spin', () => {
    const none = simulateKick(base);
    const back = simulateKick({ ...base, backspinRps: 6 });
    // Common practice (no source): backspin holds the ball up.
    expect(back.flightTimeS).toBeGreaterThan(none.flightTimeS);
    expect(back.carryM).toBeGreaterThan(none.carryM);
    expect(back.apexM).toBeGreaterThan(none.apexM);
  });

  it('brings a ball with topspin down sooner and shorter', () => {
    const none = simulateKick(base);
    const top = simulateKick({ ...base, backspinRps: -6 });
    // Common practice (no source): topspin makes the ball dip.
    expect(top.flightTimeS).toBeLessThan(none.flightTimeS);
    expect(top.carryM).toBeLessThan(none.carryM);
  });

  it('curls a ball with positive sidespin to the left, and mirrors negative sidespin exactly', () => {
    const left = simulateKick({ ...base, sidespinRps: 6, backspinRps: 3 });
    const right = simulateKick({ ...base, sidespinRps: -6, backspinRps: 3 });
    // Common practice (no source): spin about +z curls to the kicker's left; the model is symmetric in y.
    expect(left.landing.y).toBeGreaterThan(0.5);
    expect(right.landing.y).toBe(-left.landing.y);
    expect(right.landing.x).toBe(left.landing.x);
    expect(right.carryM).toBe(left.carryM);
    expect(right.flightTimeS).toBe(left.flightTimeS);
  });

  it('mirrors a kick launched to the right with opposite sidespin exactly', () => {
    const a = simulateKick({ ...base, azimuthDeg: 7, sidespinRps: 4, wind: { speedMs: 3, fromDeg: 60 } });
    const b = simulateKick({ ...base, azimuthDeg: -7, sidespinRps: -4, wind: { speedMs: 3, fromDeg: -60 } });
    // Common practice (no source): the mirror image of a kick is a kick.
    expect(b.landing.y).toBeCloseTo(-a.landing.y, 12);
    expect(b.carryM).toBeCloseTo(a.carryM, 12);
  });

  for (const kick of [base, { speed: 26, elevationDeg: 35, backspinRps: 6 }]) {
    it(`shortens carry into a headwind and lengthens it with a tailwind (${kick.speed} m/s, ${kick.elevationDeg}°)`, () => {
      const still = simulateKick(kick);
      const head = simulateKick({ ...kick, wind: { speedMs: 5, fromDeg: 0 } });
      const tail = simulateKick({ ...kick, wind: { speedMs: 5, fromDeg: 180 } });
      // Common practice (no source), for a no-spin kick and a lofted pass with backspin. (For low, driven
      // balls with backspin the model predicts a tailwind can cost carry, because it takes away lift.)
      expect(head.carryM).toBeLessThan(still.carryM - 1);
      expect(tail.carryM).toBeGreaterThan(still.carryM + 1);
    });
  }

  it('drifts a ball with the crosswind', () => {
    const f = simulateKick({ ...base, wind: { speedMs: 5, fromDeg: 90 } });
    // Common practice (no source): wind from the left (90°) pushes the ball to the right (−y).
    expect(f.landing.y).toBeLessThan(-0.1);
  });

  it('carries further in thinner air at altitude', () => {
    const sea = simulateKick({ ...base, backspinRps: 3 });
    const high = simulateKick({ ...base, backspinRps: 3, air: { altitudeM: 2200 } });
    // Common practice (no source): balls fly further at altitude.
    expect(high.carryM).toBeGreaterThan(sea.carryM);
  });

  it('shortens carry with a lower launch speed', () => {
    // Common practice (no source).
    expect(simulateKick({ ...base, speed: 20 }).carryM).toBeLessThan(simulateKick(base).carryM);
  });
});
