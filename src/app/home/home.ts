import { DigestSelfOptIn } from './digest-self-opt-in';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Observable, Subject, map, of, startWith, switchMap } from 'rxjs';
import { ROLE_LABELS, isStaffRole, type Role } from '../../../shared/roles';
import type { PlayerSummary, SquadSummary } from '../../../shared/schemas/squads';
import { AuthSession } from '../core/auth/auth-session';
import { LOADING, LoadState, toLoadState } from '../core/load-state';
import { ProfileStore } from '../core/profile-store';
import { SquadApi } from '../core/squad-api';
import { LoadFailure } from '../ui/load-failure';

/** What the home page lists, which depends on the role. */
type HomeList =
  | { readonly kind: 'squads'; readonly state: LoadState<SquadSummary[]> }
  | { readonly kind: 'players'; readonly state: LoadState<PlayerSummary[]> }
  | { readonly kind: 'none' };

/**
 * The first page after signing in: a greeting and the things this user works with. Staff
 * see their squads; a player sees their own entry; a guardian sees their linked children.
 * What each role may see is decided by the server; the page only chooses what to ask for.
 */
@Component({
  selector: 'll-home',
  imports: [MatCardModule, MatIconModule, MatProgressBarModule, LoadFailure, DigestSelfOptIn],
  templateUrl: './home.html',
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Home {
  private readonly session = inject(AuthSession);
  private readonly squadApi = inject(SquadApi);
  private readonly reloadList = new Subject<void>();

  protected readonly profile = inject(ProfileStore);
  protected readonly role = this.session.role;
  private readonly clubName = computed(() => this.profile.me()?.club.name ?? this.session.club()?.name ?? null);
  /** Role and club under the greeting, e.g. "Head coach · Harbour Academy". */
  protected readonly subtitle = computed(() => {
    const role = this.role();
    return [role ? ROLE_LABELS[role] : null, this.clubName()].filter((part) => part !== null).join(' · ');
  });
  /** The name to greet: the server's current one once known, the stored one before. */
  protected readonly displayName = computed(() => this.profile.me()?.user.displayName ?? this.session.user()?.displayName ?? '');

  protected readonly list = toSignal(
    this.reloadList.pipe(
      startWith(undefined),
      switchMap(() => this.loadList(this.role())),
    ),
    { initialValue: this.initialList(this.role()) },
  );

  constructor() {
    this.profile.ensureLoaded();
  }

  protected retryProfile(): void {
    this.profile.load();
  }

  protected retryList(): void {
    this.reloadList.next();
  }

  private initialList(role: Role | null): HomeList {
    if (role === null) {
      return { kind: 'none' };
    }
    return isStaffRole(role) ? { kind: 'squads', state: LOADING } : { kind: 'players', state: LOADING };
  }

  private loadList(role: Role | null): Observable<HomeList> {
    if (role === null) {
      return of({ kind: 'none' });
    }
    if (isStaffRole(role)) {
      return this.squadApi.listSquads().pipe(
        toLoadState(),
        map((state): HomeList => ({ kind: 'squads', state })),
      );
    }
    return this.squadApi.listPlayers().pipe(
      toLoadState(),
      map((state): HomeList => ({ kind: 'players', state })),
    );
  }
}
