import { Injectable, inject } from '@angular/core';
import { Observable, defer, forkJoin, from, map, of, switchMap, tap } from 'rxjs';
import {
  BALL_SIZES,
  CURVE_SAMPLES,
  type FlightConditions,
  type KickProfile,
  type ReachCurve,
  type ReachEnvelope,
} from '../../../../shared/flight';
import type { ProfileEntry } from '../../../../shared/schemas/analysis';
import type { Technique } from '../../../../shared/schemas/sync';
import { AuthSession } from '../auth/auth-session';
import { ClubSettingsStore } from '../club-settings-store';
import { FlightEngine } from '../../flight/flight-engine';
import { ANSWER_STORE } from '../offline-cache';
import { type NextTargetResult, bestTarget, nextTarget } from './next-target';

/**
 * Samples and seed of the standard-conditions envelope and its reach curve. They match the server's
 * cached curve (the one behind `reliableReachM` in a profile answer), so the number the server reports
 * and the one computed here agree.
 */
export const ENVELOPE_SAMPLES = CURVE_SAMPLES;
/** See {@link ENVELOPE_SAMPLES}. */
export const ENVELOPE_SEED = 20_260_101;

/**
 * Standard conditions of Loftline's comparisons: ISA sea level, 15 °C, still air, with the squad's ball
 * (and the club's drag crisis when it has set one, as the server's fits use).
 */
export function standardConditions(ballSize: number, dragCrisisRe?: number): FlightConditions {
  const ball = BALL_SIZES[ballSize === 3 || ballSize === 4 ? ballSize : 5];
  const conditions: FlightConditions = { ball: { massKg: ball.massKg, radiusM: ball.radiusM }, air: { altitudeM: 0, temperatureC: 15 } };
  if (dragCrisisRe !== undefined) conditions.aero = { dragCrisisRe };
  return conditions;
}

/** What the Player file and Squad week show about one player's reach in one technique. */
export interface ReachAnalysis {
  readonly technique: Technique;
  /** Landing cloud of kicks aimed at the player's typical target distance. */
  readonly envelope: ReachEnvelope;
  /** Hit probability of kicks aimed at each distance: behind reliable reach, drill targets and the next target. */
  readonly curve: ReachCurve;
  /** Ball size of the standard conditions the envelope was computed in. */
  readonly ballSize: number;
  /** Target radius reliable reach and the next target use: the player's usual drill radius. */
  readonly radiusM: number;
  readonly reliableReachM: number | null;
  /**
   * Lowest and highest reliable reach with the fitted mean launch-speed offset one standard error
   * softer and harder: how far the number could move on the evidence so far. Low is null when not
   * asked for, or when some shifted fit reaches no distance at the threshold.
   */
  readonly reliableReachLowM: number | null;
  readonly reliableReachHighM: number | null;
  /** Whether the range was computed (false: only the central envelope). */
  readonly hasRange: boolean;
  readonly nextTarget: NextTargetResult;
  /** The distance most likely to be hit with the usual radius (what to say when there is no reliable reach). */
  readonly bestTarget: { readonly distanceM: number; readonly probability: number };
}

/**
 * Lowest and highest reliable reach over the central fit and the two shifted ones. Striking harder
 * than a target needs costs hits as much as striking softer, so either shift can lower the reach: the
 * range is taken over all three, not read off as low/high.
 */
function reachRange(
  central: number | null,
  bounds: [number | null, number | null] | null,
): { reliableReachLowM: number | null; reliableReachHighM: number | null } {
  if (bounds === null) {
    return { reliableReachLowM: null, reliableReachHighM: null };
  }
  const values = [central, ...bounds].filter((v): v is number => v !== null);
  if (values.length === 0) {
    return { reliableReachLowM: null, reliableReachHighM: null };
  }
  const low = bounds.includes(null) ? null : Math.min(...values);
  return { reliableReachLowM: low, reliableReachHighM: Math.max(...values) };
}

/** The profile with its mean launch-speed offset moved by `shiftSe` standard errors, taken as known. */
function shifted(profile: KickProfile, shiftSe: number): KickProfile {
  const a = profile.aimedSpeed;
  return {
    ...profile,
    aimedSpeed: { ...a, offsetLogMean: a.offsetLogMean + shiftSe * a.offsetLogMeanSe, offsetLogMeanSe: 0 },
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
  private readonly clubSettings = inject(ClubSettingsStore);

  /**
   * The analysis of a profile entry, or null when it has no profile yet. With `withRange`, two
   * more envelopes (mean launch-speed offset ±1 standard error) give the uncertainty of reliable reach.
   */
  analyse(entry: ProfileEntry, ballSize: number, withRange: boolean): Observable<ReachAnalysis | null> {
    const profile = entry.profile;
    if (profile === null) {
      return of(null);
    }
    const radiusM = entry.reachRadiusM;
    const dragCrisisRe = this.clubSettings.settings().dragCrisisRe;
    const conditions = standardConditions(ballSize, dragCrisisRe);
    const keyOf = (variant: string): string =>
      `${this.session.user()?.id ?? 'signed-out'}|envelope-aimed:${entry.playerId}:${entry.technique}:${entry.computedAt ?? 'none'}:${ballSize}:${dragCrisisRe ?? '-'}:${ENVELOPE_SAMPLES}:${ENVELOPE_SEED}:${radiusM}:${variant}`;
    const central = this.envelope(keyOf('central'), profile, conditions, radiusM);
    const range: Observable<[number | null, number | null] | null> = withRange
      ? forkJoin([
          this.envelope(keyOf('low'), shifted(profile, -1), conditions, radiusM),
          this.envelope(keyOf('high'), shifted(profile, 1), conditions, radiusM),
        ]).pipe(map(([low, high]) => [low.reliableReach.distanceM, high.reliableReach.distanceM]))
      : of(null);
    return forkJoin([central, range]).pipe(
      map(([envelope, bounds]) => {
        const curve = envelope.curve;
        if (curve === null) {
          throw new RangeError('the envelope came without its reach curve');
        }
        return {
          technique: entry.technique,
          envelope,
          curve,
          ballSize,
          radiusM,
          reliableReachM: envelope.reliableReach.distanceM,
          ...reachRange(envelope.reliableReach.distanceM, bounds),
          hasRange: bounds !== null,
          nextTarget: nextTarget(curve, radiusM),
          bestTarget: bestTarget(curve, radiusM),
        };
      }),
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
