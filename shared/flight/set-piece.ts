/**
 * Set-piece check: for a free-kick position, the share of a player's kicks that clear a wall at 9.15 m
 * (IFAB Laws of the Game, Law 13) and cross the goal line inside the posts and under the bar of a
 * 7.32 × 2.44 m goal (Law 1). Each player takes the kick they would choose for this spot (set-piece-aim.ts)
 * and their own spreads scatter it. Crossings are roots on ODEX's dense output, like landing.
 */

import { WALL_DISTANCE_M } from './constants';
import type { VerticalPlane } from './integrate';
import { resolveConditions } from './model';
import type { KickProfile } from './profile-types';
import { checkedProfile, drawLaunchNoise } from './sampling';
import {
  chooseKick,
  deliveredLaunches,
  flySample,
  SAMPLE_OUTCOME,
  type IntendedKick,
  type SampleOutcome,
  type SetPieceScene,
} from './set-piece-aim';
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
  /**
   * The intended kick to check. Absent (the planner) = the kick the player would choose for this spot
   * (set-piece-aim.ts): the speed, elevation and spin that maximise their own on-target share.
   */
  kick?: IntendedKick;
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
  /** The intended kick the samples scatter around (the player's choice, or the one given). */
  kick: IntendedKick;
  /** Whether `kick` was chosen by the search (false: it was given). */
  kickChosen: boolean;
  /** Forward simulations the search spent (0 when the kick was given). */
  searchFlights: number;
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

/** Run the set-piece check: the player's chosen kick for this spot, scattered by their spreads (seeded Monte Carlo). */
export function setPieceCheck(input: SetPieceInput): SetPieceResult {
  return runSetPiece(input, null);
}

/** The same check, also returning where each kick that cleared the wall crossed the goal line. */
export function setPieceCloud(input: SetPieceInput): SetPieceCloudResult {
  const cloud: GoalMouthCloud = { yM: [], zM: [], kind: [] };
  return { ...runSetPiece(input, cloud), cloud };
}

/** Validated geometry and conditions of a free kick. */
export function setPieceScene(input: Pick<SetPieceInput, 'ballX' | 'ballY' | 'wallHeightM' | 'aimYM' | 'conditions'>): SetPieceScene & {
  ballX: number;
} {
  const ballX = requireInHalfOpen('ballX', input.ballX, 0, 60, 'm');
  const ballY = requireInRange('ballY', input.ballY, -40, 40, 'm');
  const wallHeightM = requireInHalfOpen('wallHeightM', input.wallHeightM ?? DEFAULT_WALL_HEIGHT_M, 0, 3, 'm');
  const aimYM = requireInRange('aimYM', input.aimYM ?? 0, -10, 10, 'm');
  const { phi, psi, planes } = setPieceGeometry(ballX, ballY, aimYM);
  if (ballX - WALL_DISTANCE_M * Math.cos(psi) < 0.5) {
    throw new RangeError(`ballX: a wall ${WALL_DISTANCE_M} m from the ball would stand on or behind the goal line`);
  }
  return { ballX, ballY, aimYM, phi, planes, wallHeightM, conditions: resolveConditions(input.conditions ?? {}) };
}

function checkedKick(k: IntendedKick): IntendedKick {
  if (k === null || typeof k !== 'object') throw new RangeError('kick must be an object');
  return {
    speedMs: requireInHalfOpen('kick.speedMs', k.speedMs, 0, 60, 'm/s'),
    elevationDeg: requireInHalfOpen('kick.elevationDeg', k.elevationDeg, 0, 90, '°'),
    backspinRps: requireInRange('kick.backspinRps', k.backspinRps, -30, 30, 'rev/s'),
    sidespinRps: requireInRange('kick.sidespinRps', k.sidespinRps, -30, 30, 'rev/s'),
    aimOffDeg: requireInRange('kick.aimOffDeg', k.aimOffDeg, -45, 45, '°'),
  };
}

function runSetPiece(input: SetPieceInput, cloud: GoalMouthCloud | null): SetPieceResult {
  if (input === null || typeof input !== 'object') throw new RangeError('set-piece input must be an object');
  const scene = setPieceScene(input);
  const profile = checkedProfile(input.profile);
  const noises = drawLaunchNoise(profile, input.samples, input.seed);
  const choice = input.kick === undefined ? chooseKick(scene, profile, input.seed) : null;
  const kick = choice ? choice.kick : checkedKick(input.kick!);
  const r = scene.conditions.radiusM;
  const counts = [0, 0, 0, 0, 0, 0];
  const wallHeights: number[] = [];
  const goalHeights: number[] = [];
  for (const launch of deliveredLaunches(profile, kick, noises)) {
    const s = flySample(scene, launch);
    counts[s.outcome]!++;
    if (s.wallZ !== null) wallHeights.push(s.wallZ);
    if (s.goalZ === null || s.goalY === null) continue;
    goalHeights.push(s.goalZ + r);
    if (cloud) {
      cloud.yM.push(round3(s.goalY));
      cloud.zM.push(round3(s.goalZ + r));
      cloud.kind.push(
        s.outcome === SAMPLE_OUTCOME.onTarget
          ? GOAL_CROSSING.in
          : s.outcome === SAMPLE_OUTCOME.over
            ? GOAL_CROSSING.over
            : GOAL_CROSSING.wide,
      );
    }
  }
  const n = noises.length;
  const share = (o: SampleOutcome): number => counts[o]! / n;
  return {
    samples: n,
    seed: input.seed,
    ballX: scene.ballX,
    ballY: scene.ballY,
    aimYM: scene.aimYM,
    wallDistanceM: WALL_DISTANCE_M,
    wallHeightM: scene.wallHeightM,
    aimDistanceM: Math.hypot(scene.ballX, scene.aimYM - scene.ballY),
    kick: {
      speedMs: round3(kick.speedMs),
      elevationDeg: round3(kick.elevationDeg),
      backspinRps: round3(kick.backspinRps),
      sidespinRps: round3(kick.sidespinRps),
      aimOffDeg: round3(kick.aimOffDeg),
    },
    kickChosen: choice !== null,
    searchFlights: choice ? choice.flights : 0,
    shares: {
      onTarget: share(SAMPLE_OUTCOME.onTarget),
      clearsWall: (n - counts[SAMPLE_OUTCOME.shortOfWall]! - counts[SAMPLE_OUTCOME.blocked]!) / n,
      blocked: share(SAMPLE_OUTCOME.blocked),
      shortOfWall: share(SAMPLE_OUTCOME.shortOfWall),
      shortOfGoal: share(SAMPLE_OUTCOME.shortOfGoal),
      wide: share(SAMPLE_OUTCOME.wide),
      over: share(SAMPLE_OUTCOME.over),
    },
    wallCrossingHeightM: wallHeights.length > 0 ? summarise(wallHeights) : null,
    goalCrossingHeightM: goalHeights.length > 0 ? summarise(goalHeights) : null,
  };
}
