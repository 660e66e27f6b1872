/** `/api/me`: who the caller is, for the app shell. */
import { eq } from 'drizzle-orm';
import { Router } from 'express';
import type { MeResponse } from '../../shared/schemas/auth';
import type { Db } from '../db/client';
import { clubs } from '../db/schema';
import { NotFound } from '../errors';
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
  return router;
}
