import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { RouterLink } from '@angular/router';
import { Observable, Subject, combineLatest, map, merge, of, scan, startWith, switchMap } from 'rxjs';
import { isStaffRole } from '../../../shared/roles';
import type { Technique } from '../../../shared/schemas/sync';
import { AuthSession } from '../core/auth/auth-session';
import { LOADING, type LoadState } from '../core/load-state';
import { LoadFailure } from '../ui/load-failure';
import { TECHNIQUES, TECHNIQUE_LABELS } from '../../../shared/vocabulary';
import { isNotFound, oldestCachedAt, readyValue, toAnswerState, updatedLabel } from '../core/analysis/answer-state';
import { CarryBasisChoice } from '../ui/carry-basis-choice';
import { PlayerFileApi } from './player-file-api';
import { busiestTechnique } from './player-file-view';
import { ProgressPanel } from './progress-panel';
import { ReachEnvelopes } from '../core/analysis/reach-envelopes';
import { ReachPanel } from './reach-panel';
import { ReachTable } from './reach-table';
import { HangTimeSpin } from './hang-time-spin';
import { RecentKicks } from './recent-kicks';
import type { TechniqueReach } from './technique-reach';

/** Ball size assumed when the player's squad (and so its ball) is unknown: the senior ball. */
const DEFAULT_BALL_SIZE = 5;

/**
 * The Player file (`/players/:id`, `/players/me` for a player's own): one player's progress over
 * the weeks, outcome mix, reach envelope on a top view with the drill targets, reliable reach with
 * its uncertainty, next week's targets, and the recent kicks. The server decides who may open
 * which file (a player only their own); a refused file says so and shows nothing else. Every
 * answer is kept on the device, so the file opens offline and says how old what it shows is.
 */
@Component({
  selector: 'll-player-file',
  imports: [
    MatButtonToggleModule,
    MatIconModule,
    MatProgressBarModule,
    MatSlideToggleModule,
    RouterLink,
    LoadFailure,
    ProgressPanel,
    ReachPanel,
    ReachTable,
    RecentKicks,
    HangTimeSpin,
  ],
  templateUrl: './player-file.html',
  styleUrl: './player-file.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlayerFile {
  private readonly api = inject(PlayerFileApi);
  private readonly envelopes = inject(ReachEnvelopes);
  private readonly session = inject(AuthSession);
  private readonly retries = new Subject<void>();

  /** The player's id from the route, or `me` for the signed-in player's own file. */
  readonly id = input.required<string>();

  protected readonly carry = inject(CarryBasisChoice);
  protected readonly techniques = TECHNIQUES;
  protected readonly techniqueLabels = TECHNIQUE_LABELS;
  protected readonly isStaff = computed(() => {
    const role = this.session.role();
    return role !== null && isStaffRole(role);
  });

  private readonly retry$ = this.retries.pipe(startWith(undefined));

  protected readonly playerIdState = toSignal(
    combineLatest([toObservable(this.id), this.retry$]).pipe(switchMap(([id]) => this.api.resolvePlayerId(id).pipe(toAnswerState()))),
    { initialValue: LOADING as LoadState<string> },
  );
  private readonly playerId = computed(() => readyValue(this.playerIdState()));
  private readonly playerId$ = toObservable(this.playerId);

  protected readonly header = toSignal(
    this.whenPlayer((id) => this.api.player(id)),
    { initialValue: LOADING },
  );
  protected readonly progress = toSignal(
    combineLatest([this.playerId$, toObservable(this.carry.basis), this.retry$]).pipe(
      switchMap(([id, basis]) => (id === null ? of(LOADING) : this.api.progress(id, basis).pipe(toAnswerState()))),
    ),
    { initialValue: LOADING },
  );
  protected readonly kicks = toSignal(
    this.whenPlayer((id) => this.api.kicks(id)),
    { initialValue: LOADING },
  );
  private readonly squads = toSignal(
    this.whenPlayer(() => this.api.squads()),
    { initialValue: LOADING },
  );
  protected readonly spin = toSignal(
    this.whenPlayer((id) => this.api.spinEstimates(id)),
    { initialValue: LOADING },
  );

  /** Whether the server refused this file (not the caller's, or no such player). */
  protected readonly refused = computed(() => isNotFound(this.header()) || isNotFound(this.playerIdState()));

  /** The ball the player's squad trains with; envelopes use it (null until known). */
  private readonly ballSize = computed(() => {
    const player = readyValue(this.header())?.value;
    const squads = this.squads();
    if (!player || squads.status === 'loading') return null;
    return squads.status === 'ready'
      ? (squads.value.value.find((s) => s.id === player.squadId)?.ballSize ?? DEFAULT_BALL_SIZE)
      : DEFAULT_BALL_SIZE;
  });

  private readonly chosenTechnique = signal<Technique | null>(null);
  /** The technique the charts and envelope show: the chosen one, else the most practised. */
  protected readonly technique = computed<Technique>(
    () => this.chosenTechnique() ?? busiestTechnique(readyValue(this.progress())?.value.weeks ?? []) ?? 'lofted',
  );

  protected readonly reaches = toSignal(
    combineLatest([this.playerId$, toObservable(this.ballSize), this.retry$]).pipe(
      switchMap(([id, ball]) => (id === null || ball === null ? of(this.loadingReaches()) : this.loadReaches(id, ball))),
    ),
    { initialValue: this.loadingReaches() },
  );
  protected readonly selectedReach = computed(() => this.reaches().find((r) => r.technique === this.technique()) ?? null);

  /** "Offline: last updated …" when anything shown came from the device's cache. */
  protected readonly cacheNote = computed(() => {
    const oldest = oldestCachedAt([readyValue(this.header()), readyValue(this.progress()), readyValue(this.kicks())]);
    return oldest === null ? null : `The server cannot be reached: showing what this device saved, last updated ${updatedLabel(oldest)}.`;
  });

  protected readonly title = computed(() => {
    const player = readyValue(this.header())?.value;
    if (!player) return 'Player file';
    return player.shirtNumber === null ? player.displayName : `${player.shirtNumber} · ${player.displayName}`;
  });

  protected chooseTechnique(technique: Technique): void {
    this.chosenTechnique.set(technique);
  }

  protected setStillAir(stillAir: boolean): void {
    this.carry.setStillAir(stillAir);
  }

  protected retry(): void {
    this.retries.next();
  }

  private whenPlayer<T>(load: (playerId: string) => Observable<T>): Observable<LoadState<T>> {
    return combineLatest([this.playerId$, this.retry$]).pipe(
      switchMap(([id]) => (id === null ? of<LoadState<T>>(LOADING) : load(id).pipe(toAnswerState()))),
    );
  }

  private loadingReaches(): TechniqueReach[] {
    return TECHNIQUES.map((technique) => ({ technique, status: 'loading' as const }));
  }

  /** Each technique's profile, then its envelope in the worker; rows update as each arrives. */
  private loadReaches(playerId: string, ballSize: number): Observable<TechniqueReach[]> {
    const one = (technique: Technique): Observable<TechniqueReach> =>
      this.api.profile(playerId, technique).pipe(
        switchMap((answer): Observable<TechniqueReach> => {
          const entry = answer.value;
          if (entry.profile === null) {
            return of({ technique, status: 'empty', entry });
          }
          return this.envelopes.analyse(entry, ballSize, true).pipe(
            map((analysis): TechniqueReach =>
              analysis ? { technique, status: 'ready', entry, analysis } : { technique, status: 'empty', entry },
            ),
            startWith<TechniqueReach>({ technique, status: 'computing', entry }),
          );
        }),
        toAnswerState(),
        map((state): TechniqueReach => {
          if (state.status === 'ready') return state.value;
          if (state.status === 'error') return { technique, status: 'error', message: state.problem.message };
          return { technique, status: 'loading' };
        }),
      );
    return merge(...TECHNIQUES.map(one)).pipe(
      scan((all, reach) => all.map((r) => (r.technique === reach.technique ? reach : r)), this.loadingReaches()),
    );
  }
}
