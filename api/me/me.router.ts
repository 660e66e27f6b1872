/** `/api/me`: who the caller is, for the app shell. */
import { audit } from '../audit';
import { eq } from 'drizzle-orm';
import { Router } from 'express';
import type { MeResponse } from '../../shared/schemas/auth';
import type { Db } from '../db/client';
import * as z from 'zod';
import { requireRole } from '../auth/passport';
import { clubs, players } from '../db/schema';
import { NotFound, parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';

/** Builds the me router (mounted behind authentication and scope). */
export function meRouter(db: Db): Router {
  const router = Router();
  router.get('/', (req, res) => {
    const scope = scopeOf(req);
    const club = db.select({ id: clubs.id, name: clubs.name }).from(clubs).where(eq(clubs.id, scope.user.clubId)).get();
    if (!club) throw new NotFound('Your club no longer exists');
    const body: MeResponse = {
      user: scope.user,
      club,
      playerId: scope.user.role === 'player' ? (scope.ownPlayerIds?.[0] ?? null) : null,
      childPlayerIds: scope.user.role === 'guardian' ? [...(scope.ownPlayerIds ?? [])] : [],
    };
    res.json(body);
  });
  /** An adult player's own choice about Family digests sent to their linked guardians (none without it). */
  router.get('/digest-opt-in', requireRole('player'), (req, res) => {
    const own = ownPlayer(db, scopeOf(req).ownPlayerIds);
    res.json({ optIn: own.digestSelfOptIn });
  });
  router.put('/digest-opt-in', requireRole('player'), (req, res) => {
    const scope = scopeOf(req);
    const { optIn } = parseOrThrow(
      z.strictObject({ optIn: z.boolean({ error: 'optIn must be true or false' }) }),
      req.body,
      'Digest opt-in',
    );
    const own = ownPlayer(db, scope.ownPlayerIds);
    db.update(players).set({ digestSelfOptIn: optIn, updatedAt: new Date().toISOString() }).where(eq(players.id, own.id)).run();
    audit(db, {
      clubId: scope.user.clubId,
      userId: scope.user.id,
      action: optIn ? 'digest.self_opted_in' : 'digest.self_opted_out',
      entity: 'player',
      entityId: own.id,
    });
    res.json({ optIn });
  });
  return router;
}

function ownPlayer(db: Db, ids: readonly string[] | null): typeof players.$inferSelect {
  const id = ids?.[0];
  const row = id ? db.select().from(players).where(eq(players.id, id)).get() : undefined;
  if (!row) throw new NotFound('Your account is not linked to a player');
  return row;
}
