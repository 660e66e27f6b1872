import { DestroyRef, Injectable, computed, inject, linkedSignal, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import {
  EMPTY,
  Observable,
  auditTime,
  catchError,
  concat,
  debounceTime,
  distinctUntilChanged,
  expand,
  filter,
  from,
  map,
  of,
  share,
  switchMap,
  timer,
} from 'rxjs';
import { BALL_SIZES, type FlightConditions, type Technique } from '../../../shared/flight';
import type { SquadProfilesResponse } from '../../../shared/schemas/analysis';
import type { SquadSummary } from '../../../shared/schemas/squads';
import { ClubSettingsStore } from '../core/club-settings-store';
import { SquadApi } from '../core/squad-api';
import { FlightEngine } from '../flight/flight-engine';
import { latestWhenIdle } from '../flight/latest-when-idle';
import type { SetPieceRankEntry, SetPieceRankInput } from '../flight/set-piece-rank';
import { toSetPieceFrame } from '../ui/pitch-markings';
import { ANSWER_STORE, type AnswerKind, type CachedLoad, type CachedValue, cacheFirst } from '../core/offline-cache';
import { PlannerApi } from './planner-api';
import {
  clampBall,
  profilesCacheKey,
  profilesFingerprint,
  rankSetPiece,
  resultsCacheKey,
  type PlannerSpot,
  type RankedPlayer,
} from './planner-rank';

/** Monte Carlo samples per player: ±2.5 percentage points on a 50 % share (common practice for a planning aid). */
export const PLANNER_SAMPLES = 400;
/** Fixed seed: every player meets the same random draws, and a spot always gives the same numbers. */
export const PLANNER_SEED = 91_505;
/** How often the planner asks again while the server is still computing profiles, ms, and how many times. */
export const PROFILE_POLL_MS = 4000;
export const PROFILE_POLL_LIMIT = 30;
/** How long the ball must rest before its ranking is kept offline, ms (dragging would fill the cache). */
export const CACHE_AFTER_REST_MS = 1000;

export type { CachedLoad } from '../core/offline-cache';

/** The ranking for the current spot. */
export type RankingState =
  | { readonly status: 'idle' }
  | { readonly status: 'computing' }
  | {
      readonly status: 'ready';
      readonly players: readonly RankedPlayer[];
      readonly key: string;
      /** When a kept ranking was computed (null: computed just now). */
      readonly savedAt: string | null;
      /** Whether a newer computation is on its way (a kept ranking of older profiles is shown meanwhile). */
      readonly refreshing: boolean;
      readonly entries: readonly SetPieceRankEntry[];
      readonly fingerprint: string;
    }
  | { readonly status: 'error'; readonly message: string };

interface KeptRanking {
  fingerprint: string;
  entries: SetPieceRankEntry[];
}

/** The planner's choices, restored when it opens again. */
interface LastPlan {
  squadId: string | null;
  technique: Technique;
  spot: PlannerSpot;
}

interface RankJob {
  squadId: string;
  technique: Technique;
  spot: PlannerSpot;
  profiles: SquadProfilesResponse;
  ballSize: 3 | 4 | 5;
  key: string;
  fingerprint: string;
}

const LAST_PLAN_KEY = 'planner:last';
const SQUADS_KEY = 'planner-squads';
/** A direct free kick from 22 m, slightly right of centre: where the planner opens the first time. */
export const DEFAULT_SPOT: PlannerSpot = { ball: { x: 6, y: 22 }, wallHeightM: 2, aimXM: 0 };

/**
 * State and work of the Set-piece planner: the squads and the chosen squad's launch profiles (from the
 * server, kept on the device for offline use, asked again while the server is still computing), the
 * spot being planned, and the squad's ranking for it, computed in the flight worker and kept offline
 * once the ball rests. Provided by the planner screen, so it lives as long as the screen.
 */
@Injectable()
export class PlannerStore {
  private readonly squadApi = inject(SquadApi);
  private readonly api = inject(PlannerApi);
  private readonly engine = inject(FlightEngine);
  private readonly cache = inject(ANSWER_STORE);
  private readonly clubSettings = inject(ClubSettingsStore);

  /** Whether the last plan has been read back (nothing is computed before, to avoid a wasted run). */
  private readonly restored = signal(false);
  readonly squadId = signal<string | null>(null);
  readonly technique = signal<Technique>('curled');
  readonly spot = signal<PlannerSpot>(DEFAULT_SPOT);
  readonly selectedPlayerId = signal<string | null>(null);

  /** Bumped to ask the server again after a failure. */
  private readonly reloads = signal(0);

  readonly squads = toSignal(
    toObservable(this.reloads).pipe(switchMap(() => this.cachedThenFresh(SQUADS_KEY, 'planner-squads', () => this.squadApi.listSquads()))),
    { initialValue: { status: 'loading' } as CachedLoad<SquadSummary[]> },
  );
  readonly squad = computed(() => {
    const squads = this.squads();
    return squads.status === 'ready' ? (squads.value.find((s) => s.id === this.squadId()) ?? null) : null;
  });

  private readonly profileQuery = computed(() => {
    const squadId = this.squadId();
    return this.restored() && squadId !== null ? { squadId, technique: this.technique(), reload: this.reloads() } : null;
  });
  readonly profiles = toSignal(
    toObservable(this.profileQuery).pipe(
      distinctUntilChanged((a, b) => a?.squadId === b?.squadId && a?.technique === b?.technique && a?.reload === b?.reload),
      switchMap((q) =>
        q === null ? of<CachedLoad<SquadProfilesResponse>>({ status: 'loading' }) : this.loadProfiles(q.squadId, q.technique),
      ),
    ),
    { initialValue: { status: 'loading' } as CachedLoad<SquadProfilesResponse> },
  );

  private readonly job = computed<RankJob | null>(() => {
    const profiles = this.profiles();
    const squadId = this.squadId();
    if (profiles.status !== 'ready' || squadId === null || profiles.value.squadId !== squadId) return null;
    const size = this.squad()?.ballSize;
    const technique = this.technique();
    if (profiles.value.technique !== technique) return null;
    const spot = this.spot();
    return {
      squadId,
      technique,
      spot,
      profiles: profiles.value,
      ballSize: size === 3 || size === 4 ? size : 5,
      key: resultsCacheKey(squadId, technique, spot),
      fingerprint: profilesFingerprint(profiles.value),
    };
  });

  private readonly ranking$ = toObservable(this.job).pipe(
    auditTime(150),
    distinctUntilChanged((a, b) => a?.key === b?.key && a?.fingerprint === b?.fingerprint),
    latestWhenIdle((job) => (job === null ? of<RankingState>({ status: 'idle' }) : this.rank(job))),
    share(),
  );
  readonly ranking = toSignal(this.ranking$, { initialValue: { status: 'idle' } as RankingState });

  /** The players in ranking order (the last ranking stays while the next one computes). */
  readonly rankedPlayers = linkedSignal<RankingState, readonly RankedPlayer[]>({
    source: this.ranking,
    computation: (r, previous) => (r.status === 'ready' ? r.players : r.status === 'computing' ? (previous?.value ?? []) : []),
  });
  /** The player whose cloud and flight are shown: the one picked, else the top of the ranking. */
  readonly selectedPlayer = computed(() => {
    const players = this.rankedPlayers();
    const id = this.selectedPlayerId();
    return players.find((p) => p.playerId === id && p.result !== null) ?? players.find((p) => p.result !== null) ?? null;
  });

  constructor() {
    const destroyRef = inject(DestroyRef);
    void this.restore();
    // Pick a squad once the list is known and none is chosen (or the kept one is gone).
    toObservable(this.squads)
      .pipe(takeUntilDestroyed(destroyRef))
      .subscribe((squads) => {
        if (squads.status !== 'ready' || !this.restored()) return;
        const id = this.squadId();
        if (id === null || !squads.value.some((s) => s.id === id)) this.squadId.set(squads.value[0]?.id ?? null);
      });
    // Keep a ranking offline once the ball has rested on its spot, and remember the plan.
    this.ranking$
      .pipe(
        filter((r): r is Extract<RankingState, { status: 'ready' }> => r.status === 'ready' && r.savedAt === null),
        debounceTime(CACHE_AFTER_REST_MS),
        takeUntilDestroyed(destroyRef),
      )
      .subscribe((r) => void this.keep(r));
  }

  /** Ask the server again for squads and profiles (after a failed load). */
  retry(): void {
    this.reloads.update((n) => n + 1);
  }

  /** Move the ball (kept where a wall can stand in front of the goal). */
  moveBall(ball: { x: number; y: number }): void {
    this.spot.update((s) => ({ ...s, ball: clampBall(ball) }));
  }

  /** Set the wall's height, m. */
  setWallHeight(wallHeightM: number): void {
    this.spot.update((s) => ({ ...s, wallHeightM }));
  }

  /** Set the aim point across the goal, m from the centre, + = right. */
  setAim(aimXM: number): void {
    this.spot.update((s) => ({ ...s, aimXM }));
  }

  private async restore(): Promise<void> {
    try {
      const last = await this.cache.get<LastPlan>(LAST_PLAN_KEY);
      if (last) {
        this.squadId.set(last.squadId);
        this.technique.set(last.technique);
        this.spot.set({ ...last.spot, ball: clampBall(last.spot.ball) });
      }
    } catch {
      // No kept plan (or storage refused): start from the defaults.
    }
    this.restored.set(true);
    const squads = this.squads();
    if (squads.status === 'ready' && (this.squadId() === null || !squads.value.some((s) => s.id === this.squadId()))) {
      this.squadId.set(squads.value[0]?.id ?? null);
    }
  }

  private async keep(r: Extract<RankingState, { status: 'ready' }>): Promise<void> {
    const plan: LastPlan = { squadId: this.squadId(), technique: this.technique(), spot: this.spot() };
    try {
      await this.cache.put<CachedValue<KeptRanking>>(r.key, 'planner-ranking', {
        savedAt: new Date().toISOString(),
        value: { fingerprint: r.fingerprint, entries: [...r.entries] },
      });
      await this.cache.put<LastPlan>(LAST_PLAN_KEY, 'planner-plan', plan);
    } catch {
      // Storage full or refused: the planner still works, it just will not open offline on this spot.
    }
  }

  /** The device's copy first (if any), then the server's answer, kept for next time. */
  private cachedThenFresh<T>(key: string, kind: AnswerKind, fetch: () => Observable<T>): Observable<CachedLoad<T>> {
    return cacheFirst(this.cache, key, kind, fetch);
  }

  private loadProfiles(squadId: string, technique: Technique): Observable<CachedLoad<SquadProfilesResponse>> {
    // Ask again while the server is still computing some players' profiles.
    const fetch = (): Observable<SquadProfilesResponse> =>
      this.api
        .squadProfiles(squadId, technique)
        .pipe(
          expand((res, i) =>
            res.players.some((p) => p.pending) && i < PROFILE_POLL_LIMIT
              ? timer(PROFILE_POLL_MS).pipe(switchMap(() => this.api.squadProfiles(squadId, technique)))
              : EMPTY,
          ),
        );
    return this.cachedThenFresh(profilesCacheKey(squadId, technique), 'planner-profiles', fetch);
  }

  private rank(job: RankJob): Observable<RankingState> {
    return from(this.cache.get<CachedValue<KeptRanking>>(job.key).catch(() => undefined)).pipe(
      switchMap((kept) => {
        const shown = (entries: readonly SetPieceRankEntry[], savedAt: string | null, refreshing: boolean): RankingState => ({
          status: 'ready',
          players: rankSetPiece(job.profiles, entries),
          key: job.key,
          savedAt,
          refreshing,
          entries,
          fingerprint: job.fingerprint,
        });
        if (kept && kept.value.fingerprint === job.fingerprint) return of(shown(kept.value.entries, kept.savedAt, false));
        const compute = this.engine.setPieceRank(this.rankInput(job)).pipe(
          map((entries) => shown(entries, null, false)),
          catchError((e: unknown) => of<RankingState>({ status: 'error', message: e instanceof Error ? e.message : String(e) })),
        );
        const first = kept ? shown(kept.value.entries, kept.savedAt, true) : ({ status: 'computing' } as const);
        return concat(of<RankingState>(first), compute);
      }),
    );
  }

  private rankInput(job: RankJob): SetPieceRankInput {
    const ball = BALL_SIZES[job.ballSize];
    const conditions: FlightConditions = { ball: { massKg: ball.massKg, radiusM: ball.radiusM } };
    // The club's ball (drag crisis), as the server's fits of these profiles used.
    const dragCrisisRe = this.clubSettings.settings().dragCrisisRe;
    if (dragCrisisRe !== undefined) conditions.aero = { dragCrisisRe };
    const { ballX, ballY } = toSetPieceFrame(job.spot.ball);
    return {
      ballX,
      ballY,
      wallHeightM: job.spot.wallHeightM,
      aimYM: job.spot.aimXM === 0 ? 0 : -job.spot.aimXM,
      conditions,
      samples: PLANNER_SAMPLES,
      seed: PLANNER_SEED,
      players: job.profiles.players.flatMap((p) => (p.profile ? [{ id: p.playerId, profile: p.profile }] : [])),
    };
  }
}
