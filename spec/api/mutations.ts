/*
 * Sync mutations for specs and benches: one definition of "a lofted kick on target at 35 m" so a
 * spec spells out only the fields its check is about. Every call makes fresh mutation and row ids.
 */
import { randomUUID } from 'node:crypto';

/** A `kick` upsert by `playerId` in `sessionId`; `data` overrides the typical repetition's fields. */
export function kickUpsert(sessionId: string, playerId: string, data: Record<string, unknown> = {}) {
  return {
    id: randomUUID(),
    entity: 'kick',
    op: 'upsert',
    data: {
      id: randomUUID(),
      sessionId,
      playerId,
      technique: 'lofted',
      foot: 'right',
      backspinStep: 1,
      sidespinStep: 0,
      targetDistanceM: 35,
      targetRadiusM: 3,
      outcome: 'on_target',
      recordedAt: '2026-11-20T18:41:12.345Z',
      ...data,
    },
  };
}

/** A `training_session` upsert of squad `squadId` with id `sessionId`; `data` adds or overrides fields. */
export function sessionUpsert(sessionId: string, squadId: string, startedAt: string, data: Record<string, unknown> = {}) {
  return {
    id: randomUUID(),
    entity: 'training_session',
    op: 'upsert',
    data: { id: sessionId, squadId, startedAt, ballSize: 5, ...data },
  };
}
