import {
  fitProfile,
  reachEnvelope,
  setPieceCheck,
  simulateKick,
  solveLaunchSpeed,
  type KickInput,
  type KickProfile,
} from '../../shared/flight';

// Bad input must throw a RangeError naming the field (a product requirement: nothing returns NaN silently).
describe('input validation', () => {
  const ok: KickInput = { speed: 25, elevationDeg: 30 };
  const cases: [string, KickInput, string][] = [
    ['NaN speed', { ...ok, speed: Number.NaN }, 'speed'],
    ['negative speed', { ...ok, speed: -3 }, 'speed'],
    ['zero speed', { ...ok, speed: 0 }, 'speed'],
    ['elevation −10°', { ...ok, elevationDeg: -10 }, 'elevationDeg'],
    ['elevation above 90°', { ...ok, elevationDeg: 90.5 }, 'elevationDeg'],
    ['infinite elevation', { ...ok, elevationDeg: Number.POSITIVE_INFINITY }, 'elevationDeg'],
    ['absurd backspin', { ...ok, backspinRps: 400 }, 'backspinRps'],
    ['NaN sidespin', { ...ok, sidespinRps: Number.NaN }, 'sidespinRps'],
    ['absurd density', { ...ok, air: { densityKgM3: 12 } }, 'air.densityKgM3'],
    ['NaN temperature', { ...ok, air: { temperatureC: Number.NaN } }, 'air.temperatureC'],
    ['humidity over 100 %', { ...ok, air: { relativeHumidityPct: 130 } }, 'air.relativeHumidityPct'],
    ['negative wind', { ...ok, wind: { speedMs: -1, fromDeg: 0 } }, 'wind.speedMs'],
    ['NaN wind direction', { ...ok, wind: { speedMs: 3, fromDeg: Number.NaN } }, 'wind.fromDeg'],
    ['weightless ball', { ...ok, ball: { massKg: 0, radiusM: 0.11 } }, 'ball.massKg'],
    ['negative drag constant', { ...ok, aero: { drag: { constant: -0.2 } } }, 'aero.drag.constant'],
    ['zero spin-decay time', { ...ok, aero: { spinDecayTauS: 0 } }, 'aero.spinDecayTauS'],
    ['NaN plane', { ...ok, planes: [9.15, Number.NaN] }, 'planes[1]'],
  ];
  for (const [name, input, field] of cases) {
    it(`rejects ${name}`, () => {
      expect(() => simulateKick(input)).toThrowMatching((e: unknown) => e instanceof RangeError && e.message.startsWith(field));
    });
  }

  it('accepts the edges of the elevation range', () => {
    expect(simulateKick({ ...ok, elevationDeg: 90 }).landed).toBeTrue();
    expect(simulateKick({ ...ok, elevationDeg: -9.99 }).carryM).toBe(0);
  });

  it('rejects a bad carry in the inverse', () => {
    expect(() => solveLaunchSpeed({ carryM: -5, elevationDeg: 30 })).toThrowMatching(
      (e: unknown) => e instanceof RangeError && e.message.startsWith('carryM'),
    );
  });

  it('rejects bad logged kicks naming the kick and field', () => {
    const kick = {
      technique: 'lofted',
      outcome: 'short',
      targetDistanceM: 30,
      targetRadiusM: 3,
      backspinStep: 2,
      sidespinStep: 0,
    } as const;
    expect(() => fitProfile([kick, { ...kick, targetRadiusM: Number.NaN }])).toThrowMatching(
      (e: unknown) => e instanceof RangeError && e.message.startsWith('kicks[1].targetRadiusM'),
    );
    expect(() => fitProfile([kick, { ...kick, technique: 'driven' }])).toThrowMatching(
      (e: unknown) => e instanceof RangeError && e.message.startsWith('kicks[1].technique'),
    );
    expect(() => fitProfile([{ ...kick, backspinStep: 4 as 3 }])).toThrowMatching(
      (e: unknown) => e instanceof RangeError && e.message.startsWith('kicks[0].backspinStep'),
    );
    expect(() => fitProfile([])).toThrowError(RangeError);
  });

  it('rejects bad envelope and set-piece requests', () => {
    const profile: KickProfile = fitProfile([], {
      technique: 'curled',
      meanSpeedMs: 23,
      sdSpeedMs: 2,
      meanAzimuthDeg: 0,
      sdAzimuthDeg: 2,
      weightReps: 3,
    });
    expect(() => reachEnvelope(profile, {}, { samples: 0, seed: 1 })).toThrowMatching(
      (e: unknown) => e instanceof RangeError && e.message.startsWith('samples'),
    );
    expect(() => reachEnvelope(profile, {}, { samples: 10, seed: -1 })).toThrowMatching(
      (e: unknown) => e instanceof RangeError && e.message.startsWith('seed'),
    );
    expect(() => reachEnvelope({ ...profile, meanSpeedMs: Number.NaN }, {}, { samples: 10, seed: 1 })).toThrowMatching(
      (e: unknown) => e instanceof RangeError && e.message.startsWith('profile.meanSpeedMs'),
    );
    expect(() => setPieceCheck({ ballX: 5, ballY: 0, profile, conditions: {}, samples: 10, seed: 1 })).toThrowMatching(
      (e: unknown) => e instanceof RangeError && e.message.startsWith('ballX'),
    );
  });
});
