/** `/api/players`: the players the caller may see, and (staff and the player themself) each one's progress, kicks and profile. */
import { idSchema } from '../id-param';
import { Router } from 'express';
import type { ProfileCache } from '../analysis/profile-cache';
import type { Db } from '../db/client';
import { STAFF_ROLES } from '../../shared/roles';
import { requireRole } from '../auth/passport';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { playerKicks } from './kicks.service';
import { kicksQuerySchema, listPlayersQuerySchema, profileQuerySchema, progressQuerySchema } from './players.schemas';
import { getPlayer, listPlayers } from './players.service';
import { playerProgress } from './progress.service';
import { playerSpinEstimates } from './spin.service';

/**
 * Raw training data (progress, kicks, profile, spin estimates) is for staff and the player themself. A
 * guardian gets the child summary (`/api/guardians/children/:playerId/summary`), as the README promises.
 */
const rawDataReaders = requireRole(...STAFF_ROLES, 'player');

/** Builds the players router (mounted behind authentication and scope). */
export function playersRouter(db: Db, profiles: ProfileCache): Router {
  const router = Router();
  router.get('/', (req, res) => {
    const { squadId } = parseOrThrow(listPlayersQuerySchema, req.query, 'Query');
    res.json({ players: listPlayers(db, scopeOf(req), squadId) });
  });
  router.get('/:id', (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Player id');
    res.json({ player: getPlayer(db, scopeOf(req), id) });
  });
  router.get('/:id/progress', rawDataReaders, (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Player id');
    const player = getPlayer(db, scopeOf(req), id);
    const filter = parseOrThrow(progressQuerySchema, req.query, 'Query');
    res.json({ playerId: player.id, carryBasis: filter.carry, weeks: playerProgress(db, player.id, filter) });
  });
  router.get('/:id/kicks', rawDataReaders, (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Player id');
    const player = getPlayer(db, scopeOf(req), id);
    const q = parseOrThrow(kicksQuerySchema, req.query, 'Query');
    res.json({ playerId: player.id, ...playerKicks(db, player.id, q.technique, q.limit) });
  });
  router.get('/:id/profile', rawDataReaders, (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Player id');
    const player = getPlayer(db, scopeOf(req), id);
    const { technique } = parseOrThrow(profileQuerySchema, req.query, 'Query');
    res.json(profiles.get(player.id, technique));
  });
  router.get('/:id/spin-estimates', rawDataReaders, (req, res) => {
    const id = parseOrThrow(idSchema, req.params['id'], 'Player id');
    const scope = scopeOf(req);
    const player = getPlayer(db, scope, id);
    res.json(playerSpinEstimates(db, scope, player.id));
  });
  return router;
}
