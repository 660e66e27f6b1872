/**
 * Roster import: squads, players (name, shirt number, birth year or date, foot) and guardians'
 * e-mails from one CSV. Natural keys make a re-import update rather than duplicate: a squad by
 * name, a player by squad and name, a guardian by e-mail, a link by guardian and player.
 */
import { audit } from '../audit';
import { createHash, randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { cachedStatement } from '../db/statements';
import * as z from 'zod';
import type { AuthUser } from '../auth/passport';
import type { Db } from '../db/client';
import { squads, uploads } from '../db/schema';
import { hasUnsafeNameCharacters } from '../../shared/safe-text';
import type { RosterSummary } from '../../shared/schemas/imports';
import { readCsv } from './csv';
import { ImportInvalid, type ImportAnswer, type ImportRowError } from './import-types';

/** What a roster commit did (shape defined once in shared/). */
export type { RosterSummary };

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

function validate(table: ReturnType<typeof readCsv>, now: Date): { rows: RosterRow[]; errors: ImportRowError[] } {
  const errors: ImportRowError[] = [];
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
): ImportAnswer<RosterSummary> {
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

/**
 * What the club already has, read once per import: squads by name and players by squad and name. A
 * lookup per row without a fitting index made a 50,000-row roster quadratic (minutes of a frozen
 * server); a map makes it linear.
 */
class RosterIndex {
  readonly squadsByName = new Map<string, string>();
  readonly squadsByLowerName = new Map<string, string>();
  private readonly players = new Map<string, string>();

  constructor(db: Db, clubId: string) {
    for (const q of cachedStatement(db.$client, 'SELECT id, name FROM squads WHERE club_id = ? ORDER BY rowid').all(clubId) as {
      id: string;
      name: string;
    }[]) {
      if (!this.squadsByName.has(q.name)) this.squadsByName.set(q.name, q.id);
      if (!this.squadsByLowerName.has(q.name.toLowerCase())) this.squadsByLowerName.set(q.name.toLowerCase(), q.id);
    }
    const rows = cachedStatement(
      db.$client,
      // An erased player is never matched (and so never brought back): a row with the same name is someone new.
      'SELECT id, squad_id AS squadId, display_name AS name FROM players WHERE club_id = ? AND erased_at IS NULL ORDER BY rowid',
    ).all(clubId) as { id: string; squadId: string; name: string }[];
    for (const p of rows) this.addPlayer(p.squadId, p.name, p.id, false);
  }

  player(squadId: string, name: string): string | undefined {
    return this.players.get(`${squadId}\u0000${name}`);
  }

  addPlayer(squadId: string, name: string, id: string, replace = true): void {
    const key = `${squadId}\u0000${name}`;
    if (replace || !this.players.has(key)) this.players.set(key, id);
  }
}

/** A guardian account by e-mail (unique index) and whether a guardian is already linked to a player. */
function accountByEmail(db: Db, email: string): { id: string; clubId: string; role: string } | undefined {
  return cachedStatement(db.$client, 'SELECT id, club_id AS clubId, role FROM users WHERE email = ?').get(email) as
    { id: string; clubId: string; role: string } | undefined;
}

function isLinked(db: Db, guardianUserId: string, playerId: string): boolean {
  return (
    cachedStatement(db.$client, 'SELECT 1 FROM guardian_links WHERE guardian_user_id = ? AND player_id = ?').get(
      guardianUserId,
      playerId,
    ) !== undefined
  );
}

/** Counts what a commit would do, without writing. */
function plan(db: Db, clubId: string, rows: RosterRow[]): RosterSummary {
  const s: RosterSummary = { squadsCreated: 0, playersCreated: 0, playersUpdated: 0, guardiansCreated: 0, linksCreated: 0 };
  const index = new RosterIndex(db, clubId);
  const newSquads = new Set<string>();
  const newGuardians = new Set<string>();
  for (const r of rows) {
    const squadId = index.squadsByLowerName.get(r.squad.toLowerCase());
    if (!squadId && !newSquads.has(r.squad.toLowerCase())) {
      newSquads.add(r.squad.toLowerCase());
      s.squadsCreated++;
    }
    const existing = squadId ? index.player(squadId, r.name) : undefined;
    if (existing) s.playersUpdated++;
    else s.playersCreated++;
    for (const e of r.guardianEmails) {
      const user = accountByEmail(db, e);
      if (!user && !newGuardians.has(e)) {
        newGuardians.add(e);
        s.guardiansCreated++;
      }
      if (!(user && existing && isLinked(db, user.id, existing))) s.linksCreated++;
    }
  }
  return s;
}

function apply(db: Db, clubId: string, rows: RosterRow[]): RosterSummary {
  const s: RosterSummary = { squadsCreated: 0, playersCreated: 0, playersUpdated: 0, guardiansCreated: 0, linksCreated: 0 };
  const now = new Date().toISOString();
  const index = new RosterIndex(db, clubId);
  const sqlite = db.$client;
  const updatePlayer = cachedStatement(
    sqlite,
    'UPDATE players SET shirt_number = ?, birth_date = ?, dominant_foot = ?, deleted_at = NULL, updated_at = ? WHERE id = ?',
  );
  const insertPlayer = cachedStatement(
    sqlite,
    'INSERT INTO players (id, club_id, squad_id, display_name, shirt_number, birth_date, dominant_foot) VALUES (?, ?, ?, ?, ?, ?, ?)',
  );
  const insertGuardian = cachedStatement(
    sqlite,
    "INSERT INTO users (id, club_id, email, display_name, role, password_hash) VALUES (?, ?, ?, ?, 'guardian', NULL)",
  );
  const insertLink = cachedStatement(sqlite, 'INSERT INTO guardian_links (id, guardian_user_id, player_id) VALUES (?, ?, ?)');
  for (const r of rows) {
    let squadId = index.squadsByName.get(r.squad);
    if (!squadId) {
      squadId = randomUUID();
      db.insert(squads).values({ id: squadId, clubId, name: r.squad, ageGroup: r.ageGroup, ballSize: r.ballSize }).run();
      index.squadsByName.set(r.squad, squadId);
      s.squadsCreated++;
    }
    let playerId = index.player(squadId, r.name);
    if (playerId) {
      updatePlayer.run(r.shirtNumber, r.birthDate, r.foot, now, playerId);
      s.playersUpdated++;
    } else {
      playerId = randomUUID();
      insertPlayer.run(playerId, clubId, squadId, r.name, r.shirtNumber, r.birthDate, r.foot);
      index.addPlayer(squadId, r.name, playerId);
      s.playersCreated++;
    }
    for (const e of r.guardianEmails) {
      let user = accountByEmail(db, e);
      if (user && (user.clubId !== clubId || user.role !== 'guardian')) {
        throw new ImportInvalid(`Row ${r.row}: ${e} belongs to an account that is not a guardian of this club; nothing was imported`, [
          { row: r.row, column: 'guardian_emails', message: `${e} is not a guardian account of this club` },
        ]);
      }
      if (!user) {
        user = { id: randomUUID(), clubId, role: 'guardian' };
        insertGuardian.run(user.id, clubId, e, e.split('@')[0]!);
        s.guardiansCreated++;
      }
      if (!isLinked(db, user.id, playerId)) {
        insertLink.run(randomUUID(), user.id, playerId);
        s.linksCreated++;
      }
    }
  }
  return s;
}
