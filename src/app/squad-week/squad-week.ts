import { DigestRun } from '../ui/digest-run';
import { AuthSession } from '../core/auth/auth-session';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { ActivatedRoute, Router } from '@angular/router';
import { Subject, combineLatest, of, startWith, switchMap } from 'rxjs';
import type { Technique } from '../../../shared/schemas/sync';
import { LOADING, type LoadState } from '../core/load-state';
import type { SquadWeek as SquadWeekAnswer } from '../../../shared/schemas/analysis';
import type { Answer } from '../core/offline-cache';
import { oldestCachedAt, readyValue, toAnswerState, updatedLabel } from '../core/analysis/answer-state';
import { CarryBasisChoice } from '../ui/carry-basis-choice';
import { CalibrationChart, type CalibrationMark } from '../ui/charts/calibration-chart';
import { TECHNIQUES, TECHNIQUE_LABELS, isTechnique } from '../../../shared/vocabulary';
import { ZoneRateChart } from '../ui/charts/zone-rate-chart';
import { LoadFailure } from '../ui/load-failure';
import { PlayerSheets } from './player-sheets';
import { LoadCaution } from './load-caution';
import { SquadNextTargets } from './squad-next-targets';
import { SquadWeekApi } from './squad-week-api';
import { type NextTargets, busiestTechniqueOfWeek, squadRows } from './squad-week-rows';
import { SquadWeekTable } from './squad-week-table';
import { REVIEW_CLOCK, isMonday, lastCompleteWeek, mondayOf } from './week-dates';
import { WeekPicker } from './week-picker';
import { ClubFormat } from '../core/club-format';

const NO_TARGETS: NextTargets = { byPlayer: new Map(), otherwise: { status: 'computing' } };

/**
 * Squad week (`/squad-week?squad=&week=&technique=`): the head coach's weekly review of a squad.
 * A line per player (sortable, filterable, exportable as CSV) with the week-on-week change, the
 * kicking-load caution, hit rate by target distance, and the flight model's predictions against
 * what happened. The squad, week and technique live in the address, so a review can be shared
 * and reopened; answers are kept on the device so it opens offline with the last data.
 */
@Component({
  selector: 'll-squad-week',
  imports: [
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSlideToggleModule,
    CalibrationChart,
    DigestRun,
    LoadCaution,
    LoadFailure,
    PlayerSheets,
    SquadWeekTable,
    WeekPicker,
    ZoneRateChart,
  ],
  templateUrl: './squad-week.html',
  styleUrl: './squad-week.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SquadWeek {
  /** The club's formatter (distance unit, locale). */
  protected readonly fmt = inject(ClubFormat).format;
  /** Whether the signed-in user may send the weekly digests now (admins and head coaches). */
  private readonly auth = inject(AuthSession);
  protected readonly canSendDigests = computed(() => ['admin', 'head_coach'].includes(this.auth.role() ?? ''));
  private readonly api = inject(SquadWeekApi);
  private readonly targets = inject(SquadNextTargets);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly retries = new Subject<void>();
  private readonly retry$ = this.retries.pipe(startWith(undefined));

  /** `?squad=`: the squad to review (default: the first of the caller's squads). */
  readonly squad = input<string | undefined>(undefined);
  /** `?week=`: Monday of the week (default: the last complete week). */
  readonly week = input<string | undefined>(undefined);
  /** `?technique=`: the technique of the technique columns and charts (default: the week's busiest). */
  readonly technique = input<string | undefined>(undefined);

  protected readonly carry = inject(CarryBasisChoice);
  protected readonly techniques = TECHNIQUES;
  protected readonly techniqueLabels = TECHNIQUE_LABELS;
  /** The current ISO week: the latest that can be reviewed. */
  protected readonly latestWeek = mondayOf(inject(REVIEW_CLOCK)());
  private readonly defaultWeek = lastCompleteWeek(inject(REVIEW_CLOCK)());

  protected readonly squads = toSignal(this.retry$.pipe(switchMap(() => this.api.squads().pipe(toAnswerState()))), {
    initialValue: LOADING,
  });
  protected readonly squadId = computed(() => {
    const list = readyValue(this.squads())?.value ?? [];
    const asked = this.squad();
    return list.find((s) => s.id === asked)?.id ?? list[0]?.id ?? null;
  });
  private readonly squadSummary = computed(() => readyValue(this.squads())?.value.find((s) => s.id === this.squadId()) ?? null);
  protected readonly weekStart = computed(() => {
    const asked = this.week();
    return isMonday(asked) && asked <= this.latestWeek ? asked : this.defaultWeek;
  });

  protected readonly weekState = toSignal(
    combineLatest([toObservable(this.squadId), toObservable(this.weekStart), toObservable(this.carry.basis), this.retry$]).pipe(
      switchMap(([squadId, week, basis]) =>
        squadId === null ? of<LoadState<Answer<SquadWeekAnswer>>>(LOADING) : this.api.week(squadId, week, basis).pipe(toAnswerState()),
      ),
    ),
    { initialValue: LOADING },
  );
  protected readonly weekAnswer = computed(() => readyValue(this.weekState())?.value ?? null);
  /**
   * The Weekly digests card sits below the week; shown before the week has loaded, it would be pushed
   * down the screen when the week arrives (a layout shift of the whole card), so it waits for it.
   */
  protected readonly digestsShown = computed(
    () => this.canSendDigests() && this.squads().status !== 'loading' && this.weekState().status !== 'loading',
  );

  protected readonly chosenTechnique = computed<Technique>(() => {
    const asked = this.technique();
    if (isTechnique(asked)) return asked;
    const week = this.weekAnswer();
    return (week ? busiestTechniqueOfWeek(week) : null) ?? 'lofted';
  });

  private readonly nextTargets = toSignal(
    combineLatest([toObservable(this.squadSummary), toObservable(this.chosenTechnique), this.retry$]).pipe(
      switchMap(([squad, technique]) => (squad === null ? of(NO_TARGETS) : this.targets.forSquad(squad.id, technique, squad.ballSize))),
    ),
    { initialValue: NO_TARGETS },
  );

  protected readonly rows = computed(() => {
    const week = this.weekAnswer();
    return week ? squadRows(week, this.chosenTechnique(), this.nextTargets()) : [];
  });
  protected readonly zones = computed(() =>
    (this.weekAnswer()?.zones ?? []).filter((z) => z.technique === this.chosenTechnique()).sort((a, b) => a.bandStartM - b.bandStartM),
  );
  protected readonly calibration = computed<CalibrationMark[]>(() =>
    (this.weekAnswer()?.players ?? []).flatMap((p) =>
      p.calibration
        .filter((c) => c.technique === this.chosenTechnique() && c.reps > 0)
        .map((c) => ({
          id: `${p.playerId}:${c.technique}`,
          label: p.shirtNumber === null ? p.displayName : `${p.shirtNumber} ${p.displayName}`,
          reps: c.reps,
          predicted: c.predictedHitRate,
          observed: c.observedHitRate,
        })),
    ),
  );

  protected readonly zoneSummary = computed(() => {
    const zones = this.zones();
    const label = TECHNIQUE_LABELS[this.chosenTechnique()].toLowerCase();
    if (zones.length === 0) return `No ${label} repetitions this week.`;
    const best = zones.reduce((a, b) => (b.hitRate > a.hitRate ? b : a));
    return `Squad ${label} hit rate in ${zones.length} distance bands; highest ${this.fmt().percent(best.hitRate)} at ${this.fmt().distanceRange(best.bandStartM, best.bandEndM, 0)}.`;
  });
  protected readonly calibrationSummary = computed(() => {
    const marks = this.calibration();
    if (marks.length === 0) return 'No predictions to compare this week.';
    const reps = marks.reduce((n, m) => n + m.reps, 0);
    const predicted = marks.reduce((n, m) => n + m.predicted * m.reps, 0) / reps;
    const observed = marks.reduce((n, m) => n + m.observed * m.reps, 0) / reps;
    const f = this.fmt();
    return (
      `${marks.length} players, ${reps} repetitions: predicted ${f.percent(predicted)} hits ` +
      `(${f.fixed(predicted * reps, 1)}), observed ${f.percent(observed)} (${Math.round(observed * reps)}).`
    );
  });

  protected readonly cacheNote = computed(() => {
    const oldest = oldestCachedAt([readyValue(this.squads()), readyValue(this.weekState())]);
    return oldest === null
      ? null
      : `The server cannot be reached: showing what this device saved, last updated ${updatedLabel(oldest, this.fmt())}.`;
  });

  protected chooseSquad(squadId: string): void {
    this.navigate({ squad: squadId });
  }

  protected chooseWeek(week: string): void {
    this.navigate({ week });
  }

  protected chooseTechnique(technique: Technique): void {
    this.navigate({ technique });
  }

  protected setStillAir(stillAir: boolean): void {
    this.carry.setStillAir(stillAir);
  }

  protected retry(): void {
    this.retries.next();
  }

  private navigate(change: Record<string, string>): void {
    const queryParams = { squad: this.squadId(), week: this.weekStart(), technique: this.chosenTechnique(), ...change };
    void this.router.navigate([], { relativeTo: this.route, queryParams, replaceUrl: true });
  }
}
