import type { Outcome, Technique } from '../../../shared/schemas/sync';

/*
 * Pitchside's words for the values the sync schema stores, in one place so the pad, the
 * entry list and the editor all say the same thing. Types come from the shared schema; the
 * values are repeated here (not imported) to keep zod out of the code every screen loads.
 */

/** Outcomes in pad order: the three along the target line first (the usual results), then the misses. */
export const OUTCOME_ORDER: readonly Outcome[] = ['short', 'on_target', 'long', 'left', 'right', 'blocked', 'over'];

/** Label of each outcome. */
export const OUTCOME_LABELS: Record<Outcome, string> = {
  on_target: 'On target',
  short: 'Short',
  long: 'Long',
  left: 'Left',
  right: 'Right',
  blocked: 'Blocked',
  over: 'Over',
};

/** Techniques in the order coaches usually run them. */
export const TECHNIQUE_ORDER: readonly Technique[] = ['driven', 'lofted', 'chipped', 'curled'];

/** Label of each technique. */
export const TECHNIQUE_LABELS: Record<Technique, string> = {
  driven: 'Driven',
  lofted: 'Lofted',
  chipped: 'Chipped',
  curled: 'Curled',
};

/** The seven-step backspin scale (docs/design.md §3), + = backspin, − = topspin. */
export function backspinLabel(step: number): string {
  const labels: Record<number, string> = {
    3: 'heavy backspin',
    2: 'backspin',
    1: 'light backspin',
    0: 'no spin',
    [-1]: 'light topspin',
    [-2]: 'topspin',
    [-3]: 'heavy topspin',
  };
  return labels[step] ?? `${step}`;
}

/** The five-step sidespin scale (docs/design.md §3), + = curls to the left. */
export function sidespinLabel(step: number): string {
  const labels: Record<number, string> = {
    2: 'strong left curl',
    1: 'left curl',
    0: 'no curl',
    [-1]: 'right curl',
    [-2]: 'strong right curl',
  };
  return labels[step] ?? `${step}`;
}

/** Where the wind comes from, relative to the main kicking direction. */
export type WindDirection = 'calm' | 'headwind' | 'tailwind' | 'from_left' | 'from_right';

/** Wind directions as the coach taps them, with the stored `windFromDeg` (0 = headwind, 90 = from the left). */
export const WIND_DIRECTIONS: readonly { readonly value: WindDirection; readonly label: string; readonly fromDeg: number | null }[] = [
  { value: 'headwind', label: 'Headwind', fromDeg: 0 },
  { value: 'tailwind', label: 'Tailwind', fromDeg: 180 },
  { value: 'from_left', label: 'From left', fromDeg: 90 },
  { value: 'from_right', label: 'From right', fromDeg: 270 },
  { value: 'calm', label: 'Calm', fromDeg: null },
];

/** How strong the wind is, as the coach judges it on the pitch. */
export type WindStrength = 'light' | 'moderate' | 'strong';

/**
 * Wind strengths and the speed stored for each. Beaufort scale (WMO): "light breeze" force 2
 * is 1.6–3.3 m/s, "moderate breeze" force 4 is 5.5–7.9 m/s, "strong breeze" force 6 is
 * 10.8–13.8 m/s; each value sits inside its band.
 */
export const WIND_STRENGTHS: readonly { readonly value: WindStrength; readonly label: string; readonly speedMs: number }[] = [
  { value: 'light', label: 'Light', speedMs: 3 },
  { value: 'moderate', label: 'Moderate', speedMs: 6 },
  { value: 'strong', label: 'Strong', speedMs: 11 },
];

/** The coach's words for stored wind values, e.g. "headwind moderate", "calm", or null if not recorded. */
export function windLabel(speedMs: number | null | undefined, fromDeg: number | null | undefined): string | null {
  if (speedMs === null || speedMs === undefined) {
    return null;
  }
  if (speedMs < 0.5) {
    return 'calm';
  }
  const direction =
    fromDeg === null || fromDeg === undefined
      ? 'wind'
      : (WIND_DIRECTIONS.find((d) => d.fromDeg !== null && angleDistance(d.fromDeg, fromDeg) <= 45)?.label.toLowerCase() ?? 'wind');
  const strength =
    [...WIND_STRENGTHS]
      .reverse()
      .find((s) => speedMs >= s.speedMs - 1.5)
      ?.label.toLowerCase() ?? 'light';
  return `${direction} ${strength}`;
}

function angleDistance(a: number, b: number): number {
  const d = Math.abs(a - b) % 360;
  return d > 180 ? 360 - d : d;
}
