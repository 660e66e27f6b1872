/**
 * Which stored kicks the profile fit can use. Sync and imports refuse values outside the model's
 * domain (`KICK_DOMAIN`), but rows stored before those checks, or written by an older server, may
 * still hold a carry of 0 or a negative spin: the fit would throw on them and the player's profile
 * would answer 500 (and Squad week would wait for it for ever). They are left out and counted.
 */
import { HANG_TIME_RANGE_S, inDomain, KICK_DOMAIN } from '../../shared/schemas/sync';
import type { StoredKick } from './flight-inputs';

/** The first field of a stored kick that the model cannot use, or null when it can use the whole kick. */
export function unusableField(k: StoredKick): string | null {
  for (const name of Object.keys(KICK_DOMAIN) as (keyof typeof KICK_DOMAIN)[]) {
    const v = k[name];
    if (v !== null && v !== undefined && !inDomain(KICK_DOMAIN[name], v)) return name;
  }
  if (k.hangTimeS !== null && k.hangTimeS !== undefined && !(k.hangTimeS >= HANG_TIME_RANGE_S[0] && k.hangTimeS <= HANG_TIME_RANGE_S[1]))
    return 'hangTimeS';
  if (!(k.targetDistanceM > 0 && k.targetDistanceM <= 150)) return 'targetDistanceM';
  if (!(k.targetRadiusM > 0 && k.targetRadiusM <= 30)) return 'targetRadiusM';
  if (!Number.isInteger(k.backspinStep) || Math.abs(k.backspinStep) > 3) return 'backspinStep';
  if (!Number.isInteger(k.sidespinStep) || Math.abs(k.sidespinStep) > 2) return 'sidespinStep';
  return null;
}

/** Splits stored kicks into those the fit can use and the number it must skip. */
export function usableKicks<K extends StoredKick>(rows: readonly K[]): { usable: K[]; skipped: number } {
  const usable = rows.filter((r) => unusableField(r) === null);
  return { usable, skipped: rows.length - usable.length };
}
