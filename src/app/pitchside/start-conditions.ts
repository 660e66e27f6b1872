import { computed, signal, type WritableSignal } from '@angular/core';
import type { ConditionSource, MeasuredConditions } from '../../../shared/schemas/grounds';
import { relativeWindName } from '../../../shared/weather';
import { WIND_STRENGTHS, type WindDirection, type WindStrength } from './pitchside-labels';

/** Temperature the stepper starts from before the coach sets it (recorded as a default, not a reading). */
export const DEFAULT_TEMPERATURE_C = 12;

/** One condition value and where it came from. */
export interface Sourced<T> {
  readonly value: T;
  readonly source: ConditionSource;
}

/** The condition fields a session start records with a source. */
export type StartField = 'temperatureC' | 'relativeHumidityPct' | 'pressureHpa' | 'windSpeedMs' | 'windFromDeg';

/** Below this a measured wind reads as calm on the taps (its measured value is still stored). */
const CALM_BELOW_MS = 0.5;

/**
 * The conditions of a session being started, each value with its source: the coach's taps, a default,
 * or the weather service's measurement at the ground. A measurement fills only what the coach has not
 * set; any tap afterwards makes that value the coach's. Plain signals, owned by `SessionStart`.
 */
export class StartConditions {
  readonly temperatureC = signal<Sourced<number>>({ value: DEFAULT_TEMPERATURE_C, source: 'default' });
  readonly relativeHumidityPct = signal<Sourced<number | null>>({ value: null, source: 'default' });
  readonly pressureHpa = signal<Sourced<number | null>>({ value: null, source: 'default' });
  readonly windSpeedMs = signal<Sourced<number>>({ value: 0, source: 'default' });
  readonly windFromDeg = signal<Sourced<number | null>>({ value: null, source: 'default' });
  /** The measurement in use, if any. */
  readonly measured = signal<MeasuredConditions | null>(null);

  /** Whether any value is still the measurement's (a tap on every one leaves none). */
  readonly usesMeasurement = computed(() => this.fields().some((f) => this[f]().source === 'weather'));

  /** The fields in display order. */
  fields(): readonly StartField[] {
    return ['temperatureC', 'relativeHumidityPct', 'pressureHpa', 'windSpeedMs', 'windFromDeg'];
  }

  /** The coach set a value. */
  enter(field: 'temperatureC' | 'relativeHumidityPct' | 'pressureHpa', value: number): void {
    this[field].set({ value, source: 'coach' });
  }

  /**
   * The coach tapped a wind direction. Calm also sets the speed to nothing; a direction on a still
   * default speed takes the strength the toggles show (the coach sees it selected, so it is theirs).
   */
  enterDirection(direction: WindDirection, fromDeg: number | null, shownStrengthMs: number): void {
    if (direction === 'calm') {
      this.windSpeedMs.set({ value: 0, source: 'coach' });
      this.windFromDeg.set({ value: null, source: 'coach' });
      return;
    }
    this.windFromDeg.set({ value: fromDeg, source: 'coach' });
    if (this.windSpeedMs().source === 'default' || this.windSpeedMs().value < CALM_BELOW_MS) {
      this.windSpeedMs.set({ value: shownStrengthMs, source: 'coach' });
    }
  }

  /** The coach tapped a wind strength. */
  enterStrength(speedMs: number): void {
    this.windSpeedMs.set({ value: speedMs, source: 'coach' });
  }

  /**
   * Takes a measurement: it fills every value the coach has not set (all of them with `replaceEntries`,
   * the "use the measurement" button). Returns the taps that now match the wind, for the toggles.
   */
  applyMeasured(m: MeasuredConditions, replaceEntries = false): { direction: WindDirection; strength: WindStrength } {
    this.measured.set(m);
    const take = <T>(field: WritableSignal<Sourced<T>>, value: T): void => {
      if (replaceEntries || field().source !== 'coach') field.set({ value, source: 'weather' });
    };
    take(this.temperatureC, m.temperatureC);
    take(this.relativeHumidityPct, m.relativeHumidityPct);
    take(this.pressureHpa, m.pressureHpa);
    take(this.windSpeedMs, m.windSpeedMs);
    take(this.windFromDeg, m.windFromDeg);
    return this.taps();
  }

  /** Drops a measurement (another ground picked): its values go back to the defaults, the coach's stay. */
  clearMeasured(): { direction: WindDirection; strength: WindStrength } {
    this.measured.set(null);
    const reset = <T>(field: WritableSignal<Sourced<T>>, value: T): void => {
      if (field().source === 'weather') field.set({ value, source: 'default' });
    };
    reset(this.temperatureC, DEFAULT_TEMPERATURE_C);
    reset(this.relativeHumidityPct, null);
    reset(this.pressureHpa, null);
    reset(this.windSpeedMs, 0);
    reset(this.windFromDeg, null);
    return this.taps();
  }

  /** The wind taps nearest to the current values. */
  taps(): { direction: WindDirection; strength: WindStrength } {
    const speed = this.windSpeedMs().value;
    const from = this.windFromDeg().value;
    const direction: WindDirection = speed < CALM_BELOW_MS || from === null ? 'calm' : relativeWindName(from);
    const strength = [...WIND_STRENGTHS].sort((a, b) => Math.abs(a.speedMs - speed) - Math.abs(b.speedMs - speed))[0].value;
    return { direction, strength };
  }

  /** The values and their sources as the session stores them, plus when the service measured. */
  record(): {
    temperatureC: number;
    relativeHumidityPct: number | null;
    pressureHpa: number | null;
    windSpeedMs: number;
    windFromDeg: number | null;
    conditionsSource: Record<string, ConditionSource>;
    conditionsObservedAt: string | null;
  } {
    const conditionsSource: Record<string, ConditionSource> = {};
    for (const field of this.fields()) {
      if (this[field]().value !== null) {
        conditionsSource[field] = this[field]().source;
      }
    }
    const measured = this.measured();
    return {
      temperatureC: this.temperatureC().value,
      relativeHumidityPct: this.relativeHumidityPct().value,
      pressureHpa: this.pressureHpa().value,
      windSpeedMs: this.windSpeedMs().value,
      windFromDeg: this.windFromDeg().value,
      conditionsSource,
      conditionsObservedAt: measured && this.usesMeasurement() ? measured.observedAt : null,
    };
  }
}
