import type { Outcome, Technique } from '../../../../shared/schemas/sync';

/*
 * The analysis screens' words for techniques and outcomes, shared by the charts, their tables and
 * the screens around them. The values repeat the shared schema's lists (types are imported, values
 * are not) so zod stays out of the chart code.
 */

/** Techniques in the order coaches usually run them. */
export const TECHNIQUE_ORDER: readonly Technique[] = ['driven', 'lofted', 'chipped', 'curled'];

/** Label of each technique. */
export const TECHNIQUE_LABELS: Readonly<Record<Technique, string>> = {
  driven: 'Driven',
  lofted: 'Lofted',
  chipped: 'Chipped',
  curled: 'Curled',
};

/** Outcomes with on target first, then the misses along the line, then sideways, then the rest. */
export const OUTCOME_ORDER: readonly Outcome[] = ['on_target', 'short', 'long', 'left', 'right', 'blocked', 'over'];

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

/** Whether a string names a technique (query parameters arrive as plain strings). */
export function isTechnique(value: unknown): value is Technique {
  return typeof value === 'string' && (TECHNIQUE_ORDER as readonly string[]).includes(value);
}

const BACKSPIN_LABELS: Readonly<Record<number, string>> = {
  3: 'heavy backspin',
  2: 'backspin',
  1: 'light backspin',
  0: 'no spin',
  [-1]: 'light topspin',
  [-2]: 'topspin',
  [-3]: 'heavy topspin',
};

const SIDESPIN_LABELS: Readonly<Record<number, string>> = {
  2: 'strong left curl',
  1: 'left curl',
  0: 'no curl',
  [-1]: 'right curl',
  [-2]: 'strong right curl',
};

/** A step of the seven-step backspin scale in words (+ = backspin, − = topspin). */
export function backspinLabel(step: number): string {
  return BACKSPIN_LABELS[step] ?? `step ${step}`;
}

/** A step of the five-step sidespin scale in words (+ = curls to the left). */
export function sidespinLabel(step: number): string {
  return SIDESPIN_LABELS[step] ?? `step ${step}`;
}
