import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { Router } from '@angular/router';
import { describeLocalError } from './local-error';
import { RosterStore } from '../core/roster-store';
import { SessionStore } from '../core/session-store';
import { StorageStatus } from '../core/storage-status';
import { StepControl } from './step-control';
import { WIND_DIRECTIONS, WIND_STRENGTHS, type WindDirection, type WindStrength } from './pitchside-labels';

/** Temperature the stepper starts from before the coach sets it (recorded as a default, not a reading). */
const DEFAULT_TEMPERATURE_C = 12;

/**
 * Starting a session on the pitch: the squad, then the conditions as big taps — temperature,
 * wind direction relative to the kicking direction and its strength, and the ball size from the
 * squad's age group (overridable). Each condition records whether the coach set it or it is a
 * default, so later analysis knows what to trust. Open sessions of the last hours are offered
 * to continue, so a reload or a dead battery never splits a session in two.
 */
@Component({
  selector: 'll-session-start',
  imports: [ReactiveFormsModule, MatButtonModule, MatButtonToggleModule, MatIconModule, StepControl],
  templateUrl: './session-start.html',
  styleUrl: './session-start.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SessionStart {
  private readonly roster = inject(RosterStore);
  private readonly sessions = inject(SessionStore);
  private readonly storage = inject(StorageStatus);
  private readonly router = inject(Router);

  protected readonly squads = this.roster.squads;
  protected readonly rosterProblem = this.roster.problem;
  protected readonly windDirections = WIND_DIRECTIONS;
  protected readonly windStrengths = WIND_STRENGTHS;
  protected readonly ballSizes = [3, 4, 5] as const;
  protected readonly temperatureC = signal(DEFAULT_TEMPERATURE_C);
  protected readonly temperatureSet = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly starting = signal(false);
  protected readonly describeTemperature = (c: number): string => `${c} °C`;

  protected readonly form = inject(NonNullableFormBuilder).group({
    squadId: ['', Validators.required],
    windDirection: ['calm' as WindDirection],
    windStrength: ['light' as WindStrength],
    ballSize: [5 as 3 | 4 | 5],
  });
  private readonly squadId = toSignal(this.form.controls.squadId.valueChanges, { initialValue: '' });
  private readonly direction = toSignal(this.form.controls.windDirection.valueChanges, { initialValue: 'calm' as WindDirection });
  /** Whether the wind strength matters (not when calm). */
  protected readonly windBlows = computed(() => this.direction() !== 'calm');
  protected readonly selectedSquad = computed(() => this.squads()?.find((s) => s.id === this.squadId()) ?? null);

  private readonly openSessions = this.sessions.liveOpenSessions();
  /** Open sessions of the user's squads, with the squad's name. */
  protected readonly resumable = computed(() => {
    const squads = new Map((this.squads() ?? []).map((s) => [s.id, s.name]));
    return (this.openSessions() ?? [])
      .filter((s) => squads.has(s.squadId))
      .map((s) => ({ id: s.id, squadName: squads.get(s.squadId) ?? '', startedAt: s.startedAt }));
  });

  constructor() {
    void this.roster.refresh();
    // One squad: pick it. A picked squad sets the ball size of its age group.
    effect(() => {
      const squads = this.squads();
      if (squads?.length === 1 && this.form.controls.squadId.value === '') {
        this.form.controls.squadId.setValue(squads[0].id);
      }
    });
    // Only a newly picked squad sets the ball size, so the coach's override survives a refresh.
    let sizedFor: string | null = null;
    effect(() => {
      const squad = this.selectedSquad();
      if (squad && squad.id !== sizedFor && (squad.ballSize === 3 || squad.ballSize === 4 || squad.ballSize === 5)) {
        sizedFor = squad.id;
        this.form.controls.ballSize.setValue(squad.ballSize);
      }
    });
  }

  protected setTemperature(value: number): void {
    this.temperatureC.set(value);
    this.temperatureSet.set(true);
  }

  protected time(iso: string): string {
    return new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
  }

  protected async start(): Promise<void> {
    if (this.form.invalid || this.starting()) {
      this.form.markAllAsTouched();
      this.failure.set(this.form.controls.squadId.invalid ? 'Pick the squad first.' : null);
      return;
    }
    const value = this.form.getRawValue();
    const squad = this.selectedSquad();
    const wind = WIND_DIRECTIONS.find((d) => d.value === value.windDirection);
    const strength = WIND_STRENGTHS.find((s) => s.value === value.windStrength);
    const calm = value.windDirection === 'calm';
    this.starting.set(true);
    this.failure.set(null);
    try {
      const session = await this.sessions.start({
        squadId: value.squadId,
        temperatureC: this.temperatureC(),
        windSpeedMs: calm ? 0 : (strength?.speedMs ?? null),
        windFromDeg: calm ? null : (wind?.fromDeg ?? null),
        ballSize: value.ballSize,
        conditionsSource: {
          temperatureC: this.temperatureSet() ? 'coach' : 'default',
          windSpeedMs: 'coach',
          windFromDeg: 'coach',
          ballSize: squad && squad.ballSize === value.ballSize ? 'default' : 'coach',
        },
      });
      // The first session is the moment the device starts holding data only it has.
      void this.storage.requestPersistence();
      await this.router.navigate(['/pitchside', session.id]);
    } catch (error) {
      this.failure.set(describeLocalError(error));
    } finally {
      this.starting.set(false);
    }
  }

  protected resume(id: string): void {
    void this.router.navigate(['/pitchside', id]);
  }
}
