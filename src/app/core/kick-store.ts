import { liveSignal } from './live-signal';
import { Injectable, Signal, inject } from '@angular/core';
import { Dexie } from 'dexie';
import { SPIN_STEP_RPS } from '../../../shared/flight/constants';
import { kickDataSchema, type KickData, type VideoTrack } from '../../../shared/schemas/sync';
import { AuthSession } from './auth/auth-session';
import { InvalidEntryError, validateEntry } from './entry-validation';
import { LocalWrites } from './sync/local-writes';
import { type LocalKick, LOFTLINE_DB, newId } from './loftline-db';
import { mutationData, recordChange } from './sync/outbox';

/** What Pitchside knows when a repetition is logged (the store adds id and time). */
export type NewKick = Omit<KickData, 'id' | 'recordedAt' | 'updatedAt'>;

/** Fields of a logged kick the coach may correct afterwards. */
export type KickCorrection = Partial<
  Pick<
    KickData,
    | 'playerId'
    | 'outcome'
    | 'backspinStep'
    | 'sidespinStep'
    | 'carryM'
    | 'lateralM'
    | 'hangTimeS'
    | 'foot'
    | 'technique'
    | 'targetDistanceM'
    | 'targetRadiusM'
    | 'measuredSource'
    | 'measuredSpeedMs'
    | 'launchAngleDeg'
    | 'measuredSpinRps'
    | 'videoTrack'
  >
>;

/** A launch measured from video, ready to record on a kick. */
export interface VideoMeasurement {
  speedMs: number;
  elevationDeg: number;
  videoTrack: VideoTrack;
}

/** Below this measured spin (rev/s) its direction is within the fit's noise: the logged step stands. */
const SPIN_DIRECTION_MIN_RPS = 0.5;

/** The backspin step size (1–3) whose default rate is nearest a spin size, rev/s. */
function nearestStepSize(spinRps: number): number {
  let best = 1;
  for (const size of [1, 2, 3] as const) {
    if (Math.abs(SPIN_STEP_RPS[size] - spinRps) < Math.abs(SPIN_STEP_RPS[best as 1 | 2 | 3] - spinRps)) best = size;
  }
  return best;
}

/**
 * The repetitions of a session on this device. `log()` resolves only once the kick and its
 * outbox mutation are committed together in IndexedDB — that is what "saved" means on
 * Pitchside, signal or not. Corrections and voids are mutations of their own (a void is a
 * tombstone the server keeps), so every change reaches the server exactly once and in order.
 */
@Injectable({ providedIn: 'root' })
export class KickStore {
  private readonly db = inject(LOFTLINE_DB);
  private readonly session = inject(AuthSession);
  private readonly writes = inject(LocalWrites);

  /** Logs one repetition now. */
  async log(input: NewKick): Promise<LocalKick> {
    const userId = this.requireUser();
    const now = new Date().toISOString();
    const data = validateEntry(kickDataSchema, { ...input, id: newId(), recordedAt: now, updatedAt: now });
    const row: LocalKick = { ...data, updatedAt: now, version: 0, deletedAt: null, recordedBy: userId };
    await this.db.transaction('rw', [this.db.kicks, this.db.outbox], () =>
      recordChange(this.db, { userId, entity: 'kick', row, op: 'upsert' }),
    );
    this.writes.announce('kick');
    return row;
  }

  /** Corrects a logged kick. */
  async edit(id: string, changes: KickCorrection): Promise<LocalKick> {
    const userId = this.requireUser();
    const row = await this.db.transaction('rw', [this.db.kicks, this.db.outbox], async () => {
      const existing = await this.db.kicks.get(id);
      if (!existing || existing.deletedAt) {
        throw new InvalidEntryError('That repetition is not on this device any more', { id: 'Unknown kick' });
      }
      const data = validateEntry(kickDataSchema, { ...mutationData(existing), ...changes });
      const next: LocalKick = { ...existing, ...data, updatedAt: existing.updatedAt };
      await recordChange(this.db, { userId, entity: 'kick', row: next, op: 'upsert' });
      return next;
    });
    this.writes.announce('kick');
    return row;
  }

  /**
   * Records a launch measured from video on a logged kick: speed, angle and spin size in the measured
   * fields with source `video`, the taps and fit beside them. The backspin step takes the measurement's
   * direction (topspin stays topspin) so the profile fit, which signs the measured spin by the step,
   * reads it the right way round; a step the coach logged in the same direction is kept.
   */
  async recordVideoMeasurement(id: string, measurement: VideoMeasurement): Promise<LocalKick> {
    const existing = await this.db.kicks.get(id);
    const logged = existing?.backspinStep ?? 0;
    const spin = measurement.videoTrack.backspinRps;
    let backspinStep = logged;
    if (Math.abs(spin) >= SPIN_DIRECTION_MIN_RPS && Math.sign(spin) !== Math.sign(logged)) {
      backspinStep = Math.sign(spin) * Math.min(3, Math.max(1, nearestStepSize(Math.abs(spin))));
    }
    return this.edit(id, {
      measuredSource: 'video',
      measuredSpeedMs: measurement.speedMs,
      launchAngleDeg: measurement.elevationDeg,
      measuredSpinRps: Math.abs(spin),
      videoTrack: measurement.videoTrack,
      backspinStep,
    });
  }

  /**
   * Voids a kick. A kick the server never accepted (only rejected mutations, never applied)
   * simply goes, with its rejected entries; any other becomes a tombstone sent to the server.
   */
  async void(id: string): Promise<void> {
    const userId = this.requireUser();
    await this.db.transaction('rw', [this.db.kicks, this.db.outbox], async () => {
      const existing = await this.db.kicks.get(id);
      if (!existing || existing.deletedAt) {
        return;
      }
      const entries = await this.db.outbox.where('entityId').equals(id).toArray();
      if (existing.version === 0 && entries.length > 0 && entries.every((e) => e.state === 'rejected')) {
        await this.db.outbox.bulkDelete(entries.map((e) => e.id));
        await this.db.kicks.delete(id);
        return;
      }
      await recordChange(this.db, { userId, entity: 'kick', row: existing, op: 'delete' });
    });
    this.writes.announce('kick');
  }

  /** Voids the latest kick this user logged in the session; returns it, or null if there was none. */
  async undoLast(sessionId: string): Promise<LocalKick | null> {
    const userId = this.requireUser();
    const latest = await this.db.kicks
      .where('[sessionId+recordedAt]')
      .between([sessionId, Dexie.minKey], [sessionId, Dexie.maxKey])
      .reverse()
      .filter((k) => !k.deletedAt && k.recordedBy === userId)
      .first();
    if (!latest) {
      return null;
    }
    await this.void(latest.id);
    return latest;
  }

  /** One kick, live: undefined while loading, null when it is not on this device (or voided). */
  liveKick(id: Signal<string | null>): Signal<LocalKick | null | undefined> {
    return liveSignal(
      id,
      async (kickId) => {
        const row = await this.db.kicks.get(kickId);
        return row && !row.deletedAt ? row : null;
      },
      { whenNull: null, initial: undefined },
    );
  }

  /** The session's kicks that are not voided, newest first, live. */
  liveKicks(sessionId: Signal<string | null>): Signal<LocalKick[] | undefined> {
    return liveSignal(
      sessionId,
      (id) =>
        this.db.kicks
          .where('[sessionId+recordedAt]')
          .between([id, Dexie.minKey], [id, Dexie.maxKey])
          .reverse()
          .filter((k) => !k.deletedAt)
          .toArray(),
      { whenNull: [], initial: undefined },
    );
  }

  private requireUser(): string {
    const id = this.session.user()?.id;
    if (!id) {
      throw new InvalidEntryError('Sign in to log repetitions', { user: 'Signed out' });
    }
    return id;
  }
}
