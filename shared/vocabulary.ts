/**
 * The product's vocabulary, defined once (docs/design.md §3): techniques, outcomes, feet and the spin
 * scales, in their canonical order, with the words the screens use for them. The database schema, the
 * zod schemas, the flight model, the seed, the server and the client all import these lists, so a new
 * value is added here and nowhere else. Plain TypeScript without zod, so screens that only need the
 * words do not load the validator.
 */

/** Kicking techniques, in the order coaches usually run them. */
export const TECHNIQUES = ['driven', 'lofted', 'chipped', 'curled'] as const;
export type Technique = (typeof TECHNIQUES)[number];

/** Outcomes of a repetition: on target, the misses along the line, sideways, then wall and bar. */
export const OUTCOMES = ['on_target', 'short', 'long', 'left', 'right', 'blocked', 'over'] as const;
export type Outcome = (typeof OUTCOMES)[number];

/** The foot a kick is struck with (a player's dominant foot uses the same words). */
export const FEET = ['left', 'right'] as const;
export type Foot = (typeof FEET)[number];

/** The seven-step backspin scale as stored: + = backspin, − = topspin. */
export const BACKSPIN_STEPS = [-3, -2, -1, 0, 1, 2, 3] as const;
export type BackspinStep = (typeof BACKSPIN_STEPS)[number];

/** The five-step sidespin scale as stored: + = curls to the kicker's left. */
export const SIDESPIN_STEPS = [-2, -1, 0, 1, 2] as const;
export type SidespinStep = (typeof SIDESPIN_STEPS)[number];

/** Label of each technique. */
export const TECHNIQUE_LABELS: Readonly<Record<Technique, string>> = {
  driven: 'Driven',
  lofted: 'Lofted',
  chipped: 'Chipped',
  curled: 'Curled',
};

/** Label of each outcome. */
export const OUTCOME_LABELS: Readonly<Record<Outcome, string>> = {
  on_target: 'On target',
  short: 'Short',
  long: 'Long',
  left: 'Left',
  right: 'Right',
  blocked: 'Blocked',
  over: 'Over',
};

/** Label of each foot. */
export const FOOT_LABELS: Readonly<Record<Foot, string>> = { left: 'Left foot', right: 'Right foot' };

const BACKSPIN_LABELS: Readonly<Record<BackspinStep, string>> = {
  3: 'heavy backspin',
  2: 'backspin',
  1: 'light backspin',
  0: 'no spin',
  [-1]: 'light topspin',
  [-2]: 'topspin',
  [-3]: 'heavy topspin',
};

const SIDESPIN_LABELS: Readonly<Record<SidespinStep, string>> = {
  2: 'strong left curl',
  1: 'left curl',
  0: 'no curl',
  [-1]: 'right curl',
  [-2]: 'strong right curl',
};

/** A step of the backspin scale in words; a value off the scale is shown as its number. */
export function backspinLabel(step: number): string {
  return BACKSPIN_LABELS[step as BackspinStep] ?? `step ${step}`;
}

/** A step of the sidespin scale in words; a value off the scale is shown as its number. */
export function sidespinLabel(step: number): string {
  return SIDESPIN_LABELS[step as SidespinStep] ?? `step ${step}`;
}

/** Whether a string names a technique (query parameters and CSV cells arrive as plain strings). */
export function isTechnique(value: unknown): value is Technique {
  return typeof value === 'string' && (TECHNIQUES as readonly string[]).includes(value);
}

/**
 * Where a kick's measured launch (speed, angle, spin) came from: a ball-measuring device's export, or a
 * side-on phone video solved through the flight model (`solveLaunchFromTrack`).
 */
export const MEASURED_SOURCES = ['device', 'video'] as const;
export type MeasuredSource = (typeof MEASURED_SOURCES)[number];
