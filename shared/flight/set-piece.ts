/**
 * Set-piece check: for a free-kick position, the share of a player's envelope that clears a
 * wall at 9.15 m (IFAB Laws of the Game, Law 13) and crosses the goal line inside the posts and under
 * the bar of a 7.32 × 2.44 m goal (Law 1). Crossings are roots on odex's dense output, like landing.
 */

import { GOAL_HEIGHT_M, GOAL_WIDTH_M, WALL_DISTANCE_M } from './constants';
import { sampleLaunches } from './envelope';
import { DEFAULT_SOLVER_SETTINGS, integrateFlight, type VerticalPlane } from './integrate';
import { buildModel, resolveConditions } from './model';
import type { KickProfile } from './profile-types';
import { type DistributionSummary, summarise } from './stats';
import type { FlightConditions } from './types';
import { requireInHalfOpen, requireInRange } from './validate';

/** Default wall height, m (common practice: an adult wall jumping). */
export const DEFAULT_WALL_HEIGHT_M = 2.0;

/**
 * A free kick. Goal frame: origin at the centre of the goal line, `ballX` metres out into the pitch,
 * `ballY` metres along the goal line, + = to the left as the kicker faces the goal. The wall stands
 * square to the line from the ball to the centre of the goal and is treated as wide enough that the ball
 * must go over it. Wind in `conditions` is relative to the kick's aim line, as in KickInput.
 */
export interface SetPieceInput {
  ballX: number;
  ballY: number;
  wallHeightM?: number;
  /** Where on the goal line the kicker aims (goal-frame y), default 0 = the centre. */
  aimYM?: number;
  profile: KickProfile;
  conditions: FlightConditions;
  samples: number;
  seed: number;
}

/** Shares of sampled kicks by what happened to them; they sum to 1 except `clearsWall`. */
export interface SetPieceShares {
  /** Cleared the wall and crossed the goal line inside the posts, under the bar. */
  onTarget: number;
  /** Went over the wall (whatever happened next). */
  clearsWall: number;
  /** Reached the wall at or below its top. */
  blocked: number;
  /** Landed before reaching the wall. */
  shortOfWall: number;
  /** Cleared the wall but landed before the goal line. */
  shortOfGoal: number;
  /** Crossed the goal line outside the posts. */
  wide: number;
  /** Crossed the goal line between the posts but over the bar. */
  over: number;
}

/** Result of a set-piece check. JSON-serialisable. */
export interface SetPieceResult {
  samples: number;
  seed: number;
  ballX: number;
  ballY: number;
  aimYM: number;
  wallDistanceM: number;
  wallHeightM: number;
  /** Distance from the ball to the aim point on the goal line, m. */
  aimDistanceM: number;
  shares: SetPieceShares;
  /** Height of the ball's underside where it reached the wall (samples that did), m. */
  wallCrossingHeightM: DistributionSummary | null;
  /** Height of the ball's centre where it crossed the goal line (samples that did), m. */
  goalCrossingHeightM: DistributionSummary | null;
}

/** How a sampled kick crossed the goal line, as a small code (compact in worker messages). */
export const GOAL_CROSSING = { in: 0, over: 1, wide: 2 } as const;
/** One of the GOAL_CROSSING codes. */
export type GoalCrossingKind = (typeof GOAL_CROSSING)[keyof typeof GOAL_CROSSING];

/** Where each sample that cleared the wall crossed the goal line (goal-frame y, height of the centre), mm-rounded. */
export interface GoalMouthCloud {
  yM: number[];
  zM: number[];
  kind: GoalCrossingKind[];
}

/** A set-piece check with its goal-mouth cloud, for drawing. */
export interface SetPieceCloudResult extends SetPieceResult {
  cloud: GoalMouthCloud;
}

/**
 * Aim geometry in the goal frame: `phi` the aim direction, `psi` the direction to the goal's
 * centre, and the two vertical planes the flight is crossed with (the wall, the goal line).
 */
export function setPieceGeometry(ballX: number, ballY: number, aimYM: number): { phi: number; psi: number; planes: VerticalPlane[] } {
  const phi = Math.atan2(aimYM - ballY, ballX); // aim direction, to the left of straight at the goal line
  const psi = Math.atan2(-ballY, ballX); // direction to the centre of the goal
  return {
    phi,
    psi,
    planes: [
      { nx: Math.cos(phi - psi), ny: Math.sin(psi - phi), d: WALL_DISTANCE_M },
      { nx: Math.cos(phi), ny: -Math.sin(phi), d: ballX },
    ],
  };
}

const round3 = (v: number): number => Math.round(v * 1000) / 1000;

/** Run the set-piece check: seeded Monte Carlo of the profile against wall and goal. */
export function setPieceCheck(input: SetPieceInput): SetPieceResult {
  return runSetPiece(input, null);
}

/** The same check, also returning where each kick that cleared the wall crossed the goal line. */
export function setPieceCloud(input: SetPieceInput): SetPieceCloudResult {
  const cloud: GoalMouthCloud = { yM: [], zM: [], kind: [] };
  return { ...runSetPiece(input, cloud), cloud };
}

function runSetPiece(input: SetPieceInput, cloud: GoalMouthCloud | null): SetPieceResult {
  if (input === null || typeof input !== 'object') throw new RangeError('set-piece input must be an object');
  const ballX = requireInHalfOpen('ballX', input.ballX, 0, 60, 'm');
  const ballY = requireInRange('ballY', input.ballY, -40, 40, 'm');
  const wallHeightM = requireInHalfOpen('wallHeightM', input.wallHeightM ?? DEFAULT_WALL_HEIGHT_M, 0, 3, 'm');
  const aimYM = requireInRange('aimYM', input.aimYM ?? 0, -10, 10, 'm');
  const { phi, psi, planes } = setPieceGeometry(ballX, ballY, aimYM);
  if (ballX - WALL_DISTANCE_M * Math.cos(psi) < 0.5) {
    throw new RangeError(`ballX: a wall ${WALL_DISTANCE_M} m from the ball would stand on or behind the goal line`);
  }
  const conditions = resolveConditions(input.conditions ?? {});
  const r = conditions.radiusM;
  const launches = sampleLaunches(input.profile, input.samples, input.seed);
  const counts = { onTarget: 0, blocked: 0, shortOfWall: 0, shortOfGoal: 0, wide: 0, over: 0 };
  const wallHeights: number[] = [];
  const goalHeights: number[] = [];
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
    if (cloud) {
      cloud.yM.push(round3(y));
      cloud.zM.push(round3(goal.z + r));
      cloud.kind.push(kind);
    }
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
  };
}
