import type { MutationResult, SyncChange, SyncEntity, SyncRow } from '../../../../shared/schemas/sync';
import { type ConflictNotice, type LoftlineDb, type OutboxEntry, type SyncStateRow, newId, tableFor } from '../loftline-db';
import type { LocalRow } from './outbox';

/**
 * The Dexie side of a sync round, kept apart from the scheduling in `SyncQueue`: taking a
 * batch from the outbox, settling the server's answers, and landing pulled rows. Each function
 * is one transaction (landing a pulled page: slices, the cursor moving with the last), so a crash
 * between two of them leaves the outbox consistent (at worst a mutation is sent again, which the
 * server acknowledges as a duplicate, or a page is pulled again).
 */

/** Fields that say nothing about the coach's data when comparing two versions of a row. */
const NOT_COMPARED = new Set(['id', 'updatedAt', 'version', 'deletedAt', 'recordedBy', 'confirmed']);

/** Puts entries a previous page or tab left `in_flight` back to `pending` (run under the sync lock). */
export async function releaseStaleInFlight(db: LoftlineDb, userId: string): Promise<void> {
  await db.outbox.where('[userId+state]').equals([userId, 'in_flight']).modify({ state: 'pending' });
}

/** Marks up to `max` of the user's oldest pending entries `in_flight` and returns them. */
export function takeBatch(db: LoftlineDb, userId: string, max: number): Promise<OutboxEntry[]> {
  return db.transaction('rw', db.outbox, async () => {
    const batch = await db.outbox
      .where('[userId+seq]')
      .between([userId, -Infinity], [userId, Infinity])
      .filter((e) => e.state === 'pending')
      .limit(max)
      .toArray();
    await db.outbox.bulkUpdate(batch.map((e) => ({ key: e.id, changes: { state: 'in_flight' as const } })));
    return batch.map((e) => ({ ...e, state: 'in_flight' as const }));
  });
}

/** Puts a batch whose push failed (no answer) back to `pending`, counting the attempt. */
export async function releaseBatch(db: LoftlineDb, batch: readonly OutboxEntry[]): Promise<void> {
  await db.transaction('rw', db.outbox, async () => {
    for (const sent of batch) {
      const entry = await db.outbox.get(sent.id);
      if (entry?.state === 'in_flight') {
        await db.outbox.update(sent.id, { state: 'pending', attempts: entry.attempts + 1 });
      }
    }
  });
}

/** What settling one push answer did, for the queue's status line and the specs. */
export interface SettleSummary {
  acknowledged: number;
  conflicts: number;
  rejected: number;
  unanswered: number;
}

/**
 * Settles the server's per-mutation answers in one transaction:
 *  - `applied`/`duplicate`: the entry leaves the outbox and the row's known version rises.
 *  - `conflict`: the server's row replaces ours, the entry leaves, a notice keeps our data.
 *  - `rejected`: the entry stays, marked with the reason.
 *  - no answer for an entry: it goes back to pending.
 */
export function settlePush(db: LoftlineDb, batch: readonly OutboxEntry[], results: readonly MutationResult[]): Promise<SettleSummary> {
  const byId = new Map(results.map((r) => [r.id, r]));
  const summary: SettleSummary = { acknowledged: 0, conflicts: 0, rejected: 0, unanswered: 0 };
  return db.transaction('rw', [db.sessions, db.drills, db.kicks, db.outbox, db.conflicts], async () => {
    for (const sent of batch) {
      const entry = await db.outbox.get(sent.id);
      const result = byId.get(sent.id);
      if (!entry) {
        continue;
      }
      if (!result) {
        summary.unanswered++;
        await db.outbox.update(entry.id, { state: 'pending', attempts: entry.attempts + 1 });
      } else if (result.status === 'applied' || result.status === 'duplicate') {
        summary.acknowledged++;
        await acknowledge(db, sent, entry, result.status);
      } else if (result.status === 'conflict' && result.current) {
        summary.conflicts++;
        await keepServerRow(db, sent, result.current);
      } else {
        summary.rejected++;
        const error = result.error ?? { code: 'conflict', message: 'The server refused the change without saying why' };
        // Edited while on its way: the new data may well fix it, so send it again.
        const state = entry.revision !== sent.revision ? 'pending' : 'rejected';
        await db.outbox.update(entry.id, { state, error, attempts: entry.attempts + 1 });
      }
    }
    return summary;
  });
}

async function acknowledge(db: LoftlineDb, sent: OutboxEntry, entry: OutboxEntry, status: 'applied' | 'duplicate'): Promise<void> {
  const table = tableFor(db, sent.entity);
  const serverVersion = (sent.baseVersion ?? 0) + 1;
  if (entry.revision === sent.revision) {
    await db.outbox.delete(entry.id);
  } else {
    // A later edit was folded in while this entry was on its way (another tab): the server has
    // the older data under this id, so the newer data needs an id of its own.
    await db.outbox.delete(entry.id);
    await db.outbox.add({ ...entry, id: newId(), baseVersion: serverVersion, state: 'pending', revision: 0, attempts: 0 });
  }
  const row = await table.get(sent.entityId);
  if (row) {
    const remaining = await db.outbox.where('entityId').equals(sent.entityId).count();
    const version = Math.max(row.version, serverVersion);
    const confirmed: SyncRow | null =
      remaining === 0
        ? null
        : { ...sent.data, id: sent.entityId, version, updatedAt: row.updatedAt, deletedAt: sent.op === 'delete' ? row.deletedAt : null };
    await table.put({ ...row, version, confirmed: remaining === 0 ? undefined : confirmed });
  }
  // Kicks refused because their session was not on the server yet can go now.
  if (sent.entity === 'training_session' && status === 'applied') {
    await db.outbox
      .where('sessionId')
      .equals(sent.entityId)
      .filter((e) => e.state === 'rejected' && e.error?.code === 'unknown_session')
      .modify({ state: 'pending', error: undefined });
  }
}

async function keepServerRow(db: LoftlineDb, sent: OutboxEntry, theirs: SyncRow): Promise<void> {
  const table = tableFor(db, sent.entity);
  await db.outbox.delete(sent.id);
  const remaining = await db.outbox.where('entityId').equals(sent.entityId).count();
  const stored = { ...theirs, confirmed: remaining === 0 ? undefined : theirs } as unknown as LocalRow;
  await table.put(stored);
  const changedFields = sent.op === 'delete' ? [] : differingFields(sent.data, theirs);
  if (sent.op === 'upsert' && changedFields.length === 0) {
    return; // Both sides agree on every field: nothing for the coach to review.
  }
  const notice: ConflictNotice = {
    id: sent.id,
    userId: sent.userId,
    entity: sent.entity,
    entityId: sent.entityId,
    sessionId: sent.sessionId,
    mine: sent.data,
    mineWasDelete: sent.op === 'delete',
    theirs,
    changedFields,
    at: new Date().toISOString(),
  };
  await db.conflicts.put(notice);
}

/** Fields of `mine` whose values differ from the server's row. */
export function differingFields(mine: Record<string, unknown>, theirs: Record<string, unknown>): string[] {
  return Object.keys(mine)
    .filter((key) => !NOT_COMPARED.has(key))
    .filter((key) => JSON.stringify(mine[key] ?? null) !== JSON.stringify(theirs[key] ?? null))
    .sort();
}

/**
 * Rows landed per transaction. IndexedDB copies each row on the calling thread as it is put, so a
 * 500-row page put in one go is a long task on a phone (hundreds of milliseconds under a 4× slower
 * CPU); slices of this size stay near the 50 ms a tap can wait unnoticed, with a pause between them.
 */
export const LAND_SLICE_ROWS = 100;

/**
 * Lands one pulled page and moves the user's cursor. A row with outbox entries keeps the device's
 * version (those edits are still on their way) and only records the server's copy as the confirmed one.
 *
 * The rows land in slices of {@link LAND_SLICE_ROWS}, each its own transaction, with `pause()` between
 * them so input and rendering run; the cursor moves in the last slice's transaction. A page cut short
 * (the tab closed between two slices) is pulled again from the old cursor and landed again: landing is
 * idempotent, because every pulled row is the server's state at or after that cursor. Each slice looks
 * for outbox entries inside its own transaction, so an edit made between two slices is never overwritten.
 */
export async function landPulledChanges(
  db: LoftlineDb,
  userId: string,
  changes: readonly SyncChange[],
  cursor: number,
  progress: Partial<Pick<SyncStateRow, 'firstPullFrom' | 'history'>> = {},
  pause: () => Promise<void> = () => Promise.resolve(),
): Promise<void> {
  const latest = new Map<string, SyncChange>();
  for (const change of changes) {
    latest.set(change.data.id, change);
  }
  const rows = [...latest.values()];
  let start = 0;
  for (; start + LAND_SLICE_ROWS < rows.length; start += LAND_SLICE_ROWS) {
    const slice = rows.slice(start, start + LAND_SLICE_ROWS);
    await db.transaction('rw', [db.sessions, db.drills, db.kicks, db.outbox], () => landRows(db, slice));
    await pause();
  }
  await db.transaction('rw', [db.sessions, db.drills, db.kicks, db.outbox, db.syncState], async () => {
    await landRows(db, rows.slice(start));
    const state: SyncStateRow = {
      ...(await db.syncState.get(userId)),
      ...progress,
      userId,
      cursor,
      lastPulledAt: new Date().toISOString(),
    };
    // An explicit undefined ends that phase (the first pull, the history).
    if ('firstPullFrom' in progress && progress.firstPullFrom === undefined) delete state.firstPullFrom;
    if ('history' in progress && progress.history === undefined) delete state.history;
    await db.syncState.put(state);
  });
}

/** Puts pulled rows (one per id) inside the caller's transaction; rows with outbox entries only get their confirmed copy. */
async function landRows(db: LoftlineDb, changes: readonly SyncChange[]): Promise<void> {
  if (changes.length === 0) return;
  const ids = changes.map((c) => c.data.id);
  const busy = new Set((await db.outbox.where('entityId').anyOf(ids).toArray()).map((e) => e.entityId));
  const puts: Record<SyncEntity, LocalRow[]> = { training_session: [], drill: [], kick: [] };
  for (const change of changes) {
    if (busy.has(change.data.id)) {
      await tableFor(db, change.entity).update(change.data.id, { confirmed: change.data });
    } else {
      puts[change.entity].push(change.data as unknown as LocalRow);
    }
  }
  for (const entity of Object.keys(puts) as SyncEntity[]) {
    if (puts[entity].length > 0) {
      await tableFor(db, entity).bulkPut(puts[entity]);
    }
  }
}

/**
 * Lands one page of history (rows as they stood up to the first pull's cursor) and moves the history
 * cursor, in one transaction. A row the device already has is kept: it came from a later pull or from
 * this device, so it is as new or newer. `done` ends the history.
 */
export function landHistory(
  db: LoftlineDb,
  userId: string,
  changes: readonly SyncChange[],
  historyCursor: number,
  done: boolean,
): Promise<void> {
  return db.transaction('rw', [db.sessions, db.drills, db.kicks, db.syncState], async () => {
    const byEntity: Record<SyncEntity, LocalRow[]> = { training_session: [], drill: [], kick: [] };
    for (const change of changes) byEntity[change.entity].push(change.data as unknown as LocalRow);
    for (const entity of Object.keys(byEntity) as SyncEntity[]) {
      const rows = byEntity[entity];
      if (rows.length === 0) continue;
      const table = tableFor(db, entity);
      const present = await table.bulkGet(rows.map((r) => r.id));
      const missing = rows.filter((_, i) => present[i] === undefined);
      if (missing.length > 0) await table.bulkPut(missing);
    }
    const state = await db.syncState.get(userId);
    if (!state?.history) return;
    const next: SyncStateRow = { ...state, history: { upTo: state.history.upTo, cursor: historyCursor } };
    if (done) delete next.history;
    await db.syncState.put(next);
  });
}

/**
 * Takes a rejected (or pending) change back: the entry leaves the outbox and, when it was the
 * row's last one, the row returns to the server's confirmed copy — or disappears if the server
 * never had it. Refuses an entry that is on its way to the server.
 */
export function discardEntry(db: LoftlineDb, mutationId: string): Promise<boolean> {
  return db.transaction('rw', [db.sessions, db.drills, db.kicks, db.outbox], async () => {
    const entry = await db.outbox.get(mutationId);
    if (!entry || entry.state === 'in_flight') {
      return false;
    }
    await db.outbox.delete(entry.id);
    const remaining = await db.outbox.where('entityId').equals(entry.entityId).count();
    if (remaining > 0) {
      return true;
    }
    const table = tableFor(db, entry.entity);
    const row = await table.get(entry.entityId);
    if (row?.confirmed) {
      await table.put(row.confirmed as unknown as LocalRow);
    } else if (row && row.version === 0) {
      await table.delete(row.id);
    }
    return true;
  });
}

/** Sends a rejected entry again as it is (e.g. after its session reached the server). */
export async function retryEntry(db: LoftlineDb, mutationId: string): Promise<void> {
  await db.outbox
    .where('id')
    .equals(mutationId)
    .filter((e) => e.state === 'rejected')
    .modify({ state: 'pending', error: undefined });
}
