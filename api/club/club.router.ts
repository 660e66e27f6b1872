/** `/api/club/settings`: the club's stopwatch calibration (staff read it for Pitchside; the admin sets it). */
import { Router } from 'express';
import { clubSettingsSchema } from '../../shared/schemas/club';
import { requireRole } from '../auth/passport';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { clubSettings, updateClubSettings } from './club.service';

/** Builds the club router (mounted behind authentication and scope). */
export function clubRouter(db: Db): Router {
  const router = Router();
  router.get('/settings', requireRole('admin', 'head_coach', 'assistant_coach'), (req, res) => {
    res.json(clubSettings(db, scopeOf(req)));
  });
  router.put('/settings', requireRole('admin'), (req, res) => {
    const next = parseOrThrow(clubSettingsSchema, req.body, 'Club settings');
    res.json(updateClubSettings(db, scopeOf(req), next));
  });
  return router;
}
