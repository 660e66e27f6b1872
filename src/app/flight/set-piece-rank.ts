/**
 * The set-piece planner's worker jobs: a squad ranking that runs shared/flight's `setPieceCloud` for
 * every player at one spot with the same seed (common random numbers, so players differ only by their
 * profiles); each player takes the kick they would choose for the spot, and the side view flies that
 * intended kick along the aim line. Plain TypeScript with no DOM so it runs in the flight worker.
 */

import {
  WALL_DISTANCE_M,
  setPieceCloud,
  setPieceGeometry,
  simulateKick,
  type FlightConditions,
  type IntendedKick,
  type KickProfile,
  type PathPoint,
  type SetPieceCloudResult,
  type SetPieceInput,
} from '../../../shared/flight';

export { GOAL_CROSSING, setPieceCloud } from '../../../shared/flight';
export type { GoalCrossingKind, GoalMouthCloud, SetPieceCloudResult } from '../../../shared/flight';

const round3 = (v: number): number => Math.round(v * 1000) / 1000;

/** The planner's side view: the player's chosen kick (no spread) along the aim line, with wall and goal distances. */
export interface AimLineFlight {
  /** The intended kick flown: speed, elevation, spins and the aim-off for curl. */
  kick: IntendedKick;
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

/** An intended kick flown along the aim line (the planner's side view). */
export function aimLineFlight(input: Omit<SetPieceInput, 'samples' | 'seed' | 'kick' | 'profile'>, kick: IntendedKick): AimLineFlight {
  const aimYM = input.aimYM ?? 0;
  const { phi, psi } = setPieceGeometry(input.ballX, input.ballY, aimYM);
  const wallAlongAimM = WALL_DISTANCE_M / Math.cos(phi - psi);
  const goalAlongAimM = input.ballX / Math.cos(phi);
  const flight = simulateKick({
    ...input.conditions,
    speed: kick.speedMs,
    elevationDeg: kick.elevationDeg,
    azimuthDeg: kick.aimOffDeg,
    backspinRps: kick.backspinRps,
    sidespinRps: kick.sidespinRps,
    planes: [wallAlongAimM, goalAlongAimM],
    path: true,
  });
  const at = (d: number): number | null => {
    const c = flight.crossings.find((x) => Math.abs(x.x - d) < 1e-3);
    return c ? round3(c.z) : null;
  };
  return {
    kick,
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
      conditions: input.conditions,
    };
    const result = setPieceCloud({ ...spot, profile, samples: input.samples, seed: input.seed });
    return { id, result, meanKick: aimLineFlight(spot, result.kick) };
  });
}
