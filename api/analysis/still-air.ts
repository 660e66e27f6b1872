/**
 * Keeps `kicks.still_air_carry_m` filled off the sync path: a push (or a change of a session's
 * conditions) leaves it NULL, and the refresher normalises new carries in small slices a moment
 * later, in `change_seq` order, so a push of 500 kicks never waits for 170 inverse solves.
 */
import type { Db } from '../db/client';
import { cachedStatement } from '../db/statements';
import { isSqliteBusy } from '../errors';
import { stillAirCarryM, type SessionConditions, type StoredKick } from './flight-inputs';

interface Row extends StoredKick, SessionConditions {
  id: string;
  changeSeq: number;
}

const SELECT = `SELECT k.id, k.change_seq AS changeSeq, k.technique, k.outcome, k.target_distance_m AS targetDistanceM, k.target_radius_m AS targetRadiusM,
       k.backspin_step AS backspinStep, k.sidespin_step AS sidespinStep, k.carry_m AS carryM, k.lateral_m AS lateralM,
       k.measured_speed_ms AS measuredSpeedMs, k.launch_angle_deg AS launchAngleDeg, k.measured_spin_rps AS measuredSpinRps, k.measured_source AS measuredSource,
       s.temperature_c AS temperatureC, s.altitude_m AS altitudeM, s.relative_humidity_pct AS relativeHumidityPct,
       s.pressure_hpa AS pressureHpa, s.wind_speed_ms AS windSpeedMs, s.wind_from_deg AS windFromDeg, s.ball_size AS ballSize,
       s.conditions_source_json AS conditionsSourceJson, (SELECT c.drag_crisis_re FROM clubs c WHERE c.id = s.club_id) AS dragCrisisRe
  FROM kicks k JOIN training_sessions s ON s.id = k.session_id`;

/** Per connection: the lowest change sequence a refresher must walk back to (older rows were cleared). */
const rewind = new WeakMap<Db['$client'], number>();

/** Marks a session's kicks for renormalisation (its conditions changed); call in the write transaction. */
export function clearSessionStillAirCarry(db: Db, sessionId: string): void {
  const first = cachedStatement(db.$client, 'SELECT MIN(change_seq) AS s FROM kicks WHERE session_id = ? AND carry_m IS NOT NULL').get(
    sessionId,
  ) as { s: number | null };
  cachedStatement(db.$client, 'UPDATE kicks SET still_air_carry_m = NULL WHERE session_id = ? AND still_air_carry_m IS NOT NULL').run(
    sessionId,
  );
  if (first.s !== null) rewind.set(db.$client, Math.min(rewind.get(db.$client) ?? Infinity, first.s - 1));
}

/** Marks all of a club's kicks for renormalisation (its ball model changed); call in the write transaction. */
export function clearClubStillAirCarry(db: Db, clubId: string): void {
  const first = cachedStatement(db.$client, 'SELECT MIN(change_seq) AS s FROM kicks WHERE club_id = ? AND carry_m IS NOT NULL').get(
    clubId,
  ) as {
    s: number | null;
  };
  cachedStatement(db.$client, 'UPDATE kicks SET still_air_carry_m = NULL WHERE club_id = ? AND still_air_carry_m IS NOT NULL').run(clubId);
  if (first.s !== null) rewind.set(db.$client, Math.min(rewind.get(db.$client) ?? Infinity, first.s - 1));
}

/**
 * Normalises up to `limit` kicks that have a carry but no normalised value, after change
 * sequence `afterSeq`. Returns how many were looked at and the last sequence seen, so a caller
 * can walk forward without retrying carries the model cannot explain (those stay NULL).
 */
export function normaliseStillAirSlice(db: Db, afterSeq: number, limit: number): { processed: number; lastSeq: number } {
  const rows = cachedStatement(
    db.$client,
    `${SELECT} WHERE k.carry_m IS NOT NULL AND k.still_air_carry_m IS NULL AND k.change_seq > ? ORDER BY k.change_seq LIMIT ?`,
  ).all(afterSeq, limit) as Row[];
  const update = cachedStatement(db.$client, 'UPDATE kicks SET still_air_carry_m = ? WHERE id = ? AND change_seq = ?');
  db.$client.transaction(() => {
    for (const row of rows) update.run(stillAirCarryM(row, row), row.id, row.changeSeq);
  })();
  return { processed: rows.length, lastSeq: rows.at(-1)?.changeSeq ?? afterSeq };
}

/** Normalises every pending carry now (start-up, tests); returns how many were looked at. */
export function backfillStillAirCarry(db: Db): number {
  let total = 0;
  let after = 0;
  for (;;) {
    const { processed, lastSeq } = normaliseStillAirSlice(db, after, 500);
    total += processed;
    after = lastSeq;
    if (processed < 500) return total;
  }
}

/** Walks new carries forward in the background, a slice per tick. */
export class StillAirRefresher {
  private afterSeq = 0;
  private timer: NodeJS.Timeout | null = null;

  constructor(
    private readonly db: Db,
    private readonly sliceSize = 100,
    private readonly intervalMs = 1000,
  ) {}

  /** Starts ticking. */
  start(): void {
    // A database locked past the busy timeout skips this slice (the next tick retries); thrown from a timer it would end the process.
    this.timer ??= setInterval(() => {
      try {
        this.tick();
      } catch (err) {
        if (!isSqliteBusy(err)) throw err;
      }
    }, this.intervalMs);
    this.timer.unref();
  }

  /** One slice now; returns how many kicks it normalised. */
  tick(): number {
    const back = rewind.get(this.db.$client);
    if (back !== undefined) {
      rewind.delete(this.db.$client);
      this.afterSeq = Math.min(this.afterSeq, back);
    }
    const { processed, lastSeq } = normaliseStillAirSlice(this.db, this.afterSeq, this.sliceSize);
    this.afterSeq = lastSeq;
    return processed;
  }

  /** Stops ticking. */
  stop(): void {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
  }
}
