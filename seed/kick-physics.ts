/**
 * How the demo's repetitions happen: each is flown through the flight model (`simulateKick`) from the
 * player's hidden truth (`truth.ts`) in its session's conditions, and logged the way a coach logs it —
 * the outcome called from where the ball came down, the spin step judged by eye, a paced-out carry now
 * and then, and for the first team's ball-tracking device a measured launch with its noise.
 */
import { softMinLog } from '../shared/flight/aimed-speed';
import { BALL_SIZES, SIDESPIN_STEP_RPS, SPIN_STEP_RPS, simulateKick, type FlightConditions } from '../shared/flight/index';
import { pchip } from '../shared/flight/interpolate';
import { BACKSPIN_STEPS, SIDESPIN_STEPS, type Outcome, type Technique } from '../shared/vocabulary';
import type { Prng } from './prng';
import { kickingAt, type TrueKicking, type TrueTechnique } from './truth';

export type { Outcome };

/** Distance of the wall from the ball, m (IFAB Laws of the Game, Law 13). */
const WALL_DISTANCE_M = 9.15;
/** Width of a training wall of mannequins, m (common practice: four to five mannequins). */
const WALL_WIDTH_M = 4;
/** Gap between the aim line and the wall's near edge when the ball is driven past it, m (common practice). */
const DRIVEN_PAST_GAP_M = 0.4;
/** Height of the crossbar's lower edge, m (IFAB Laws of the Game, Law 1). */
const BAR_HEIGHT_M = 2.44;
/** Training mannequin heights per squad, m (common practice: adult and youth free-kick mannequins). */
export const WALL_HEIGHT_M = { first: 1.85, u16: 1.75, u14: 1.6 } as const;

/** Speed nodes of the intention table, m/s (log-spaced). */
const NODE_MIN_MS = 4;
const NODE_MAX_MS = 50;
const NODES = 20;
const DEG = Math.PI / 180;

/** Standard conditions of a player's intention: still air, ISA sea level, 15 °C, the session's ball. */
function intentionConditions(ballSize: 3 | 4 | 5): FlightConditions {
  const b = BALL_SIZES[ballSize];
  return { ball: { massKg: b.massKg, radiusM: b.radiusM }, air: { altitudeM: 0, temperatureC: 15 } };
}

/**
 * The player's usual ball of one technique in standard conditions, flown at 20 speeds: what speed a
 * target needs (the player judges distance, not the air) and how far it curls, so they aim off for it.
 */
export class IntentionTable {
  private readonly lnSpeed: number[] = [];
  private readonly lnCarry: number[] = [];
  private readonly curlRad: number[] = [];

  constructor(launch: Pick<TrueKicking, 'elevationDeg' | 'backspinRps' | 'sidespinRps'>, ballSize: 3 | 4 | 5) {
    const conditions = intentionConditions(ballSize);
    const [a, b] = [Math.log(NODE_MIN_MS), Math.log(NODE_MAX_MS)];
    for (let k = 0; k < NODES; k++) {
      const lv = a + ((b - a) * k) / (NODES - 1);
      const f = simulateKick({ ...conditions, speed: Math.exp(lv), ...launch });
      const lc = Math.log(Math.max(1e-3, f.carryM));
      if (this.lnCarry.length && lc <= this.lnCarry[this.lnCarry.length - 1]!) continue;
      this.lnSpeed.push(lv);
      this.lnCarry.push(lc);
      this.curlRad.push(Math.atan2(f.landing.y, f.landing.x));
    }
  }

  /** ln of the speed that carries `distanceM`. */
  lnNeedFor(distanceM: number): number {
    return pchip(this.lnCarry, this.lnSpeed, Math.log(distanceM));
  }

  /** Angle (rad, + = left) by which a ball struck at exp(lnSpeed) curls off its launch direction. */
  curlAt(lnSpeed: number): number {
    return pchip(this.lnSpeed, this.curlRad, lnSpeed);
  }
}

/** Cache of intention tables per player, technique, foot side and ball. */
export class Intentions {
  private readonly tables = new Map<string, IntentionTable>();

  /** The table of `kicking`'s mean launch with this ball. */
  of(key: string, kicking: TrueKicking, ballSize: 3 | 4 | 5): IntentionTable {
    const k = `${key}|${Math.sign(kicking.sidespinRps)}|${ballSize}`;
    let t = this.tables.get(k);
    if (!t) {
      t = new IntentionTable(kicking, ballSize);
      this.tables.set(k, t);
    }
    return t;
  }
}

/** The launch of one repetition. */
export interface TrueLaunch {
  speedMs: number;
  elevationDeg: number;
  azimuthDeg: number;
  backspinRps: number;
  sidespinRps: number;
}

/** One repetition as it really happened. */
export interface FlownRepetition {
  launch: TrueLaunch;
  /** Landing point: x along the line to the target, y to the kicker's left, m. */
  landing: { x: number; y: number };
  /** For free-kick drills: the height of the ball's underside at the wall and of its top at the target line (null: not reached). */
  wallUndersideM: number | null;
  wallLateralM: number | null;
  goalTopM: number | null;
}

/** What one repetition is aimed at, and in which conditions. */
export interface RepetitionContext {
  /** Key of the player and technique (for the intention cache). */
  key: string;
  truth: TrueTechnique;
  /** 0 at the start of week one … 1 at the end of week eight. */
  progress: number;
  weakFoot: boolean;
  targetDistanceM: number;
  ballSize: 3 | 4 | 5;
  /** The session's conditions, exactly as the profile fit will read them. */
  conditions: FlightConditions;
  freeKick: boolean;
}

/** Draws the launch of one repetition from the truth (the same order of draws every time) and flies it. */
export function flyRepetition(prng: Prng, intentions: Intentions, rep: RepetitionContext): FlownRepetition {
  const k = kickingAt(rep.truth, rep.progress, rep.weakFoot);
  const table = intentions.of(rep.key, k, rep.ballSize);
  const lnIntended = softMinLog(table.lnNeedFor(rep.targetDistanceM), Math.log(k.ceilingMs));
  const launch: TrueLaunch = {
    speedMs: Math.exp(lnIntended + k.offsetLogMean + k.offsetLogSd * prng.normal()),
    elevationDeg: Math.max(1, k.elevationDeg + k.sdElevationDeg * prng.normal()),
    // The player aims off for the curl of the ball they meant to strike.
    azimuthDeg: -table.curlAt(lnIntended) / DEG + k.aimBiasDeg + k.sdAimDeg * prng.normal(),
    backspinRps: k.backspinRps + k.sdBackspinRps * prng.normal(),
    sidespinRps: k.sidespinRps + k.sdSidespinRps * prng.normal(),
  };
  const flight = simulateKick({
    ...rep.conditions,
    speed: launch.speedMs,
    elevationDeg: launch.elevationDeg,
    azimuthDeg: launch.azimuthDeg,
    backspinRps: launch.backspinRps,
    sidespinRps: launch.sidespinRps,
    planes: rep.freeKick ? [WALL_DISTANCE_M, rep.targetDistanceM] : undefined,
  });
  const radiusM = (rep.conditions.ball ?? { radiusM: BALL_SIZES[5].radiusM }).radiusM;
  const wall = rep.freeKick ? flight.crossings.find((c) => Math.abs(c.x - WALL_DISTANCE_M) < 1e-6) : undefined;
  const goal = rep.freeKick ? flight.crossings.find((c) => Math.abs(c.x - rep.targetDistanceM) < 1e-6) : undefined;
  return {
    launch,
    landing: flight.landing,
    wallUndersideM: wall ? wall.z : null,
    wallLateralM: wall ? wall.y : null,
    goalTopM: goal ? goal.z + 2 * radiusM : null,
  };
}

/** Rounds to the nearest half unit — 0.5 m is what a coach pacing out a landing spot resolves (never −0). */
export function roundToHalf(x: number): number {
  const r = Math.round(x * 2) / 2;
  return r === 0 ? 0 : r;
}

/** Where a coach saw the ball come down: paced distance from the kick spot and offset from the line, to 0.5 m. */
export interface SeenLanding {
  carryM: number;
  lateralM: number;
}

/** The landing as paced out. */
export function seenLanding(rep: FlownRepetition): SeenLanding {
  return { carryM: roundToHalf(Math.hypot(rep.landing.x, rep.landing.y)), lateralM: roundToHalf(rep.landing.y) };
}

/**
 * The outcome a coach calls for a landing point: on target when the landing lies within the
 * target radius (distance in the plane), otherwise the dominant miss direction — short/long
 * when the carry error is at least as large as the lateral error, else left/right.
 */
export function classifyLanding(landing: SeenLanding, targetDistanceM: number, targetRadiusM: number): Outcome {
  const carryErrorM = landing.carryM - targetDistanceM;
  if (Math.hypot(carryErrorM, landing.lateralM) <= targetRadiusM) return 'on_target';
  if (Math.abs(carryErrorM) >= Math.abs(landing.lateralM)) return carryErrorM < 0 ? 'short' : 'long';
  return landing.lateralM > 0 ? 'left' : 'right';
}

/**
 * A free-kick drill's extra calls: `blocked` when the ball reached the wall of mannequins no higher than
 * their heads within the wall's width, `over` when it crossed the target line above the bar; else null.
 * A curled ball goes over a wall standing across the aim line; a driven one past a wall standing just to
 * its right.
 */
export function freeKickOutcome(rep: FlownRepetition, technique: Technique, wallHeightM: number): Outcome | null {
  const y = rep.wallLateralM ?? 0;
  const inWall =
    technique === 'driven' ? y <= -DRIVEN_PAST_GAP_M && y >= -DRIVEN_PAST_GAP_M - WALL_WIDTH_M : Math.abs(y) <= WALL_WIDTH_M / 2;
  if (rep.wallUndersideM !== null && rep.wallUndersideM <= wallHeightM && inWall) return 'blocked';
  if (rep.goalTopM !== null && rep.goalTopM > BAR_HEIGHT_M) return 'over';
  return null;
}

/** Spread of a coach's by-eye spin judgement, rev/s: 1 rev/s plus 15 % of the rate (common practice: about a step). */
function eyeSdRps(rps: number): number {
  return 1 + 0.15 * Math.abs(rps);
}

/** The nearest step to a rate, with the coach's eye error. */
function stepByEye<S extends number>(prng: Prng, rps: number, steps: readonly S[], rate: Readonly<Record<S, number>>): S {
  const seen = rps + eyeSdRps(rps) * prng.normal();
  let best = steps[0]!;
  for (const s of steps) if (Math.abs(rate[s] - seen) < Math.abs(rate[best] - seen)) best = s;
  return best;
}

/** The spin steps a coach logs for a launch, judged by eye. */
export function spinStepsByEye(prng: Prng, launch: TrueLaunch): { backspinStep: number; sidespinStep: number } {
  return {
    backspinStep: stepByEye(prng, launch.backspinRps, BACKSPIN_STEPS, SPIN_STEP_RPS),
    sidespinStep: stepByEye(prng, launch.sidespinRps, SIDESPIN_STEPS, SIDESPIN_STEP_RPS),
  };
}

/** What a ball-tracking device reports at launch (rounded like one). */
export interface LaunchMeasurement {
  speedMs: number;
  launchAngleDeg: number;
  spinRps: number;
}

/** A device's reading of the true launch: ±2 % speed, ±0.7° angle, ±0.8 rev/s spin (common practice for radar units). */
export function measureLaunch(prng: Prng, launch: TrueLaunch): LaunchMeasurement {
  const round1 = (x: number): number => Math.round(x * 10) / 10;
  return {
    speedMs: round1(launch.speedMs * (1 + 0.02 * prng.normal())),
    launchAngleDeg: round1(Math.max(0.5, launch.elevationDeg + 0.7 * prng.normal())),
    spinRps: round1(Math.min(30, Math.max(0.1, Math.hypot(launch.backspinRps, launch.sidespinRps) + 0.8 * prng.normal()))),
  };
}
