import { Clipboard } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router } from '@angular/router';
import { catchError, debounceTime, map, of, skip, type Observable } from 'rxjs';
import { WALL_DISTANCE_M, type Flight } from '../../../shared/flight';
import { FlightEngine } from '../flight/flight-engine';
import { latestWhenIdle } from '../flight/latest-when-idle';
import { SliderField, distanceSlider } from '../ui/slider-field';
import { TrajectoryChart, type TrajectoryTrace } from '../ui/charts/trajectory-chart';
import {
  CONDITION_FIELDS,
  DEFAULT_KICK,
  GOAL_DISTANCE_FIELD,
  KICK_NAMES,
  LAUNCH_FIELDS,
  MAX_KICKS,
  decodeState,
  encodeState,
  flightFigures,
  toKickInput,
  type FlightFigures,
  type SandboxBallSize,
  type SandboxKick,
  type SandboxState,
} from './sandbox-kick';
import { figureRows, sideSummary, topSummary, type FigureRow } from './sandbox-text';
import { ClubFormat } from '../core/club-format';

/** The latest computed flights with the inputs they belong to, or why they could not be computed. */
type SandboxRun =
  | {
      readonly status: 'ready';
      readonly kicks: readonly SandboxKick[];
      readonly goalDistanceM: number;
      readonly flights: readonly Flight[];
    }
  | { readonly status: 'error'; readonly message: string };

/** A sandbox wall for reference in the side view, m (common practice: an adult wall jumping). */
const REFERENCE_WALL_HEIGHT_M = 2;

/**
 * Flight sandbox: one kick's launch and conditions on sliders (with exact number fields), its side and
 * top views redrawn as the sliders move, and the figures coaches talk about — carry, apex, time, landing
 * speed, height at the wall and at the goal line. Up to three kicks overlay for comparison, and the whole
 * state lives in the URL, so "what if he struck it 2 m/s harder into that wind" can be sent as a link.
 * The flight model runs in the worker; while it is busy only the newest slider position waits.
 */
@Component({
  selector: 'll-sandbox',
  imports: [MatButtonModule, MatButtonToggleModule, MatIconModule, MatTableModule, ReactiveFormsModule, SliderField, TrajectoryChart],
  templateUrl: './sandbox.html',
  styleUrl: './sandbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Sandbox {
  private readonly engine = inject(FlightEngine);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly clipboard = inject(Clipboard);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fmt = inject(ClubFormat).format;

  protected readonly launchFields = LAUNCH_FIELDS;
  protected readonly conditionFields = CONDITION_FIELDS;
  /** The goal line's distance, slid and typed in the club's unit (the kick state keeps metres). */
  protected readonly goalField = computed(() => ({ ...GOAL_DISTANCE_FIELD, ...distanceSlider(GOAL_DISTANCE_FIELD, this.fmt()) }));
  protected readonly kickNames = KICK_NAMES;
  protected readonly maxKicks = MAX_KICKS;
  protected readonly ballSizes: readonly SandboxBallSize[] = [5, 4, 3];

  private readonly initial = this.readLink();
  protected readonly kicks = signal<readonly SandboxKick[]>(this.initial.kicks);
  protected readonly selected = signal(this.initial.selected);
  protected readonly goalDistanceM = signal(this.initial.goalDistanceM);
  /** On a phone one view at a time stays pinned above the sliders; on a wide screen both show. */
  protected readonly shownView = signal<'side' | 'top'>('side');

  protected readonly form = new FormGroup({
    speedMs: this.control(this.initial.kicks[this.initial.selected]!.speedMs),
    elevationDeg: this.control(0),
    azimuthDeg: this.control(0),
    backspinRps: this.control(0),
    sidespinRps: this.control(0),
    windSpeedMs: this.control(0),
    windFromDeg: this.control(0),
    temperatureC: this.control(0),
    altitudeM: this.control(0),
    humidityPct: this.control(0),
    ballSize: new FormControl<SandboxBallSize>(5, { nonNullable: true }),
  });
  protected readonly goalControl = this.control(this.initial.goalDistanceM);

  private readonly state = computed<SandboxState>(() => ({
    kicks: [...this.kicks()],
    selected: this.selected(),
    goalDistanceM: this.goalDistanceM(),
  }));
  private readonly work = computed(() => ({ kicks: this.kicks(), goalDistanceM: this.goalDistanceM() }));

  protected readonly run = toSignal(
    toObservable(this.work).pipe(latestWhenIdle(({ kicks, goalDistanceM }) => this.compute(kicks, goalDistanceM))),
    { initialValue: null },
  );
  /** Whether the views show older inputs than the sliders (the worker is still on it). */
  protected readonly catchingUp = computed(() => {
    const run = this.run();
    return run?.status === 'ready' && (run.kicks !== this.kicks() || run.goalDistanceM !== this.goalDistanceM());
  });

  private readonly readyRun = computed(() => {
    const run = this.run();
    return run?.status === 'ready' ? run : null;
  });
  protected readonly figures = computed<readonly FlightFigures[]>(() => {
    const run = this.readyRun();
    return run ? run.flights.map((f, i) => flightFigures(f, run.kicks[i]!, run.goalDistanceM)) : [];
  });
  protected readonly sideTraces = computed(() => this.traces((p) => p.z));
  protected readonly topTraces = computed(() => this.traces((p) => p.y));
  protected readonly landmarks = computed(() => ({
    wallAtM: WALL_DISTANCE_M,
    wallHeightM: REFERENCE_WALL_HEIGHT_M,
    goalAtM: this.readyRun()?.goalDistanceM ?? this.goalDistanceM(),
  }));
  protected readonly sideSummary = computed(() =>
    sideSummary(this.figures(), this.readyRun()?.goalDistanceM ?? this.goalDistanceM(), this.fmt()),
  );
  protected readonly topSummary = computed(() => topSummary(this.readyRun()?.flights ?? [], this.fmt()));
  protected readonly rows = computed<readonly FigureRow[]>(() => figureRows(this.figures(), this.fmt()));
  protected readonly columns = computed(() => ['figure', ...this.figures().map((_, i) => KICK_NAMES[i]!)]);

  constructor() {
    const destroyRef = inject(DestroyRef);
    this.form.setValue(this.initial.kicks[this.initial.selected]!, { emitEvent: false });
    this.form.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe(() => {
      const edited = this.form.getRawValue();
      this.kicks.update((list) => list.map((k, i) => (i === this.selected() ? edited : k)));
    });
    this.goalControl.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((v) => this.goalDistanceM.set(v));
    // The permalink follows the sliders once they rest, without filling the history.
    toObservable(this.state)
      .pipe(skip(1), debounceTime(400), takeUntilDestroyed(destroyRef))
      .subscribe((state) => void this.router.navigate([], { relativeTo: this.route, queryParams: encodeState(state), replaceUrl: true }));
  }

  /** Edit another of the overlaid kicks. */
  protected selectKick(index: number): void {
    const kick = this.kicks()[index];
    if (!kick) return;
    this.selected.set(index);
    this.form.setValue(kick, { emitEvent: false });
  }

  /** Overlay a copy of the kick being edited, to change one thing and compare. */
  protected addKick(): void {
    if (this.kicks().length >= MAX_KICKS) return;
    this.kicks.update((list) => [...list, { ...list[this.selected()]! }]);
    this.selectKick(this.kicks().length - 1);
  }

  /** Drop the kick being edited from the comparison. */
  protected removeKick(): void {
    if (this.kicks().length <= 1) return;
    const at = this.selected();
    this.kicks.update((list) => list.filter((_, i) => i !== at));
    this.selectKick(Math.max(0, at - 1));
  }

  /** Put the kick being edited back to the sandbox's starting kick. */
  protected resetKick(): void {
    this.form.setValue({ ...DEFAULT_KICK });
  }

  /** Copy a link that opens the sandbox exactly as it is now. */
  protected copyLink(): void {
    const tree = this.router.createUrlTree(['/sandbox'], { queryParams: encodeState(this.state()) });
    const url = new URL(this.router.serializeUrl(tree), document.baseURI).href;
    const copied = this.clipboard.copy(url);
    this.snackBar.open(copied ? 'Link copied: it opens these kicks as they are now.' : `Copy this link: ${url}`, 'OK', { duration: 5000 });
  }

  private compute(kicks: readonly SandboxKick[], goalDistanceM: number): Observable<SandboxRun> {
    return this.engine.simulateKicks(kicks.map((k) => toKickInput(k, goalDistanceM))).pipe(
      map((flights): SandboxRun => ({ status: 'ready', kicks, goalDistanceM, flights })),
      catchError((e: unknown) => of<SandboxRun>({ status: 'error', message: e instanceof Error ? e.message : String(e) })),
    );
  }

  private traces(value: (p: Flight['path'][number]) => number): TrajectoryTrace[] {
    const run = this.readyRun();
    if (!run) return [];
    const many = run.flights.length > 1;
    return run.flights.map((f, i) => ({
      id: KICK_NAMES[i]!,
      label: `Kick ${KICK_NAMES[i]}`,
      points: f.path.map((p) => ({ x: p.x, y: value(p) })),
      tone: i,
      emphasised: many && i === this.selected(),
    }));
  }

  private control(value: number): FormControl<number> {
    return new FormControl(value, { nonNullable: true });
  }

  private readLink(): SandboxState {
    const params = this.route.snapshot.queryParamMap;
    return decodeState(params.getAll('k'), params.get('goal'), params.get('sel'));
  }
}
