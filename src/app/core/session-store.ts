import { liveQuerySignal, liveSignal } from './live-signal';
import { Injectable, Signal, inject } from '@angular/core';
import { drillDataSchema, sessionDataSchema, type DrillData, type SessionData } from '../../../shared/schemas/sync';
import { AuthSession } from './auth/auth-session';
import { InvalidEntryError, validateEntry } from './entry-validation';
import { LocalWrites } from './sync/local-writes';
import { type LocalDrill, type LocalSession, LOFTLINE_DB, newId } from './loftline-db';
import { mutationData, recordChange } from './sync/outbox';

/** What the coach enters to start a session (the rest is filled in here). */
export type NewSession = Omit<SessionData, 'id' | 'startedAt' | 'updatedAt'>;
/** What the coach enters for a drill. */
export type NewDrill = Omit<DrillData, 'id' | 'sessionId' | 'updatedAt'>;

/** How long after its start an open session is offered to continue (a long evening session plus margin). */
export const OPEN_SESSION_WINDOW_MS = 18 * 60 * 60_000;

/**
 * Training sessions and their drills on this device. Every write goes to IndexedDB and the
 * outbox in one transaction (see `recordChange`) and is checked against the shared schema
 * first, so what the coach saw saved is what the server will accept. Reads are live queries:
 * the screen updates when a pull lands a change made on another phone.
 */
@Injectable({ providedIn: 'root' })
export class SessionStore {
  private readonly db = inject(LOFTLINE_DB);
  private readonly session = inject(AuthSession);
  private readonly writes = inject(LocalWrites);

  /** Starts a session now and returns it once it is stored. */
  async start(input: NewSession): Promise<LocalSession> {
    const userId = this.requireUser();
    const now = new Date().toISOString();
    const data = validateEntry(sessionDataSchema, { ...input, id: newId(), startedAt: now, updatedAt: now });
    const row: LocalSession = { ...data, updatedAt: now, version: 0, deletedAt: null, recordedBy: userId };
    await this.db.transaction('rw', [this.db.sessions, this.db.outbox], () =>
      recordChange(this.db, { userId, entity: 'training_session', row, op: 'upsert' }),
    );
    this.writes.announce('training_session');
    return row;
  }

  /** Changes a session's conditions or notes. */
  async update(id: string, changes: Partial<NewSession> & { endedAt?: string | null }): Promise<LocalSession> {
    const userId = this.requireUser();
    const row = await this.db.transaction('rw', [this.db.sessions, this.db.outbox], async () => {
      const existing = await this.db.sessions.get(id);
      if (!existing || existing.deletedAt) {
        throw new InvalidEntryError('The session is not on this device', { id: 'Unknown session' });
      }
      const data = validateEntry(sessionDataSchema, { ...mutationData(existing), ...changes });
      const next: LocalSession = { ...existing, ...data, updatedAt: existing.updatedAt };
      await recordChange(this.db, { userId, entity: 'training_session', row: next, op: 'upsert' });
      return next;
    });
    this.writes.announce('training_session');
    return row;
  }

  /** Ends a session now. */
  end(id: string): Promise<LocalSession> {
    return this.update(id, { endedAt: new Date().toISOString() });
  }

  /** Adds a drill to a session. */
  async addDrill(sessionId: string, input: NewDrill): Promise<LocalDrill> {
    const userId = this.requireUser();
    const now = new Date().toISOString();
    const data = validateEntry(drillDataSchema, { ...input, id: newId(), sessionId, updatedAt: now });
    const row: LocalDrill = { ...data, updatedAt: now, version: 0, deletedAt: null, addedAt: now };
    await this.db.transaction('rw', [this.db.drills, this.db.outbox], () =>
      recordChange(this.db, { userId, entity: 'drill', row, op: 'upsert' }),
    );
    this.writes.announce('drill');
    return row;
  }

  /** Changes a drill (its target or default spin). Kicks already logged keep their own values. */
  async updateDrill(id: string, changes: Partial<NewDrill>): Promise<LocalDrill> {
    const userId = this.requireUser();
    const row = await this.db.transaction('rw', [this.db.drills, this.db.outbox], async () => {
      const existing = await this.db.drills.get(id);
      if (!existing || existing.deletedAt) {
        throw new InvalidEntryError('The drill is not on this device', { id: 'Unknown drill' });
      }
      const data = validateEntry(drillDataSchema, { ...mutationData(existing), ...changes });
      const next: LocalDrill = { ...existing, ...data, updatedAt: existing.updatedAt };
      await recordChange(this.db, { userId, entity: 'drill', row: next, op: 'upsert' });
      return next;
    });
    this.writes.announce('drill');
    return row;
  }

  /** One session, live: undefined while loading, null when it is not on this device (or deleted). */
  liveSession(id: Signal<string | null>): Signal<LocalSession | null | undefined> {
    return liveSignal(
      id,
      async (sessionId): Promise<LocalSession | null> => {
        const row = await this.db.sessions.get(sessionId);
        return row && !row.deletedAt ? row : null;
      },
      { whenNull: null, initial: undefined },
    );
  }

  /** A session's drills in the order they were added, live. */
  liveDrills(sessionId: Signal<string | null>): Signal<LocalDrill[] | undefined> {
    return liveSignal(
      sessionId,
      async (id) => {
        const drills = await this.db.drills.where('sessionId').equals(id).toArray();
        const added = (d: LocalDrill): string => d.addedAt ?? d.updatedAt;
        return drills.filter((d) => !d.deletedAt).sort((a, b) => added(a).localeCompare(added(b)) || a.id.localeCompare(b.id));
      },
      { whenNull: [], initial: undefined },
    );
  }

  /** Sessions started in the last 18 hours and not ended, newest first, live (any squad: callers filter). */
  liveOpenSessions(): Signal<LocalSession[] | undefined> {
    const since = new Date(Date.now() - OPEN_SESSION_WINDOW_MS).toISOString();
    return liveQuerySignal(async () => {
      const rows = await this.db.sessions.where('startedAt').above(since).reverse().sortBy('startedAt');
      return rows.filter((s) => !s.deletedAt && !s.endedAt);
    }, undefined);
  }

  private requireUser(): string {
    const id = this.session.user()?.id;
    if (!id) {
      throw new InvalidEntryError('Sign in to record sessions', { user: 'Signed out' });
    }
    return id;
  }
}
