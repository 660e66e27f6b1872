import { DEFAULT_PRIORS, type KickProfile, fitProfile } from '../../../../shared/flight';
import type { PlayerKick, ProfileEntry, ProgressWeek, SquadWeek, SquadWeekPlayer } from '../../../../shared/schemas/analysis';
import type { SessionUser } from '../../../../shared/schemas/auth';
import type { PlayerSummary, SquadSummary } from '../../../../shared/schemas/squads';
import type { Outcome, Technique } from '../../../../shared/schemas/sync';

/*
 * Fixtures for the Player file and Squad week specs: small, hand-made answers in the shapes of
 * shared/schemas/analysis.ts. Nothing in the app imports this file.
 */

/** Ids that look like the server's UUIDs. */
export const FIXTURE_IDS = {
  club: '7b1d2c3e-0000-4000-8000-000000000001',
  squad: '7b1d2c3e-0000-4000-8000-0000000000a1',
  playerAda: '7b1d2c3e-0000-4000-8000-0000000000b1',
  playerBo: '7b1d2c3e-0000-4000-8000-0000000000b2',
  playerCy: '7b1d2c3e-0000-4000-8000-0000000000b3',
} as const;

/** A signed-in user of the given role. */
export function fixtureUser(role: SessionUser['role']): SessionUser {
  return { id: `user-${role}`, email: `${role}@example.org`, displayName: `Sam ${role}`, role, clubId: FIXTURE_IDS.club };
}

/** The squad. */
export const FIXTURE_SQUAD: SquadSummary = {
  id: FIXTURE_IDS.squad,
  name: 'U16 Kestrels',
  ageGroup: 'Under 16',
  ballSize: 5,
  playerCount: 3,
};

/** A player of the squad. */
export function fixturePlayer(
  id: string = FIXTURE_IDS.playerAda,
  displayName = 'Ada Okafor',
  shirtNumber: number | null = 7,
): PlayerSummary {
  return { id, squadId: FIXTURE_IDS.squad, squadName: FIXTURE_SQUAD.name, displayName, shirtNumber, dominantFoot: 'right', isMinor: true };
}

/** Every outcome at share 0, with the given shares set. */
export function shares(set: Partial<Record<Outcome, number>>): Record<Outcome, number> {
  return { on_target: 0, short: 0, long: 0, left: 0, right: 0, blocked: 0, over: 0, ...set };
}

/** One week of progress. */
export function progressWeek(
  weekStart: string,
  technique: Technique,
  reps: number,
  hitRate: number,
  medianCarryM: number | null,
): ProgressWeek {
  return {
    weekStart,
    technique,
    reps,
    hitRate,
    outcomeShare: shares({ on_target: hitRate, short: (1 - hitRate) / 2, long: (1 - hitRate) / 2 }),
    carryCount: medianCarryM === null ? 0 : reps,
    medianCarryM,
    carryP25M: medianCarryM === null ? null : medianCarryM - 2,
    carryP75M: medianCarryM === null ? null : medianCarryM + 2,
    carrySdM: medianCarryM === null ? null : 3,
  };
}

/** A consistent kicker's profile: mean 21 m/s at the technique's default angle, 0.5 m/s spread, ±2° aim. */
export function fixtureProfile(technique: Technique = 'lofted', repetitions = 40): KickProfile {
  const base = fitProfile([], { ...DEFAULT_PRIORS[technique], technique });
  return {
    ...base,
    technique,
    repetitions,
    meanSpeedMs: 21,
    sdSpeedMs: 0.5,
    meanSpeedSeMs: 0.2,
    sdAzimuthDeg: 2,
    meanAzimuthSeDeg: 0.3,
    backspinRps: 3,
  };
}

/** A profile answer. */
export function profileEntry(
  playerId: string,
  technique: Technique,
  profile: KickProfile | null,
  reliableReachM: number | null = null,
): ProfileEntry {
  return {
    playerId,
    technique,
    profile,
    repetitions: profile?.repetitions ?? 0,
    reliableReachM,
    reachRadiusM: 3,
    computedAt: profile ? '2025-03-09T20:00:00.000Z' : null,
    pending: false,
    skippedKicks: 0,
  };
}

/** A kick. */
export function kick(n: number, technique: Technique, outcome: Outcome, carryM: number | null, targetDistanceM = 30): PlayerKick {
  return {
    id: `kick-${n}`,
    sessionId: 'session-1',
    recordedAt: new Date(Date.UTC(2025, 2, 4, 18, 0, n)).toISOString(),
    technique,
    foot: 'right',
    backspinStep: 1,
    sidespinStep: 0,
    targetDistanceM,
    targetRadiusM: 3,
    outcome,
    carryM,
    stillAirCarryM: carryM === null ? null : carryM + 1.5,
    lateralM: n % 2 === 0 ? 0.8 : -1.2,
    measuredSpeedMs: null,
    launchAngleDeg: null,
    measuredSpinRps: null,
    measuredSource: null,
    hangTimeS: null,
  };
}

/** One Squad week player line. */
export function weekPlayer(
  playerId: string,
  displayName: string,
  shirtNumber: number | null,
  reps: number,
  hitRate: number | null,
  previousHitRate: number | null,
  extra: Partial<SquadWeekPlayer> = {},
): SquadWeekPlayer {
  return {
    playerId,
    displayName,
    shirtNumber,
    reps,
    hitRate,
    previousReps: previousHitRate === null ? 0 : 20,
    previousHitRate,
    hitRateChange: hitRate === null || previousHitRate === null ? null : hitRate - previousHitRate,
    bestTechnique: reps > 0 ? 'lofted' : null,
    byTechnique: reps > 0 ? [{ technique: 'lofted', reps, hitRate: hitRate ?? 0, medianCarryM: 28 + reps / 10 }] : [],
    reach: [{ technique: 'lofted', reliableReachM: 25 + reps / 10, reachRadiusM: 3, repetitions: 40, pending: false, warnings: [] }],
    calibration:
      reps > 0
        ? [
            {
              technique: 'lofted',
              reps,
              hits: Math.round((hitRate ?? 0) * reps),
              predictedHits: 0.5 * reps,
              predictedHitRate: 0.5,
              observedHitRate: hitRate ?? 0,
            },
          ]
        : [],
    calibrationPending: 0,
    loadFlags: [],
    ...extra,
  };
}

/** A week of three players: Ada (improving), Bo (worse, over the load limit once), Cy (no kicks). */
export function fixtureWeek(weekStart = '2025-03-03'): SquadWeek {
  return {
    squadId: FIXTURE_IDS.squad,
    squadName: FIXTURE_SQUAD.name,
    weekStart,
    previousWeekStart: '2025-02-24',
    carryBasis: 'logged',
    repLimitPerSession: 40,
    players: [
      weekPlayer(FIXTURE_IDS.playerAda, 'Ada Okafor', 7, 30, 0.6, 0.5),
      weekPlayer(FIXTURE_IDS.playerBo, 'Bo Lind', 9, 44, 0.4, 0.55, {
        loadFlags: [{ sessionId: 'session-2', startedAt: '2025-03-04T18:30:00.000Z', reps: 44, limit: 40 }],
      }),
      weekPlayer(FIXTURE_IDS.playerCy, 'Cy Marsh', 11, 0, null, null),
    ],
    zones: [
      { technique: 'lofted', bandStartM: 20, bandEndM: 25, reps: 20, hitRate: 0.7 },
      { technique: 'lofted', bandStartM: 25, bandEndM: 30, reps: 34, hitRate: 0.5 },
      { technique: 'lofted', bandStartM: 30, bandEndM: 35, reps: 20, hitRate: 0.3 },
      { technique: 'driven', bandStartM: 15, bandEndM: 20, reps: 6, hitRate: 0.5 },
    ],
  };
}
