import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { DrillSuggestion } from '../core/drill-suggestion';
import { Router } from '@angular/router';
import { kickDataSchema, type Outcome } from '../../../shared/schemas/sync';
import { AppUpdate } from '../core/app-update';
import { ClubFormat } from '../core/club-format';
import { ClubSettingsStore } from '../core/club-settings-store';
import { KickStore } from '../core/kick-store';
import type { LocalDrill, LocalSession } from '../core/loftline-db';
import { RosterStore } from '../core/roster-store';
import { SessionStore, type NewDrill } from '../core/session-store';
import { SyncIssues } from '../core/sync/sync-issues';
import { DrillForm } from './drill-form';
import { EntryList, type EntryCorrection } from './entry-list';
import { HangTimer } from './hang-timer';
import { DEFAULT_REP_LIMIT_PER_SESSION } from '../../../shared/schemas/club';
import { isOverLoadLimit, loadCautionText } from './kicking-load';
import { describeLocalError } from './local-error';
import { metresValidator, optionalMetres } from './metres-field';
import { OutcomePad } from './outcome-pad';
import { OUTCOME_LABELS, TECHNIQUE_LABELS, backspinLabel, sidespinLabel } from '../../../shared/vocabulary';
import { PlayerChips } from './player-chips';
import { BackspinControl, CurlControl } from './spin-controls';
import { StopwatchDrills } from './stopwatch-drills';

/**
 * Logging a session's repetitions: pick the kicker (tap 1), optionally adjust the spin from the
 * drill's default (tap 2), tap the outcome (the last tap, which saves). The pad sits at the
 * bottom for the thumb; the chips above show each player's count and the load caution. Undo
 * voids the coach's last entry; every entry can be corrected or voided from the list. With the
 * stopwatch on for the drill, the time tapped on the big timer button goes with the next repetition.
 */
@Component({
  selector: 'll-kick-logger',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSlideToggleModule,
    DrillForm,
    EntryList,
    HangTimer,
    OutcomePad,
    PlayerChips,
    BackspinControl,
    CurlControl,
  ],
  templateUrl: './kick-logger.html',
  styleUrl: './kick-logger.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KickLogger {
  private readonly kicksStore = inject(KickStore);
  private readonly sessions = inject(SessionStore);
  private readonly router = inject(Router);
  private readonly stopwatchDrills = inject(StopwatchDrills);
  protected readonly clubSettings = inject(ClubSettingsStore);
  private readonly clubFormat = inject(ClubFormat);
  /** The club's formatter (distance unit, locale). */
  protected readonly fmt = this.clubFormat.format;

  /** The session being logged. */
  readonly session = input.required<LocalSession>();

  private readonly sessionId = computed(() => this.session().id);
  private readonly squadId = computed(() => this.session().squadId);
  private readonly entryList = viewChild(EntryList);
  private readonly hangTimer = viewChild(HangTimer);

  protected readonly drills = this.sessions.liveDrills(this.sessionId);
  protected readonly kicks = this.kicksStore.liveKicks(this.sessionId);
  protected readonly players = inject(RosterStore).livePlayers(this.squadId);
  protected readonly entries = inject(SyncIssues).liveSessionEntries(this.sessionId);
  /** The club's repetition limit per player per session (cached with its settings, so it holds offline). */
  protected readonly limit = computed(() => this.clubSettings.settings().repLimitPerSession ?? DEFAULT_REP_LIMIT_PER_SESSION);

  protected readonly chosenDrillId = signal<string | null>(null);
  /** Open when a Next-targets suggestion is waiting, so adding it is one tap. */
  protected readonly drillPickerOpen = signal(inject(DrillSuggestion).pending() !== null);
  protected readonly selectedPlayerId = signal<string | null>(null);
  protected readonly backspinStep = signal(0);
  protected readonly sidespinStep = signal(0);
  protected readonly view = signal<'log' | 'entries'>('log');
  protected readonly statusText = signal('Pick a player, then the outcome.');
  protected readonly savedCount = signal(0);
  protected readonly failure = signal<string | null>(null);
  protected readonly carry = new FormControl('', {
    nonNullable: true,
    validators: metresValidator(
      kickDataSchema.shape.carryM,
      () => this.fmt().unitWord,
      () => this.fmt().distanceUnit,
    ),
  });
  protected readonly hangTime = new FormControl('', {
    nonNullable: true,
    validators: metresValidator(kickDataSchema.shape.hangTimeS, 'seconds'),
  });

  protected readonly techniqueLabels = TECHNIQUE_LABELS;

  /** The drill repetitions are logged against: the one chosen, else the latest added. */
  protected readonly drill = computed<LocalDrill | null>(
    () => {
      const drills = this.drills() ?? [];
      return drills.find((d) => d.id === this.chosenDrillId()) ?? drills.at(-1) ?? null;
    },
    { equal: sameDrill },
  );
  /** Whether the hang-time stopwatch is on for the current drill (a per-device choice). */
  protected readonly stopwatchOn = computed(() => {
    const drill = this.drill();
    return drill !== null && this.stopwatchDrills.drillIds().includes(drill.id);
  });
  protected readonly needsDrill = computed(() => this.drills() !== undefined && this.drill() === null);
  protected readonly counts = computed(() => {
    const counts = new Map<string, number>();
    for (const kick of this.kicks() ?? []) {
      counts.set(kick.playerId, (counts.get(kick.playerId) ?? 0) + 1);
    }
    return counts;
  });
  protected readonly selectedPlayer = computed(() => (this.players() ?? []).find((p) => p.id === this.selectedPlayerId()) ?? null);
  protected readonly caution = computed(() => {
    const counts = this.counts();
    const over = (this.players() ?? []).filter((p) => isOverLoadLimit(counts.get(p.id) ?? 0, this.limit())).map((p) => p.displayName);
    return over.length === 0 ? null : loadCautionText(over, this.limit());
  });
  /** Whether the curl stepper is worth its space: curled drills, or a drill or kick with curl set. */
  protected readonly showCurl = computed(() => {
    const drill = this.drill();
    return drill?.technique === 'curled' || (drill?.sidespinStep ?? 0) !== 0 || this.sidespinStep() !== 0;
  });

  /** Whether a repetition is being entered here: a carry or stopwatch reading typed, or a save in flight. */
  private readonly saving = signal(false);
  private readonly carryText = toSignal(this.carry.valueChanges, { initialValue: '' });
  private readonly hangText = toSignal(this.hangTime.valueChanges, { initialValue: '' });
  private readonly midEntry = computed(() => this.saving() || this.carryText().trim() !== '' || this.hangText().trim() !== '');

  constructor() {
    // A new version's reload offer waits while a repetition is half entered (AppUpdate).
    const update = inject(AppUpdate);
    let release: (() => void) | null = null;
    effect(() => {
      if (this.midEntry() && release === null) release = update.hold();
      if (!this.midEntry() && release !== null) {
        release();
        release = null;
      }
    });
    inject(DestroyRef).onDestroy(() => release?.());
    // A new drill resets the spin to its default.
    effect(() => {
      const drill = this.drill();
      untracked(() => this.resetSpin(drill));
    });
    void this.clubSettings.refresh();
  }

  /** Opens an entry for correction (the sync panel's "fix"). */
  openEntry(kickId: string): void {
    this.view.set('entries');
    queueMicrotask(() => this.entryList()?.open(kickId));
  }

  protected selectPlayer(id: string): void {
    this.selectedPlayerId.set(id);
    const player = this.selectedPlayer();
    this.statusText.set(player ? `Selected: ${this.playerName(player.id)}` : 'Pick a player, then the outcome.');
  }

  protected async logOutcome(outcome: Outcome): Promise<void> {
    const player = this.selectedPlayer();
    const drill = this.drill();
    if (!player || !drill) {
      this.failure.set(player ? 'Set up a drill first.' : 'Pick the player first.');
      return;
    }
    const timed = this.stopwatchOn();
    if (this.carry.invalid || (timed && this.hangTime.invalid)) {
      this.carry.markAsTouched();
      this.hangTime.markAsTouched();
      return;
    }
    const carryM = optionalMetres(this.carry.value, this.fmt().distanceUnit);
    this.saving.set(true);
    const hangTimeS = timed ? optionalMetres(this.hangTime.value) : null;
    const backspinStep = this.backspinStep();
    const sidespinStep = this.sidespinStep();
    this.resetSpin(drill);
    this.carry.setValue('');
    if (timed) this.hangTimer()?.reset();
    try {
      await this.kicksStore.log({
        sessionId: this.sessionId(),
        drillId: drill.id,
        playerId: player.id,
        technique: drill.technique,
        foot: player.dominantFoot,
        backspinStep,
        sidespinStep,
        targetDistanceM: drill.targetDistanceM,
        targetRadiusM: drill.targetRadiusM,
        outcome,
        carryM,
        lateralM: null,
        hangTimeS,
      });
      this.failure.set(null);
      this.savedCount.update((n) => n + 1);
      const time = hangTimeS === null ? '' : ` · ${this.fmt().fixed(hangTimeS, 2)} s`;
      this.statusText.set(`Saved · ${this.playerName(player.id)} · ${OUTCOME_LABELS[outcome]}${time}`);
    } catch (error) {
      this.failure.set(describeLocalError(error));
    } finally {
      this.saving.set(false);
    }
  }

  protected async undoLast(): Promise<void> {
    try {
      const undone = await this.kicksStore.undoLast(this.sessionId());
      this.statusText.set(undone ? `Undone · ${this.playerName(undone.playerId)} · ${OUTCOME_LABELS[undone.outcome]}` : 'Nothing to undo.');
    } catch (error) {
      this.failure.set(describeLocalError(error));
    }
  }

  protected async correct(correction: EntryCorrection): Promise<void> {
    try {
      await this.kicksStore.edit(correction.id, correction.changes);
      this.statusText.set('Correction saved.');
    } catch (error) {
      this.failure.set(describeLocalError(error));
    }
  }

  protected async voidEntry(id: string): Promise<void> {
    try {
      await this.kicksStore.void(id);
      this.statusText.set('Entry voided.');
    } catch (error) {
      this.failure.set(describeLocalError(error));
    }
  }

  protected async addDrill(drill: NewDrill): Promise<void> {
    try {
      const added = await this.sessions.addDrill(this.sessionId(), drill);
      this.chosenDrillId.set(added.id);
      this.drillPickerOpen.set(false);
      this.failure.set(null);
    } catch (error) {
      this.failure.set(describeLocalError(error));
    }
  }

  protected setStopwatch(enabled: boolean): void {
    const drill = this.drill();
    if (drill) this.stopwatchDrills.set(drill.id, enabled);
    if (!enabled) this.hangTimer()?.reset();
  }

  protected chooseDrill(id: string): void {
    this.chosenDrillId.set(id);
    this.drillPickerOpen.set(false);
  }

  protected async endSession(): Promise<void> {
    try {
      await this.sessions.end(this.sessionId());
      await this.router.navigate(['/pitchside']);
    } catch (error) {
      this.failure.set(describeLocalError(error));
    }
  }

  protected drillSummary(drill: LocalDrill): string {
    const spin = backspinLabel(drill.backspinStep ?? 0);
    const curl = (drill.sidespinStep ?? 0) === 0 ? '' : ` · ${sidespinLabel(drill.sidespinStep ?? 0)}`;
    const name = drill.label ? `${drill.label}: ` : '';
    const f = this.fmt();
    return `${name}${TECHNIQUE_LABELS[drill.technique]} → ${f.round(drill.targetDistanceM)} (r ${f.round(drill.targetRadiusM)}) · ${spin}${curl}`;
  }

  private playerName(id: string): string {
    const player = (this.players() ?? []).find((p) => p.id === id);
    return player ? `${player.shirtNumber ?? ''} ${player.displayName}`.trim() : 'player';
  }

  private resetSpin(drill: LocalDrill | null): void {
    this.backspinStep.set(drill?.backspinStep ?? 0);
    this.sidespinStep.set(drill?.sidespinStep ?? 0);
  }
}

/** Whether two drill values describe the same drill set-up (a re-read row is not a new drill). */
function sameDrill(a: LocalDrill | null, b: LocalDrill | null): boolean {
  return a === b || (a !== null && b !== null && a.id === b.id && a.version === b.version && a.updatedAt === b.updatedAt);
}
