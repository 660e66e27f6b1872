/**
 * The demo scenario: counts, the demo-account rules other specs and the README rely on,
 * determinism, and the properties the demo exists to show (trends, load caution, consent gaps).
 */
import bcrypt from 'bcryptjs';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openDatabase, type Db } from '../../api/db/client';
import { ageInYears, isoWeekStartUtc } from '../../seed/calendar';
import {
  DEMO_ACCOUNTS,
  DEMO_CLUB_ID,
  DEMO_PASSWORD,
  DEMO_SQUAD_IDS,
  DEMO_USER_IDS,
  demoPeriod,
  demoPlayerId,
  demoTruths,
  isDatabaseEmpty,
  seedDemo,
  type SeedSummary,
} from '../../seed/scenario';
import { PLAYERS, SQUADS } from '../../seed/roster';
import { TARGET_RANGE_M } from '../../seed/sessions';
import { kickingAt } from '../../seed/truth';
import { trueHitProbability } from '../../seed/truth-reach';

/** A Wednesday after the UK clock change, so the eight weeks straddle it. */
const NOW = new Date('2025-04-09T15:00:00Z');
const WEEK_MS = 7 * 86_400_000;
const UUID_V4 = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

interface KickRow {
  id: string;
  session_id: string;
  drill_id: string;
  player_id: string;
  technique: string;
  foot: string;
  backspin_step: number;
  sidespin_step: number;
  target_distance_m: number;
  target_radius_m: number;
  outcome: string;
  carry_m: number | null;
  lateral_m: number | null;
  measured_speed_ms: number | null;
  launch_angle_deg: number | null;
  measured_spin_rps: number | null;
  recorded_at: string;
  version: number;
  change_seq: number;
}

function all<T>(db: Db, query: string, ...params: unknown[]): T[] {
  return db.$client.prepare(query).all(...params) as T[];
}
function one<T>(db: Db, query: string, ...params: unknown[]): T {
  return db.$client.prepare(query).get(...params) as T;
}
const count = (db: Db, table: string): number => one<{ n: number }>(db, `SELECT count(*) AS n FROM ${table}`).n;

describe('demo scenario (seed/scenario.ts)', () => {
  let dir: string;
  let db: Db;
  let twin: Db;
  let summary: SeedSummary;
  let cheapHash: string;

  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'loftline-seed-'));
    cheapHash = bcrypt.hashSync(DEMO_PASSWORD, 4);
    db = openDatabase(join(dir, 'a.db'));
    twin = openDatabase(join(dir, 'b.db'));
    expect(isDatabaseEmpty(db)).toBeTrue();
    summary = seedDemo(db, { now: NOW, passwordHash: cheapHash });
    seedDemo(twin, { now: NOW, passwordHash: cheapHash });
  }, 60_000);

  afterAll(() => {
    db.$client.close();
    twin.$client.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('reports the counts it inserted: 3 squads, 45 players, 8 weeks × 2 sessions × 3 squads', () => {
    expect(summary.clubs).toBe(1);
    expect(summary.squads).toBe(3);
    expect(summary.players).toBe(45);
    expect(summary.trainingSessions).toBe(48);
    const tables: Record<keyof SeedSummary, string> = {
      clubs: 'clubs',
      trainingGrounds: 'training_grounds',
      users: 'users',
      squads: 'squads',
      squadStaff: 'squad_staff',
      players: 'players',
      guardianLinks: 'guardian_links',
      trainingSessions: 'training_sessions',
      drills: 'drills',
      kicks: 'kicks',
    };
    for (const [key, table] of Object.entries(tables) as [keyof SeedSummary, string][]) {
      expect(count(db, table)).withContext(table).toBe(summary[key]);
    }
    expect(summary.kicks / summary.trainingSessions).toBeGreaterThan(120);
    expect(summary.kicks / summary.trainingSessions).toBeLessThan(260);
  });

  it('loads into an empty database only, and a refused load changes nothing', () => {
    expect(isDatabaseEmpty(db)).toBeFalse();
    const before = count(db, 'kicks');
    expect(() => seedDemo(db, { now: NOW, passwordHash: cheapHash })).toThrowError(/already has data/);
    expect(count(db, 'kicks')).toBe(before);
    expect(count(db, 'clubs')).toBe(1);
  });

  it('sets up the club, a ground in England and size-4 balls for the U14s', () => {
    const club = one<{ id: string; timezone: string; rep_limit_per_session: number }>(db, 'SELECT * FROM clubs');
    expect(club).toEqual(jasmine.objectContaining({ id: DEMO_CLUB_ID, timezone: 'Europe/London', rep_limit_per_session: 40 }));
    const ground = one<{ latitude: number; longitude: number; altitude_m: number }>(db, 'SELECT * FROM training_grounds');
    expect(ground.latitude).toBeGreaterThan(50);
    expect(ground.latitude).toBeLessThan(55.8);
    expect(ground.longitude).toBeGreaterThan(-5.7);
    expect(ground.longitude).toBeLessThan(1.8);
    expect(ground.altitude_m).toBeGreaterThanOrEqual(60);
    expect(ground.altitude_m).toBeLessThanOrEqual(120);
    const sizes = all<{ id: string; ball_size: number }>(db, 'SELECT id, ball_size FROM squads');
    expect(sizes.find((s) => s.id === DEMO_SQUAD_IDS.u14)?.ball_size).toBe(4);
    expect(sizes.filter((s) => s.ball_size === 5).length).toBe(2);
    const u14Balls = all<{ ball_size: number }>(
      db,
      'SELECT DISTINCT ball_size FROM training_sessions WHERE squad_id = ?',
      DEMO_SQUAD_IDS.u14,
    );
    expect(u14Balls).toEqual([{ ball_size: 4 }]);
    const mismatched = one<{ n: number }>(
      db,
      'SELECT count(*) AS n FROM training_sessions t JOIN squads s ON s.id = t.squad_id WHERE t.ball_size <> s.ball_size',
    );
    expect(mismatched.n).toBe(0);
  });

  it('gives each squad 15 players with unique shirts, about a quarter left-footed, ages fitting the squad', () => {
    const rows = all<{ squad_id: string; shirt_number: number; dominant_foot: string; birth_date: string }>(db, 'SELECT * FROM players');
    for (const [key, squadId] of Object.entries(DEMO_SQUAD_IDS)) {
      const squad = rows.filter((r) => r.squad_id === squadId);
      expect(squad.length).withContext(key).toBe(15);
      expect(new Set(squad.map((r) => r.shirt_number)).size)
        .withContext(key)
        .toBe(15);
      const ages = squad.map((r) => ageInYears(r.birth_date, NOW));
      const [lo, hi] = key === 'u14' ? [11, 14] : key === 'u16' ? [13, 16] : [18, 30];
      for (const age of ages)
        expect(age >= lo && age <= hi)
          .withContext(`${key} age ${age}`)
          .toBeTrue();
    }
    const left = rows.filter((r) => r.dominant_foot === 'left').length / rows.length;
    expect(left).toBeGreaterThan(0.18);
    expect(left).toBeLessThan(0.34);
  });

  it('has one demo account per role, all with the demo password, on the test domain', () => {
    for (const [role, email] of Object.entries(DEMO_ACCOUNTS)) {
      const user = one<{ id: string; role: string; password_hash: string; disabled_at: string | null } | undefined>(
        db,
        'SELECT * FROM users WHERE email = ?',
        email,
      );
      expect(user).withContext(email).toBeDefined();
      expect(user?.role).withContext(email).toBe(role);
      expect(user?.id).toBe(DEMO_USER_IDS[role as keyof typeof DEMO_USER_IDS]);
      expect(user?.disabled_at).toBeNull();
      expect(bcrypt.compareSync(DEMO_PASSWORD, user?.password_hash ?? '')).toBeTrue();
    }
    const foreign = one<{ n: number }>(db, "SELECT count(*) AS n FROM users WHERE email NOT LIKE '%@kestrel-vale.test'");
    expect(foreign.n).toBe(0);
  });

  it('staffs the head coach on all squads and the assistant coach on U14 and U16 only', () => {
    const squadsOf = (userId: string) =>
      all<{ squad_id: string }>(db, 'SELECT squad_id FROM squad_staff WHERE user_id = ?', userId)
        .map((r) => r.squad_id)
        .sort();
    expect(squadsOf(DEMO_USER_IDS.head_coach)).toEqual(Object.values(DEMO_SQUAD_IDS).sort());
    expect(squadsOf(DEMO_USER_IDS.assistant_coach)).toEqual([DEMO_SQUAD_IDS.u14, DEMO_SQUAD_IDS.u16].sort());
    const firstTeamStaff = all<{ user_id: string }>(db, 'SELECT user_id FROM squad_staff WHERE squad_id = ?', DEMO_SQUAD_IDS.first);
    expect(firstTeamStaff.some((r) => r.user_id !== DEMO_USER_IDS.head_coach)).toBeTrue();
  });

  it('links the player account to one U16 player and the guardian account to exactly one U14 child', () => {
    const own = all<{ squad_id: string }>(db, 'SELECT squad_id FROM players WHERE user_id = ?', DEMO_USER_IDS.player);
    expect(own).toEqual([{ squad_id: DEMO_SQUAD_IDS.u16 }]);
    const children = all<{ squad_id: string; birth_date: string }>(
      db,
      'SELECT p.squad_id, p.birth_date FROM guardian_links g JOIN players p ON p.id = g.player_id WHERE g.guardian_user_id = ?',
      DEMO_USER_IDS.guardian,
    );
    expect(children.length).toBe(1);
    expect(children[0]?.squad_id).toBe(DEMO_SQUAD_IDS.u14);
    expect(ageInYears(children[0]?.birth_date ?? '', NOW)).toBeLessThan(18);
  });

  it('gives every minor a guardian, records consent for most links but not all, and never opts in without consent', () => {
    const unguarded = one<{ n: number }>(
      db,
      `SELECT count(*) AS n FROM players p WHERE p.squad_id IN (?, ?) AND NOT EXISTS (SELECT 1 FROM guardian_links g WHERE g.player_id = p.id)`,
      DEMO_SQUAD_IDS.u14,
      DEMO_SQUAD_IDS.u16,
    );
    expect(unguarded.n).toBe(0);
    const links = all<{ consent_at: string | null; digest_opt_in: number; consent_recorded_by: string | null }>(
      db,
      'SELECT * FROM guardian_links',
    );
    const consented = links.filter((l) => l.consent_at !== null);
    expect(consented.length).toBeGreaterThan(links.length / 2);
    expect(consented.length).toBeLessThan(links.length);
    expect(links.some((l) => l.consent_at !== null && l.digest_opt_in === 0)).toBeTrue();
    expect(links.filter((l) => l.consent_at === null && l.digest_opt_in === 1).length).toBe(0);
    expect(consented.every((l) => l.consent_recorded_by === DEMO_USER_IDS.admin)).toBeTrue();
  });

  it('schedules two sessions per squad in each of the eight ISO weeks before now, recorded by squad staff', () => {
    const period = demoPeriod(NOW);
    expect(period.periodEnd.toISOString()).toBe('2025-04-07T00:00:00.000Z');
    const sessions = all<{
      squad_id: string;
      started_at: string;
      ended_at: string;
      recorded_by: string;
      temperature_c: number;
      wind_speed_ms: number;
      wind_from_deg: number;
      relative_humidity_pct: number;
      altitude_m: number;
      conditions_source_json: string;
      version: number;
    }>(db, 'SELECT * FROM training_sessions');
    const perSquadWeek = new Map<string, number>();
    for (const s of sessions) {
      const start = new Date(s.started_at);
      expect(start.getTime()).toBeGreaterThanOrEqual(period.firstWeekStart.getTime());
      expect(new Date(s.ended_at).getTime()).toBeLessThan(period.periodEnd.getTime());
      const key = `${s.squad_id}:${isoWeekStartUtc(start).toISOString()}`;
      perSquadWeek.set(key, (perSquadWeek.get(key) ?? 0) + 1);
      const staff = one<{ n: number }>(
        db,
        'SELECT count(*) AS n FROM squad_staff WHERE squad_id = ? AND user_id = ?',
        s.squad_id,
        s.recorded_by,
      );
      expect(staff.n).withContext('recorder staffs the squad').toBe(1);
      expect(s.temperature_c).toBeGreaterThanOrEqual(4);
      expect(s.temperature_c).toBeLessThanOrEqual(18);
      expect(s.wind_speed_ms).toBeGreaterThanOrEqual(0);
      expect(s.wind_speed_ms).toBeLessThanOrEqual(9);
      expect(s.relative_humidity_pct).toBeGreaterThanOrEqual(55);
      expect(s.relative_humidity_pct).toBeLessThanOrEqual(95);
      expect(s.altitude_m).toBe(88);
      expect(s.version).toBe(1);
      expect(Object.keys(JSON.parse(s.conditions_source_json) as Record<string, string>)).toContain('temperatureC');
    }
    expect(perSquadWeek.size).toBe(24);
    expect([...perSquadWeek.values()].every((n) => n === 2)).toBeTrue();
    const drillsPerSession = all<{ n: number }>(db, 'SELECT count(*) AS n FROM drills GROUP BY session_id');
    expect(drillsPerSession.every((d) => d.n >= 2 && d.n <= 3)).toBeTrue();
  });

  it('is deterministic: the same now gives identical sessions, drills and kicks, ids included', () => {
    for (const table of ['training_sessions', 'drills', 'kicks', 'players', 'guardian_links']) {
      const a = all<Record<string, unknown>>(db, `SELECT * FROM ${table} ORDER BY id`);
      const b = all<Record<string, unknown>>(twin, `SELECT * FROM ${table} ORDER BY id`);
      expect(b.length).withContext(table).toBe(a.length);
      expect(b).withContext(table).toEqual(a);
    }
  });

  it('uses UUID v4 ids, version 1 and strictly increasing, unique change_seq on synced rows', () => {
    const synced = all<{ id: string; change_seq: number; version: number }>(
      db,
      'SELECT id, change_seq, version FROM training_sessions UNION ALL SELECT id, change_seq, version FROM drills UNION ALL SELECT id, change_seq, version FROM kicks',
    );
    expect(synced.every((r) => UUID_V4.test(r.id) && r.version === 1)).toBeTrue();
    expect(new Set(synced.map((r) => r.change_seq)).size).toBe(synced.length);
    const people = all<{ id: string }>(db, 'SELECT id FROM users UNION ALL SELECT id FROM players UNION ALL SELECT id FROM squads');
    expect(people.every((r) => UUID_V4.test(r.id))).toBeTrue();
  });

  it('copies drill technique and target onto every kick, inside the session, mostly with the dominant foot', () => {
    const mismatch = one<{ n: number }>(
      db,
      `SELECT count(*) AS n FROM kicks k JOIN drills d ON d.id = k.drill_id JOIN training_sessions s ON s.id = k.session_id
       WHERE k.technique <> d.technique OR k.target_distance_m <> d.target_distance_m OR k.target_radius_m <> d.target_radius_m
          OR d.session_id <> k.session_id OR k.recorded_at < s.started_at OR k.recorded_at > s.ended_at OR k.recorded_by <> s.recorded_by`,
    );
    expect(mismatch.n).toBe(0);
    const dominant = one<{ share: number }>(
      db,
      'SELECT avg(k.foot = p.dominant_foot) AS share FROM kicks k JOIN players p ON p.id = k.player_id',
    );
    expect(dominant.share).toBeGreaterThan(0.85);
    const logged = one<{ share: number }>(db, 'SELECT avg(carry_m IS NOT NULL) AS share FROM kicks');
    expect(logged.share).toBeGreaterThan(0.28);
    expect(logged.share).toBeLessThan(0.42);
    const measured = all<{ squad_id: string; share: number }>(
      db,
      'SELECT s.squad_id, avg(k.measured_speed_ms IS NOT NULL) AS share FROM kicks k JOIN training_sessions s ON s.id = k.session_id GROUP BY s.squad_id',
    );
    for (const m of measured) {
      if (m.squad_id === DEMO_SQUAD_IDS.first) expect(m.share).toBeGreaterThan(0.06);
      else expect(m.share).toBe(0);
    }
  });

  it('logs outcomes consistent with the logged carry and lateral offset', () => {
    const kicks = all<KickRow>(db, 'SELECT * FROM kicks WHERE carry_m IS NOT NULL');
    expect(kicks.length).toBeGreaterThan(1000);
    for (const k of kicks) {
      expect(k.lateral_m).not.toBeNull();
      const dc = (k.carry_m ?? 0) - k.target_distance_m;
      const lat = k.lateral_m ?? 0;
      let expected: string;
      if (Math.hypot(dc, lat) <= k.target_radius_m) expected = 'on_target';
      else if (Math.abs(dc) >= Math.abs(lat)) expected = dc < 0 ? 'short' : 'long';
      else expected = lat > 0 ? 'left' : 'right';
      if (k.outcome !== expected) fail(`kick ${k.id}: ${k.outcome} but carry ${k.carry_m} / lateral ${k.lateral_m} says ${expected}`);
      expect((k.carry_m ?? 0) * 2).toBe(Math.round((k.carry_m ?? 0) * 2));
    }
    const freeKickOnly = one<{ n: number }>(
      db,
      `SELECT count(*) AS n FROM kicks WHERE outcome IN ('blocked', 'over') AND (carry_m IS NOT NULL OR technique NOT IN ('curled', 'driven'))`,
    );
    expect(freeKickOnly.n).toBe(0);
  });

  it('shows progress: in each squad the hidden truth hits more often by week eight than in week one, in the same conditions', () => {
    // Session weather moves raw hit rates by more than eight weeks of progress, so the trend is read off the
    // truth itself: every player's kicks flown in standard conditions at the squad's mid-range targets, with
    // the same random numbers early and late.
    const truths = demoTruths();
    for (const squad of SQUADS) {
      let early = 0;
      let late = 0;
      let n = 0;
      for (const pl of PLAYERS.filter((p) => p.squad === squad.key)) {
        for (const technique of ['driven', 'curled'] as const) {
          const [lo, hi] = TARGET_RANGE_M[squad.key][technique];
          const at = (progress: number): number =>
            trueHitProbability(
              truths.get(pl.key)!.techniques[technique],
              squad.ballSize,
              [{ progress, weakFoot: false }],
              (lo + hi) / 2,
              3,
              120,
              `trend:${pl.key}:${technique}`,
            );
          early += at(0.06);
          late += at(0.94);
          n++;
        }
      }
      expect(late / n)
        .withContext(`${squad.key}: ${(early / n).toFixed(2)} → ${(late / n).toFixed(2)}`)
        .toBeGreaterThan(early / n + 0.03);
    }
  });

  it('orders the squads by their hidden truth: the first team hits more often than the U16s, who hit more often than the U14s', () => {
    // Same targets (22 m, 3 m radius), standard conditions, mid-period, each squad with its own ball.
    const truths = demoTruths();
    const rate = (squad: (typeof SQUADS)[number]): number => {
      let sum = 0;
      let n = 0;
      for (const pl of PLAYERS.filter((p) => p.squad === squad.key)) {
        for (const technique of ['driven', 'curled', 'lofted'] as const) {
          const truth = truths.get(pl.key)!.techniques[technique];
          sum += trueHitProbability(
            truth,
            squad.ballSize,
            [{ progress: 0.5, weakFoot: false }],
            22,
            3,
            100,
            `order:${pl.key}:${technique}`,
          );
          n++;
        }
      }
      return sum / n;
    };
    const [u14, u16, first] = ['u14', 'u16', 'first'].map((key) => rate(SQUADS.find((s) => s.key === key)!));
    expect(first)
      .withContext(`first ${first!.toFixed(2)} vs U16 ${u16!.toFixed(2)}`)
      .toBeGreaterThan(u16! + 0.03);
    expect(u16)
      .withContext(`U16 ${u16!.toFixed(2)} vs U14 ${u14!.toFixed(2)}`)
      .toBeGreaterThan(u14! + 0.03);
  });

  it('has individual differences: in the same first-team sessions the strong improver gains on the player who regresses', () => {
    const period = demoPeriod(NOW);
    const rate = (playerId: string, from: Date, to: Date): number =>
      one<{ r: number }>(
        db,
        `SELECT avg(outcome = 'on_target') AS r FROM kicks WHERE player_id = ? AND recorded_at >= ? AND recorded_at < ?`,
        playerId,
        from.toISOString(),
        to.toISOString(),
      ).r;
    const change = (playerKey: string): number => {
      const id = demoPlayerId(playerKey);
      const early = rate(id, period.firstWeekStart, new Date(period.firstWeekStart.getTime() + 2 * WEEK_MS));
      return rate(id, new Date(period.periodEnd.getTime() - 2 * WEEK_MS), period.periodEnd) - early;
    };
    const [improver, regresser] = [change('felix-ravenscroft'), change('liam-hargest')];
    expect(improver - regresser)
      .withContext(`Felix ${improver.toFixed(2)}, Liam ${regresser.toFixed(2)}`)
      .toBeGreaterThan(0.1);
    const truths = demoTruths();
    const spreadAt = (key: string, progress: number): number => kickingAt(truths.get(key)!.techniques.curled, progress, false).offsetLogSd;
    expect(spreadAt('felix-ravenscroft', 1)).toBeLessThan(0.75 * spreadAt('felix-ravenscroft', 0));
    expect(spreadAt('liam-hargest', 1)).toBeGreaterThan(1.15 * spreadAt('liam-hargest', 0));
  });

  it('lets at least one player pass the club rep limit in some session, so the load caution shows', () => {
    const over = all<{ n: number }>(
      db,
      'SELECT count(*) AS n FROM kicks GROUP BY session_id, player_id HAVING n > (SELECT rep_limit_per_session FROM clubs)',
    );
    expect(over.length).toBeGreaterThan(0);
    expect(over.length).toBeLessThan(24); // occasional, not routine
  });
});
