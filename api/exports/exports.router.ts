/**
 * `/api/exports`: kicks as CSV (RFC 4180) for a squad or a player and a date range, and a
 * player's full data as JSON for a data-access request (admin). Every export is audited.
 */
import { idSchema } from '../id-param';
import { audit } from '../audit';
import { eq } from 'drizzle-orm';
import { Router } from 'express';
import * as z from 'zod';
import { requireRole, requireStaff } from '../auth/passport';
import type { Db } from '../db/client';
import { guardianLinks, kicks, players, playerProfiles, squads, trainingSessions, users } from '../db/schema';
import { Forbidden, NotFound, parseOrThrow } from '../errors';
import { getPlayer } from '../players/players.service';
import { scopeOf } from '../scope/scope.middleware';
import { toCsv, type CsvCell } from '../../shared/csv';
import { settingsOfClub } from '../club/club.service';
import { metresTo, type DistanceUnit } from '../../shared/units';

const isoDate = (name: string) => z.iso.date({ error: `${name} must be a date (YYYY-MM-DD)` });
export const kicksQuery = z
  .object({ squadId: z.uuid().optional(), playerId: z.uuid().optional(), from: isoDate('from').optional(), to: isoDate('to').optional() })
  .refine((q) => Boolean(q.squadId) !== Boolean(q.playerId), { error: 'give exactly one of squadId or playerId', path: ['squadId'] });

/**
 * Column order of the kicks CSV; the measured-kick import reads it back with a matching mapping. Distance
 * columns are named by the club's unit: `_m` in metres, or `_yd` in a yards club (values converted from the
 * stored metres, to 0.1 mm). Numbers keep the point as decimal mark in every
 * locale (the comma separates RFC 4180 fields), and times stay ISO 8601 UTC, so a file reads the same anywhere.
 */
export const KICK_EXPORT_COLUMNS = [
  'kick_id',
  'recorded_at',
  'squad',
  'session_id',
  'player_id',
  'player',
  'shirt_number',
  'technique',
  'foot',
  'backspin_step',
  'sidespin_step',
  'target_distance_m',
  'target_radius_m',
  'outcome',
  'carry_m',
  'still_air_carry_m',
  'lateral_m',
  'measured_speed_ms',
  'launch_angle_deg',
  'measured_spin_rps',
  'hang_time_s',
] as const;

/** Indexes of the distance columns in {@link KICK_EXPORT_COLUMNS}. */
const DISTANCE_COLUMNS = new Set(KICK_EXPORT_COLUMNS.flatMap((c, i) => (c.endsWith('_m') ? [i] : [])));

/** The header and rows in the club's distance unit (metres pass through untouched). */
function inClubUnit(rows: CsvCell[][], unit: DistanceUnit): { header: string[]; rows: CsvCell[][] } {
  if (unit === 'm') return { header: [...KICK_EXPORT_COLUMNS], rows };
  const header = KICK_EXPORT_COLUMNS.map((c, i) => (DISTANCE_COLUMNS.has(i) ? `${c.slice(0, -2)}_${unit}` : c));
  const convert = (v: CsvCell): CsvCell => (typeof v === 'number' ? Math.round(metresTo(v, unit) * 10_000) / 10_000 : v);
  return { header, rows: rows.map((r) => r.map((v, i) => (DISTANCE_COLUMNS.has(i) ? convert(v) : v))) };
}

/** Builds the exports router (behind authentication and scope). */
export function exportsRouter(db: Db): Router {
  const router = Router();
  router.get('/kicks.csv', requireStaff(), (req, res) => {
    const q = parseOrThrow(kicksQuery, req.query, 'Query');
    const scope = scopeOf(req);
    if (q.squadId && !scope.canReadSquad(q.squadId)) throw new NotFound('No such squad among yours');
    if (q.playerId) getPlayer(db, scope, q.playerId);
    const where = [q.squadId ? 's.squad_id = @squadId' : 'k.player_id = @playerId', 'k.deleted_at IS NULL'];
    if (q.from) where.push('k.recorded_at >= @from');
    if (q.to) where.push(`k.recorded_at < date(@to, '+1 day')`);
    const rows = db.$client
      .prepare(
        `SELECT k.id, k.recorded_at, q.name, k.session_id, k.player_id, p.display_name, p.shirt_number, k.technique, k.foot, k.backspin_step, k.sidespin_step,
                k.target_distance_m, k.target_radius_m, k.outcome, k.carry_m, k.still_air_carry_m, k.lateral_m, k.measured_speed_ms, k.launch_angle_deg, k.measured_spin_rps,
                k.hang_time_s
           FROM kicks k JOIN training_sessions s ON s.id = k.session_id JOIN squads q ON q.id = s.squad_id JOIN players p ON p.id = k.player_id
          WHERE ${where.join(' AND ')} ORDER BY k.recorded_at`,
      )
      .raw()
      .all({ squadId: q.squadId ?? null, playerId: q.playerId ?? null, from: q.from ?? null, to: q.to ?? null }) as CsvCell[][];
    audit(db, {
      clubId: scope.user.clubId,
      userId: scope.user.id,
      action: 'export.kicks',
      entity: q.squadId ? 'squad' : 'player',
      entityId: q.squadId ?? q.playerId ?? null,
      detail: { from: q.from, to: q.to, rows: rows.length },
    });
    res.setHeader('Content-Type', 'text/csv; charset=utf-8; header=present');
    res.setHeader('Content-Disposition', `attachment; filename="loftline-kicks-${q.from ?? 'all'}-${q.to ?? 'now'}.csv"`);
    const shown = inClubUnit(rows, settingsOfClub(db, scope.user.clubId).distanceUnit);
    res.send(toCsv(shown.header, shown.rows));
  });

  router.get('/players/:id.json', requireRole('admin'), (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Player id');
    const scope = scopeOf(req);
    const player = db.select().from(players).where(eq(players.id, id)).get();
    if (!player || player.clubId !== scope.user.clubId) throw new NotFound('No such player in your club');
    if (scope.user.role !== 'admin') throw new Forbidden();
    const squad = db.select().from(squads).where(eq(squads.id, player.squadId)).get();
    const account = player.userId
      ? db
          .select({ id: users.id, email: users.email, displayName: users.displayName, role: users.role, createdAt: users.createdAt })
          .from(users)
          .where(eq(users.id, player.userId))
          .get()
      : null;
    const links = db
      .select({
        id: guardianLinks.id,
        guardianName: users.displayName,
        guardianEmail: users.email,
        relationship: guardianLinks.relationship,
        consentAt: guardianLinks.consentAt,
        consentTextVersion: guardianLinks.consentTextVersion,
        consentWithdrawnAt: guardianLinks.consentWithdrawnAt,
        digestOptIn: guardianLinks.digestOptIn,
      })
      .from(guardianLinks)
      .innerJoin(users, eq(users.id, guardianLinks.guardianUserId))
      .where(eq(guardianLinks.playerId, id))
      .all();
    const kickRows = db.select().from(kicks).where(eq(kicks.playerId, id)).all();
    const sessionIds = [...new Set(kickRows.map((k) => k.sessionId))];
    const sessions = sessionIds.map((s) => db.select().from(trainingSessions).where(eq(trainingSessions.id, s)).get()).filter(Boolean);
    const profiles = db.select().from(playerProfiles).where(eq(playerProfiles.playerId, id)).all();
    audit(db, { clubId: scope.user.clubId, userId: scope.user.id, action: 'export.player_data', entity: 'player', entityId: id });
    res.setHeader('Content-Disposition', `attachment; filename="loftline-player-${id}.json"`);
    res.json({ exportedAt: new Date().toISOString(), player, squad, account, guardianLinks: links, sessions, kicks: kickRows, profiles });
  });
  return router;
}
