/**
 * Roster import: squads, players (name, shirt number, birth year or date, foot) and guardians'
 * e-mails from one CSV. Natural keys make a re-import update rather than duplicate: a squad by
 * name, a player by squad and name, a guardian by e-mail, a link by guardian and player.
 */
import { audit } from '../audit';
import { createHash, randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import * as z from 'zod';
import type { AuthUser } from '../auth/passport';
import type { Db } from '../db/client';
import { guardianLinks, players, squads, uploads, users } from '../db/schema';
import { hasUnsafeNameCharacters } from '../../shared/safe-text';
import { readCsv } from './csv';
import { ImportInvalid, type ImportResult, type RowError } from './import-types';

/** What a roster commit did. */
export interface RosterSummary {
  squadsCreated: number;
  playersCreated: number;
  playersUpdated: number;
  guardiansCreated: number;
  linksCreated: number;
}

interface RosterRow {
  row: number;
  squad: string;
  name: string;
  shirtNumber: number | null;
  birthDate: string | null;
  foot: 'left' | 'right';
  guardianEmails: string[];
  ageGroup: string;
  ballSize: number;
}

const emailSchema = z.email();

/** Ball size by age group (common practice in English youth football: 3 to U8, 4 to U14, then 5). */
export function ballSizeFor(ageGroup: string): number {
  const m = /u\s*(\d+)/i.exec(ageGroup);
  if (!m) return 5;
  const age = Number(m[1]);
  return age <= 8 ? 3 : age <= 14 ? 4 : 5;
}

function validate(table: ReturnType<typeof readCsv>, now: Date): { rows: RosterRow[]; errors: RowError[] } {
  const errors: RowError[] = [];
  const rows: RosterRow[] = [];
  const seen = new Map<string, number>();
  for (const { row, values } of table.rows) {
    const err = (column: string, message: string) => errors.push({ row, column, message });
    const squad = values['squad']?.trim() ?? '';
    const name = values['name']?.trim() ?? '';
    if (!squad) err('squad', 'Squad is required');
    else if (squad.length > 60) err('squad', 'Squad name is longer than 60 characters');
    else if (hasUnsafeNameCharacters(squad)) err('squad', 'Squad name contains control characters or text-direction overrides');
    if (!name) err('name', 'Name is required');
    else if (name.length > 120) err('name', 'Name is longer than 120 characters');
    else if (hasUnsafeNameCharacters(name)) err('name', 'Name contains control characters or text-direction overrides');
    const shirtRaw = values['shirt_number']?.trim() ?? '';
    const shirtNumber = shirtRaw === '' ? null : Number(shirtRaw);
    if (shirtNumber !== null && (!Number.isInteger(shirtNumber) || shirtNumber < 1 || shirtNumber > 99))
      err('shirt_number', 'Shirt number must be a whole number from 1 to 99');
    let birthDate: string | null = null;
    const year = values['birth_year']?.trim() ?? '';
    const date = values['birth_date']?.trim() ?? '';
    if (date) {
      if (!/^\d{4}-\d{2}-\d{2}$/.test(date) || Number.isNaN(Date.parse(date + 'T00:00:00Z')))
        err('birth_date', 'Birth date must be YYYY-MM-DD');
      else birthDate = date;
    } else if (year) {
      const y = Number(year);
      if (!Number.isInteger(y) || y < 1900 || y > now.getUTCFullYear())
        err('birth_year', `Birth year must be a year from 1900 to ${now.getUTCFullYear()}`);
      else birthDate = `${y}-01-01`;
    }
    const footRaw = (values['foot']?.trim() ?? '').toLowerCase();
    const foot = footRaw === '' || footRaw === 'right' || footRaw === 'r' ? 'right' : footRaw === 'left' || footRaw === 'l' ? 'left' : null;
    if (!foot) err('foot', 'Foot must be left or right');
    const guardianEmails = (values['guardian_emails'] ?? '')
      .split(/[;\s]+/)
      .map((e) => e.trim().toLowerCase())
      .filter(Boolean);
    for (const e of guardianEmails) if (!emailSchema.safeParse(e).success) err('guardian_emails', `"${e}" is not a valid e-mail address`);
    const ageGroup = values['age_group']?.trim() || squad;
    const ballRaw = values['ball_size']?.trim() ?? '';
    const ballSize = ballRaw === '' ? ballSizeFor(ageGroup) : Number(ballRaw);
    if (![3, 4, 5].includes(ballSize)) err('ball_size', 'Ball size must be 3, 4 or 5');
    const key = `${squad.toLowerCase()}|${name.toLowerCase()}`;
    if (squad && name) {
      if (seen.has(key)) err('name', `Same squad and name as row ${seen.get(key)}`);
      else seen.set(key, row);
    }
    rows.push({ row, squad, name, shirtNumber, birthDate, foot: foot ?? 'right', guardianEmails, ageGroup, ballSize });
  }
  return { rows, errors };
}

/** Previews or commits a roster file for the admin's club. */
export function importRoster(
  db: Db,
  admin: AuthUser,
  file: { name: string; buffer: Buffer },
  dryRun: boolean,
  now = new Date(),
): ImportResult<RosterSummary> {
  const table = readCsv(file.buffer, ['squad', 'name']);
  const { rows, errors } = validate(table, now);
  const hash = createHash('sha256').update(file.buffer).digest('hex');
  const empty: RosterSummary = { squadsCreated: 0, playersCreated: 0, playersUpdated: 0, guardiansCreated: 0, linksCreated: 0 };
  const previous = db
    .select()
    .from(uploads)
    .where(
      and(eq(uploads.clubId, admin.clubId), eq(uploads.kind, 'roster'), eq(uploads.contentHash, hash), eq(uploads.status, 'committed')),
    )
    .get();
  if (previous) {
    return {
      dryRun,
      uploadId: previous.id,
      alreadyImported: true,
      rows: rows.length,
      errors: [],
      summary: previous.summaryJson ? (JSON.parse(previous.summaryJson) as RosterSummary) : empty,
    };
  }
  if (dryRun) return { dryRun, uploadId: null, alreadyImported: false, rows: rows.length, errors, summary: plan(db, admin.clubId, rows) };
  if (errors.length) {
    throw new ImportInvalid(`The file has ${errors.length} problem${errors.length > 1 ? 's' : ''}; nothing was imported`, errors);
  }
  const uploadId = randomUUID();
  const summary = db.transaction(
    () => {
      const s = apply(db, admin.clubId, rows);
      db.insert(uploads)
        .values({
          id: uploadId,
          clubId: admin.clubId,
          uploadedBy: admin.id,
          kind: 'roster',
          filename: file.name,
          sizeBytes: file.buffer.length,
          contentHash: hash,
          content: file.buffer.toString('utf8'),
          status: 'committed',
          committedAt: new Date().toISOString(),
          summaryJson: JSON.stringify(s),
        })
        .run();
      audit(db, { clubId: admin.clubId, userId: admin.id, action: 'import.roster', entity: 'upload', entityId: uploadId, detail: s });
      return s;
    },
    { behavior: 'immediate' },
  );
  return { dryRun, uploadId, alreadyImported: false, rows: rows.length, errors: [], summary };
}

/** Counts what a commit would do, without writing. */
function plan(db: Db, clubId: string, rows: RosterRow[]): RosterSummary {
  const s: RosterSummary = { squadsCreated: 0, playersCreated: 0, playersUpdated: 0, guardiansCreated: 0, linksCreated: 0 };
  const clubSquads = new Map(
    db
      .select()
      .from(squads)
      .where(eq(squads.clubId, clubId))
      .all()
      .map((q) => [q.name.toLowerCase(), q.id]),
  );
  const newSquads = new Set<string>();
  const newGuardians = new Set<string>();
  for (const r of rows) {
    const squadId = clubSquads.get(r.squad.toLowerCase());
    if (!squadId && !newSquads.has(r.squad.toLowerCase())) {
      newSquads.add(r.squad.toLowerCase());
      s.squadsCreated++;
    }
    const existing = squadId
      ? db
          .select({ id: players.id })
          .from(players)
          .where(and(eq(players.squadId, squadId), eq(players.displayName, r.name), isNull(players.erasedAt)))
          .get()
      : undefined;
    if (existing) s.playersUpdated++;
    else s.playersCreated++;
    for (const e of r.guardianEmails) {
      const user = db.select({ id: users.id }).from(users).where(eq(users.email, e)).get();
      if (!user && !newGuardians.has(e)) {
        newGuardians.add(e);
        s.guardiansCreated++;
      }
      const linked =
        user && existing
          ? db
              .select()
              .from(guardianLinks)
              .where(and(eq(guardianLinks.guardianUserId, user.id), eq(guardianLinks.playerId, existing.id)))
              .get()
          : undefined;
      if (!linked) s.linksCreated++;
    }
  }
  return s;
}

function apply(db: Db, clubId: string, rows: RosterRow[]): RosterSummary {
  const s: RosterSummary = { squadsCreated: 0, playersCreated: 0, playersUpdated: 0, guardiansCreated: 0, linksCreated: 0 };
  const now = new Date().toISOString();
  for (const r of rows) {
    let squad = db
      .select()
      .from(squads)
      .where(and(eq(squads.clubId, clubId), eq(squads.name, r.squad)))
      .get();
    if (!squad) {
      const id = randomUUID();
      db.insert(squads).values({ id, clubId, name: r.squad, ageGroup: r.ageGroup, ballSize: r.ballSize }).run();
      squad = db.select().from(squads).where(eq(squads.id, id)).get()!;
      s.squadsCreated++;
    }
    let player = db
      .select()
      .from(players)
      // An erased player is never matched (and so never brought back): a row with the same name is someone new.
      .where(and(eq(players.squadId, squad.id), eq(players.displayName, r.name), isNull(players.erasedAt)))
      .get();
    if (player) {
      db.update(players)
        .set({ shirtNumber: r.shirtNumber, birthDate: r.birthDate, dominantFoot: r.foot, deletedAt: null, updatedAt: now })
        .where(eq(players.id, player.id))
        .run();
      s.playersUpdated++;
    } else {
      const id = randomUUID();
      db.insert(players)
        .values({
          id,
          clubId,
          squadId: squad.id,
          displayName: r.name,
          shirtNumber: r.shirtNumber,
          birthDate: r.birthDate,
          dominantFoot: r.foot,
        })
        .run();
      player = db.select().from(players).where(eq(players.id, id)).get()!;
      s.playersCreated++;
    }
    for (const e of r.guardianEmails) {
      let user = db.select().from(users).where(eq(users.email, e)).get();
      if (user && (user.clubId !== clubId || user.role !== 'guardian')) {
        throw new ImportInvalid(`Row ${r.row}: ${e} belongs to an account that is not a guardian of this club; nothing was imported`, [
          { row: r.row, column: 'guardian_emails', message: `${e} is not a guardian account of this club` },
        ]);
      }
      if (!user) {
        const id = randomUUID();
        db.insert(users)
          .values({ id, clubId, email: e, displayName: e.split('@')[0]!, role: 'guardian', passwordHash: null })
          .run();
        user = db.select().from(users).where(eq(users.id, id)).get()!;
        s.guardiansCreated++;
      }
      const linked = db
        .select()
        .from(guardianLinks)
        .where(and(eq(guardianLinks.guardianUserId, user.id), eq(guardianLinks.playerId, player.id)))
        .get();
      if (!linked) {
        db.insert(guardianLinks).values({ id: randomUUID(), guardianUserId: user.id, playerId: player.id }).run();
        s.linksCreated++;
      }
    }
  }
  return s;
}
