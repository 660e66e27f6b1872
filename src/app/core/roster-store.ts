import { liveSignal } from './live-signal';
import { Injectable, Signal, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from './api-error';
import { AuthSession } from './auth/auth-session';
import { type CachedPlayer, type CachedSquad, LOFTLINE_DB } from './loftline-db';
import { SquadApi } from './squad-api';
import { SyncQueue } from './sync/sync-queue';

/** How old the cached roster may get before a successful sync round refreshes it. */
const ROSTER_MAX_AGE_MS = 10 * 60_000;

/**
 * The signed-in user's squads and players, read from IndexedDB so Pitchside can draw the
 * player chips with no signal, and refreshed from the API whenever the phone is online
 * (on open and after sync rounds, at most every ten minutes unless asked). The server scopes
 * the lists; the cache remembers per squad which users on this device may see it, so a shared
 * phone does not show one coach another coach's squads.
 */
@Injectable({ providedIn: 'root' })
export class RosterStore {
  private readonly db = inject(LOFTLINE_DB);
  private readonly api = inject(SquadApi);
  private readonly session = inject(AuthSession);
  private readonly userId = computed(() => this.session.user()?.id ?? null);
  private readonly refreshedAt = signal<number | null>(null);
  private inFlight: Promise<void> | null = null;

  /** Whether a refresh is under way. */
  readonly refreshing = signal(false);
  /** Why the last refresh failed, or null. */
  readonly problem = signal<string | null>(null);

  /** The user's squads, by name (undefined until IndexedDB has answered). */
  readonly squads: Signal<CachedSquad[] | undefined> = liveSignal(
    this.userId,
    (id) => this.db.squads.where('userIds').equals(id).sortBy('name'),
    {
      whenNull: [],
      initial: undefined,
    },
  );

  constructor() {
    inject(SyncQueue)
      .synced$.pipe(takeUntilDestroyed())
      .subscribe(() => {
        const at = this.refreshedAt();
        if (at === null || Date.now() - at > ROSTER_MAX_AGE_MS) {
          void this.refresh();
        }
      });
  }

  /**
   * The players of a squad, by shirt number then name, live. Call from an injection context
   * (a component's field initialiser): the squad may change while the screen is open.
   */
  livePlayers(squadId: Signal<string | null>): Signal<CachedPlayer[] | undefined> {
    return liveSignal(
      squadId,
      async (id) => {
        const players = await this.db.players.where('squadId').equals(id).toArray();
        return players.sort((a, b) => (a.shirtNumber ?? 999) - (b.shirtNumber ?? 999) || a.displayName.localeCompare(b.displayName));
      },
      { whenNull: [], initial: undefined },
    );
  }

  /**
   * Fetches squads and players and replaces the cache for this user. A failure (no signal)
   * leaves the cache as it was and says why in `problem`. Calls made while one runs share it.
   */
  refresh(): Promise<void> {
    this.inFlight ??= this.load().finally(() => {
      this.inFlight = null;
    });
    return this.inFlight;
  }

  private async load(): Promise<void> {
    const userId = this.userId();
    if (userId === null) {
      return;
    }
    this.refreshing.set(true);
    try {
      const [squads, players] = await Promise.all([firstValueFrom(this.api.listSquads()), firstValueFrom(this.api.listPlayers())]);
      const fetchedAt = new Date().toISOString();
      await this.db.transaction('rw', [this.db.squads, this.db.players], async () => {
        const listed = new Set(squads.map((s) => s.id));
        const previous = await this.db.squads.where('userIds').equals(userId).toArray();
        for (const gone of previous.filter((s) => !listed.has(s.id))) {
          await this.db.squads.update(gone.id, { userIds: gone.userIds.filter((id) => id !== userId) });
        }
        const existing = new Map((await this.db.squads.bulkGet([...listed])).flatMap((s) => (s ? [[s.id, s] as const] : [])));
        await this.db.squads.bulkPut(
          squads.map((s) => ({ ...s, fetchedAt, userIds: [...new Set([...(existing.get(s.id)?.userIds ?? []), userId])] })),
        );
        // Players who left a listed squad must not stay on its chips.
        const current = new Set(players.map((p) => p.id));
        const stale = await this.db.players
          .where('squadId')
          .anyOf([...listed])
          .filter((p) => !current.has(p.id))
          .primaryKeys();
        await this.db.players.bulkDelete(stale);
        await this.db.players.bulkPut(players.map((p) => ({ ...p, fetchedAt })));
      });
      this.refreshedAt.set(Date.now());
      this.problem.set(null);
    } catch (error) {
      this.problem.set(describeApiError(error).message);
    } finally {
      this.refreshing.set(false);
    }
  }
}
