import { Injectable } from '@angular/core';
import { Observable, Subject } from 'rxjs';
import type { SyncEntity } from '../../../../shared/schemas/sync';

/**
 * Announces that a change has been committed to IndexedDB and the outbox. The stores call
 * `announce()` after each write; `SyncQueue` listens and pushes soon after (debounced), so a
 * coach logging a run of kicks sends them in one push instead of one request per tap. Its own
 * service so the stores need not know the queue, and the queue need not know the stores.
 */
@Injectable({ providedIn: 'root' })
export class LocalWrites {
  private readonly writes = new Subject<SyncEntity>();

  /** The entity of each committed change, as it happens. */
  readonly written$: Observable<SyncEntity> = this.writes.asObservable();

  /** Tells listeners that a change of this entity is in the outbox. */
  announce(entity: SyncEntity): void {
    this.writes.next(entity);
  }
}
