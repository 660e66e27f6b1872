/**
 * Erasure on request (UK GDPR Art. 17). `anonymise` keeps the player's kicks for squad aggregates
 * under an anonymous player row with no name, birth date or account; `remove` deletes the kicks too.
 * Either way guardian links, profiles and the account go, and the name is scrubbed from every place
 * it was copied to as text: the stored roster and kick uploads, queued and sent mail, captured mail,
 * session notes, drill labels and the audit log. The erased row is marked so nothing can revive it.
 */
import { eq, inArray } from 'drizzle-orm';
import { audit } from '../audit';
import { revokeAllRefreshFamilies } from '../auth/tokens';
import type { AuthUser } from '../auth/passport';
import { nextChangeSeq, type Db } from '../db/client';
import { guardianLinks, kicks, playerProfiles, players, users } from '../db/schema';
import { Invalid, NotFound } from '../errors';

/** What an erased player's name becomes wherever it was written. */
export const ERASED_NAME = 'Erased player';

/** How a text copy of a name may have been escaped where it was stored (as typed, JSON, HTML, a quoted CSV field). */
function spellings(name: string): string[] {
  const html = name.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
  const forms = [name, JSON.stringify(name).slice(1, -1), html, name.replace(/"/g, '""')];
  return [...new Set(forms)].filter((f) => f.length > 0);
}

/**
 * Text columns that may hold a copy of a player's name, with the condition that keeps the scrub inside
 * the club (`?` is the club id). Captured mail has no club: it exists only outside production.
 */
const NAME_COPIES: { table: string; columns: string[]; clubCondition: string | null }[] = [
  { table: 'uploads', columns: ['content', 'filename', 'summary_json', 'error'], clubCondition: 'club_id = ?' },
  { table: 'mail_outbox', columns: ['subject', 'text_body', 'html_body', 'headers_json'], clubCondition: 'club_id = ?' },
  { table: 'audit_log', columns: ['detail_json'], clubCondition: 'club_id = ?' },
  { table: 'training_sessions', columns: ['notes'], clubCondition: 'club_id = ?' },
  { table: 'drills', columns: ['label'], clubCondition: 'club_id = ?' },
  { table: 'captured_mail', columns: ['subject', 'text_body', 'html_body', 'headers_json', 'to_json'], clubCondition: null },
];

function scrubName(db: Db, clubId: string, name: string): void {
  for (const spelling of spellings(name)) {
    for (const { table, columns, clubCondition } of NAME_COPIES) {
      for (const column of columns) {
        const where = `instr(${column}, ?) > 0${clubCondition ? ` AND ${clubCondition}` : ''}`;
        const params = clubCondition ? [spelling, ERASED_NAME, spelling, clubId] : [spelling, ERASED_NAME, spelling];
        // Table and column names come from the constant above, never from input.
        db.$client.prepare(`UPDATE ${table} SET ${column} = replace(${column}, ?, ?) WHERE ${where}`).run(...params);
      }
    }
  }
}

/** Erases a player of the admin's club; returns how many kicks were affected. */
export function erasePlayer(db: Db, admin: AuthUser, id: string, mode: 'anonymise' | 'remove', confirmName: string): number {
  const player = db.select().from(players).where(eq(players.id, id)).get();
  if (!player || player.clubId !== admin.clubId || player.erasedAt) throw new NotFound('No such player in your club');
  if (confirmName.trim() !== player.displayName)
    throw new Invalid('Type the player’s full name exactly to confirm', [
      { field: 'confirmName', message: 'Does not match the player’s name' },
    ]);
  return db.transaction(() => {
    const n = db.select({ id: kicks.id }).from(kicks).where(eq(kicks.playerId, id)).all().length;
    const now = new Date().toISOString();
    if (mode === 'remove') {
      db.delete(kicks).where(eq(kicks.playerId, id)).run();
    } else {
      // Keep the rows for squad aggregates; drop what could identify the player in them.
      db.update(kicks)
        .set({ carryM: null, lateralM: null, deviceId: null, recordedBy: null, updatedAt: now, changeSeq: nextChangeSeq(db) })
        .where(eq(kicks.playerId, id))
        .run();
    }
    // Family digests about the child may call them by first name only: their copies go whole.
    const linkIds = db
      .select({ id: guardianLinks.id })
      .from(guardianLinks)
      .where(eq(guardianLinks.playerId, id))
      .all()
      .map((l) => l.id);
    for (const linkId of linkIds) {
      db.$client
        .prepare(
          `UPDATE mail_outbox SET subject = 'Family digest (erased)', text_body = '(erased on request)', html_body = NULL,
             attachments_json = NULL WHERE club_id = ? AND dedupe_key LIKE ? ESCAPE '\\'`,
        )
        .run(admin.clubId, `family\\_digest:${linkId}:%`);
    }
    if (linkIds.length) db.delete(guardianLinks).where(inArray(guardianLinks.id, linkIds)).run();
    db.delete(playerProfiles).where(eq(playerProfiles.playerId, id)).run();
    if (player.userId) {
      revokeAllRefreshFamilies(db, player.userId);
      db.update(players).set({ userId: null }).where(eq(players.id, id)).run();
      db.update(users)
        .set({ disabledAt: now, email: `erased-${player.userId}@erased.invalid`, displayName: 'Erased account', passwordHash: null })
        .where(eq(users.id, player.userId))
        .run();
    }
    db.update(players)
      .set({ displayName: ERASED_NAME, shirtNumber: null, birthDate: null, deletedAt: now, erasedAt: now, updatedAt: now })
      .where(eq(players.id, id))
      .run();
    scrubName(db, admin.clubId, player.displayName);
    audit(db, { clubId: admin.clubId, userId: admin.id, action: `erasure.${mode}`, entity: 'player', entityId: id, detail: { kicks: n } });
    return n;
  });
}
