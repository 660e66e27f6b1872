import { liveSignal } from '../live-signal';
import { Injectable, computed, inject, type Injector, type Signal } from '@angular/core';
import { LOFTLINE_DB, tableFor, type LoftlineDb } from '../loftline-db';
import { AuthSession } from './auth-session';

/** The localStorage key of the last user who signed in on this device (kept after sign-out). */
export const DEVICE_USER_STORAGE_KEY = 'loftline.device-user.v1';

/** What a hand-over did. */
export interface HandoverResult {
  /** Whether the previous user's local data was cleared (a different user signed in). */
  cleared: boolean;
  /** Unsynced changes of other users kept on the device (sent when their author signs in again). */
  keptForOthers: number;
}

/**
 * Clears what the device holds for other users before `userId` sees anything: pulled sessions, drills
 * and kicks, the squad and player caches, other users' conflict notices and pull cursors, and the
 * whole analysis cache (profiles, Squad week, planner). The one exception is the outbox: another
 * user's unsynced changes stay, under their author (only the author pushes them, `SyncQueue`), but
 * the rows they change are removed from the tables so the new user never sees them. `userId`'s own
 * unsynced rows stay as they are.
 */
export async function clearOtherUsersData(db: LoftlineDb, userId: string): Promise<HandoverResult> {
  const tables = [db.sessions, db.drills, db.kicks, db.squads, db.players, db.outbox, db.conflicts, db.syncState, db.analysisCache];
  return db.transaction('rw', tables, async () => {
    const entries = await db.outbox.toArray();
    const own = new Set(entries.filter((e) => e.userId === userId).map((e) => `${e.entity}:${e.entityId}`));
    for (const entity of ['training_session', 'drill', 'kick'] as const) {
      const table = tableFor(db, entity);
      const keep = (await table.toCollection().primaryKeys()).filter((id) => own.has(`${entity}:${id}`));
      const keptRows = await table.bulkGet(keep);
      await table.clear();
      await table.bulkPut(keptRows.filter((r) => r !== undefined));
    }
    await db.squads.clear();
    await db.players.clear();
    await db.analysisCache.clear();
    await db.conflicts.where('userId').notEqual(userId).delete();
    await db.syncState.where('userId').notEqual(userId).delete();
    return { cleared: true, keptForOthers: entries.filter((e) => e.userId !== userId).length };
  });
}

/**
 * Shared phones: called by `AuthSession.signIn` before the new user's first screen. When the last user
 * who signed in here (remembered across sign-outs, so "sign out, hand the phone over, sign in" is caught)
 * is someone else, their local data goes (`clearOtherUsersData`).
 */
export async function handOverDevice(db: LoftlineDb, storage: Storage, userId: string): Promise<HandoverResult> {
  let previous: string | null = null;
  try {
    previous = storage.getItem(DEVICE_USER_STORAGE_KEY);
    storage.setItem(DEVICE_USER_STORAGE_KEY, userId);
  } catch {
    // Storage refused: clear anyway, as if another user had been here (losing a cache costs a refetch).
  }
  if (previous === userId) {
    return { cleared: false, keptForOthers: await othersEntries(db, userId) };
  }
  return clearOtherUsersData(db, userId);
}

/** `handOverDevice` on the app's own database, for `AuthSession`, which loads this module only when someone signs in. */
export function handOverDeviceOf(injector: Injector, storage: Storage, userId: string): Promise<HandoverResult> {
  return handOverDevice(injector.get(LOFTLINE_DB), storage, userId);
}

function othersEntries(db: LoftlineDb, userId: string): Promise<number> {
  // The outbox has no index on the author alone; it holds a few hundred entries at most.
  return db.outbox.filter((e) => e.userId !== userId).count();
}

/** Other users' unsynced changes on this device, for the notice that they wait for their author. */
@Injectable({ providedIn: 'root' })
export class DeviceHandover {
  private readonly db = inject(LOFTLINE_DB);
  private readonly session = inject(AuthSession);
  private readonly userId = computed(() => this.session.user()?.id ?? null);

  /** Unsynced changes made here by users other than the signed-in one (not shown to them, not sent as them). */
  readonly keptForOthers: Signal<number> = liveSignal(this.userId, (id) => othersEntries(this.db, id), { whenNull: 0, initial: 0 });
}
