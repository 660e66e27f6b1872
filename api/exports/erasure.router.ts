/**
 * `POST /api/admin/players/:id/erase` (admin): erases a player on request. `anonymise` keeps
 * their kicks for squad aggregates under an anonymous player row with no name, birth date or
 * account; `remove` deletes the kicks too. Guardian links, profiles and the account go either
 * way. Written to the audit log; the name must be typed to confirm.
 */
import { audit } from '../audit';
import { eq } from 'drizzle-orm';
import { Router } from 'express';
import * as z from 'zod';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { nextChangeSeq } from '../db/client';
import { guardianLinks, kicks, playerProfiles, players, refreshTokens, users } from '../db/schema';
import { Invalid, NotFound, parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';

export const eraseSchema = z.strictObject({
  mode: z.enum(['anonymise', 'remove'], { error: 'mode must be anonymise or remove' }),
  confirmName: z.string({ error: 'confirmName is required' }),
});

/** Builds the erasure router, mounted at `/api/admin/players`. */
export function erasureRouter(db: Db): Router {
  const router = Router();
  router.post('/:id/erase', requireRole('admin'), (req, res) => {
    const id = parseOrThrow(z.uuid({ error: 'id must be a UUID' }), req.params['id'], 'Player id', 'id');
    const { mode, confirmName } = parseOrThrow(eraseSchema, req.body, 'Erasure');
    const admin = scopeOf(req).user;
    const player = db.select().from(players).where(eq(players.id, id)).get();
    if (!player || player.clubId !== admin.clubId) throw new NotFound('No such player in your club');
    if (confirmName.trim() !== player.displayName)
      throw new Invalid('Type the player’s full name exactly to confirm', [
        { field: 'confirmName', message: 'Does not match the player’s name' },
      ]);
    const kicksAffected = db.transaction(() => {
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
      db.delete(guardianLinks).where(eq(guardianLinks.playerId, id)).run();
      db.delete(playerProfiles).where(eq(playerProfiles.playerId, id)).run();
      if (player.userId) {
        db.delete(refreshTokens).where(eq(refreshTokens.userId, player.userId)).run();
        db.update(players).set({ userId: null }).where(eq(players.id, id)).run();
        db.update(users)
          .set({ disabledAt: now, email: `erased-${player.userId}@erased.invalid`, displayName: 'Erased account', passwordHash: null })
          .where(eq(users.id, player.userId))
          .run();
      }
      db.update(players)
        .set({ displayName: 'Erased player', shirtNumber: null, birthDate: null, deletedAt: now, updatedAt: now })
        .where(eq(players.id, id))
        .run();
      audit(db, {
        clubId: admin.clubId,
        userId: admin.id,
        action: `erasure.${mode}`,
        entity: 'player',
        entityId: id,
        detail: { kicks: n },
      });
      return n;
    });
    res.json({ erased: true, kicksAffected });
  });
  return router;
}
