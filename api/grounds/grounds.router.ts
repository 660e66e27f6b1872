/** `/api/grounds`: the club's training grounds (staff read, admins edit) and the conditions measured at each. */
import { Router } from 'express';
import { requireRole, requireStaff } from '../auth/passport';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import type { GroundConditionsService } from './conditions.service';
import { groundIdSchema, groundInputSchema } from './grounds.schemas';
import { createGround, listGrounds, updateGround } from './grounds.service';

/** Builds the grounds router (mounted behind authentication and scope). */
export function groundsRouter(db: Db, conditions: GroundConditionsService): Router {
  const router = Router();
  const staff = requireStaff();
  router.get('/', staff, (req, res) => {
    res.json({ grounds: listGrounds(db, scopeOf(req)) });
  });
  router.post('/', requireRole('admin'), (req, res) => {
    const body = parseOrThrow(groundInputSchema, req.body, 'Training ground');
    res.status(201).json(createGround(db, scopeOf(req), body));
  });
  router.put('/:id', requireRole('admin'), (req, res) => {
    const id = parseOrThrow(groundIdSchema, req.params['id'], 'Ground id');
    const body = parseOrThrow(groundInputSchema, req.body, 'Training ground');
    res.json(updateGround(db, scopeOf(req), id, body));
  });
  router.get('/:id/conditions', staff, async (req, res) => {
    const id = parseOrThrow(groundIdSchema, req.params['id'], 'Ground id');
    res.json(await conditions.forGround(scopeOf(req), id));
  });
  return router;
}
