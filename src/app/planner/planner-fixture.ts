import { DEFAULT_PRIORS, fitProfile, type KickProfile } from '../../../shared/flight';
import type { SquadProfilesResponse } from '../../../shared/schemas/analysis';
import type { SquadSummary } from '../../../shared/schemas/squads';

/*
 * A small squad for the planner's specs: three curlers of clearly different quality and one player
 * without a profile. Nothing in the app imports this file.
 */

/** A curled-kick profile: a fit with no kicks (so the prior) with the fields a spec cares about set. */
export function curlProfile(overrides: Partial<KickProfile>): KickProfile {
  const base = fitProfile([], { ...DEFAULT_PRIORS.curled, technique: 'curled' });
  return {
    ...base,
    meanSpeedMs: 23,
    sdSpeedMs: 1.2,
    meanSpeedSeMs: 0.3,
    meanAzimuthDeg: 0,
    sdAzimuthDeg: 2,
    elevationDeg: 20,
    sdElevationDeg: 1,
    backspinRps: 3,
    sdBackspinRps: 1,
    sidespinRps: 0,
    sdSidespinRps: 1,
    ...overrides,
  };
}

/** The fixture squad. */
export const FIXTURE_SQUAD: SquadSummary = {
  id: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1b01',
  name: 'U16',
  ageGroup: 'U16',
  ballSize: 5,
  playerCount: 4,
};

const entry = (playerId: string, displayName: string, shirtNumber: number, profile: KickProfile | null) => ({
  playerId,
  technique: 'curled' as const,
  profile,
  repetitions: profile ? 24 : 0,
  reliableReachM: null,
  reachRadiusM: 3,
  computedAt: profile ? '2026-11-30T08:00:00.000Z' : null,
  pending: false,
  skippedKicks: 0,
  displayName,
  shirtNumber,
});

/**
 * Profiles: three curlers whose aim spreads (7°, 3.5° and 1.5°) set their shares apart — each takes the
 * kick they would choose, so speed and angle alone no longer separate them — and one with none.
 */
export const FIXTURE_PROFILES: SquadProfilesResponse = {
  squadId: FIXTURE_SQUAD.id,
  technique: 'curled',
  players: [
    entry('6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1c01', 'Ada Lovelock', 7, curlProfile({ meanSpeedMs: 18, elevationDeg: 15, sdAzimuthDeg: 7 })),
    entry('6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1c02', 'Bo Brennan', 9, curlProfile({ meanSpeedMs: 22, elevationDeg: 19, sdAzimuthDeg: 3.5 })),
    entry(
      '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1c03',
      'Cy Okafor',
      11,
      curlProfile({ meanSpeedMs: 21, elevationDeg: 20, backspinRps: 0, sdAzimuthDeg: 1.5 }),
    ),
    entry('6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1c04', 'Di Marsh', 14, null),
  ],
};
