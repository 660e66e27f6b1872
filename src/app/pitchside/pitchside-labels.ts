import type { Outcome } from '../../../shared/vocabulary';

/*
 * Pitchside's own words and layouts. The vocabulary (techniques, outcomes, spin scales and their
 * labels) is defined once in `shared/vocabulary.ts`; what lives here is how Pitchside lays it out
 * and the coach's wind words.
 */

/** Outcomes in pad order: the three along the target line first (the usual results), then the misses. */
export const PAD_OUTCOMES: readonly Outcome[] = ['short', 'on_target', 'long', 'left', 'right', 'blocked', 'over'];

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
