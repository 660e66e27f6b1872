/** `/api/squads`: the caller's squads. */
import { Router } from 'express';
import type { Db } from '../db/client';
import { scopeOf } from '../scope/scope.middleware';
import { listSquads } from './squads.service';

/** Builds the squads router (mounted behind authentication and scope). */
export function squadsRouter(db: Db): Router {
  const router = Router();
  router.get('/', (req, res) => {
    res.json({ squads: listSquads(db, scopeOf(req)) });
  });
  return router;
}
