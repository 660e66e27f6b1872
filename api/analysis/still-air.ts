/**
 * Keeps `kicks.still_air_carry_m` filled: for new or edited kicks as they are applied, and as a
 * backfill for rows that have a carry but no normalised value yet (the demo data, older rows).
 */
import type { Db } from '../db/client';
import { stillAirCarryM, type SessionConditions, type StoredKick } from './flight-inputs';

interface Row extends StoredKick, SessionConditions {
  id: string;
}

const SELECT = `SELECT k.id, k.technique, k.outcome, k.target_distance_m AS targetDistanceM, k.target_radius_m AS targetRadiusM,
       k.backspin_step AS backspinStep, k.sidespin_step AS sidespinStep, k.carry_m AS carryM, k.lateral_m AS lateralM,
       k.measured_speed_ms AS measuredSpeedMs, k.launch_angle_deg AS launchAngleDeg, k.measured_spin_rps AS measuredSpinRps,
       s.temperature_c AS temperatureC, s.altitude_m AS altitudeM, s.relative_humidity_pct AS relativeHumidityPct,
       s.pressure_hpa AS pressureHpa, s.wind_speed_ms AS windSpeedMs, s.wind_from_deg AS windFromDeg, s.ball_size AS ballSize
  FROM kicks k JOIN training_sessions s ON s.id = k.session_id`;

/** Recomputes the normalised carry of the given kicks (inside the caller's transaction). */
export function refreshStillAirCarry(db: Db, kickIds: readonly string[]): void {
  if (kickIds.length === 0) return;
  const select = db.$client.prepare(`${SELECT} WHERE k.id = ?`);
  const update = db.$client.prepare('UPDATE kicks SET still_air_carry_m = ? WHERE id = ?');
  for (const id of kickIds) {
    const row = select.get(id) as Row | undefined;
    if (row) update.run(stillAirCarryM(row, row), id);
  }
}

/** Recomputes the normalised carry of every kick of a session (its conditions changed). */
export function refreshSessionStillAirCarry(db: Db, sessionId: string): void {
  const ids = db.$client.prepare('SELECT id FROM kicks WHERE session_id = ? AND carry_m IS NOT NULL').all(sessionId) as { id: string }[];
  refreshStillAirCarry(db, ids.map((r) => r.id));
}

/** Fills every missing normalised carry; returns how many kicks were computed. */
export function backfillStillAirCarry(db: Db): number {
  const rows = db.$client.prepare(`${SELECT} WHERE k.carry_m IS NOT NULL AND k.still_air_carry_m IS NULL`).all() as Row[];
  const update = db.$client.prepare('UPDATE kicks SET still_air_carry_m = ? WHERE id = ?');
  db.$client.transaction(() => {
    for (const row of rows) update.run(stillAirCarryM(row, row), row.id);
  })();
  return rows.length;
}
