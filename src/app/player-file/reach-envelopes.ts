import { Injectable, inject } from '@angular/core';
import { Observable, defer, forkJoin, from, map, of, switchMap, tap } from 'rxjs';
import {
  BALL_SIZES,
  type FlightConditions,
  type KickProfile,
  type ReachEnvelope,
} from '../../../shared/flight';
import type { ProfileEntry } from '../../../shared/schemas/analysis';
import type { Technique } from '../../../shared/schemas/sync';
import { AuthSession } from '../core/auth-session';
import { FlightEngine } from '../flight/flight-engine';
import { ANSWER_STORE } from './cached-answer';
import { type NextTargetResult, bestTarget, nextTarget } from './next-target';

/**
 * Samples and seed of the standard-conditions envelope. They match the server's cached envelope
 * (the one behind `reliableReachM` in a profile answer), so the number the server reports and the
 * cloud drawn here agree to the decimetre.
 */
export const ENVELOPE_SAMPLES = 1000;
/** See {@link ENVELOPE_SAMPLES}. */
export const ENVELOPE_SEED = 20_260_101;

/** Standard conditions of Loftline's comparisons: ISA sea level, 15 °C, still air, with the squad's ball. */
export function standardConditions(ballSize: number): FlightConditions {
  const ball = BALL_SIZES[ballSize === 3 || ballSize === 4 ? ballSize : 5];
  return { ball: { massKg: ball.massKg, radiusM: ball.radiusM }, air: { altitudeM: 0, temperatureC: 15 } };
}

/** What the Player file and Squad week show about one player's reach in one technique. */
export interface ReachAnalysis {
  readonly technique: Technique;
  readonly envelope: ReachEnvelope;
  /** Ball size of the standard conditions the envelope was computed in. */
  readonly ballSize: number;
  /** Target radius reliable reach and the next target use: the player's usual drill radius. */
  readonly radiusM: number;
  readonly reliableReachM: number | null;
  /**
   * Reliable reach with the fitted mean launch speed one standard error lower and higher: how far
   * the number could move on the evidence so far. Null when not asked for, or when no distance
   * reaches the threshold at that speed.
   */
  readonly reliableReachLowM: number | null;
  readonly reliableReachHighM: number | null;
  /** Whether the range was computed (false: only the central envelope). */
  readonly hasRange: boolean;
  readonly nextTarget: NextTargetResult;
  /** The distance most likely to be hit with the usual radius (what to say when there is no reliable reach). */
  readonly bestTarget: { readonly distanceM: number; readonly probability: number };
}

/** The profile with its mean launch speed moved by `shiftSe` standard errors, taken as known. */
function shifted(profile: KickProfile, shiftSe: number): KickProfile {
  return {
    ...profile,
    meanSpeedMs: Math.max(1, profile.meanSpeedMs + shiftSe * profile.meanSpeedSeMs),
    meanSpeedSeMs: 0,
  };
}

/**
 * Reach envelopes of fitted launch profiles at standard conditions, computed in the flight worker
 * and kept on the device (keyed by the profile's computation time, so a refreshed profile gets a
 * fresh envelope), so the Player file opens offline with its diagram. Also derives the next drill
 * target and the uncertainty of reliable reach.
 */
@Injectable({ providedIn: 'root' })
export class ReachEnvelopes {
  private readonly engine = inject(FlightEngine);
  private readonly store = inject(ANSWER_STORE);
  private readonly session = inject(AuthSession);

  /**
   * The analysis of a profile entry, or null when it has no profile yet. With `withRange`, two
   * more envelopes (mean launch speed ±1 standard error) give the uncertainty of reliable reach.
   */
  analyse(entry: ProfileEntry, ballSize: number, withRange: boolean): Observable<ReachAnalysis | null> {
    const profile = entry.profile;
    if (profile === null) {
      return of(null);
    }
    const radiusM = entry.reachRadiusM;
    const conditions = standardConditions(ballSize);
    const keyOf = (variant: string): string =>
      `${this.session.user()?.id ?? 'signed-out'}|envelope:${entry.playerId}:${entry.technique}:${entry.computedAt ?? 'none'}:${ballSize}:${ENVELOPE_SAMPLES}:${ENVELOPE_SEED}:${radiusM}:${variant}`;
    const central = this.envelope(keyOf('central'), profile, conditions, radiusM);
    const range: Observable<[number | null, number | null] | null> = withRange
      ? forkJoin([
          this.envelope(keyOf('low'), shifted(profile, -1), conditions, radiusM),
          this.envelope(keyOf('high'), shifted(profile, 1), conditions, radiusM),
        ]).pipe(map(([low, high]) => [low.reliableReach.distanceM, high.reliableReach.distanceM]))
      : of(null);
    return forkJoin([central, range]).pipe(
      map(([envelope, bounds]) => ({
        technique: entry.technique,
        envelope,
        ballSize,
        radiusM,
        reliableReachM: envelope.reliableReach.distanceM,
        reliableReachLowM: bounds?.[0] ?? null,
        reliableReachHighM: bounds?.[1] ?? null,
        hasRange: bounds !== null,
        nextTarget: nextTarget(envelope, radiusM),
        bestTarget: bestTarget(envelope, radiusM),
      })),
    );
  }

  private envelope(key: string, profile: KickProfile, conditions: FlightConditions, radiusM: number): Observable<ReachEnvelope> {
    const compute = defer(() =>
      this.engine.envelope(profile, conditions, { samples: ENVELOPE_SAMPLES, seed: ENVELOPE_SEED, reliableReachRadiusM: radiusM }),
    ).pipe(tap((envelope) => void this.store.put(key, 'envelope', envelope).catch(() => undefined)));
    // Same profile, conditions and seed give the same numbers, so a cached envelope is never stale.
    return defer(() => from(this.store.get<ReachEnvelope>(key).catch(() => undefined))).pipe(
      switchMap((cached) => (cached ? of(cached) : compute)),
    );
  }
}
