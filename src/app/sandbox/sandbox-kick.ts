/**
 * The Flight sandbox's kick: the launch and conditions one set of sliders edits, the ranges the sliders
 * and number fields allow, the permalink codec (so a what-if can be sent to a colleague) and what the
 * results table shows for a computed flight. Pure functions, no Angular, so they are tested directly.
 */

import {
  BALL_SIZES,
  COACH_WIND_HEIGHT_M,
  GOAL_HEIGHT_M,
  GOAL_WIDTH_M,
  LIMITS,
  WALL_DISTANCE_M,
  type Flight,
  type KickInput,
} from '../../../shared/flight';

/** Ball sizes a club trains with (IFAB Laws of the Game, Law 2 for size 5; 3 and 4 common practice). */
export type SandboxBallSize = 3 | 4 | 5;

/** One kick of the sandbox, every value in the unit its name says. */
export interface SandboxKick {
  speedMs: number;
  elevationDeg: number;
  /** + = left of the aim. */
  azimuthDeg: number;
  /** + = backspin, − = topspin. */
  backspinRps: number;
  /** + = curls left. */
  sidespinRps: number;
  /** Wind as a coach would judge it, at head height (COACH_WIND_HEIGHT_M); the model scales it to the ball's height. */
  windSpeedMs: number;
  /** Where the wind comes from: 0 = from the target (headwind), 90 = from the left, 180 = tailwind. */
  windFromDeg: number;
  temperatureC: number;
  altitudeM: number;
  humidityPct: number;
  ballSize: SandboxBallSize;
}

/** The numeric fields of a kick (everything but the ball size). */
export type SandboxNumberField = Exclude<keyof SandboxKick, 'ballSize'>;

/** Every value a slider edits: a kick's numbers and the shared goal-line distance. */
export type SandboxFieldKey = SandboxNumberField | 'goalDistanceM';

/** How one numeric field is edited: the slider's usual range and the wider range a typed number may use. */
export interface FieldSpec<K extends SandboxFieldKey = SandboxFieldKey> {
  readonly key: K;
  readonly label: string;
  readonly unit: string;
  /** Slider range: where almost every real kick lies. */
  readonly sliderMin: number;
  readonly sliderMax: number;
  /** Typed values may go this far (within the flight model's LIMITS). */
  readonly min: number;
  readonly max: number;
  readonly step: number;
  /** A short note under the field, e.g. what the sign means. */
  readonly hint?: string;
}

/** The numeric fields in screen order, grouped as the screen groups them. */
export const LAUNCH_FIELDS: readonly FieldSpec<SandboxNumberField>[] = [
  { key: 'speedMs', label: 'Speed', unit: 'm/s', sliderMin: 5, sliderMax: 40, min: 1, max: LIMITS.speedMs[1], step: 0.5 },
  { key: 'elevationDeg', label: 'Elevation', unit: '°', sliderMin: 1, sliderMax: 70, min: 1, max: 85, step: 1 },
  {
    key: 'azimuthDeg',
    label: 'Azimuth',
    unit: '°',
    sliderMin: -15,
    sliderMax: 15,
    min: -45,
    max: 45,
    step: 0.5,
    hint: '+ left of the aim',
  },
  {
    key: 'backspinRps',
    label: 'Backspin',
    unit: 'rev/s',
    sliderMin: -15,
    sliderMax: 15,
    min: LIMITS.spinRps[0],
    max: LIMITS.spinRps[1],
    step: 0.5,
    hint: '− = topspin',
  },
  {
    key: 'sidespinRps',
    label: 'Sidespin',
    unit: 'rev/s',
    sliderMin: -15,
    sliderMax: 15,
    min: LIMITS.spinRps[0],
    max: LIMITS.spinRps[1],
    step: 0.5,
    hint: '+ curls left',
  },
];

/** Conditions fields in screen order. */
export const CONDITION_FIELDS: readonly FieldSpec<SandboxNumberField>[] = [
  {
    key: 'windSpeedMs',
    label: 'Wind',
    unit: 'm/s',
    sliderMin: 0,
    sliderMax: 15,
    min: 0,
    max: LIMITS.windSpeedMs[1],
    step: 0.5,
    hint: 'as felt at head height; weaker near the grass',
  },
  {
    key: 'windFromDeg',
    label: 'Wind from',
    unit: '°',
    sliderMin: 0,
    sliderMax: 345,
    min: 0,
    max: 359,
    step: 15,
    hint: '0 head, 90 left, 180 tail',
  },
  {
    key: 'temperatureC',
    label: 'Temperature',
    unit: '°C',
    sliderMin: -10,
    sliderMax: 40,
    min: LIMITS.temperatureC[0],
    max: LIMITS.temperatureC[1],
    step: 1,
  },
  { key: 'altitudeM', label: 'Altitude', unit: 'm', sliderMin: 0, sliderMax: 3000, min: LIMITS.altitudeM[0], max: 5000, step: 50 },
  { key: 'humidityPct', label: 'Humidity', unit: '%', sliderMin: 0, sliderMax: 100, min: 0, max: 100, step: 5 },
];

/** Where the goal line is for "height at the goal line", m from the ball along the aim. */
export const GOAL_DISTANCE_FIELD: FieldSpec<'goalDistanceM'> = {
  key: 'goalDistanceM',
  label: 'Goal line at',
  unit: 'm',
  sliderMin: 10,
  sliderMax: 60,
  min: 10,
  max: 100,
  step: 0.5,
};

/** A lofted ball struck with backspin in still air at 15 °C, sea level, size 5: the sandbox's start. */
export const DEFAULT_KICK: SandboxKick = {
  speedMs: 25,
  elevationDeg: 28,
  azimuthDeg: 0,
  backspinRps: 6,
  sidespinRps: 0,
  windSpeedMs: 0,
  windFromDeg: 0,
  temperatureC: 15,
  altitudeM: 0,
  humidityPct: 50,
  ballSize: 5,
};

/** Default distance to the goal line, m (a typical direct free kick). */
export const DEFAULT_GOAL_DISTANCE_M = 25;
/** How many kicks can be overlaid. */
export const MAX_KICKS = 3;
/** Names of the overlaid kicks, in order. */
export const KICK_NAMES = ['A', 'B', 'C'] as const;

const FIELD_ORDER: readonly SandboxNumberField[] = [...LAUNCH_FIELDS, ...CONDITION_FIELDS].map((f) => f.key);
const SPECS = new Map([...LAUNCH_FIELDS, ...CONDITION_FIELDS].map((f) => [f.key, f]));

function decimalsOf(step: number): number {
  const text = String(step);
  const dot = text.indexOf('.');
  return dot < 0 ? 0 : text.length - dot - 1;
}

/** Round to the field's step precision and keep within its typed range. */
function fit(spec: FieldSpec, value: number): number {
  const d = decimalsOf(spec.step);
  const rounded = Number(value.toFixed(d));
  return Math.min(spec.max, Math.max(spec.min, rounded));
}

/** The flight model's input for a sandbox kick, reporting crossings at the wall and the goal line. */
export function toKickInput(kick: SandboxKick, goalDistanceM: number): KickInput {
  const ball = BALL_SIZES[kick.ballSize];
  return {
    speed: kick.speedMs,
    elevationDeg: kick.elevationDeg,
    azimuthDeg: kick.azimuthDeg,
    backspinRps: kick.backspinRps,
    sidespinRps: kick.sidespinRps,
    ball: { massKg: ball.massKg, radiusM: ball.radiusM },
    air: { temperatureC: kick.temperatureC, altitudeM: kick.altitudeM, relativeHumidityPct: kick.humidityPct },
    wind: { speedMs: kick.windSpeedMs, fromDeg: kick.windFromDeg, referenceHeightM: COACH_WIND_HEIGHT_M },
    planes: [WALL_DISTANCE_M, goalDistanceM],
    path: true,
  };
}

/** The sandbox's whole state as the permalink carries it. */
export interface SandboxState {
  kicks: SandboxKick[];
  selected: number;
  goalDistanceM: number;
}

/**
 * Query parameters for a state: `k` once per kick, its values comma-separated in screen order with the
 * ball size last; `goal` the goal-line distance; `sel` the kick being edited (omitted for the first).
 */
export function encodeState(state: SandboxState): Record<string, string | string[]> {
  const params: Record<string, string | string[]> = {
    k: state.kicks.map((kick) => [...FIELD_ORDER.map((key) => String(fit(SPECS.get(key)!, kick[key]))), String(kick.ballSize)].join(',')),
    goal: String(fit(GOAL_DISTANCE_FIELD, state.goalDistanceM)),
  };
  if (state.selected > 0) params['sel'] = String(state.selected);
  return params;
}

function decodeKick(text: string): SandboxKick | null {
  const parts = text.split(',');
  if (parts.length !== FIELD_ORDER.length + 1) return null;
  const kick: SandboxKick = { ...DEFAULT_KICK };
  for (let i = 0; i < FIELD_ORDER.length; i++) {
    const value = Number(parts[i]);
    if (parts[i]!.trim() === '' || !Number.isFinite(value)) return null;
    const key = FIELD_ORDER[i]!;
    kick[key] = fit(SPECS.get(key)!, value);
  }
  const size = Number(parts[FIELD_ORDER.length]);
  if (size !== 3 && size !== 4 && size !== 5) return null;
  kick.ballSize = size;
  return kick;
}

/**
 * Read a permalink's parameters back. Garbled kicks are skipped and values outside a field's range are
 * pulled into it, so an edited or truncated link still opens something sensible; with no usable kick,
 * the default kick.
 */
export function decodeState(kickParams: readonly string[], goal: string | null, selected: string | null): SandboxState {
  const kicks = kickParams
    .map(decodeKick)
    .filter((k): k is SandboxKick => k !== null)
    .slice(0, MAX_KICKS);
  const goalValue = goal === null ? NaN : Number(goal);
  const sel = selected === null ? 0 : Number(selected);
  const list = kicks.length > 0 ? kicks : [{ ...DEFAULT_KICK }];
  return {
    kicks: list,
    selected: Number.isInteger(sel) && sel >= 0 && sel < list.length ? sel : 0,
    goalDistanceM: Number.isFinite(goalValue) ? fit(GOAL_DISTANCE_FIELD, goalValue) : DEFAULT_GOAL_DISTANCE_M,
  };
}

/** What happened at the goal line. */
export type GoalLineVerdict = 'in' | 'over' | 'wide' | 'short';

/** The figures the results table shows for one flight. */
export interface FlightFigures {
  carryM: number;
  apexM: number;
  flightTimeS: number;
  landingSpeedMs: number;
  /** Height of the ball's underside where it passes 9.15 m (null: landed before). */
  wallHeightM: number | null;
  /** Height of the top of the ball at the goal line (null: landed before). */
  goalTopHeightM: number | null;
  goalVerdict: GoalLineVerdict;
  /** Whether the ball was still in the air at the model's 30 s cap. */
  landed: boolean;
}

/** Read the figures off a flight computed with {@link toKickInput}. */
export function flightFigures(flight: Flight, kick: SandboxKick, goalDistanceM: number): FlightFigures {
  const r = BALL_SIZES[kick.ballSize].radiusM;
  const at = (d: number) => flight.crossings.find((c) => Math.abs(c.x - d) < 1e-3) ?? null;
  const wall = at(WALL_DISTANCE_M);
  const goal = at(goalDistanceM);
  let goalVerdict: GoalLineVerdict = 'short';
  // IFAB Laws of the Game, Law 1: 7.32 m between the posts, 2.44 m under the bar; the whole ball inside.
  if (goal) goalVerdict = Math.abs(goal.y) + r >= GOAL_WIDTH_M / 2 ? 'wide' : goal.z + 2 * r >= GOAL_HEIGHT_M ? 'over' : 'in';
  return {
    carryM: flight.carryM,
    apexM: flight.apexM,
    flightTimeS: flight.flightTimeS,
    landingSpeedMs: flight.landingSpeedMs,
    wallHeightM: wall ? wall.z : null,
    goalTopHeightM: goal ? goal.z + 2 * r : null,
    goalVerdict,
    landed: flight.landed,
  };
}
