/** One place that writes the audit log (admin actions, consent, imports, exports, erasure). */
import { randomUUID } from 'node:crypto';
import type { Db } from './db/client';
import { auditLog } from './db/schema';

/** An audit entry. */
export interface AuditEntry {
  clubId?: string | null;
  userId: string | null;
  action: string;
  entity?: string | null;
  entityId?: string | null;
  detail?: object;
}

/** Appends an entry (inside the caller's transaction when there is one). */
export function audit(db: Db, e: AuditEntry): void {
  db.insert(auditLog)
    .values({
      id: randomUUID(),
      clubId: e.clubId ?? null,
      userId: e.userId,
      action: e.action,
      entity: e.entity ?? null,
      entityId: e.entityId ?? null,
      detailJson: e.detail ? JSON.stringify(e.detail) : null,
    })
    .run();
}
