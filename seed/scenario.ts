/**
 * The demo scenario: Loftline's fictional Kestrel Vale Athletic Academy with three squads,
 * staff, players, guardians and eight weeks of logged kicking drills. `npm start` loads it into
 * an empty database and `npm run seed -- --reset` reloads it, so every developer, reviewer and
 * test sees the same academy. All data is generated from a fixed seed: the same `now` always
 * gives the same rows, ids included.
 */
import bcrypt from 'bcryptjs';
import { sql } from 'drizzle-orm';
import { nextChangeSeq, type Db } from '../api/db/client';
import {
  clubs,
  drills,
  guardianLinks,
  kicks,
  players,
  squads,
  squadStaff,
  trainingGrounds,
  trainingSessions,
  users,
} from '../api/db/schema';
import type { Role } from '../shared/roles';
import { birthDateForAge, DAY_MS, demoPeriod } from './calendar';
import { Intentions } from './kick-physics';
import { Prng, stableId } from './prng';
import { GUARDIANS, PLAYERS, SESSION_RECORDERS, SQUADS, STAFF, DEMO_EMAIL_DOMAIN, type SquadKey } from './roster';
import { demoPlayerTruth, FREE_KICK_TAKERS, type PlayerTruth } from './truth';
import { generateSession, type DrillRow, type KickRow, type SessionPlayer, type SessionRow } from './sessions';

export { demoPeriod } from './calendar';

/** Password of every seeded account (demo data only; never used outside a local database). */
export const DEMO_PASSWORD = 'loftline-demo';

/** The five demo sign-ins, one per role, as the README and the sign-in page hint list them. */
export const DEMO_ACCOUNTS = {
  admin: `admin@${DEMO_EMAIL_DOMAIN}`,
  head_coach: `head.coach@${DEMO_EMAIL_DOMAIN}`,
  assistant_coach: `assistant.coach@${DEMO_EMAIL_DOMAIN}`,
  player: `player@${DEMO_EMAIL_DOMAIN}`,
  guardian: `guardian@${DEMO_EMAIL_DOMAIN}`,
} as const satisfies Record<Role, string>;

/** The demo academy's name. */
export const DEMO_CLUB_NAME = 'Kestrel Vale Athletic Academy';
/** Stable id of the demo club, the same whatever the load date. */
export const DEMO_CLUB_ID = stableId('club');
/** Stable id of the demo training ground. */
export const DEMO_GROUND_ID = stableId('ground');
/** Stable ids of the three demo squads. */
export const DEMO_SQUAD_IDS: Record<SquadKey, string> = {
  u14: stableId('squad:u14'),
  u16: stableId('squad:u16'),
  first: stableId('squad:first'),
};

/** Shirt numbers (in roster order) and which members are left-footed, as drawn for one squad. */
function squadRosterDraw(squad: SquadKey, members: number): { shirts: number[]; leftFooted: Set<number> } {
  const prng = Prng.fromLabel(`squad-roster:${squad}`);
  const shirts = prng.shuffle([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 14, 15, 16, 17, 18, 19, 20, 21, 22, 23, 24, 26]).slice(0, members);
  const leftFooted = new Set(prng.shuffle(Array.from({ length: members }, (_, i) => i)).slice(0, 4));
  return { shirts, leftFooted };
}

/**
 * The hidden truth of every demo player, keyed by roster key — for the recovery specs only: it is
 * never stored and never served (the generator flies each repetition from it).
 */
export function demoTruths(): Map<string, PlayerTruth> {
  const out = new Map<string, PlayerTruth>();
  for (const squad of SQUADS) {
    const members = PLAYERS.filter((pl) => pl.squad === squad.key);
    const { leftFooted } = squadRosterDraw(squad.key, members.length);
    members.forEach((pl, i) => out.set(pl.key, demoPlayerTruth(pl.key, leftFooted.has(i) ? 'left' : 'right')));
  }
  return out;
}

/** Stable id of a seeded user, from the account's e-mail. */
export function demoUserId(email: string): string {
  return stableId(`user:${email}`);
}
/** Stable id of a seeded player, from the roster key (e.g. "nia-okafor-blythe"). */
export function demoPlayerId(playerKey: string): string {
  return stableId(`player:${playerKey}`);
}

/** Stable ids of the five demo accounts. */
export const DEMO_USER_IDS: Record<Role, string> = {
  admin: demoUserId(DEMO_ACCOUNTS.admin),
  head_coach: demoUserId(DEMO_ACCOUNTS.head_coach),
  assistant_coach: demoUserId(DEMO_ACCOUNTS.assistant_coach),
  player: demoUserId(DEMO_ACCOUNTS.player),
  guardian: demoUserId(DEMO_ACCOUNTS.guardian),
};

/** The training ground: fictional, in the English Midlands, ~88 m above sea level. */
const GROUND = { name: 'Longmere Lane Training Centre', latitude: 52.7713, longitude: -1.5528, altitudeM: 88, kickingBearingDeg: 205 };

/** The club's kicking-load caution threshold (reps per player per session, docs/design.md §10). */
const REP_LIMIT_PER_SESSION = 40;

/** How many rows of each table the scenario inserted. */
export interface SeedSummary {
  clubs: number;
  trainingGrounds: number;
  users: number;
  squads: number;
  squadStaff: number;
  players: number;
  guardianLinks: number;
  trainingSessions: number;
  drills: number;
  kicks: number;
}

/** Options for `seedDemo`. */
export interface SeedOptions {
  /** The load date; the eight weeks end with the last complete ISO week before it. Default: now. */
  now?: Date;
  /** A precomputed bcrypt hash of the demo password (tests pass a cheap one). Default: cost 12. */
  passwordHash?: string;
}

/** Hashes the demo password once (bcrypt cost 12, the production cost in `AppConfig`). */
export function hashDemoPassword(cost = 12): string {
  return bcrypt.hashSync(DEMO_PASSWORD, cost);
}

/** Whether the database has no club yet — the only state the scenario loads into. */
export function isDatabaseEmpty(db: Db): boolean {
  const row = db
    .select({ n: sql<number>`count(*)` })
    .from(clubs)
    .get();
  return (row?.n ?? 0) === 0;
}

/** Splits rows into chunks that stay well inside SQLite's bound-parameter limit. */
function chunked<T>(rows: readonly T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < rows.length; i += size) out.push(rows.slice(i, i + size));
  return out;
}

const iso = (ms: number): string => new Date(ms).toISOString();

/**
 * Inserts the whole demo academy in one transaction (all or nothing) and returns the counts.
 * Refuses a database that already holds a club, so it can never mix with real data.
 */
export function seedDemo(db: Db, options: SeedOptions = {}): SeedSummary {
  const now = options.now ?? new Date();
  const passwordHash = options.passwordHash ?? hashDemoPassword();
  const period = demoPeriod(now);
  const periodStartMs = period.firstWeekStart.getTime();
  const periodLengthMs = period.periodEnd.getTime() - periodStartMs;
  // The club was set up three weeks before the first recorded week.
  const setupMs = periodStartMs - 21 * DAY_MS + 9 * 3_600_000;
  const setupAt = iso(setupMs);
  const stamps = { createdAt: setupAt, updatedAt: setupAt };

  const run = db.$client.transaction((): SeedSummary => {
    if (!isDatabaseEmpty(db)) throw new Error('The database already has data; the demo scenario loads into an empty database only.');

    db.insert(clubs)
      .values({
        id: DEMO_CLUB_ID,
        name: DEMO_CLUB_NAME,
        timezone: 'Europe/London',
        repLimitPerSession: REP_LIMIT_PER_SESSION,
        spinStepsJson: null,
        ...stamps,
      })
      .run();
    db.insert(trainingGrounds)
      .values({ id: DEMO_GROUND_ID, clubId: DEMO_CLUB_ID, ...GROUND, ...stamps })
      .run();
    db.insert(squads)
      .values(
        SQUADS.map((s) => ({
          id: DEMO_SQUAD_IDS[s.key],
          clubId: DEMO_CLUB_ID,
          name: s.name,
          ageGroup: s.ageGroup,
          ballSize: s.ballSize,
          groundId: DEMO_GROUND_ID,
          ...stamps,
          deletedAt: null,
        })),
      )
      .run();

    // Accounts: staff, the players who have one, guardians. All share the demo password.
    const userRows: (typeof users.$inferInsert)[] = [];
    const account = (email: string, displayName: string, role: Role, disabledAt: string | null = null) =>
      userRows.push({ id: demoUserId(email), clubId: DEMO_CLUB_ID, email, displayName, role, passwordHash, disabledAt, ...stamps });
    for (const s of STAFF) account(s.email, s.displayName, s.role, s.disabled ? iso(setupMs + 10 * DAY_MS) : null);
    for (const pl of PLAYERS) if (pl.accountEmail) account(pl.accountEmail, pl.displayName, 'player');
    for (const gd of GUARDIANS) account(gd.email, gd.displayName, 'guardian');
    for (const chunk of chunked(userRows, 200)) db.insert(users).values(chunk).run();

    const staffRows = STAFF.flatMap((s) =>
      s.squads.map((sq) => ({ squadId: DEMO_SQUAD_IDS[sq], userId: demoUserId(s.email), createdAt: setupAt })),
    );
    db.insert(squadStaff).values(staffRows).run();

    // Players: shirt numbers, a quarter left-footed, ages fitting the squad at the load date.
    const sessionPlayers = new Map<SquadKey, SessionPlayer[]>();
    const playerRows: (typeof players.$inferInsert)[] = [];
    for (const squad of SQUADS) {
      const members = PLAYERS.filter((pl) => pl.squad === squad.key);
      const { shirts, leftFooted } = squadRosterDraw(squad.key, members.length);
      const list: SessionPlayer[] = [];
      members.forEach((pl, i) => {
        const own = Prng.fromLabel(`player:${pl.key}`);
        const [minAge, maxAge] = squad.ageRangeYears;
        const id = demoPlayerId(pl.key);
        const dominantFoot = leftFooted.has(i) ? 'left' : 'right';
        playerRows.push({
          id,
          clubId: DEMO_CLUB_ID,
          squadId: DEMO_SQUAD_IDS[squad.key],
          userId: pl.accountEmail ? demoUserId(pl.accountEmail) : null,
          displayName: pl.displayName,
          shirtNumber: shirts[i] ?? i + 30,
          dominantFoot,
          birthDate: birthDateForAge(now, own.uniform(minAge, maxAge)),
          ...stamps,
          deletedAt: null,
        });
        list.push({
          id,
          dominantFoot,
          truth: demoPlayerTruth(pl.key, dominantFoot),
          extraWork: pl.extraWork === true,
          freeKickTaker: FREE_KICK_TAKERS.includes(pl.key),
        });
      });
      sessionPlayers.set(squad.key, list);
    }
    db.insert(players).values(playerRows).run();

    // Guardian links; consent (where given) recorded by the administrator before or early in the period.
    const adminId = DEMO_USER_IDS.admin;
    const linkRows: (typeof guardianLinks.$inferInsert)[] = [];
    for (const gd of GUARDIANS) {
      for (const c of gd.children) {
        const prng = Prng.fromLabel(`guardian-link:${gd.email}:${c.playerKey}`);
        const consented = c.consent !== 'none';
        const consentMs = setupMs + prng.int(1, 30) * DAY_MS + prng.int(0, 8 * 60) * 60_000;
        linkRows.push({
          id: stableId(`guardian-link:${gd.email}:${c.playerKey}`),
          guardianUserId: demoUserId(gd.email),
          playerId: demoPlayerId(c.playerKey),
          relationship: c.relationship,
          consentAt: consented ? iso(consentMs) : null,
          consentRecordedBy: consented ? adminId : null,
          digestOptIn: c.consent === 'opted_in',
          createdAt: setupAt,
          updatedAt: consented ? iso(consentMs) : setupAt,
        });
      }
    }
    db.insert(guardianLinks).values(linkRows).run();

    // Eight weeks of sessions, oldest first, so change_seq follows time.
    const sessionRows: SessionRow[] = [];
    const drillRows: DrillRow[] = [];
    const kickRows: KickRow[] = [];
    const nextSeq = (): number => nextChangeSeq(db);
    const intentions = new Intentions();
    const slots = period.weekStarts.flatMap((weekStart, weekIndex) =>
      SQUADS.flatMap((squad) =>
        squad.sessionSlots.map((slot, slotIndex) => ({
          squad,
          weekIndex,
          slotIndex,
          dayStartUtc: new Date(weekStart.getTime() + (slot.isoWeekday - 1) * DAY_MS),
          sortKey: (slot.isoWeekday - 1) * 1440 + slot.hour * 60 + slot.minute,
        })),
      ),
    );
    slots.sort((a, b) => a.weekIndex - b.weekIndex || a.sortKey - b.sortKey);
    for (const slot of slots) {
      const generated = generateSession({
        clubId: DEMO_CLUB_ID,
        groundId: DEMO_GROUND_ID,
        groundAltitudeM: GROUND.altitudeM,
        squad: { ...slot.squad, id: DEMO_SQUAD_IDS[slot.squad.key] },
        players: sessionPlayers.get(slot.squad.key) ?? [],
        recorders: SESSION_RECORDERS[slot.squad.key].map((r) => ({
          userId: demoUserId(STAFF.find((s) => s.key === r.staffKey)?.email ?? ''),
          deviceId: stableId(`device:${r.staffKey}`),
          weight: r.weight,
        })),
        weekIndex: slot.weekIndex,
        slotIndex: slot.slotIndex,
        dayStartUtc: slot.dayStartUtc,
        periodStartMs,
        periodLengthMs,
        nextSeq,
        intentions,
      });
      sessionRows.push(generated.session);
      drillRows.push(...generated.drills);
      kickRows.push(...generated.kicks);
    }
    for (const chunk of chunked(sessionRows, 200)) db.insert(trainingSessions).values(chunk).run();
    for (const chunk of chunked(drillRows, 400)) db.insert(drills).values(chunk).run();
    for (const chunk of chunked(kickRows, 400)) db.insert(kicks).values(chunk).run();

    return {
      clubs: 1,
      trainingGrounds: 1,
      users: userRows.length,
      squads: SQUADS.length,
      squadStaff: staffRows.length,
      players: playerRows.length,
      guardianLinks: linkRows.length,
      trainingSessions: sessionRows.length,
      drills: drillRows.length,
      kicks: kickRows.length,
    };
  });
  return run.immediate();
}
