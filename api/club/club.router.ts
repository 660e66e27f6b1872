/**
 * `/api/club/settings`: the club's stopwatch calibration, distance unit and locale. Every signed-in member reads
 * them (a guardian's dates follow the club's locale too); the admin sets them.
 */
import { Router } from 'express';
import { clubSettingsUpdateSchema } from '../../shared/schemas/club';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { clubSettings, updateClubSettings } from './club.service';

/** Builds the club router (mounted behind authentication and scope). */
export function clubRouter(db: Db): Router {
  const router = Router();
  router.get('/settings', (req, res) => {
    res.json(clubSettings(db, scopeOf(req)));
  });
  router.put('/settings', requireRole('admin'), (req, res) => {
    const next = parseOrThrow(clubSettingsUpdateSchema, req.body, 'Club settings');
    res.json(updateClubSettings(db, scopeOf(req), next));
  });
  return router;
}
