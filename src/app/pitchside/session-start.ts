import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked, type Signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { Router } from '@angular/router';
import { concat, map, of, switchMap } from 'rxjs';
import type { ConditionSource } from '../../../shared/schemas/grounds';
import type { SquadGround } from '../../../shared/schemas/squads';
import { ClubFormat } from '../core/club-format';
import { GroundApi, type Ground, type GroundConditions } from '../core/ground-api';
import { describeLocalError } from './local-error';
import { RosterStore } from '../core/roster-store';
import { SessionStore } from '../core/session-store';
import { StorageStatus } from '../core/storage-status';
import { StepControl } from './step-control';
import { WIND_DIRECTIONS, WIND_STRENGTHS, type WindDirection, type WindStrength } from './pitchside-labels';
import { StartConditions } from './start-conditions';

/** What the session start knows of the weather at the ground. */
type WeatherState =
  { readonly state: 'none' } | { readonly state: 'asking' } | { readonly state: 'answered'; readonly answer: GroundConditions };

/**
 * Starting a session on the pitch: the squad, its training ground, then the conditions as big taps —
 * temperature, wind direction relative to the kicking direction and its strength, and the ball size
 * from the squad's age group (overridable). With signal, the conditions the weather service measured
 * at the ground fill in what the coach has not set (humidity and pressure too, which no coach can
 * judge on a pitch); every value says whether it was measured or entered, and a tap overrides it.
 * Without signal, or if the service is slow, the taps stay the source and the start never waits.
 * Open sessions of the last hours are offered to continue, so a reload or a dead battery never
 * splits a session in two.
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
  private readonly groundApi = inject(GroundApi);
  /** The club's formatter (locale); conditions stay in SI and °C, only the decimal mark and clock follow the club. */
  protected readonly fmt = inject(ClubFormat).format;

  protected readonly squads = this.roster.squads;
  protected readonly rosterProblem = this.roster.problem;
  protected readonly windDirections = WIND_DIRECTIONS;
  protected readonly windStrengths = WIND_STRENGTHS;
  protected readonly ballSizes = [3, 4, 5] as const;
  protected readonly conditions = new StartConditions();
  protected readonly failure = signal<string | null>(null);
  protected readonly starting = signal(false);
  protected readonly describeTemperature = (c: number): string => `${this.fmt().number(c, 1)} °C`;
  protected readonly describeHumidity = (pct: number): string => `${Math.round(pct)} %`;
  protected readonly describePressure = (hpa: number): string => `${this.fmt().number(hpa, 1)} hPa`;

  protected readonly form = inject(NonNullableFormBuilder).group({
    squadId: ['', Validators.required],
    groundId: [''],
    windDirection: ['calm' as WindDirection],
    windStrength: ['light' as WindStrength],
    ballSize: [5 as 3 | 4 | 5],
  });
  private readonly squadId = toSignal(this.form.controls.squadId.valueChanges, { initialValue: '' });
  private readonly groundId = toSignal(this.form.controls.groundId.valueChanges, { initialValue: '' });
  /** Whether the wind strength matters (not when calm). */
  protected readonly windBlows = computed(() => this.conditions.taps().direction !== 'calm');
  protected readonly selectedSquad = computed(() => this.squads()?.find((s) => s.id === this.squadId()) ?? null);

  /** The club's grounds when the server could be asked; offline, the squad's own ground (cached with the squad). */
  private readonly clubGrounds = signal<Ground[]>([]);
  /** Grounds to choose from (only when there is a choice). */
  protected readonly groundChoices = computed(() => (this.clubGrounds().length > 1 ? this.clubGrounds() : []));
  /** The ground the session is at. */
  protected readonly ground = computed<SquadGround | null>(() => {
    const id = this.groundId();
    const squadGround = this.selectedSquad()?.ground ?? null;
    return this.clubGrounds().find((g) => g.id === id) ?? (squadGround?.id === id ? squadGround : null);
  });

  /** The weather service's answer for the ground (asked again when the ground changes). */
  protected readonly weather: Signal<WeatherState> = toSignal(
    toObservable(computed(() => this.ground()?.id ?? null)).pipe(
      switchMap((id) =>
        id === null
          ? of<WeatherState>({ state: 'none' })
          : concat(
              of<WeatherState>({ state: 'asking' }),
              this.groundApi.conditions(id).pipe(map((answer): WeatherState => ({ state: 'answered', answer }))),
            ),
      ),
    ),
    { initialValue: { state: 'none' } },
  );
  protected readonly measured = this.conditions.measured;

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
    this.groundApi
      .list()
      .pipe(takeUntilDestroyed())
      .subscribe({ next: (grounds) => this.clubGrounds.set(grounds), error: () => this.clubGrounds.set([]) });
    // One squad: pick it. A picked squad sets the ball size of its age group.
    effect(() => {
      const squads = this.squads();
      if (squads?.length === 1 && this.form.controls.squadId.value === '') {
        this.form.controls.squadId.setValue(squads[0].id);
      }
    });
    // Only a newly picked squad sets the ball size and ground, so the coach's override survives a refresh.
    let sizedFor: string | null = null;
    effect(() => {
      const squad = this.selectedSquad();
      if (squad && squad.id !== sizedFor) {
        sizedFor = squad.id;
        this.form.controls.groundId.setValue(squad.ground?.id ?? '');
        if (squad.ballSize === 3 || squad.ballSize === 4 || squad.ballSize === 5) {
          this.form.controls.ballSize.setValue(squad.ballSize);
        }
      }
    });
    // A measurement fills what the coach has not set; a new ground drops the old ground's measurement.
    effect(() => {
      const weather = this.weather();
      const measured = weather.state === 'answered' && weather.answer.source === 'weather' ? weather.answer : null;
      this.showTaps(untracked(() => (measured ? this.conditions.applyMeasured(measured) : this.conditions.clearMeasured())));
    });
    this.form.controls.windDirection.valueChanges.pipe(takeUntilDestroyed()).subscribe((direction) => {
      const shown = WIND_STRENGTHS.find((s) => s.value === this.form.controls.windStrength.value)?.speedMs ?? WIND_STRENGTHS[0].speedMs;
      this.conditions.enterDirection(direction, WIND_DIRECTIONS.find((d) => d.value === direction)?.fromDeg ?? null, shown);
    });
    this.form.controls.windStrength.valueChanges.pipe(takeUntilDestroyed()).subscribe((strength) => {
      const speed = WIND_STRENGTHS.find((s) => s.value === strength)?.speedMs;
      if (speed !== undefined) {
        this.conditions.enterStrength(speed);
      }
    });
  }

  /** Where a value came from, in the coach's words. */
  protected sourceNote(source: ConditionSource): string {
    const measured = this.measured();
    switch (source) {
      case 'weather':
        return measured ? `measured by the weather service at ${this.time(measured.observedAt)}` : 'measured by the weather service';
      case 'coach':
        return 'entered';
      case 'ground':
        return `from the ground`;
      default:
        return 'not set, a default';
    }
  }

  /** The wind in numbers, e.g. "6.0 m/s headwind", or null when calm. */
  protected readonly windText = computed(() => {
    const speed = this.conditions.windSpeedMs().value;
    const taps = this.conditions.taps();
    if (taps.direction === 'calm') {
      return speed > 0 ? `${this.fmt().number(speed, 1)} m/s, calm` : 'calm';
    }
    const label = WIND_DIRECTIONS.find((d) => d.value === taps.direction)?.label.toLowerCase() ?? 'wind';
    return `${this.fmt().number(speed, 1)} m/s ${label}`;
  });

  /** Whether the coach changed a measured value (so "use the measurement" would change something). */
  protected readonly overridden = computed(
    () => this.measured() !== null && this.conditions.fields().some((f) => this.conditions[f]().source === 'coach'),
  );

  protected setTemperature(value: number): void {
    this.conditions.enter('temperatureC', value);
  }

  protected setHumidity(value: number): void {
    this.conditions.enter('relativeHumidityPct', Math.min(100, Math.max(0, value)));
  }

  protected setPressure(value: number): void {
    this.conditions.enter('pressureHpa', value);
  }

  protected useMeasurement(): void {
    const measured = this.measured();
    if (measured) {
      this.showTaps(this.conditions.applyMeasured(measured, true));
    }
  }

  protected time(iso: string): string {
    return this.fmt().time(iso);
  }

  protected async start(): Promise<void> {
    if (this.form.invalid || this.starting()) {
      this.form.markAllAsTouched();
      this.failure.set(this.form.controls.squadId.invalid ? 'Pick the squad first.' : null);
      return;
    }
    const value = this.form.getRawValue();
    const squad = this.selectedSquad();
    const ground = this.ground();
    const recorded = this.conditions.record();
    this.starting.set(true);
    this.failure.set(null);
    try {
      const session = await this.sessions.start({
        squadId: value.squadId,
        groundId: ground?.id ?? null,
        ...recorded,
        altitudeM: ground ? ground.altitudeM : null,
        ballSize: value.ballSize,
        conditionsSource: {
          ...recorded.conditionsSource,
          ...(ground ? { altitudeM: 'ground' as const } : {}),
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

  /** Shows the wind taps that match the values, without counting it as the coach's tap. */
  private showTaps(taps: { direction: WindDirection; strength: WindStrength }): void {
    this.form.patchValue({ windDirection: taps.direction, windStrength: taps.strength }, { emitEvent: false });
  }

  protected resume(id: string): void {
    void this.router.navigate(['/pitchside', id]);
  }
}
