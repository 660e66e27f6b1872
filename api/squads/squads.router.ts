/** `/api/squads`: the caller's squads and each squad's week. */
import { idSchema } from '../id-param';
import { Router } from 'express';
import * as z from 'zod';
import { requireStaff } from '../auth/passport';
import type { ProfileCache } from '../analysis/profile-cache';
import type { Db } from '../db/client';
import { profileQuerySchema } from '../players/players.schemas';
import { squadProfiles } from './profiles.service';
import { NotFound, parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { listSquads } from './squads.service';
import { squadWeek } from './week.service';

export const weekQuerySchema = z.object({
  start: z.iso.date({ error: 'start must be a date (YYYY-MM-DD)' }),
  carry: z.enum(['logged', 'still-air'], { error: 'carry must be logged or still-air' }).default('logged'),
});

/** Builds the squads router (mounted behind authentication and scope). */
export function squadsRouter(db: Db, profiles: ProfileCache): Router {
  const router = Router();
  router.get('/', (req, res) => {
    res.json({ squads: listSquads(db, scopeOf(req)) });
  });
  router.get('/:id/week', requireStaff(), (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Squad id');
    if (!scopeOf(req).canReadSquad(id)) throw new NotFound('No such squad among yours');
    const { start, carry } = parseOrThrow(weekQuerySchema, req.query, 'Query');
    res.json(squadWeek(db, profiles, scopeOf(req), id, start, carry));
  });
  router.get('/:id/profiles', requireStaff(), (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Squad id');
    if (!scopeOf(req).canReadSquad(id)) throw new NotFound('No such squad among yours');
    const { technique } = parseOrThrow(profileQuerySchema, req.query, 'Query');
    res.json(squadProfiles(db, profiles, scopeOf(req), id, technique));
  });
  return router;
}
