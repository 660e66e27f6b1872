import {
  BALL_SIZES,
  DEFAULT_PRIORS,
  fitProfile,
  setPieceCheck,
  simulateKick,
  WALL_DISTANCE_M,
  type KickProfile,
} from '../../shared/flight';

function curled(over: Partial<KickProfile>): KickProfile {
  const base = fitProfile([], { ...DEFAULT_PRIORS.curled, technique: 'curled' });
  return {
    ...base,
    meanSpeedMs: 24,
    sdSpeedMs: 1.5,
    meanSpeedSeMs: 0.2,
    elevationDeg: 20,
    sdElevationDeg: 1.5,
    sdAzimuthDeg: 1.5,
    meanAzimuthSeDeg: 0.2,
    ...over,
  };
}

const base = curled({});
const exact: Partial<KickProfile> = {
  // A ceiling far above the kicks and no speed error: every sample is the intended kick.
  aimedSpeed: { ...base.aimedSpeed, offsetLogMean: 0, offsetLogSd: 0, offsetLogMeanSe: 0, ceilingMs: 60, ceilingLogSe: 0 },
  sdSpeedMs: 0,
  meanSpeedSeMs: 0,
  sdAzimuthDeg: 0,
  meanAzimuthSeDeg: 0,
  meanAzimuthDeg: 0,
  sdElevationDeg: 0,
  sdBackspinRps: 0,
  sdSidespinRps: 0,
};

describe('setPieceCheck', () => {
  it('classifies every sample exactly once', () => {
    const r = setPieceCheck({ ballX: 22, ballY: 4, profile: curled({}), conditions: {}, samples: 300, seed: 9 });
    const s = r.shares;
    expect(s.onTarget + s.blocked + s.shortOfWall + s.shortOfGoal + s.wide + s.over).toBeCloseTo(1, 12);
    expect(s.clearsWall).toBeCloseTo(1 - s.blocked - s.shortOfWall, 12);
    // IFAB Laws of the Game, Law 13: the wall stands 9.15 m from the ball.
    expect(r.wallDistanceM).toBe(9.15);
    expect(r.aimDistanceM).toBeCloseTo(Math.hypot(22, 4), 12);
  });

  it('finds the wall and goal line where a single kick crosses them', () => {
    // Zero-spread profile: every sample is the same kick, so the check must agree with simulateKick's planes.
    const profile = curled({ ...exact, backspinRps: 2 });
    const intended = { speedMs: 24, elevationDeg: 20, backspinRps: 2, sidespinRps: 0, aimOffDeg: 0 };
    const kick = { speed: 24, elevationDeg: 20, backspinRps: 2 };
    const radius = BALL_SIZES[5].radiusM;
    for (const [ballX, ballY] of [
      [20, 0],
      [19, 9],
    ] as const) {
      const along = Math.hypot(ballX, ballY);
      const r = setPieceCheck({ ballX, ballY, aimYM: 0, profile, conditions: {}, samples: 20, seed: 1, kick: intended });
      expect(r.kickChosen).toBeFalse();
      const f = simulateKick({ ...kick, planes: [WALL_DISTANCE_M, along] });
      // To a micrometre: the smooth cap at the 35 m/s physiological cap takes ~4e-6 % off a 24 m/s ball.
      expect(r.wallCrossingHeightM!.p10).toBeCloseTo(f.crossings[0]!.z, 5);
      expect(r.wallCrossingHeightM!.p90).toBeCloseTo(f.crossings[0]!.z, 5);
      expect(r.goalCrossingHeightM!.p50).toBeCloseTo(f.crossings[1]!.z + radius, 5);
    }
  });

  it('blocks a low driven ball and lets a higher wall stop more', () => {
    // Common practice (no source): a ball driven at 8° does not clear a wall 9.15 m away.
    const low = setPieceCheck({
      ballX: 22,
      ballY: 0,
      profile: curled({}),
      kick: { speedMs: 28, elevationDeg: 8, backspinRps: 0, sidespinRps: 0, aimOffDeg: 0 },
      conditions: {},
      samples: 200,
      seed: 3,
    });
    expect(low.shares.blocked).toBeGreaterThan(0.9);
    const profile = curled({});
    const kick = { speedMs: 24, elevationDeg: 20, backspinRps: 0, sidespinRps: 4, aimOffDeg: -5 };
    const lowWall = setPieceCheck({
      ballX: 22,
      ballY: 0,
      wallHeightM: 1.8,
      profile,
      kick,
      conditions: {},
      samples: 300,
      seed: 4,
    });
    const highWall = setPieceCheck({
      ballX: 22,
      ballY: 0,
      wallHeightM: 2.3,
      profile,
      kick,
      conditions: {},
      samples: 300,
      seed: 4,
    });
    expect(highWall.shares.clearsWall).toBeLessThan(lowWall.shares.clearsWall);
  });

  it('puts some of a given free kick on target and is reproducible', () => {
    // Common practice (no source): a 24 m/s ball at 20° from 22 m goes over the wall and often over the bar too.
    const kick = { speedMs: 24, elevationDeg: 20, backspinRps: 0, sidespinRps: 4, aimOffDeg: -5 };
    const a = setPieceCheck({ ballX: 22, ballY: 0, profile: curled({}), kick, conditions: {}, samples: 300, seed: 11 });
    expect(a.shares.onTarget).toBeGreaterThan(0.05);
    expect(a.shares.over).toBeGreaterThan(0.05);
    expect(setPieceCheck({ ballX: 22, ballY: 0, profile: curled({}), kick, conditions: {}, samples: 300, seed: 11 })).toEqual(a);
  });

  it('sends a ball aimed beyond the post wide', () => {
    const r = setPieceCheck({
      ballX: 25,
      ballY: 0,
      aimYM: 7,
      profile: curled({ ...exact }),
      kick: { speedMs: 24, elevationDeg: 17, backspinRps: 0, sidespinRps: 0, aimOffDeg: 0 },
      conditions: {},
      samples: 10,
      seed: 2,
    });
    // IFAB Laws of the Game, Law 1: posts 3.66 m either side of the centre; an unswerving ball aimed 7 m off centre misses.
    expect(r.shares.wide + r.shares.blocked).toBe(1);
  });
});
