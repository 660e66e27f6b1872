import { BALL_SIZES, GOAL_HEIGHT_M, WALL_DISTANCE_M, simulateKick } from '../../../shared/flight';
import {
  DEFAULT_GOAL_DISTANCE_M,
  DEFAULT_KICK,
  decodeState,
  encodeState,
  flightFigures,
  toKickInput,
  type SandboxKick,
} from './sandbox-kick';

const curler: SandboxKick = {
  ...DEFAULT_KICK,
  speedMs: 23.5,
  elevationDeg: 19,
  sidespinRps: 6.5,
  windSpeedMs: 3,
  windFromDeg: 90,
  ballSize: 4,
};

describe('sandbox permalink', () => {
  it('reads back exactly the kicks, the edited kick and the goal distance it wrote', () => {
    const state = { kicks: [DEFAULT_KICK, curler], selected: 1, goalDistanceM: 22.5 };
    const params = encodeState(state);
    const k = params['k'];
    expect(Array.isArray(k)).toBeTrue();
    const back = decodeState(k as string[], params['goal'] as string, params['sel'] as string);
    expect(back).toEqual(state);
  });

  it('skips garbled kicks, pulls values into range and falls back to the default kick', () => {
    const good = (encodeState({ kicks: [curler], selected: 0, goalDistanceM: 25 })['k'] as string[])[0]!;
    const tooFast = good.replace(/^23\.5/, '400');
    const back = decodeState(['1,2,3', 'x' + good, tooFast], '7', '5');
    expect(back.kicks.length).toBe(1);
    expect(back.kicks[0]!.speedMs).toBe(60);
    expect(back.selected).toBe(0);
    expect(back.goalDistanceM).toBe(10);
    expect(decodeState([], null, null)).toEqual({ kicks: [DEFAULT_KICK], selected: 0, goalDistanceM: DEFAULT_GOAL_DISTANCE_M });
  });

  it('keeps at most three kicks', () => {
    const one = (encodeState({ kicks: [curler], selected: 0, goalDistanceM: 25 })['k'] as string[])[0]!;
    expect(decodeState([one, one, one, one], null, null).kicks.length).toBe(3);
  });
});

describe('sandbox figures', () => {
  it('passes the ball size and conditions to the flight model and reads the wall and goal-line crossings', () => {
    const input = toKickInput(curler, 24);
    expect(input.ball).toEqual({ massKg: BALL_SIZES[4].massKg, radiusM: BALL_SIZES[4].radiusM });
    // A coach's wind is a head-height estimate (docs/design.md §6).
    expect(input.wind).toEqual({ speedMs: 3, fromDeg: 90, referenceHeightM: 1.8 });
    expect(input.planes).toEqual([WALL_DISTANCE_M, 24]);
    const flight = simulateKick(input);
    const f = flightFigures(flight, curler, 24);
    expect(f.carryM).toBe(flight.carryM);
    expect(f.wallHeightM).toBe(flight.crossings[0]!.z);
    expect(f.goalTopHeightM).toBeCloseTo(flight.crossings[1]!.z + 2 * BALL_SIZES[4].radiusM, 9);
  });

  it('calls a high ball over the bar and a short one short', () => {
    const high = { ...DEFAULT_KICK, speedMs: 30, elevationDeg: 35 };
    const hf = flightFigures(simulateKick(toKickInput(high, 20)), high, 20);
    // IFAB Laws of the Game, Law 1: crossbar 2.44 m.
    expect(hf.goalTopHeightM!).toBeGreaterThan(GOAL_HEIGHT_M);
    expect(hf.goalVerdict).toBe('over');
    const soft = { ...DEFAULT_KICK, speedMs: 8, elevationDeg: 20 };
    const sf = flightFigures(simulateKick(toKickInput(soft, 20)), soft, 20);
    expect(sf.goalVerdict).toBe('short');
    expect(sf.goalTopHeightM).toBeNull();
  });

  it('calls a ball that dips under the bar between the posts in', () => {
    const dipper = { ...DEFAULT_KICK, speedMs: 26, elevationDeg: 17, backspinRps: -3 };
    const f = flightFigures(simulateKick(toKickInput(dipper, 20)), dipper, 20);
    expect(f.goalTopHeightM!).toBeLessThan(GOAL_HEIGHT_M);
    expect(f.goalVerdict).toBe('in');
  });
});
