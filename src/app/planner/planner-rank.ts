/**
 * The Set-piece planner's pure parts: where the ball may stand, how the squad is ranked for a spot, and
 * the keys under which profiles and results are kept offline. No Angular, so each is tested directly.
 */

import { PROFILE_WARNING_TEXT, WALL_DISTANCE_M, type SetPieceShares, type Technique } from '../../../shared/flight';
import type { SquadProfilesResponse } from '../../../shared/schemas/analysis';
import type { AimLineFlight, SetPieceCloudResult, SetPieceRankEntry } from '../flight/set-piece-rank';
import { DEFAULT_PITCH, type PitchPoint } from '../ui/pitch-markings';

/** The spot being planned, in the pitch frame of `pitch-markings.ts` (x across, + right; y out from the goal line). */
export interface PlannerSpot {
  readonly ball: PitchPoint;
  /** Height of the wall, m. */
  readonly wallHeightM: number;
  /** Where on the goal line the kicker aims, m from the centre, + = right (pitch frame). */
  readonly aimXM: number;
}

/** The wall must stand this far in front of the goal line, m (the flight model's limit is 0.5 m; 5 cm spare for rounding). */
const WALL_CLEARANCE_M = 0.55;
/** Nearest the ball may be to the goal line, m: closer, a wall 9.15 m away would be behind the goal. */
const MIN_BALL_Y_M = 1;

/**
 * Keep a dragged ball where a free kick with a wall can be checked: on the attacking half and far enough
 * out that the wall, 9.15 m from the ball on the line to the goal (IFAB Laws of the Game, Law 13), stands
 * in front of the goal line. A ball too close is pushed straight out, away from the goal's centre.
 */
export function clampBall(p: PitchPoint, pitch = DEFAULT_PITCH): PitchPoint {
  const halfWidth = pitch.widthM / 2;
  let x = Math.min(halfWidth, Math.max(-halfWidth, p.x));
  let y = Math.min(pitch.lengthM / 2, Math.max(MIN_BALL_Y_M, p.y));
  const d = Math.hypot(x, y);
  const uy = y / d;
  // The wall's distance from the line is y − 9.15·(y/d); it must be ≥ the clearance.
  if (y - WALL_DISTANCE_M * uy < WALL_CLEARANCE_M) {
    const need = WALL_DISTANCE_M + WALL_CLEARANCE_M / uy;
    x = (x / d) * need;
    y = (y / d) * need;
    if (Math.abs(x) > halfWidth) {
      // Along the goal line the ray leaves the pitch: slide in along the touchline instead.
      x = Math.sign(x) * halfWidth;
      y = Math.max(y, solveTouchlineY(halfWidth));
    }
  }
  return { x: round(x, 2), y: round(y, 2) };
}

/** The smallest y on the touchline (|x| = w) where the wall clears the goal line. */
function solveTouchlineY(w: number): number {
  let lo = MIN_BALL_Y_M;
  let hi = 60;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (mid - (WALL_DISTANCE_M * mid) / Math.hypot(w, mid) >= WALL_CLEARANCE_M) hi = mid;
    else lo = mid;
  }
  return hi;
}

function round(v: number, decimals: number): number {
  const f = 10 ** decimals;
  const r = Math.round(v * f) / f;
  return r === 0 ? 0 : r;
}

/** One player's line in the planner's ranking. */
export interface RankedPlayer {
  readonly playerId: string;
  readonly displayName: string;
  readonly shirtNumber: number | null;
  readonly repetitions: number;
  /** Whether newer kicks exist than the profile used (the server is refreshing it). */
  readonly pending: boolean;
  /** 1-based place, or null for players without a profile of the technique. */
  readonly rank: number | null;
  readonly shares: SetPieceShares | null;
  readonly result: SetPieceCloudResult | null;
  readonly meanKick: AimLineFlight | null;
  /** The profile's warnings in plain words (thin or contradictory data), shown beside the player's share. */
  readonly warnings: readonly string[];
}

/**
 * Rank the squad for a spot: most kicks in under the bar first; ties broken by more kicks over the wall,
 * then by name, so the order never depends on the server's list order. Players without a profile follow,
 * unranked, by name.
 */
export function rankSetPiece(profiles: SquadProfilesResponse, entries: readonly SetPieceRankEntry[]): RankedPlayer[] {
  const byId = new Map(entries.map((e) => [e.id, e]));
  const lines = profiles.players.map((p) => {
    const entry = byId.get(p.playerId);
    return {
      playerId: p.playerId,
      displayName: p.displayName,
      shirtNumber: p.shirtNumber,
      repetitions: p.repetitions,
      pending: p.pending,
      shares: entry?.result.shares ?? null,
      result: entry?.result ?? null,
      meanKick: entry?.meanKick ?? null,
      warnings: (p.profile?.warnings ?? []).map((code) => PROFILE_WARNING_TEXT[code] ?? code),
    };
  });
  const byName = (a: { displayName: string }, b: { displayName: string }): number => a.displayName.localeCompare(b.displayName);
  const ranked = lines
    .filter((l) => l.shares !== null)
    .sort((a, b) => b.shares!.onTarget - a.shares!.onTarget || b.shares!.clearsWall - a.shares!.clearsWall || byName(a, b))
    .map((l, i) => ({ ...l, rank: i + 1 }));
  const unranked = lines
    .filter((l) => l.shares === null)
    .sort(byName)
    .map((l) => ({ ...l, rank: null }));
  return [...ranked, ...unranked];
}

/** Key of a squad's fetched profiles of one technique in the analysis cache. */
export function profilesCacheKey(squadId: string, technique: Technique): string {
  return `planner-profiles:${squadId}:${technique}`;
}

/** Key of a spot's ranking: squad, technique, ball to 0.1 m, wall to 1 cm, aim to 0.1 m. */
export function resultsCacheKey(squadId: string, technique: Technique, spot: PlannerSpot): string {
  const f = (v: number, d: number): string => round(v, d).toFixed(d);
  return `planner:${squadId}:${technique}:${f(spot.ball.x, 1)}:${f(spot.ball.y, 1)}:${f(spot.wallHeightM, 2)}:${f(spot.aimXM, 1)}`;
}

/**
 * How rankings are computed; part of the fingerprint, so rankings kept on a device by an older planner
 * (each player's usual ball, no chosen kick) are recomputed rather than shown.
 */
export const RANKING_METHOD = 'chosen-kick-1';

/**
 * What a cached ranking was computed from: the ranking method and each player's profile version. A cached
 * ranking is reused only when this matches, so a refreshed profile is never hidden behind an old result.
 */
export function profilesFingerprint(profiles: SquadProfilesResponse): string {
  return [RANKING_METHOD, ...profiles.players.map((p) => `${p.playerId}@${p.computedAt ?? '-'}#${p.repetitions}`)].join('|');
}
