/** A player's recent kicks for the Player file table, newest first, through one index range. */
import type { PlayerKick } from '../../shared/schemas/analysis';
import type { Technique } from '../../shared/schemas/sync';
import type { Db } from '../db/client';

/** The player's kicks (visibility checked by the caller), with the total for the paginator. */
export function playerKicks(
  db: Db,
  playerId: string,
  technique: Technique | undefined,
  limit: number,
): { total: number; kicks: PlayerKick[] } {
  const where = `k.player_id = @playerId AND k.deleted_at IS NULL${technique ? ' AND k.technique = @technique' : ''}`;
  const params = { playerId, technique: technique ?? null, limit };
  const total = (db.$client.prepare(`SELECT COUNT(*) AS n FROM kicks k WHERE ${where}`).get(params) as { n: number }).n;
  const kicks = db.$client
    .prepare(
      `SELECT k.id, k.session_id AS sessionId, k.recorded_at AS recordedAt, k.technique, k.foot, k.backspin_step AS backspinStep,
              k.sidespin_step AS sidespinStep, k.target_distance_m AS targetDistanceM, k.target_radius_m AS targetRadiusM, k.outcome,
              k.carry_m AS carryM, k.still_air_carry_m AS stillAirCarryM, k.lateral_m AS lateralM, k.measured_speed_ms AS measuredSpeedMs,
              k.launch_angle_deg AS launchAngleDeg, k.measured_spin_rps AS measuredSpinRps, k.measured_source AS measuredSource,
              k.hang_time_s AS hangTimeS
         FROM kicks k WHERE ${where} ORDER BY k.recorded_at DESC LIMIT @limit`,
    )
    .all(params) as PlayerKick[];
  return { total, kicks };
}
