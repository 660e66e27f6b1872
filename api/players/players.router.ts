/** `/api/players`: the players the caller may see. */
import { Router } from 'express';
import * as z from 'zod';
import type { Db } from '../db/client';
import { parseOrThrow } from '../errors';
import { scopeOf } from '../scope/scope.middleware';
import { listPlayersQuerySchema, progressQuerySchema } from './players.schemas';
import { getPlayer, listPlayers } from './players.service';
import { playerProgress } from './progress.service';

/** Builds the players router (mounted behind authentication and scope). */
export function playersRouter(db: Db): Router {
  const router = Router();
  router.get('/', (req, res) => {
    const { squadId } = parseOrThrow(listPlayersQuerySchema, req.query, 'Query');
    res.json({ players: listPlayers(db, scopeOf(req), squadId) });
  });
  router.get('/:id', (req, res) => {
    const id = parseOrThrow(z.uuid({ error: 'id must be a UUID' }), req.params.id, 'Player id');
    res.json({ player: getPlayer(db, scopeOf(req), id) });
  });
  router.get('/:id/progress', (req, res) => {
    const id = parseOrThrow(z.uuid({ error: 'id must be a UUID' }), req.params.id, 'Player id');
    const filter = parseOrThrow(progressQuerySchema, req.query, 'Query');
    const player = getPlayer(db, scopeOf(req), id);
    res.json({ playerId: player.id, weeks: playerProgress(db, player.id, filter) });
  });
  return router;
}
