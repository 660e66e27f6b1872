import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { map } from 'rxjs';
import { GOAL_WIDTH_M, TECHNIQUES, WALL_DISTANCE_M, type Technique } from '../../../shared/flight';
import { LoadFailure } from '../ui/load-failure';
import { SliderField, distanceSlider } from '../ui/slider-field';
import { TrajectoryChart, type TrajectoryLandmarks, type TrajectoryTrace } from '../ui/charts/trajectory-chart';
import { GoalMouthView } from './goal-mouth-view';
import type { RankedPlayer } from './planner-rank';
import { PLANNER_SAMPLES, PlannerStore } from './planner-store';
import { ClubFormat } from '../core/club-format';
import { chosenKickText, describeResult, describeSpot, percent, playerName, shortShare } from './planner-text';
import { SetPiecePitch } from './set-piece-pitch';

/** Columns of the ranking on a phone, and the extra ones from this width on. */
const NARROW_COLUMNS = ['rank', 'player', 'onTarget', 'clearsWall'] as const;
const WIDE_COLUMNS = ['rank', 'player', 'onTarget', 'clearsWall', 'blocked', 'over', 'wide', 'short', 'reps'] as const;
const WIDE_TABLE_QUERY = '(min-width: 720px)';

/**
 * Set-piece planner (staff): drag the ball on the attacking half drawn to scale, set the wall's height
 * and the aim, pick the technique, and see for each player of the squad the share of their reach
 * envelope that clears a wall 9.15 m away (IFAB Laws of the Game, Law 13) and goes in under the bar —
 * ranked, with the chosen player's landing cloud in the goal mouth and their typical flight from the
 * side. Profiles and rankings are kept on the device, so the planner opens offline on the last spot.
 */
@Component({
  selector: 'll-planner',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    ReactiveFormsModule,
    GoalMouthView,
    LoadFailure,
    SetPiecePitch,
    SliderField,
    TrajectoryChart,
  ],
  // Profiles and rankings live in the app's IndexedDB analysis cache, so the planner opens offline.
  providers: [PlannerStore],
  templateUrl: './planner.html',
  styleUrl: './planner.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Planner {
  protected readonly store = inject(PlannerStore);
  private readonly breakpoints = inject(BreakpointObserver);
  private readonly fmt = inject(ClubFormat).format;

  protected readonly techniques = TECHNIQUES;
  protected readonly samples = PLANNER_SAMPLES;
  /** The wall's distance from the ball (IFAB Laws of the Game, Law 13: 9.15 m), in the club's unit. */
  protected readonly wallDistance = computed(() => this.fmt().round(WALL_DISTANCE_M, 2));
  /** Where the aim may sit, from the centre of the goal: inside the posts by half a metre, in the club's unit. */
  protected readonly aimField = computed(() => {
    const limitM = GOAL_WIDTH_M / 2 - 0.5;
    return distanceSlider({ sliderMin: -limitM, sliderMax: limitM, min: -limitM, max: limitM, step: 0.1 }, this.fmt());
  });
  protected readonly form = new FormGroup({
    squadId: new FormControl<string | null>(null),
    technique: new FormControl<Technique>(this.store.technique(), { nonNullable: true }),
    wallHeightM: new FormControl(this.store.spot().wallHeightM, { nonNullable: true }),
    aimXM: new FormControl(this.store.spot().aimXM, { nonNullable: true }),
  });

  private readonly wideTable = toSignal(this.breakpoints.observe(WIDE_TABLE_QUERY).pipe(map((s) => s.matches)), {
    initialValue: this.breakpoints.isMatched(WIDE_TABLE_QUERY),
  });
  protected readonly columns = computed<readonly string[]>(() => (this.wideTable() ? WIDE_COLUMNS : NARROW_COLUMNS));
  protected readonly spotText = computed(() => describeSpot(this.store.spot(), this.fmt()));
  protected readonly selected = computed(() => this.store.selectedPlayer());
  protected readonly selectedText = computed(() => {
    const p = this.selected();
    return p ? describeResult(p, this.fmt()) : 'No player to show yet.';
  });
  protected readonly pendingCount = computed(() => {
    const p = this.store.profiles();
    return p.status === 'ready' ? p.value.players.filter((x) => x.pending).length : 0;
  });
  protected readonly withProfile = computed(() => {
    const p = this.store.profiles();
    return p.status === 'ready' ? p.value.players.filter((x) => x.profile !== null).length : 0;
  });
  protected readonly sideTraces = computed<TrajectoryTrace[]>(() => {
    const p = this.selected();
    if (!p?.meanKick) return [];
    return [{ id: p.playerId, label: playerName(p), points: p.meanKick.path.map((q) => ({ x: q.x, y: q.z })), tone: 0, emphasised: false }];
  });
  protected readonly sideLandmarks = computed<TrajectoryLandmarks>(() => {
    const k = this.selected()?.meanKick;
    return k ? { wallAtM: k.wallAlongAimM, wallHeightM: this.store.spot().wallHeightM, goalAtM: k.goalAlongAimM } : {};
  });
  protected readonly chosenKick = computed(() => {
    const k = this.selected()?.meanKick;
    return k ? `Kick chosen for this spot: ${chosenKickText(k.kick, this.fmt())}.` : '';
  });
  protected readonly sideSummary = computed(() => {
    const p = this.selected();
    const k = p?.meanKick;
    if (!p || !k) return 'Side view: no flight to show yet.';
    const f = this.fmt();
    const wall = k.wallHeightOfBallM === null ? 'lands before the wall' : `passes the wall at ${f.fixed(k.wallHeightOfBallM, 2)} m`;
    const goal =
      k.goalHeightOfBallM === null ? 'lands before the goal line' : `crosses the goal line at ${f.fixed(k.goalHeightOfBallM, 2)} m`;
    return `Side view along the aim of the kick ${playerName(p)} would choose here (${chosenKickText(k.kick, f)}): ${wall} and ${goal}; carry ${f.distance(k.carryM)}.`;
  });

  protected readonly percent = (share: number): string => percent(share, this.fmt());
  protected readonly playerName = playerName;
  protected readonly shortShare = shortShare;

  constructor() {
    const destroyRef = inject(DestroyRef);
    const c = this.form.controls;
    c.squadId.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((id) => this.store.squadId.set(id));
    c.technique.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((t) => this.store.technique.set(t));
    c.wallHeightM.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((h) => this.store.setWallHeight(h));
    c.aimXM.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((a) => this.store.setAim(a));
    // The store may change these itself (a restored plan, the first squad picked): show its values.
    effect(() => {
      const spot = this.store.spot();
      this.form.patchValue(
        { squadId: this.store.squadId(), technique: this.store.technique(), wallHeightM: spot.wallHeightM, aimXM: spot.aimXM },
        { emitEvent: false },
      );
    });
  }

  /** Show this player's cloud and flight. */
  protected selectPlayer(player: RankedPlayer): void {
    if (player.result) this.store.selectedPlayerId.set(player.playerId);
  }

  protected isSelected(player: RankedPlayer): boolean {
    return this.selected()?.playerId === player.playerId;
  }

  /** When something was kept on the device, in the club's locale (e.g. "3 Mar, 18:30"). */
  protected savedAt(iso: string): string {
    return this.fmt().dateTime(iso, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
  }

  protected techniqueLabel(t: Technique): string {
    return t.charAt(0).toUpperCase() + t.slice(1);
  }
}
