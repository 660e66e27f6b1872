/**
 * A large synthetic academy for benchmarks: many squads, a season of sessions and about a
 * million kicks, written with prepared statements in one transaction. Not demo data — the
 * names are generic — and never loaded by `npm start`.
 */
import type { Db } from '../api/db/client';
import { OUTCOMES, TECHNIQUES } from '../shared/vocabulary';
import { Prng, stableId } from './prng';

/** Options of the generator. */
export interface LargeAcademyOptions {
  kicks: number;
  squads?: number;
  playersPerSquad?: number;
  weeks?: number;
  sessionsPerWeek?: number;
  /** Last day of the season (sessions run up to it). */
  end?: Date;
}

/** What was generated. */
export interface LargeAcademy {
  clubId: string;
  squadIds: string[];
  playerIds: string[];
  sessions: number;
  kicks: number;
  /** Monday of the season's last full week, YYYY-MM-DD. */
  lastWeekStart: string;
}

/** Outcomes of open-play drills: no wall and no bar, so neither `blocked` nor `over`. */
const DRILL_OUTCOMES = OUTCOMES.filter((o) => o !== 'blocked' && o !== 'over');

/** Generates the academy into `db` (which must already be migrated). */
export function generateLargeAcademy(db: Db, options: LargeAcademyOptions): LargeAcademy {
  const squadsN = options.squads ?? 12;
  const perSquad = options.playersPerSquad ?? 25;
  const weeks = options.weeks ?? 40;
  const perWeek = options.sessionsPerWeek ?? 3;
  const end = options.end ?? new Date('2026-11-29T00:00:00Z');
  const prng = Prng.fromLabel('large-academy');
  const clubId = stableId('large:club');
  const sqlite = db.$client;
  const lastMonday = new Date(end);
  lastMonday.setUTCDate(lastMonday.getUTCDate() - ((lastMonday.getUTCDay() + 6) % 7) - 7);
  const firstMonday = new Date(lastMonday.getTime() - (weeks - 1) * 7 * 86_400_000);
  const kicksPerSession = Math.max(1, Math.round(options.kicks / (squadsN * weeks * perWeek)));
  const squadIds: string[] = [];
  const playerIds: string[] = [];
  let seq = (sqlite.prepare('SELECT COALESCE(MAX(last_seq), 0) AS s FROM change_counter').get() as { s: number }).s;
  let kicksWritten = 0;
  let sessions = 0;
  sqlite.transaction(() => {
    sqlite.prepare('INSERT INTO clubs (id, name) VALUES (?, ?)').run(clubId, 'Benchmark Academy');
    const insSquad = sqlite.prepare('INSERT INTO squads (id, club_id, name, age_group, ball_size) VALUES (?, ?, ?, ?, 5)');
    const insPlayer = sqlite.prepare('INSERT INTO players (id, club_id, squad_id, display_name, shirt_number) VALUES (?, ?, ?, ?, ?)');
    const insSession = sqlite.prepare(
      'INSERT INTO training_sessions (id, club_id, squad_id, started_at, temperature_c, wind_speed_ms, wind_from_deg, ball_size, change_seq) VALUES (?, ?, ?, ?, ?, ?, ?, 5, ?)',
    );
    const insKick = sqlite.prepare(
      // still_air_carry_m takes the logged carry: synthetic carries have no conditions worth re-flying, and a server
      // started on this database must not spend minutes normalising a million of them before it answers.
      `INSERT INTO kicks (id, club_id, session_id, player_id, technique, foot, backspin_step, sidespin_step, target_distance_m, target_radius_m,
                          outcome, carry_m, still_air_carry_m, recorded_at, change_seq) VALUES (?, ?, ?, ?, ?, 'right', 0, 0, ?, 3, ?, ?, ?, ?, ?)`,
    );
    for (let s = 0; s < squadsN; s++) {
      const squadId = stableId(`large:squad:${s}`);
      squadIds.push(squadId);
      insSquad.run(squadId, clubId, `Squad ${s + 1}`, `Group ${s + 1}`);
      for (let p = 0; p < perSquad; p++) {
        const playerId = stableId(`large:player:${s}:${p}`);
        playerIds.push(playerId);
        insPlayer.run(playerId, clubId, squadId, `Player ${s + 1}-${p + 1}`, p + 1);
      }
    }
    for (let w = 0; w < weeks; w++) {
      for (let d = 0; d < perWeek; d++) {
        for (let s = 0; s < squadsN; s++) {
          const start = new Date(firstMonday.getTime() + (w * 7 + d * 2) * 86_400_000 + 18 * 3_600_000);
          const sessionId = stableId(`large:session:${w}:${d}:${s}`);
          insSession.run(sessionId, clubId, squadIds[s], start.toISOString(), 10, prng.uniform(0, 6), 0, ++seq);
          sessions++;
          for (let k = 0; k < kicksPerSession; k++) {
            const playerId = playerIds[s * perSquad + (k % perSquad)]!;
            const technique = TECHNIQUES[(k >> 3) % TECHNIQUES.length]!;
            const target = 15 + ((k * 7) % 30);
            const outcome = prng.chance(0.4) ? 'on_target' : DRILL_OUTCOMES[1 + Math.floor(prng.next() * 4)]!;
            const carry = prng.chance(0.35) ? Math.round((target + prng.normal(0, 4)) * 2) / 2 : null;
            const at = new Date(start.getTime() + k * 6_000).toISOString();
            insKick.run(prng.uuid(), clubId, sessionId, playerId, technique, target, outcome, carry, carry, at, ++seq);
            kicksWritten++;
          }
        }
      }
    }
    sqlite
      .prepare('INSERT INTO change_counter (id, last_seq) VALUES (1, ?) ON CONFLICT(id) DO UPDATE SET last_seq = excluded.last_seq')
      .run(seq);
  })();
  sqlite.pragma('optimize');
  return { clubId, squadIds, playerIds, sessions, kicks: kicksWritten, lastWeekStart: lastMonday.toISOString().slice(0, 10) };
}
