import { liveSignal } from '../live-signal';
import { Injectable, Signal, inject } from '@angular/core';
import { LocalWrites } from './local-writes';
import { type ConflictNotice, LOFTLINE_DB, type OutboxEntry, tableFor } from '../loftline-db';
import { type LocalRow, recordChange } from './outbox';
import { discardEntry, retryEntry } from './sync-apply';
import { SyncQueue } from './sync-queue';

/**
 * What the server would not take, for the coach to settle: rejected changes (kept with the
 * server's reason until fixed, sent again or discarded) and conflicts (the server's row was
 * kept; the coach sees what differed and may put their version back on top). Nothing here is
 * ever dropped without the coach asking.
 */
@Injectable({ providedIn: 'root' })
export class SyncIssues {
  private readonly db = inject(LOFTLINE_DB);
  private readonly queue = inject(SyncQueue);
  private readonly writes = inject(LocalWrites);

  /** The user's rejected changes, oldest first. */
  readonly rejected: Signal<OutboxEntry[]> = liveSignal(
    this.queue.userId,
    (id) => this.db.outbox.where('[userId+state]').equals([id, 'rejected']).sortBy('seq'),
    { whenNull: [], initial: [] },
  );

  /** The user's unreviewed conflicts, newest first. */
  readonly conflicts: Signal<ConflictNotice[]> = liveSignal(
    this.queue.userId,
    async (id) => (await this.db.conflicts.where('userId').equals(id).sortBy('at')).reverse(),
    { whenNull: [], initial: [] },
  );

  /** Outbox entries of one session, by row id, live (for per-entry sync marks). */
  liveSessionEntries(sessionId: Signal<string | null>): Signal<ReadonlyMap<string, OutboxEntry>> {
    const none: ReadonlyMap<string, OutboxEntry> = new Map<string, OutboxEntry>();
    return liveSignal(
      sessionId,
      async (id): Promise<ReadonlyMap<string, OutboxEntry>> => {
        const entries = await this.db.outbox.where('sessionId').equals(id).sortBy('seq');
        return new Map(entries.map((e) => [e.entityId, e]));
      },
      { whenNull: none, initial: none },
    );
  }

  /** Drops a rejected change; the row goes back to the server's version (or away, if the server never had it). */
  async discard(mutationId: string): Promise<boolean> {
    return discardEntry(this.db, mutationId);
  }

  /** Sends a rejected change again unchanged (e.g. once its session has reached the server). */
  async retry(mutationId: string): Promise<void> {
    await retryEntry(this.db, mutationId);
    this.queue.syncNow();
  }

  /** Accepts the server's version: the notice goes, the server's row stays. */
  async dismiss(noticeId: string): Promise<void> {
    await this.db.conflicts.delete(noticeId);
  }

  /** Puts the coach's version back on top of the server's row, as a new change made now. */
  async keepMine(notice: ConflictNotice): Promise<void> {
    const table = tableFor(this.db, notice.entity);
    await this.db.transaction('rw', [table, this.db.outbox, this.db.conflicts], async () => {
      const current = await table.get(notice.entityId);
      const base = current ?? (notice.theirs as unknown as LocalRow);
      const row = { ...base, ...notice.mine, version: base.version } as LocalRow;
      await recordChange(this.db, { userId: notice.userId, entity: notice.entity, row, op: notice.mineWasDelete ? 'delete' : 'upsert' });
      await this.db.conflicts.delete(notice.id);
    });
    this.writes.announce(notice.entity);
  }
}
