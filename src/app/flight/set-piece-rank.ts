/**
 * The set-piece planner's worker jobs: the set-piece check of shared/flight with the goal-mouth landing
 * cloud kept (where each sampled kick crossed the goal line), and a squad ranking that runs it for every
 * player at one spot with the same seed (common random numbers, so players differ only by their
 * profiles). Plain TypeScript with no DOM so it runs in the flight worker.
 *
 * `setPieceCloud` repeats `setPieceCheck`'s sampling and classification in one pass so the cloud costs
 * no second Monte Carlo; `set-piece-rank.spec.ts` holds it to `setPieceCheck`'s result exactly.
 * TODO(lead): if `setPieceCheck` grows an option to return its crossings, call it here instead.
 */

import {
  GOAL_HEIGHT_M,
  GOAL_WIDTH_M,
  WALL_DISTANCE_M,
  DEFAULT_WALL_HEIGHT_M,
  simulateKick,
  type FlightConditions,
  type KickProfile,
  type PathPoint,
  type SetPieceInput,
  type SetPieceResult,
} from '../../../shared/flight';
import { sampleLaunches } from '../../../shared/flight/envelope';
import { DEFAULT_SOLVER_SETTINGS, integrateFlight, type VerticalPlane } from '../../../shared/flight/integrate';
import { buildModel, resolveConditions } from '../../../shared/flight/model';
import { summarise } from '../../../shared/flight/stats';
import { requireInHalfOpen, requireInRange } from '../../../shared/flight/validate';

/**
 * What happened to a sampled kick that reached the goal line over the wall: in (inside the posts and
 * under the bar), over (between the posts, over the bar) or wide (outside the posts). Small integers so
 * a cloud of thousands of kicks stays a small message.
 */
export const GOAL_CROSSING = { in: 0, over: 1, wide: 2 } as const;

/** One of {@link GOAL_CROSSING}'s values. */
export type GoalCrossingKind = (typeof GOAL_CROSSING)[keyof typeof GOAL_CROSSING];

/**
 * Where the sampled kicks that cleared the wall crossed the goal line, one entry per kick in sampling
 * order: `yM` along the goal line (goal frame, + = left as the kicker faces the goal), `zM` the height of
 * the ball's centre, `kind` a {@link GoalCrossingKind}. Parallel arrays keep the worker message small.
 */
export interface GoalMouthCloud {
  yM: number[];
  zM: number[];
  kind: GoalCrossingKind[];
}

/** A set-piece check with its goal-mouth cloud. */
export interface SetPieceCloudResult extends SetPieceResult {
  cloud: GoalMouthCloud;
}

/** The planner's side view: the profile's mean launch along the aim line, with wall and goal distances. */
export interface AimLineFlight {
  /** Path samples, x along the aim from the ball, z height of the ball's centre. */
  path: Pick<PathPoint, 'x' | 'z'>[];
  /** Where the wall crosses the aim line, m from the ball. */
  wallAlongAimM: number;
  /** Where the goal line crosses the aim line, m from the ball. */
  goalAlongAimM: number;
  /** Height of the ball's centre at the wall and at the goal line (null: it landed before). */
  wallHeightOfBallM: number | null;
  goalHeightOfBallM: number | null;
  carryM: number;
}

/** One free-kick spot for the whole squad. */
export interface SetPieceRankInput {
  ballX: number;
  ballY: number;
  wallHeightM?: number;
  aimYM?: number;
  conditions: FlightConditions;
  samples: number;
  seed: number;
  /** Players with a profile of the chosen technique; `id` is passed through untouched. */
  players: { id: string; profile: KickProfile }[];
}

/** One player's line of the ranking, in the order the players were given. */
export interface SetPieceRankEntry {
  id: string;
  result: SetPieceCloudResult;
  meanKick: AimLineFlight;
}

const round3 = (v: number): number => Math.round(v * 1000) / 1000;

function aimGeometry(ballX: number, ballY: number, aimYM: number): { phi: number; psi: number; planes: VerticalPlane[] } {
  const phi = Math.atan2(aimYM - ballY, ballX);
  const psi = Math.atan2(-ballY, ballX);
  return {
    phi,
    psi,
    planes: [
      { nx: Math.cos(phi - psi), ny: Math.sin(psi - phi), d: WALL_DISTANCE_M },
      { nx: Math.cos(phi), ny: -Math.sin(phi), d: ballX },
    ],
  };
}

/** `setPieceCheck` plus the goal-mouth cloud, from one Monte Carlo pass. Throws what `setPieceCheck` throws. */
export function setPieceCloud(input: SetPieceInput): SetPieceCloudResult {
  if (input === null || typeof input !== 'object') throw new RangeError('set-piece input must be an object');
  const ballX = requireInHalfOpen('ballX', input.ballX, 0, 60, 'm');
  const ballY = requireInRange('ballY', input.ballY, -40, 40, 'm');
  const wallHeightM = requireInHalfOpen('wallHeightM', input.wallHeightM ?? DEFAULT_WALL_HEIGHT_M, 0, 3, 'm');
  const aimYM = requireInRange('aimYM', input.aimYM ?? 0, -10, 10, 'm');
  const { phi, psi, planes } = aimGeometry(ballX, ballY, aimYM);
  if (ballX - WALL_DISTANCE_M * Math.cos(psi) < 0.5) {
    throw new RangeError(`ballX: a wall ${WALL_DISTANCE_M} m from the ball would stand on or behind the goal line`);
  }
  const conditions = resolveConditions(input.conditions ?? {});
  const r = conditions.radiusM;
  const launches = sampleLaunches(input.profile, input.samples, input.seed);
  const counts = { onTarget: 0, blocked: 0, shortOfWall: 0, shortOfGoal: 0, wide: 0, over: 0 };
  const wallHeights: number[] = [];
  const goalHeights: number[] = [];
  const cloud: GoalMouthCloud = { yM: [], zM: [], kind: [] };
  for (const launch of launches) {
    const f = integrateFlight(buildModel(conditions, launch), { planes, settings: DEFAULT_SOLVER_SETTINGS });
    const wall = f.generalCrossings.find((c) => c.plane === 0);
    const goal = f.generalCrossings.find((c) => c.plane === 1);
    if (!wall) {
      counts.shortOfWall++;
      continue;
    }
    wallHeights.push(wall.z);
    if (wall.z <= wallHeightM) {
      counts.blocked++;
      continue;
    }
    if (!goal) {
      counts.shortOfGoal++;
      continue;
    }
    goalHeights.push(goal.z + r);
    const y = ballY + goal.x * Math.sin(phi) + goal.y * Math.cos(phi);
    let kind: GoalCrossingKind;
    if (Math.abs(y) + r >= GOAL_WIDTH_M / 2) {
      counts.wide++;
      kind = GOAL_CROSSING.wide;
    } else if (goal.z + 2 * r >= GOAL_HEIGHT_M) {
      counts.over++;
      kind = GOAL_CROSSING.over;
    } else {
      counts.onTarget++;
      kind = GOAL_CROSSING.in;
    }
    cloud.yM.push(round3(y));
    cloud.zM.push(round3(goal.z + r));
    cloud.kind.push(kind);
  }
  const n = launches.length;
  return {
    samples: n,
    seed: input.seed,
    ballX,
    ballY,
    aimYM,
    wallDistanceM: WALL_DISTANCE_M,
    wallHeightM,
    aimDistanceM: Math.hypot(ballX, aimYM - ballY),
    shares: {
      onTarget: counts.onTarget / n,
      clearsWall: (n - counts.shortOfWall - counts.blocked) / n,
      blocked: counts.blocked / n,
      shortOfWall: counts.shortOfWall / n,
      shortOfGoal: counts.shortOfGoal / n,
      wide: counts.wide / n,
      over: counts.over / n,
    },
    wallCrossingHeightM: wallHeights.length > 0 ? summarise(wallHeights) : null,
    goalCrossingHeightM: goalHeights.length > 0 ? summarise(goalHeights) : null,
    cloud,
  };
}

/** The profile's mean launch flown along the aim line (the planner's side view). */
export function aimLineFlight(input: Omit<SetPieceInput, 'samples' | 'seed'>): AimLineFlight {
  const aimYM = input.aimYM ?? 0;
  const { phi, psi } = aimGeometry(input.ballX, input.ballY, aimYM);
  const wallAlongAimM = WALL_DISTANCE_M / Math.cos(phi - psi);
  const goalAlongAimM = input.ballX / Math.cos(phi);
  const p = input.profile;
  const flight = simulateKick({
    ...input.conditions,
    speed: p.meanSpeedMs,
    elevationDeg: p.elevationDeg,
    azimuthDeg: p.meanAzimuthDeg,
    backspinRps: p.backspinRps,
    sidespinRps: p.sidespinRps,
    planes: [wallAlongAimM, goalAlongAimM],
    path: true,
  });
  const at = (d: number): number | null => {
    const c = flight.crossings.find((x) => Math.abs(x.x - d) < 1e-3);
    return c ? round3(c.z) : null;
  };
  return {
    path: flight.path.map((q) => ({ x: round3(q.x), z: round3(q.z) })),
    wallAlongAimM,
    goalAlongAimM,
    wallHeightOfBallM: at(wallAlongAimM),
    goalHeightOfBallM: at(goalAlongAimM),
    carryM: flight.carryM,
  };
}

/** Run the set-piece check with cloud and the mean-launch flight for every player at one spot. */
export function setPieceRank(input: SetPieceRankInput): SetPieceRankEntry[] {
  if (input === null || typeof input !== 'object' || !Array.isArray(input.players)) {
    throw new RangeError('set-piece rank input must be an object with players');
  }
  return input.players.map(({ id, profile }) => {
    const spot = {
      ballX: input.ballX,
      ballY: input.ballY,
      wallHeightM: input.wallHeightM,
      aimYM: input.aimYM,
      profile,
      conditions: input.conditions,
    };
    return {
      id,
      result: setPieceCloud({ ...spot, samples: input.samples, seed: input.seed }),
      meanKick: aimLineFlight(spot),
    };
  });
}
