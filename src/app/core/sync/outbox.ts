import type { SyncEntity, SyncRow } from '../../../../shared/schemas/sync';
import { type LocalDrill, type LocalKick, type LocalSession, type LoftlineDb, type OutboxEntry, newId, tableFor } from '../loftline-db';

/** Any synced row as stored on the device. */
export type LocalRow = LocalSession | LocalDrill | LocalKick;

/** Bookkeeping fields that live on the device and never go into a mutation's `data`. */
const LOCAL_ONLY_FIELDS = new Set(['version', 'deletedAt', 'recordedBy', 'confirmed', 'addedAt']);

/** The `data` of an upsert for a row: its synced fields, without the device's bookkeeping. */
export function mutationData(row: LocalRow): Record<string, unknown> {
  const data: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(row)) {
    if (!LOCAL_ONLY_FIELDS.has(key) && value !== undefined) {
      data[key] = value;
    }
  }
  return data;
}

/** A stored row in the shape the server sends rows (to keep as the confirmed copy). */
export function asSyncRow(row: LocalRow): SyncRow {
  const { confirmed: _confirmed, ...rest } = row;
  return { ...rest, id: row.id, version: row.version, updatedAt: row.updatedAt, deletedAt: row.deletedAt };
}

/** The session a row belongs to (a session belongs to itself). */
export function sessionIdOf(entity: SyncEntity, row: LocalRow): string {
  return entity === 'training_session' ? row.id : (row as LocalDrill | LocalKick).sessionId;
}

/** One local change to record. */
export interface LocalChange {
  userId: string;
  entity: SyncEntity;
  /** The row as it should now stand (for a delete: the row, whose tombstone is set here). */
  row: LocalRow;
  op: 'upsert' | 'delete';
}

/**
 * Writes a change to its table and to the outbox. Must run inside a `db.transaction('rw', …)`
 * that includes the entity's table and `db.outbox`, so the row and its mutation commit together
 * or not at all. Returns the id of the mutation that carries the change.
 *
 * Versions (the server's optimistic-concurrency check): a new mutation's `baseVersion` is the
 * row's known server version plus the number of earlier outbox entries for the row, because
 * each of those will have raised the server's version by one when it is applied. An upsert
 * whose row already has a later upsert waiting that is not on its way to the server (pending,
 * or rejected and awaiting a fix) is folded into that entry instead — same mutation id, same
 * base version — so an edit of a not-yet-sent kick never becomes a second, conflicting
 * mutation. A rejected entry that is edited goes back to pending: the server did not record
 * the rejected id, so the fixed data under the same id applies.
 */
export async function recordChange(db: LoftlineDb, change: LocalChange): Promise<string> {
  const table = tableFor(db, change.entity);
  const now = new Date().toISOString();
  const previous = await table.get(change.row.id);
  const entries = await db.outbox.where('entityId').equals(change.row.id).sortBy('seq');

  // Keep the server's confirmed copy while local changes are outstanding (for discards).
  let confirmed: SyncRow | null;
  if (entries.length > 0) {
    confirmed = previous?.confirmed ?? null;
  } else {
    confirmed = previous && previous.version > 0 ? asSyncRow(previous) : null;
  }
  const row: LocalRow = {
    ...change.row,
    version: previous?.version ?? change.row.version,
    updatedAt: now,
    deletedAt: change.op === 'delete' ? now : null,
    confirmed,
  };
  await table.put(row);

  const last = entries.at(-1);
  if (change.op === 'upsert' && last && last.op === 'upsert' && last.state !== 'in_flight' && last.userId === change.userId) {
    await db.outbox.update(last.id, {
      data: mutationData(row),
      revision: last.revision + 1,
      state: 'pending',
      error: undefined,
    });
    return last.id;
  }

  const base = row.version + entries.length;
  const lastSeq = (await db.outbox.orderBy('seq').last())?.seq ?? 0;
  const entry: OutboxEntry = {
    id: newId(),
    seq: lastSeq + 1,
    userId: change.userId,
    entity: change.entity,
    entityId: row.id,
    sessionId: sessionIdOf(change.entity, row),
    op: change.op,
    data: change.op === 'delete' ? { id: row.id } : mutationData(row),
    queuedAt: now,
    state: 'pending',
    revision: 0,
    attempts: 0,
  };
  if (base > 0) {
    entry.baseVersion = base;
  }
  await db.outbox.add(entry);
  return entry.id;
}
