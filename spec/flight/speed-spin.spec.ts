import {
  DEFAULT_ELEVATION_DEG,
  simulateKick,
  solveSpeedAndSpin,
  timedKickEvidence,
  type FlightConditions,
  type SpeedSpinResult,
} from '../../shared/flight';
import { SeededRandom } from '../../shared/flight/random';

/** Every number in a result, nested included, so a spec can insist none is NaN or infinite. */
function numbersIn(value: unknown): number[] {
  if (typeof value === 'number') return [value];
  if (value === null || typeof value !== 'object') return [];
  return Object.values(value).flatMap(numbersIn);
}

describe('solveSpeedAndSpin (carry plus flight time → launch speed and backspin)', () => {
  describe('round trip over driven, lofted and chipped launches and spins from −8 to 10 rev/s', () => {
    const launches = [
      { technique: 'driven', elevationDeg: DEFAULT_ELEVATION_DEG.driven, speeds: [18, 27] },
      { technique: 'lofted', elevationDeg: DEFAULT_ELEVATION_DEG.lofted, speeds: [17, 25] },
      { technique: 'chipped', elevationDeg: DEFAULT_ELEVATION_DEG.chipped, speeds: [12, 18] },
    ] as const;
    const spins = [-8, -6, -3, -1, 0, 1, 3, 6, 8, 10];
    for (const launch of launches) {
      for (const speed of launch.speeds) {
        it(`recovers speed and spin of ${launch.technique} kicks at ${speed} m/s`, () => {
          for (const backspinRps of spins) {
            const flight = simulateKick({ speed, elevationDeg: launch.elevationDeg, backspinRps });
            const r = solveSpeedAndSpin({ carryM: flight.carryM, flightTimeS: flight.flightTimeS, elevationDeg: launch.elevationDeg });
            const label = `${launch.technique} ${speed} m/s ${backspinRps} rev/s`;
            expect(r.ok).withContext(label).toBeTrue();
            if (!r.ok) continue;
            // Tolerances (common practice): far inside what a hand timer resolves (~1 rev/s for 0.05 s).
            expect(Math.abs(r.speedMs - speed))
              .withContext(label)
              .toBeLessThan(0.01);
            expect(Math.abs(r.backspinRps - backspinRps))
              .withContext(label)
              .toBeLessThan(0.05);
          }
        });
      }
    }

    it('recovers a kick flown in wind, at altitude, with sidespin and a size 4 ball', () => {
      const conditions: FlightConditions = {
        ball: { massKg: 0.37, radiusM: 0.103 },
        air: { altitudeM: 900, temperatureC: 6 },
        wind: { speedMs: 5, fromDeg: 20 },
      };
      const kick = { speed: 23, elevationDeg: 18, backspinRps: 4, sidespinRps: 4 };
      const flight = simulateKick({ ...kick, ...conditions });
      const r = solveSpeedAndSpin({ carryM: flight.carryM, flightTimeS: flight.flightTimeS, elevationDeg: 18, sidespinRps: 4, conditions });
      expect(r.ok).toBeTrue();
      if (!r.ok) return;
      expect(Math.abs(r.speedMs - kick.speed)).toBeLessThan(0.01);
      expect(Math.abs(r.backspinRps - kick.backspinRps)).toBeLessThan(0.05);
    });
  });

  describe('impossible pairs', () => {
    const elevationDeg = DEFAULT_ELEVATION_DEG.lofted;
    const flight = simulateKick({ speed: 22, elevationDeg, backspinRps: 5 });

    function expectClean(r: SpeedSpinResult): void {
      for (const n of numbersIn(r)) expect(Number.isFinite(n)).withContext(JSON.stringify(r)).toBeTrue();
    }

    it('says a time too short for the carry at that angle is too short, with the possible range', () => {
      const r = solveSpeedAndSpin({ carryM: flight.carryM, flightTimeS: 0.9, elevationDeg });
      expectClean(r);
      expect(r.ok).toBeFalse();
      if (r.ok) return;
      expect(r.reason).toBe('time_too_short');
      expect(r.feasibleTimeS).not.toBeNull();
      expect(r.feasibleTimeS!.min).toBeGreaterThan(0.9);
      expect(r.feasibleTimeS!.min).toBeLessThan(flight.flightTimeS);
      expect(r.feasibleTimeS!.max).toBeGreaterThan(flight.flightTimeS);
      expect(r.message).toContain('too short');
    });

    it('says a time too long for the carry at that angle is too long, with the possible range', () => {
      const r = solveSpeedAndSpin({ carryM: flight.carryM, flightTimeS: 6, elevationDeg });
      expectClean(r);
      expect(r.ok).toBeFalse();
      if (r.ok) return;
      expect(r.reason).toBe('time_too_long');
      expect(r.feasibleTimeS!.max).toBeLessThan(6);
      expect(r.feasibleTimeS!.max).toBeGreaterThan(flight.flightTimeS);
      expect(r.message).toContain('too long');
    });

    it('finds the edge for a driven kick whose heavy topspin would need more than 60 m/s', () => {
      // 45 m at 12° cannot be carried with much topspin by any speed up to 60 m/s, so the short end of the
      // range is the edge of the reachable spins, not the −20 rev/s end of the search box.
      const r = solveSpeedAndSpin({ carryM: 45, flightTimeS: 0.4, elevationDeg: DEFAULT_ELEVATION_DEG.driven });
      expectClean(r);
      expect(r.ok).toBeFalse();
      if (r.ok) return;
      expect(r.reason).toBe('time_too_short');
      const edge = solveSpeedAndSpin({ carryM: 45, flightTimeS: r.feasibleTimeS!.min + 0.01, elevationDeg: DEFAULT_ELEVATION_DEG.driven });
      expect(edge.ok).toBeTrue();
    });

    it('treats a zero or negative time (a reading below the timing bias) as too short', () => {
      const r = solveSpeedAndSpin({ carryM: flight.carryM, flightTimeS: -0.1, elevationDeg });
      expectClean(r);
      expect(r.ok).toBeFalse();
      if (!r.ok) expect(r.reason).toBe('time_too_short');
    });

    it('says a carry out of reach is out of reach', () => {
      const r = solveSpeedAndSpin({ carryM: 300, flightTimeS: 4, elevationDeg });
      expectClean(r);
      expect(r.ok).toBeFalse();
      if (r.ok) return;
      expect(r.reason).toBe('carry_out_of_reach');
      expect(r.feasibleTimeS).toBeNull();
    });

    it('still reports spreads without NaN when the timing spread straddles the edge of what is possible', () => {
      const edgeTime = (solveSpeedAndSpin({ carryM: flight.carryM, flightTimeS: 6, elevationDeg }) as { feasibleTimeS: { max: number } })
        .feasibleTimeS.max;
      const r = solveSpeedAndSpin({ carryM: flight.carryM, flightTimeS: edgeTime - 0.01, elevationDeg, timingSdS: 0.05, samples: 40 });
      expectClean(r);
      expect(r.ok).toBeTrue();
      if (!r.ok) return;
      expect(r.uncertainty.solvedShare).toBeGreaterThan(0.1);
      expect(r.uncertainty.solvedShare).toBeLessThan(0.9);
    });

    it('rejects malformed input with a RangeError naming the field', () => {
      expect(() => solveSpeedAndSpin({ carryM: Number.NaN, flightTimeS: 2, elevationDeg })).toThrowError(RangeError, /carryM/);
      expect(() => solveSpeedAndSpin({ carryM: 30, flightTimeS: Number.POSITIVE_INFINITY, elevationDeg })).toThrowError(
        RangeError,
        /flightTimeS/,
      );
      expect(() => solveSpeedAndSpin({ carryM: 30, flightTimeS: 2, elevationDeg: 0 })).toThrowError(RangeError, /elevationDeg/);
      expect(() => solveSpeedAndSpin({ carryM: 30, flightTimeS: 2, elevationDeg, timingSdS: -1 })).toThrowError(RangeError, /timingSdS/);
    });
  });

  describe('timing noise', () => {
    // Coverage check: with a hand timer of 0.05 s spread, the reported 68 % and 90 % intervals of the spin
    // must contain the true spin in about that share of seeded trials. The percentile interval of a
    // monotone map of a normal reading is exact, so only sampling error remains; the allowance is three
    // binomial standard deviations of the trial count (common practice).
    const trials = 120;
    const timingSdS = 0.05;
    const cases = [
      { technique: 'lofted', elevationDeg: DEFAULT_ELEVATION_DEG.lofted, speed: 22, backspinRps: 5 },
      { technique: 'driven', elevationDeg: DEFAULT_ELEVATION_DEG.driven, speed: 26, backspinRps: 7 },
    ] as const;
    for (const c of cases) {
      it(`covers the true spin of a ${c.technique} kick in about the stated share of trials`, () => {
        const flight = simulateKick({ speed: c.speed, elevationDeg: c.elevationDeg, backspinRps: c.backspinRps });
        const random = new SeededRandom(7);
        let in68 = 0;
        let in90 = 0;
        let solved = 0;
        for (let trial = 0; trial < trials; trial++) {
          const flightTimeS = flight.flightTimeS + timingSdS * random.normal();
          const r = solveSpeedAndSpin({
            carryM: flight.carryM,
            flightTimeS,
            elevationDeg: c.elevationDeg,
            timingSdS,
            samples: 80,
            seed: 1000 + trial,
          });
          if (!r.ok || !r.uncertainty.backspinRps) continue;
          solved++;
          const s = r.uncertainty.backspinRps;
          if (s.p16 <= c.backspinRps && c.backspinRps <= s.p84) in68++;
          if (s.p05 <= c.backspinRps && c.backspinRps <= s.p95) in90++;
        }
        expect(solved).toBe(trials);
        const slack = (p: number): number => 3 * Math.sqrt((p * (1 - p)) / trials);
        expect(Math.abs(in68 / trials - 0.68))
          .withContext(`68 % interval covered ${in68}/${trials}`)
          .toBeLessThan(slack(0.68));
        expect(Math.abs(in90 / trials - 0.9))
          .withContext(`90 % interval covered ${in90}/${trials}`)
          .toBeLessThan(slack(0.9));
      });
    }

    it('reports a wider spin spread for a noisier timer and the same spread for the same seed', () => {
      const elevationDeg = DEFAULT_ELEVATION_DEG.lofted;
      const flight = simulateKick({ speed: 22, elevationDeg, backspinRps: 5 });
      const query = { carryM: flight.carryM, flightTimeS: flight.flightTimeS, elevationDeg, samples: 60 };
      const tight = solveSpeedAndSpin({ ...query, timingSdS: 0.02 });
      const loose = solveSpeedAndSpin({ ...query, timingSdS: 0.1 });
      const again = solveSpeedAndSpin({ ...query, timingSdS: 0.1 });
      if (!tight.ok || !loose.ok || !again.ok) throw new Error('expected solutions');
      expect(loose.uncertainty.backspinRps!.sd).toBeGreaterThan(2 * tight.uncertainty.backspinRps!.sd);
      expect(again.uncertainty).toEqual(loose.uncertainty);
    });
  });
});

describe('timedKickEvidence (a timed repetition for the profile fit)', () => {
  const elevationDeg = DEFAULT_ELEVATION_DEG.lofted;
  const flight = simulateKick({ speed: 24, elevationDeg, backspinRps: 6 });

  it('subtracts the club timing bias from the stopwatch reading before solving', () => {
    const e = timedKickEvidence({
      carryM: flight.carryM,
      hangTimeS: flight.flightTimeS + 0.2,
      elevationDeg,
      timing: { biasS: 0.2, sdS: 0.08 },
    });
    expect(e.ok).toBeTrue();
    if (!e.ok) return;
    expect(e.flightTimeS).toBeCloseTo(flight.flightTimeS, 10);
    expect(Math.abs(e.speedMs - 24)).toBeLessThan(0.01);
    expect(Math.abs(e.backspinRps - 6)).toBeLessThan(0.05);
    expect(e.speedSdMs).toBeGreaterThan(0);
    expect(e.backspinSdRps).toBeGreaterThan(0);
    const uncorrected = timedKickEvidence({
      carryM: flight.carryM,
      hangTimeS: flight.flightTimeS + 0.2,
      elevationDeg,
      timing: { biasS: 0, sdS: 0.08 },
    });
    if (uncorrected.ok) expect(uncorrected.backspinRps).toBeGreaterThan(e.backspinRps + 1);
  });

  it('widens the spin spread when the carry is only known to the target radius', () => {
    // With the time fixed the launch speed follows mostly from the time (as in a vacuum, where the time alone sets it),
    // so an uncertain carry (1.5 m, half a 3 m target radius) shows up mostly in the spin.
    const timing = { biasS: 0, sdS: 0.02 };
    const query = { hangTimeS: flight.flightTimeS, elevationDeg, timing, samples: 200 };
    const exact = timedKickEvidence({ ...query, carryM: flight.carryM });
    const onTarget = timedKickEvidence({ ...query, carryM: flight.carryM, carrySdM: 1.5 });
    if (!exact.ok || !onTarget.ok) throw new Error('expected solutions');
    expect(onTarget.backspinSdRps).toBeGreaterThan(2.5 * exact.backspinSdRps);
  });

  it('passes on which way an impossible reading is off', () => {
    const e = timedKickEvidence({ carryM: flight.carryM, hangTimeS: 0.3, elevationDeg, timing: { biasS: 0.2, sdS: 0.08 } });
    expect(e.ok).toBeFalse();
    if (!e.ok) expect(e.reason).toBe('time_too_short');
  });

  it('rejects a malformed timing setting naming the field', () => {
    expect(() => timedKickEvidence({ carryM: 30, hangTimeS: 2, elevationDeg, timing: { biasS: Number.NaN, sdS: 0.08 } })).toThrowError(
      RangeError,
      /timing\.biasS/,
    );
  });
});
