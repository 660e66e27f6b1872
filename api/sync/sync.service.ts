/**
 * Applies pushed mutations exactly once and serves scoped changes for pull.
 * The contract is written down in `shared/schemas/sync.ts`.
 */
import { and, asc, eq, getTableColumns, gt, gte, inArray, lte, sql } from 'drizzle-orm';
import type * as z from 'zod';
import {
  deleteDataSchema,
  ENTITY_SCHEMAS,
  mutationSchema,
  type DrillData,
  type KickData,
  type MutationResult,
  type PullResponse,
  type PullWindow,
  type PushResponse,
  type SessionData,
  type SyncChange,
  type SyncEntity,
} from '../../shared/schemas/sync';
import { clearSessionStillAirCarry } from '../analysis/still-air';
import { nextChangeSeq, withChangeSeqBlock, type Db } from '../db/client';
import { cachedStatement } from '../db/statements';
import { changeCounter, drills, kicks, trainingSessions } from '../db/schema';
import { fieldErrors, Forbidden } from '../errors';
import type { Scope } from '../scope/scope';
import { drillColumns, drillToSync, ENTITY_RANK, kickColumns, kickToSync, sessionColumns, sessionToSync } from './sync.rows';

/** Thrown inside one mutation's savepoint to reject it without failing the batch. */
class Rejection extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly fields?: { field: string; message: string }[],
  ) {
    super(message);
  }
}

type Parsed = z.infer<typeof mutationSchema>;

/** Applies one push in a single transaction, each mutation in its own savepoint. */
export function push(db: Db, scope: Scope, deviceId: string, raw: unknown[]): PushResponse {
  const results: MutationResult[] = new Array(raw.length);
  const parsed: { index: number; m: Parsed }[] = [];
  raw.forEach((value, index) => {
    const r = mutationSchema.safeParse(value);
    if (r.success) parsed.push({ index, m: r.data });
    else {
      const id = value && typeof value === 'object' && 'id' in value && typeof value.id === 'string' ? value.id : '';
      results[index] = {
        id,
        status: 'rejected',
        error: { code: 'invalid', message: 'The mutation is malformed', fields: fieldErrors(r.error) },
      };
    }
  });
  // Parents before children, whatever order the device sent them in (stable within an entity).
  parsed.sort((a, b) => ENTITY_RANK[a.m.entity] - ENTITY_RANK[b.m.entity] || a.index - b.index);

  const sqlite = db.$client;
  const applyOne = sqlite.transaction((m: Parsed) => applyMutation(db, scope, deviceId, m));
  const rejected = (m: Parsed, err: Rejection): MutationResult => ({
    id: m.id,
    status: 'rejected',
    error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) },
  });
  // IMMEDIATE: take the write lock at BEGIN, waiting up to the busy timeout. A deferred BEGIN would read first
  // and then fail at once with SQLITE_BUSY_SNAPSHOT if another connection committed meanwhile (SQLite documentation, "BEGIN TRANSACTION").
  // Fast path: the whole batch without savepoints. The first mutation that throws rolls it all back, and
  // the batch runs again with a savepoint per mutation, so a rejected one undoes only itself.
  const fast = sqlite.transaction(() =>
    withChangeSeqBlock(db, () => {
      for (const { index, m } of parsed) results[index] = applyMutation(db, scope, deviceId, m);
    }),
  );
  try {
    fast.immediate();
  } catch (err) {
    if (!(err instanceof Rejection)) throw err;
    sqlite
      .transaction(() =>
        withChangeSeqBlock(db, () => {
          for (const { index, m } of parsed) {
            try {
              results[index] = applyOne(m);
            } catch (e) {
              if (!(e instanceof Rejection)) throw e;
              results[index] = rejected(m, e);
            }
          }
        }),
      )
      .immediate();
  }
  return { results, cursor: currentCursor(db) };
}

/** The latest change sequence handed out. */
export function currentCursor(db: Db): number {
  return db.select({ s: changeCounter.lastSeq }).from(changeCounter).where(eq(changeCounter.id, 1)).get()?.s ?? 0;
}

function parseData<S extends z.ZodType>(schema: S, data: unknown): z.infer<S> {
  const r = schema.safeParse(data);
  if (!r.success) {
    const fields = fieldErrors(r.error).map((f) => ({ ...f, field: f.field === 'body' ? 'data' : `data.${f.field}` }));
    throw new Rejection('invalid', fields.map((f) => `${f.field}: ${f.message}`).join('; '), fields);
  }
  return r.data;
}

/** The row id a mutation names, lower-cased like every stored id (the schemas normalise UUIDs). */
function idOf(m: Parsed): string {
  return typeof m.data['id'] === 'string' ? m.data['id'].toLowerCase() : '';
}

function forbidden(what: string): Rejection {
  return new Rejection('forbidden', `You may not change ${what}`);
}

function sessionFor(db: Db, scope: Scope, sessionId: string): { clubId: string; squadId: string } {
  const session = cachedStatement(db.$client, 'SELECT club_id AS clubId, squad_id AS squadId FROM training_sessions WHERE id = ?').get(
    sessionId,
  ) as { clubId: string; squadId: string } | undefined;
  if (!session)
    throw new Rejection('unknown_session', 'The training session is not on the server; push the session first', [
      { field: 'data.sessionId', message: 'Unknown session' },
    ]);
  if (session.clubId !== scope.user.clubId || !scope.canWriteSquad(session.squadId)) throw forbidden('this squad’s sessions');
  return session;
}

function applyMutation(db: Db, scope: Scope, deviceId: string, m: Parsed): MutationResult {
  if (cachedStatement(db.$client, 'SELECT 1 FROM applied_mutations WHERE id = ?').get(m.id)) {
    return { id: m.id, status: 'duplicate' };
  }
  const now = new Date().toISOString();
  const entityId = idOf(m);
  const result =
    m.entity === 'training_session'
      ? applySession(db, scope, deviceId, m, now)
      : m.entity === 'drill'
        ? applyDrill(db, scope, m, now)
        : applyKick(db, scope, deviceId, m, now);
  if (result.status === 'applied') {
    cachedStatement(
      db.$client,
      `INSERT INTO applied_mutations (id, user_id, device_id, entity, entity_id, status) VALUES (?, ?, ?, ?, ?, 'applied')`,
    ).run(m.id, scope.user.id, deviceId, m.entity, entityId);
  }
  return result;
}

interface Versioned {
  id: string;
  clubId: string;
  version: number;
  deletedAt: string | null;
}

/** Shared rules for an existing row: club, base version, tombstones. Returns a result to stop, or null to go on. */
function checkExisting<R extends Versioned>(
  m: Parsed,
  existing: R,
  toSync: (r: R) => MutationResult['current'],
  scope: Scope,
): MutationResult | null {
  if (existing.clubId !== scope.user.clubId) throw forbidden('this record');
  if (m.op === 'delete' && existing.deletedAt) return { id: m.id, status: 'applied' };
  if (m.baseVersion === undefined || m.baseVersion !== existing.version) {
    return { id: m.id, status: 'conflict', current: toSync(existing) };
  }
  return null;
}

function applySession(db: Db, scope: Scope, deviceId: string, m: Parsed, now: string): MutationResult {
  const existing = db
    .select()
    .from(trainingSessions)
    .where(eq(trainingSessions.id, idOf(m)))
    .get();
  if (m.op === 'delete') {
    const { id } = parseData(deleteDataSchema, m.data);
    if (!existing) return { id: m.id, status: 'applied' };
    if (!scope.canWriteSquad(existing.squadId)) throw forbidden('this squad’s sessions');
    const stop = checkExisting(m, existing, sessionToSync, scope);
    if (stop) return stop;
    db.update(trainingSessions)
      .set({ deletedAt: now, updatedAt: now, version: existing.version + 1, changeSeq: nextChangeSeq(db) })
      .where(eq(trainingSessions.id, id))
      .run();
    return { id: m.id, status: 'applied' };
  }
  const d: SessionData = parseData(ENTITY_SCHEMAS.training_session, m.data);
  if (!scope.canWriteSquad(d.squadId)) throw forbidden('this squad’s sessions');
  if (
    d.groundId &&
    !cachedStatement(db.$client, 'SELECT 1 FROM training_grounds WHERE id = ? AND club_id = ?').get(d.groundId, scope.user.clubId)
  ) {
    throw new Rejection('invalid', 'data.groundId: not a training ground of your club', [
      { field: 'data.groundId', message: 'Unknown training ground' },
    ]);
  }
  if (existing) {
    if (!scope.canWriteSquad(existing.squadId)) throw forbidden('this squad’s sessions');
    const stop = checkExisting(m, existing, sessionToSync, scope);
    if (stop) return stop;
    // Its kicks were scoped to the old squad's staff and players: moving them would show them to others.
    if (d.squadId !== existing.squadId && cachedStatement(db.$client, 'SELECT 1 FROM kicks WHERE session_id = ? LIMIT 1').get(d.id)) {
      throw new Rejection('invalid', 'data.squadId: a session with kicks logged cannot move to another squad', [
        { field: 'data.squadId', message: 'The session already has kicks; start a new session for the other squad' },
      ]);
    }
    db.update(trainingSessions)
      .set({ ...sessionColumns(d), updatedAt: d.updatedAt ?? now, version: existing.version + 1, changeSeq: nextChangeSeq(db) })
      .where(eq(trainingSessions.id, d.id))
      .run();
    clearSessionStillAirCarry(db, d.id);
  } else {
    db.insert(trainingSessions)
      .values({
        id: d.id,
        clubId: scope.user.clubId,
        ...sessionColumns(d),
        recordedBy: scope.user.id,
        deviceId,
        updatedAt: d.updatedAt ?? now,
        version: 1,
        changeSeq: nextChangeSeq(db),
      })
      .run();
  }
  return { id: m.id, status: 'applied' };
}

function applyDrill(db: Db, scope: Scope, m: Parsed, now: string): MutationResult {
  const existing = db
    .select()
    .from(drills)
    .where(eq(drills.id, idOf(m)))
    .get();
  if (m.op === 'delete') {
    const { id } = parseData(deleteDataSchema, m.data);
    if (!existing) return { id: m.id, status: 'applied' };
    sessionFor(db, scope, existing.sessionId);
    const stop = checkExisting(m, existing, drillToSync, scope);
    if (stop) return stop;
    db.update(drills)
      .set({ deletedAt: now, updatedAt: now, version: existing.version + 1, changeSeq: nextChangeSeq(db) })
      .where(eq(drills.id, id))
      .run();
    return { id: m.id, status: 'applied' };
  }
  const d: DrillData = parseData(ENTITY_SCHEMAS.drill, m.data);
  sessionFor(db, scope, d.sessionId);
  if (existing) {
    sessionFor(db, scope, existing.sessionId);
    const stop = checkExisting(m, existing, drillToSync, scope);
    if (stop) return stop;
    db.update(drills)
      .set({ ...drillColumns(d), updatedAt: d.updatedAt ?? now, version: existing.version + 1, changeSeq: nextChangeSeq(db) })
      .where(eq(drills.id, d.id))
      .run();
  } else {
    db.insert(drills)
      .values({
        id: d.id,
        clubId: scope.user.clubId,
        ...drillColumns(d),
        updatedAt: d.updatedAt ?? now,
        version: 1,
        changeSeq: nextChangeSeq(db),
      })
      .run();
  }
  return { id: m.id, status: 'applied' };
}

function checkKickRefs(db: Db, scope: Scope, d: KickData): void {
  const session = sessionFor(db, scope, d.sessionId);
  const player = cachedStatement(
    db.$client,
    'SELECT club_id AS clubId, squad_id AS squadId, deleted_at AS deletedAt FROM players WHERE id = ?',
  ).get(d.playerId) as { clubId: string; squadId: string; deletedAt: string | null } | undefined;
  if (!player || player.clubId !== scope.user.clubId || player.deletedAt) {
    throw new Rejection('invalid', 'data.playerId: no such player in your club', [{ field: 'data.playerId', message: 'Unknown player' }]);
  }
  if (player.squadId !== session.squadId) {
    throw new Rejection('invalid', 'data.playerId: the player is not on this session’s squad', [
      { field: 'data.playerId', message: 'Not on the session’s squad' },
    ]);
  }
  if (d.drillId) {
    const drill = cachedStatement(db.$client, 'SELECT session_id AS sessionId FROM drills WHERE id = ?').get(d.drillId) as
      { sessionId: string } | undefined;
    if (!drill || drill.sessionId !== d.sessionId) {
      throw new Rejection('invalid', 'data.drillId: the drill is not part of this session', [
        { field: 'data.drillId', message: 'Not a drill of this session' },
      ]);
    }
  }
}

/** `SELECT` list giving kick rows the camelCase keys of the Drizzle schema. */
const KICK_COLUMNS = Object.entries(getTableColumns(kicks))
  .map(([key, column]) => `${column.name} AS "${key}"`)
  .join(', ');

type KickRow = typeof kicks.$inferSelect;

const INSERT_KICK = `INSERT INTO kicks (id, club_id, session_id, drill_id, player_id, technique, foot, backspin_step, sidespin_step,
    target_distance_m, target_radius_m, outcome, carry_m, lateral_m, measured_speed_ms, launch_angle_deg, measured_spin_rps,
    hang_time_s, measured_source, video_track_json, recorded_at, recorded_by, device_id, updated_at, version, change_seq)
  VALUES (@id, @clubId, @sessionId, @drillId, @playerId, @technique, @foot, @backspinStep, @sidespinStep, @targetDistanceM,
    @targetRadiusM, @outcome, @carryM, @lateralM, @measuredSpeedMs, @launchAngleDeg, @measuredSpinRps, @hangTimeS,
    @measuredSource, @videoTrackJson, @recordedAt, @recordedBy, @deviceId, @updatedAt, 1, @changeSeq)`;

const UPDATE_KICK = `UPDATE kicks SET session_id = @sessionId, drill_id = @drillId, player_id = @playerId, technique = @technique, foot = @foot,
    backspin_step = @backspinStep, sidespin_step = @sidespinStep, target_distance_m = @targetDistanceM, target_radius_m = @targetRadiusM,
    outcome = @outcome, carry_m = @carryM, lateral_m = @lateralM, measured_speed_ms = @measuredSpeedMs, launch_angle_deg = @launchAngleDeg,
    measured_spin_rps = @measuredSpinRps, hang_time_s = @hangTimeS,
    measured_source = CASE WHEN @keepMeasurement = 1 THEN measured_source ELSE @measuredSource END,
    video_track_json = CASE WHEN @keepMeasurement = 1 THEN video_track_json ELSE @videoTrackJson END, recorded_at = @recordedAt, updated_at = @updatedAt, version = version + 1, change_seq = @changeSeq,
    still_air_carry_m = NULL
  WHERE id = @id`;

function applyKick(db: Db, scope: Scope, deviceId: string, m: Parsed, now: string): MutationResult {
  const existing = cachedStatement(db.$client, `SELECT ${KICK_COLUMNS} FROM kicks WHERE id = ?`).get(idOf(m)) as KickRow | undefined;
  if (m.op === 'delete') {
    const { id } = parseData(deleteDataSchema, m.data);
    if (!existing) return { id: m.id, status: 'applied' };
    sessionFor(db, scope, existing.sessionId);
    const stop = checkExisting(m, existing, kickToSync, scope);
    if (stop) return stop;
    db.update(kicks)
      .set({ deletedAt: now, updatedAt: now, version: existing.version + 1, changeSeq: nextChangeSeq(db) })
      .where(eq(kicks.id, id))
      .run();
    return { id: m.id, status: 'applied' };
  }
  const d: KickData = parseData(ENTITY_SCHEMAS.kick, m.data);
  checkKickRefs(db, scope, d);
  if (existing) {
    sessionFor(db, scope, existing.sessionId);
    const stop = checkExisting(m, existing, kickToSync, scope);
    if (stop) return stop;
    cachedStatement(db.$client, UPDATE_KICK).run({
      id: d.id,
      ...kickColumns(d),
      updatedAt: d.updatedAt ?? now,
      changeSeq: nextChangeSeq(db),
    });
  } else {
    cachedStatement(db.$client, INSERT_KICK).run({
      id: d.id,
      clubId: scope.user.clubId,
      ...kickColumns(d),
      recordedBy: scope.user.id,
      deviceId,
      updatedAt: d.updatedAt ?? now,
      changeSeq: nextChangeSeq(db),
    });
  }
  return { id: m.id, status: 'applied' };
}

/**
 * Changes after `since` that the caller may read, oldest first, at most `limit`; with a `window`, only
 * the recent sessions or only the history (see `pullQuerySchema`). One read transaction, so the
 * recent part's closing cursor (the club's latest change) describes the same snapshot as its rows.
 */
export function pull(db: Db, scope: Scope, since: number, limit: number, window?: PullWindow): PullResponse {
  if (scope.user.role === 'guardian') throw new Forbidden('Guardians see their child’s summary, not raw training data');
  return db.$client.transaction(() => pullSnapshot(db, scope, since, limit, window))();
}

function pullSnapshot(db: Db, scope: Scope, since: number, limit: number, window: PullWindow | undefined): PullResponse {
  const take = limit + 1;
  const club = scope.user.clubId;
  // The recent part: sessions started from `from` on. History is every row up to `upTo`, not only the
  // older sessions: a session whose start was moved since would otherwise fall between the two parts
  // (the device keeps the copies it has, so the overlap costs bytes, never correctness).
  const windowSessions =
    window?.part === 'recent'
      ? db
          .select({ id: trainingSessions.id })
          .from(trainingSessions)
          .where(and(eq(trainingSessions.clubId, club), gte(trainingSessions.startedAt, window.from)))
      : undefined;
  const upTo = window?.part === 'history' ? window.upTo : undefined;
  const seqRange = <T extends typeof trainingSessions.changeSeq | typeof drills.changeSeq | typeof kicks.changeSeq>(col: T) =>
    upTo === undefined ? gt(col, since) : and(gt(col, since), lte(col, upTo));
  const inWindow = (col: typeof trainingSessions.id | typeof drills.sessionId | typeof kicks.sessionId) =>
    windowSessions ? inArray(col, windowSessions) : undefined;
  let sessionRows: (typeof trainingSessions.$inferSelect)[];
  let drillRows: (typeof drills.$inferSelect)[];
  let kickRows: (typeof kicks.$inferSelect)[];
  if (scope.ownPlayerIds) {
    const own = [...scope.ownPlayerIds];
    const ownSessions = db.selectDistinct({ id: kicks.sessionId }).from(kicks).where(inArray(kicks.playerId, own));
    const ownDrills = db
      .selectDistinct({ id: sql<string>`${kicks.drillId}` })
      .from(kicks)
      .where(inArray(kicks.playerId, own));
    sessionRows = db
      .select()
      .from(trainingSessions)
      .where(
        and(
          eq(trainingSessions.clubId, club),
          seqRange(trainingSessions.changeSeq),
          inArray(trainingSessions.id, ownSessions),
          inWindow(trainingSessions.id),
        ),
      )
      .orderBy(asc(trainingSessions.changeSeq))
      .limit(take)
      .all();
    drillRows = db
      .select()
      .from(drills)
      .where(and(eq(drills.clubId, club), seqRange(drills.changeSeq), inArray(drills.id, ownDrills), inWindow(drills.sessionId)))
      .orderBy(asc(drills.changeSeq))
      .limit(take)
      .all();
    kickRows = db
      .select()
      .from(kicks)
      .where(and(eq(kicks.clubId, club), seqRange(kicks.changeSeq), inArray(kicks.playerId, own), inWindow(kicks.sessionId)))
      .orderBy(asc(kicks.changeSeq))
      .limit(take)
      .all();
  } else {
    const squadIds = [...scope.readableSquadIds];
    const readableSessions = db
      .select({ id: trainingSessions.id })
      .from(trainingSessions)
      .where(and(eq(trainingSessions.clubId, club), inArray(trainingSessions.squadId, squadIds)));
    sessionRows = db
      .select()
      .from(trainingSessions)
      .where(
        and(
          eq(trainingSessions.clubId, club),
          seqRange(trainingSessions.changeSeq),
          inArray(trainingSessions.squadId, squadIds),
          inWindow(trainingSessions.id),
        ),
      )
      .orderBy(asc(trainingSessions.changeSeq))
      .limit(take)
      .all();
    drillRows = db
      .select()
      .from(drills)
      .where(
        and(eq(drills.clubId, club), seqRange(drills.changeSeq), inArray(drills.sessionId, readableSessions), inWindow(drills.sessionId)),
      )
      .orderBy(asc(drills.changeSeq))
      .limit(take)
      .all();
    kickRows = db
      .select()
      .from(kicks)
      .where(and(eq(kicks.clubId, club), seqRange(kicks.changeSeq), inArray(kicks.sessionId, readableSessions), inWindow(kicks.sessionId)))
      .orderBy(asc(kicks.changeSeq))
      .limit(take)
      .all();
  }
  const all: SyncChange[] = [
    ...sessionRows.map((r) => ({ entity: 'training_session' as SyncEntity, changeSeq: r.changeSeq, data: sessionToSync(r) })),
    ...drillRows.map((r) => ({ entity: 'drill' as SyncEntity, changeSeq: r.changeSeq, data: drillToSync(r) })),
    ...kickRows.map((r) => ({ entity: 'kick' as SyncEntity, changeSeq: r.changeSeq, data: kickToSync(r) })),
  ].sort((a, b) => a.changeSeq - b.changeSeq);
  const changes = all.slice(0, limit);
  const hasMore = all.length > limit;
  let cursor = changes.at(-1)?.changeSeq ?? since;
  if (window?.part === 'recent' && !hasMore) {
    // Everything recent is on its way; whatever else changed up to now is history. Pulling on from the
    // club's latest change misses nothing that changes next.
    cursor = Math.max(cursor, latestClubChange(db, club));
  }
  return { changes, cursor, hasMore };
}

/** The club's latest change sequence over the synced tables (each read through its club/change_seq index). */
function latestClubChange(db: Db, clubId: string): number {
  const row = cachedStatement(
    db.$client,
    `SELECT max(
       coalesce((SELECT max(change_seq) FROM training_sessions WHERE club_id = @clubId), 0),
       coalesce((SELECT max(change_seq) FROM drills WHERE club_id = @clubId), 0),
       coalesce((SELECT max(change_seq) FROM kicks WHERE club_id = @clubId), 0)) AS seq`,
  ).get({ clubId }) as { seq: number };
  return row.seq;
}
