import { LIFT_ONSET_SLOPE, onsetLiftCl, powerLiftCl, simulateKick, solveSpeedAndSpin, type LiftModel } from '../../shared/flight';

/** Lateral offset (m, + = left) where a kick crosses x = `atM`. */
function curlAt(speed: number, elevationDeg: number, sidespinRps: number, atM: number, lift?: LiftModel): number {
  const f = simulateKick({ speed, elevationDeg, sidespinRps, planes: [atM], aero: lift ? { lift } : {} });
  const crossing = f.crossings[0];
  if (!crossing) throw new Error(`kick did not reach ${atM} m`);
  return crossing.y;
}

describe('default lift law (linear through zero, the measured curve above S ≈ 0.1)', () => {
  it('gives no lift without spin and is odd-symmetric in flight', () => {
    // First principles (symmetry): a ball without spin has no preferred side, so C_L(0) = 0.
    expect(onsetLiftCl(0)).toBe(0);
    // Same principle in flight: no sidespin, no curl; mirrored sidespin, mirrored curl.
    expect(curlAt(25, 16, 0, 20)).toBe(0);
    expect(curlAt(25, 16, 3, 20)).toBeCloseTo(-curlAt(25, 16, -3, 20), 9);
  });

  it('is linear at small spin parameter', () => {
    // First principles: a smooth odd function of S is linear at S → 0 (C_L ≈ slope·S, slope ≈ 2.83).
    for (const s of [1e-4, 1e-3, 5e-3]) expect(onsetLiftCl(s) / s).toBeCloseTo(LIFT_ONSET_SLOPE, 1);
    expect(onsetLiftCl(0.002) / onsetLiftCl(0.001)).toBeCloseTo(2, 3);
  });

  it('is smooth and rises monotonically', () => {
    // First principles: more spin never gives less lift coefficient over the measured range (Carré et al. 2002 data rise with S).
    let last = 0;
    for (let s = 0.001; s <= 0.6; s += 0.001) {
      const cl = onsetLiftCl(s);
      expect(cl).toBeGreaterThan(last);
      last = cl;
    }
  });

  const published: [number, number, number, string][] = [
    // Carré et al. 2002 (Sports Engineering 5:193) wind-tunnel lift, S ≈ 0.1: C_L about 0.2.
    [0.1, 0.18, 0.24, 'Carré et al. 2002'],
    // Asai et al. 2007 (Sports Engineering 10:101) wind-tunnel lift, S ≈ 0.2: C_L about 0.25 (read from their figure, from memory).
    [0.2, 0.22, 0.3, 'Asai et al. 2007'],
    // Goff & Carré 2010 (Eur. J. Phys. 31:775) trajectory analysis, S ≈ 0.3: C_L about 0.25–0.3.
    [0.3, 0.24, 0.32, 'Goff & Carré 2010'],
  ];
  for (const [s, lo, hi, source] of published) {
    it(`sits inside the published range at S = ${s} (${source})`, () => {
      // Source in the table above.
      expect(onsetLiftCl(s)).toBeGreaterThan(lo);
      expect(onsetLiftCl(s)).toBeLessThan(hi);
    });
  }

  it('joins the power fit to the wind-tunnel data above S ≈ 0.1', () => {
    // Carré et al. 2002 (Sports Engineering 5:193), power fit C_L = 0.385 S^0.25: within 5 % at S = 0.1, 1 % from S = 0.15.
    expect(Math.abs(onsetLiftCl(0.1) / powerLiftCl(0.1) - 1)).toBeLessThan(0.05);
    for (const s of [0.15, 0.2, 0.3, 0.4]) expect(Math.abs(onsetLiftCl(s) / powerLiftCl(s) - 1)).toBeLessThan(0.01);
  });

  it('barely curls a ball with a tenth of a turn per second of sidespin', () => {
    // First principles: lift ∝ S near zero, so 0.1 rev/s (S ≈ 0.003 at 25 m/s) curls a few centimetres by 20 m,
    // where the bare power fit curls it about a metre.
    const onset = curlAt(25, 16, 0.1, 20);
    const power = curlAt(25, 16, 0.1, 20, 'power');
    expect(Math.abs(onset)).toBeLessThan(0.15);
    expect(Math.abs(power)).toBeGreaterThan(0.8);
  });

  it('curls 8 rev/s of sidespin clearly more than 4 rev/s', () => {
    // Carré et al. 2002 (Sports Engineering 5:193): C_L rises from ≈ 0.21 at S ≈ 0.11 (4 rev/s at 25 m/s) to
    // ≈ 0.26 at S ≈ 0.22 (8 rev/s), so the measured curve allows only about a quarter more curl, not double.
    const four = curlAt(25, 16, 4, 25);
    const eight = curlAt(25, 16, 8, 25);
    expect(eight / four).toBeGreaterThan(1.18);
    expect(eight - four).toBeGreaterThan(0.6);
    // First principles: at half the rate the ball curls less but in the same direction, and 2 rev/s less again.
    expect(curlAt(25, 16, 2, 25)).toBeLessThan(0.8 * four);
  });

  it('moves a carry by well under a metre for ±0.1 rev/s of backspin, symmetrically', () => {
    // First principles: a turn every ten seconds is invisible to the flow; lift ∝ spin so the change is
    // odd in the spin (the bare power fit moved this 25 m/s, 25° carry by +6.3 / −5.4 m).
    const carry = (backspinRps: number): number => simulateKick({ speed: 25, elevationDeg: 25, backspinRps }).carryM;
    const base = carry(0);
    const up = carry(0.1) - base;
    const down = carry(-0.1) - base;
    expect(up).toBeGreaterThan(0);
    expect(up).toBeLessThan(1);
    expect(down).toBeLessThan(0);
    expect(down).toBeGreaterThan(-1);
    expect(Math.abs(up + down)).toBeLessThan(0.1 * up);
  });

  it('lets the hang-time solver see small backspin as small (flight time smooth through zero spin)', () => {
    // First principles: with lift ∝ spin near zero, flight time changes about as much from 0 to 1 rev/s as
    // from 1 to 2 rev/s; the power fit made the first step several times larger, pulling solutions to zero.
    const time = (backspinRps: number, lift?: LiftModel): number =>
      simulateKick({ speed: 22, elevationDeg: 32, backspinRps, aero: lift ? { lift } : {} }).flightTimeS;
    const ratio = (lift?: LiftModel): number => (time(1, lift) - time(0, lift)) / (time(2, lift) - time(1, lift));
    expect(ratio()).toBeGreaterThan(0.7);
    expect(ratio()).toBeLessThan(1.6);
    expect(ratio('power')).toBeGreaterThan(2);
    // Round trip of a small spin through the solver.
    const f = simulateKick({ speed: 22, elevationDeg: 32, backspinRps: 0.5 });
    const r = solveSpeedAndSpin({ carryM: f.carryM, flightTimeS: f.flightTimeS, elevationDeg: 32 });
    expect(r.ok).toBeTrue();
    if (r.ok) expect(r.backspinRps).toBeCloseTo(0.5, 2);
  });

  it('keeps the power, saturating and constant laws as settings', () => {
    // Carré et al. 2002 power fit as a setting: the tenth-of-a-turn curl of the bare fit (see above) is about a metre.
    expect(Math.abs(curlAt(25, 16, 0.1, 20, 'power'))).toBeGreaterThan(0.8);
    expect(curlAt(25, 16, 4, 20, 'saturating')).toBeGreaterThan(0);
    expect(curlAt(25, 16, 4, 20, { constant: 0.25 })).toBeGreaterThan(curlAt(25, 16, 4, 20, { constant: 0.1 }));
    expect(() => simulateKick({ speed: 25, elevationDeg: 16, aero: { lift: 'linear' as unknown as LiftModel } })).toThrowError(
      RangeError,
      /aero\.lift/,
    );
  });
});
