import {
  BALL_SIZES,
  DEFAULT_PRIORS,
  GOAL_HEIGHT_M,
  GOAL_WIDTH_M,
  WALL_DISTANCE_M,
  fitProfile,
  setPieceCheck,
  simulateKick,
  type KickProfile,
  type SetPieceInput,
} from '../../../shared/flight';
import { GOAL_CROSSING, aimLineFlight, setPieceCloud, setPieceRank } from './set-piece-rank';

function curler(overrides: Partial<KickProfile> = {}): KickProfile {
  const base = fitProfile([], { ...DEFAULT_PRIORS.curled, technique: 'curled' });
  return {
    ...base,
    meanSpeedMs: 24,
    sdSpeedMs: 1.5,
    meanSpeedSeMs: 0.3,
    meanAzimuthDeg: 0,
    sdAzimuthDeg: 2.5,
    elevationDeg: 19,
    sdElevationDeg: 1.5,
    backspinRps: 3,
    sidespinRps: 4,
    sdBackspinRps: 1,
    sdSidespinRps: 1,
    ...overrides,
  };
}

const spots: SetPieceInput[] = [
  { ballX: 22, ballY: 0, profile: curler(), conditions: {}, samples: 250, seed: 11 },
  {
    ballX: 25,
    ballY: 6,
    wallHeightM: 2.2,
    aimYM: -2,
    profile: curler({ meanSpeedMs: 26 }),
    conditions: { wind: { speedMs: 4, fromDeg: 60 } },
    samples: 200,
    seed: 5,
  },
  {
    ballX: 18,
    ballY: -8,
    wallHeightM: 1.8,
    profile: curler({ elevationDeg: 25, sidespinRps: -6 }),
    conditions: { air: { altitudeM: 800, temperatureC: 25 } },
    samples: 150,
    seed: 2,
  },
];

describe('setPieceCloud', () => {
  it('gives exactly the set-piece check of the flight model, plus the cloud', () => {
    for (const spot of spots) {
      const { cloud, ...result } = setPieceCloud(spot);
      expect(result).toEqual(setPieceCheck(spot));
      expect(cloud.yM.length).toBe(cloud.kind.length);
      expect(cloud.zM.length).toBe(cloud.kind.length);
    }
  });

  it('keeps one cloud point for every kick that reached the goal line over the wall, classified as the shares say', () => {
    for (const spot of spots) {
      const r = setPieceCloud(spot);
      const n = r.samples;
      const reached = Math.round(n * (r.shares.onTarget + r.shares.over + r.shares.wide));
      expect(r.cloud.kind.length).toBe(reached);
      const count = (k: number): number => r.cloud.kind.filter((x) => x === k).length;
      expect(count(GOAL_CROSSING.in)).toBe(Math.round(n * r.shares.onTarget));
      expect(count(GOAL_CROSSING.over)).toBe(Math.round(n * r.shares.over));
      expect(count(GOAL_CROSSING.wide)).toBe(Math.round(n * r.shares.wide));
    }
  });

  it('puts "in" points inside the posts and under the bar, "wide" ones outside the posts', () => {
    const radius = BALL_SIZES[5].radiusM;
    const r = setPieceCloud(spots[0]!);
    expect(r.cloud.kind).toContain(GOAL_CROSSING.in);
    r.cloud.kind.forEach((kind, i) => {
      const y = r.cloud.yM[i]!;
      const z = r.cloud.zM[i]!;
      // IFAB Laws of the Game, Law 1: 7.32 m between the posts, 2.44 m to the bar (the whole ball inside).
      if (kind === GOAL_CROSSING.in) {
        expect(Math.abs(y) + radius).toBeLessThan(GOAL_WIDTH_M / 2 + 0.001);
        expect(z + radius).toBeLessThan(GOAL_HEIGHT_M + 0.001);
      } else if (kind === GOAL_CROSSING.wide) {
        expect(Math.abs(y) + radius).toBeGreaterThan(GOAL_WIDTH_M / 2 - 0.001);
      } else {
        expect(z + radius).toBeGreaterThan(GOAL_HEIGHT_M - 0.001);
      }
    });
  });

  it('refuses a spot whose wall would stand behind the goal line', () => {
    expect(() => setPieceCloud({ ...spots[0]!, ballX: 9 })).toThrowError(RangeError, /^ballX/);
  });
});

describe('aimLineFlight', () => {
  it('puts the wall 9.15 m and the goal line ballX away for a central kick aimed at the middle', () => {
    const kick = { speedMs: 24, elevationDeg: 19, backspinRps: 3, sidespinRps: 4, aimOffDeg: 0 };
    const f = aimLineFlight({ ballX: 24, ballY: 0, conditions: {} }, kick);
    expect(f.kick).toEqual(kick);
    // IFAB Laws of the Game, Law 13: the wall at 9.15 m.
    expect(f.wallAlongAimM).toBeCloseTo(WALL_DISTANCE_M, 9);
    expect(f.goalAlongAimM).toBeCloseTo(24, 9);
    const direct = simulateKick({
      speed: 24,
      elevationDeg: 19,
      azimuthDeg: 0,
      backspinRps: 3,
      sidespinRps: 4,
      planes: [WALL_DISTANCE_M, 24],
    });
    expect(f.wallHeightOfBallM).toBeCloseTo(direct.crossings[0]!.z, 3);
    expect(f.goalHeightOfBallM).toBeCloseTo(direct.crossings[1]!.z, 3);
    expect(f.carryM).toBe(direct.carryM);
    expect(f.path.length).toBeGreaterThan(10);
  });

  it('lengthens both distances along an oblique aim line', () => {
    const f = aimLineFlight(
      { ballX: 20, ballY: 10, aimYM: 3, conditions: {} },
      { speedMs: 24, elevationDeg: 19, backspinRps: 3, sidespinRps: 4, aimOffDeg: -5 },
    );
    expect(f.goalAlongAimM).toBeCloseTo(Math.hypot(20, 7), 9);
    expect(f.wallAlongAimM).toBeGreaterThan(WALL_DISTANCE_M);
  });
});

describe('setPieceRank', () => {
  it('answers every player in the order given with the same seed for each', () => {
    const players = [
      { id: 'slow', profile: curler({ meanSpeedMs: 15 }) },
      { id: 'good', profile: curler() },
    ];
    const ranked = setPieceRank({ ballX: 22, ballY: 0, conditions: {}, samples: 120, seed: 4, players });
    expect(ranked.map((e) => e.id)).toEqual(['slow', 'good']);
    expect(ranked[1]!.result).toEqual(
      setPieceCloud({ ballX: 22, ballY: 0, profile: players[1]!.profile, conditions: {}, samples: 120, seed: 4 }),
    );
    // The side view flies the kick each player chose for the spot.
    expect(ranked[0]!.meanKick.kick).toEqual(ranked[0]!.result.kick);
    expect(ranked[1]!.meanKick.kick).toEqual(ranked[1]!.result.kick);
  });
});
