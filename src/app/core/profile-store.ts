import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Subscription } from 'rxjs';
import type { MeResponse } from '../../../shared/schemas/auth';
import { AuthSession } from './auth/auth-session';
import { LOADING, LoadState, toLoadState } from './load-state';

/**
 * The signed-in user's profile from `GET /api/me`: who they are, their club, and which
 * player entries are theirs. Shared by the shell (club name) and the home page (greeting,
 * own player, children) so both read one request instead of fetching it twice.
 */
@Injectable({ providedIn: 'root' })
export class ProfileStore {
  private readonly http = inject(HttpClient);
  private readonly session = inject(AuthSession);
  private readonly loaded = signal<{ userId: string; state: LoadState<MeResponse> } | null>(null);
  private request: Subscription | null = null;

  /** The load state of the profile of the user signed in now (loading until it is asked for). */
  readonly state = computed<LoadState<MeResponse>>(() => {
    const loaded = this.loaded();
    return loaded && loaded.userId === this.session.user()?.id ? loaded.state : LOADING;
  });

  /** The profile once loaded, else null. */
  readonly me = computed(() => {
    const state = this.state();
    return state.status === 'ready' ? state.value : null;
  });

  /** Loads the profile unless it is loaded or loading for the current user already. */
  ensureLoaded(): void {
    const loaded = this.loaded();
    const userId = this.session.user()?.id;
    if (loaded && loaded.userId === userId && loaded.state.status !== 'error') {
      return;
    }
    this.load();
  }

  /** (Re)loads the profile, e.g. after an error the user chose to retry. */
  load(): void {
    const userId = this.session.user()?.id;
    this.request?.unsubscribe();
    this.request = null;
    if (!userId) {
      this.loaded.set(null);
      return;
    }
    this.request = this.http
      .get<MeResponse>('/api/me')
      .pipe(toLoadState())
      .subscribe((state) => {
        if (state.status === 'ready') {
          this.session.rememberProfile(state.value);
        }
        this.loaded.set({ userId, state });
      });
  }
}
