import { InjectionToken } from '@angular/core';
import { Dexie, type EntityTable } from 'dexie';
import type { DrillData, KickData, SessionData, SyncEntity, SyncRow } from '../../../shared/schemas/sync';
import type { PlayerSummary, SquadSummary } from '../../../shared/schemas/squads';

/*
 * The sync contract, seen from the phone (the server side is in shared/schemas/sync.ts):
 *  - Every change is written to its table and to `outbox` in one Dexie transaction; only then
 *    does the UI say "saved". The outbox is the device's promise to the server.
 *  - An outbox entry leaves only when the server acknowledged it (`applied`/`duplicate`), or
 *    answered `conflict` (the server's row replaces ours and a `conflicts` notice keeps what the
 *    coach had). `rejected` entries stay, with the reason, until fixed or discarded.
 *  - Replays are harmless: the mutation id is the idempotency key on the server.
 *  - Pulled rows land in the tables unless the row has outbox entries (local edits win until
 *    the server has answered them); `syncState` keeps each user's pull cursor (and, on a new
 *    device, how far its first pull and the on-demand history have got).
 *  - `squads`/`players` are a read cache of the API, refreshed when online.
 */

/** Bookkeeping every synced row carries locally. */
export interface RowBookkeeping {
  /** The server's version of the row as far as this device knows; 0 = not on the server yet. */
  version: number;
  updatedAt: string;
  deletedAt: string | null;
  /** Who recorded the row (set by the server; absent on rows made here and not yet pulled). */
  recordedBy?: string | null;
  /**
   * The row as the server last confirmed it, kept only while the row has outbox entries, so
   * discarding a rejected change can put the confirmed state back. Null: never on the server.
   */
  confirmed?: SyncRow | null;
}

/** A training session as stored on the device. */
export type LocalSession = Omit<SessionData, 'updatedAt'> & RowBookkeeping;
/** A drill as stored on the device. */
export type LocalDrill = Omit<DrillData, 'updatedAt'> &
  RowBookkeeping & {
    /** When it was added on this device (for ordering; pulled drills fall back to `updatedAt`). */
    addedAt?: string;
  };
/** A kick (one repetition) as stored on the device. */
export type LocalKick = Omit<KickData, 'updatedAt'> & RowBookkeeping;

/** A squad from `GET /api/squads`, with the users on this device allowed to see it. */
export interface CachedSquad extends SquadSummary {
  /** Ids of the signed-in users whose squad list included it (multi-entry index). */
  userIds: string[];
  fetchedAt: string;
}

/** A player from `GET /api/players`. */
export interface CachedPlayer extends PlayerSummary {
  fetchedAt: string;
}

/** Where an outbox entry stands. */
export type OutboxState = 'pending' | 'in_flight' | 'rejected';

/** One mutation waiting for the server's answer. */
export interface OutboxEntry {
  /** The mutation's own UUID: the server's idempotency key. */
  id: string;
  /** Order of creation on this device (pushes go oldest first). */
  seq: number;
  /** Who made the change: only they push it, so a shared phone never sends it as someone else. */
  userId: string;
  entity: SyncEntity;
  /** The id of the row the mutation changes. */
  entityId: string;
  /** The session the row belongs to (for kicks and drills) or is (for sessions). */
  sessionId: string;
  op: 'upsert' | 'delete';
  data: Record<string, unknown>;
  /** The server version this change was made on; absent for a create. */
  baseVersion?: number;
  queuedAt: string;
  state: OutboxState;
  /** Bumped whenever a later edit is folded into this entry. */
  revision: number;
  /** How many pushes carried this entry without an answer for it. */
  attempts: number;
  /** The server's reason, for `rejected`. */
  error?: { code: string; message: string; fields?: { field: string; message: string }[] };
}

/** What the coach had when the server refused an edit because the row had changed meanwhile. */
export interface ConflictNotice {
  /** The refused mutation's id. */
  id: string;
  userId: string;
  entity: SyncEntity;
  entityId: string;
  sessionId: string;
  /** The data this device sent. */
  mine: Record<string, unknown>;
  /** Whether the refused change was a void (delete). */
  mineWasDelete: boolean;
  /** The server's row, which now stands. */
  theirs: SyncRow;
  /** Fields whose values differ between the two, for "what changed". */
  changedFields: string[];
  at: string;
}

/** Per-user sync progress. */
export interface SyncStateRow {
  /** The user's id. */
  userId: string;
  /** The highest change sequence pulled. */
  cursor: number;
  lastPulledAt: string | null;
  /**
   * While a new device's first pull is under way: the date its recent part starts from (sessions from
   * then on come first; see `PullWindow` in `shared/schemas/sync.ts`). Absent once it is done.
   */
  firstPullFrom?: string;
  /**
   * What that first pull left on the server: every row up to change `upTo` (older sessions), fetched on
   * demand page by page from `cursor`. Absent when there is none left.
   */
  history?: { upTo: number; cursor: number };
}

/** A cached analysis answer (envelopes, profiles, progress, planner results) so screens open offline. */
export interface AnalysisCacheEntry {
  /** Caller-chosen key, e.g. `profile:<userId>:<playerId>:lofted`. */
  key: string;
  /** What the entry holds, so a kind can be cleared at once. */
  kind: string;
  value: unknown;
  updatedAt: string;
}

/** The IndexedDB name in production (specs pass their own so each test starts empty). */
export const LOFTLINE_DB_NAME = 'loftline';

/**
 * Loftline's one IndexedDB database. Keys are UUID strings (auto-increment keys do not sync);
 * each schema change adds a `version(n)` below, never edits an old one.
 */
export class LoftlineDb extends Dexie {
  /** Training sessions (synced). */
  sessions!: EntityTable<LocalSession, 'id'>;
  /** Drills (synced). */
  drills!: EntityTable<LocalDrill, 'id'>;
  /** Kicks (synced). */
  kicks!: EntityTable<LocalKick, 'id'>;
  /** Squads cache (read-only here). */
  squads!: EntityTable<CachedSquad, 'id'>;
  /** Players cache (read-only here). */
  players!: EntityTable<CachedPlayer, 'id'>;
  /** Mutations not yet answered by the server. */
  outbox!: EntityTable<OutboxEntry, 'id'>;
  /** Edits the server refused because its row was newer (the coach reviews them). */
  conflicts!: EntityTable<ConflictNotice, 'id'>;
  /** Pull cursor per user. */
  syncState!: EntityTable<SyncStateRow, 'userId'>;
  /** Local-only cache of analysis answers (never synced; safe to clear). */
  analysisCache!: EntityTable<AnalysisCacheEntry, 'key'>;

  constructor(name: string = LOFTLINE_DB_NAME) {
    super(name);
    this.version(1).stores({
      sessions: 'id, squadId, startedAt',
      drills: 'id, sessionId',
      kicks: 'id, sessionId, [sessionId+recordedAt], playerId',
      squads: 'id, *userIds',
      players: 'id, squadId',
      outbox: 'id, seq, entityId, sessionId, [userId+seq], [userId+state]',
      conflicts: 'id, userId, entityId',
      syncState: 'userId',
    });
    this.version(2).stores({
      analysisCache: 'key, kind, updatedAt',
    });
    // Kicks gain `measuredSource` and `videoTrack` (no index): measured values already on the device came
    // from a device import, as on the server (migration 0010).
    this.version(3)
      .stores({})
      .upgrade((tx) =>
        tx
          .table<LocalKick, string>('kicks')
          .toCollection()
          .modify((k) => {
            const measured = [k.measuredSpeedMs, k.launchAngleDeg, k.measuredSpinRps].some((v) => v !== null && v !== undefined);
            if (measured && k.measuredSource === undefined) k.measuredSource = 'device';
          }),
      );
  }
}

/** The app's database. A token so specs can give every test a fresh, uniquely named one. */
export const LOFTLINE_DB = new InjectionToken<LoftlineDb>('LOFTLINE_DB', {
  providedIn: 'root',
  factory: () => new LoftlineDb(),
});

/** The table that holds each synced entity. */
export function tableFor(db: LoftlineDb, entity: SyncEntity): EntityTable<LocalSession | LocalDrill | LocalKick, 'id'> {
  // The three tables share the bookkeeping; callers that need an entity's own fields use the
  // typed table directly.
  const tables = { training_session: db.sessions, drill: db.drills, kick: db.kicks } as const;
  return tables[entity] as EntityTable<LocalSession | LocalDrill | LocalKick, 'id'>;
}

/**
 * A new UUID v4. `crypto.randomUUID` exists only in secure contexts (HTTPS, localhost); the
 * fallback builds the same format from `getRandomValues` so a LAN test install still works.
 */
export function newId(): string {
  if (typeof crypto.randomUUID === 'function') {
    return crypto.randomUUID();
  }
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  bytes[6] = (bytes[6] & 0x0f) | 0x40;
  bytes[8] = (bytes[8] & 0x3f) | 0x80;
  const hex = [...bytes].map((b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}
