/**
 * Turns stored kicks and their sessions into flight-model inputs, and normalises a logged
 * carry to still air at ISA sea level, 15 °C — so a windy week does not look like a bad week.
 */
import {
  BALL_SIZES,
  DEFAULT_ELEVATION_DEG,
  LAUNCH_SPEED_CAP_MS,
  SIDESPIN_STEP_RPS,
  SPIN_STEP_RPS,
  COACH_WIND_HEIGHT_M,
  WEATHER_WIND_HEIGHT_M,
  simulateKick,
  solveLaunchSpeed,
  type BackspinStep,
  type FlightConditions,
  type LoggedKick,
  type SidespinStep,
  type Technique,
} from '../../shared/flight/index';
import type { Outcome } from '../../shared/schemas/sync';

/** The session fields the flight model needs. */
export interface SessionConditions {
  temperatureC: number | null;
  altitudeM: number | null;
  relativeHumidityPct: number | null;
  pressureHpa: number | null;
  windSpeedMs: number | null;
  windFromDeg: number | null;
  ballSize: number;
  /** The session's `conditions_source_json` (which values came from the weather service); absent = unknown. */
  conditionsSourceJson?: string | null;
  /** The club's ball: Reynolds number at the centre of its drag crisis; null or absent = the model's default. */
  dragCrisisRe?: number | null;
}

/**
 * Height the session's wind speed applies at: 10 m when it came from the weather service (its anemometer
 * height), else head height, where a coach feels it (common practice). Unknown or unreadable sources
 * count as the coach's estimate, the usual way wind is entered.
 */
export function windReferenceHeightM(conditionsSourceJson: string | null | undefined): number {
  if (!conditionsSourceJson) return COACH_WIND_HEIGHT_M;
  try {
    const parsed: unknown = JSON.parse(conditionsSourceJson);
    if (parsed !== null && typeof parsed === 'object' && (parsed as Record<string, unknown>)['windSpeedMs'] === 'weather') {
      return WEATHER_WIND_HEIGHT_M;
    }
  } catch {
    // A malformed source record is treated like none.
  }
  return COACH_WIND_HEIGHT_M;
}

/** The kick fields the flight model needs. */
export interface StoredKick {
  technique: Technique;
  outcome: Outcome;
  targetDistanceM: number;
  targetRadiusM: number;
  backspinStep: number;
  sidespinStep: number;
  carryM: number | null;
  lateralM: number | null;
  measuredSpeedMs: number | null;
  launchAngleDeg: number | null;
  measuredSpinRps: number | null;
  /** Where the measured values came from (absent where the query does not read it: taken as a device). */
  measuredSource?: 'device' | 'video' | null;
  /** Pitchside stopwatch reading, s, uncorrected (absent where the query does not read it). */
  hangTimeS?: number | null;
}

/** Mass and radius of a ball size (3, 4, 5; anything else is treated as 5). */
export function ballOf(size: number): { massKg: number; radiusM: number } {
  const b = BALL_SIZES[size === 3 || size === 4 ? size : 5];
  return { massKg: b.massKg, radiusM: b.radiusM };
}

/** Flight conditions of a session (missing values fall back to the model's defaults). */
export function conditionsOf(s: SessionConditions): FlightConditions {
  const air: NonNullable<FlightConditions['air']> = {};
  if (s.temperatureC !== null) air.temperatureC = s.temperatureC;
  if (s.altitudeM !== null) air.altitudeM = s.altitudeM;
  if (s.relativeHumidityPct !== null) air.relativeHumidityPct = s.relativeHumidityPct;
  if (s.pressureHpa !== null) air.pressureHpa = s.pressureHpa;
  const conditions: FlightConditions = { ball: ballOf(s.ballSize), air };
  if (s.dragCrisisRe !== null && s.dragCrisisRe !== undefined) conditions.aero = { dragCrisisRe: s.dragCrisisRe };
  if (s.windSpeedMs && s.windSpeedMs > 0) {
    conditions.wind = {
      speedMs: s.windSpeedMs,
      fromDeg: s.windFromDeg ?? 0,
      referenceHeightM: windReferenceHeightM(s.conditionsSourceJson),
    };
  }
  return conditions;
}

/** Standard conditions for normalised carry: ISA sea level, 15 °C, still air, the same ball (with the club's drag crisis). */
export function standardConditions(ballSize: number, dragCrisisRe?: number | null): FlightConditions {
  const conditions: FlightConditions = { ball: ballOf(ballSize), air: { altitudeM: 0, temperatureC: 15 } };
  if (dragCrisisRe !== null && dragCrisisRe !== undefined) conditions.aero = { dragCrisisRe };
  return conditions;
}

/** A stored kick as the profile fit reads it. */
export function loggedKickOf(k: StoredKick, s: SessionConditions): LoggedKick {
  return {
    technique: k.technique,
    outcome: k.outcome,
    targetDistanceM: k.targetDistanceM,
    targetRadiusM: k.targetRadiusM,
    backspinStep: k.backspinStep as BackspinStep,
    sidespinStep: k.sidespinStep as SidespinStep,
    carryM: k.carryM,
    lateralM: k.lateralM,
    measuredSpeedMs: k.measuredSpeedMs,
    launchAngleDeg: k.launchAngleDeg,
    measuredSpinRps: k.measuredSpinRps,
    measuredSource: k.measuredSource ?? null,
    hangTimeS: k.hangTimeS ?? null,
    conditions: conditionsOf(s),
  };
}

/**
 * The carry this kick would have had in standard conditions: the launch speed that explains
 * the logged carry under the session's conditions, flown again in still ISA air. Null when
 * there is no carry or no speed under the physiological cap explains it.
 */
export function stillAirCarryM(k: StoredKick, s: SessionConditions): number | null {
  if (k.carryM === null || k.carryM <= 0) return null;
  const elevationDeg = k.launchAngleDeg ?? DEFAULT_ELEVATION_DEG[k.technique];
  if (elevationDeg <= 0) return null;
  const backspinRps = SPIN_STEP_RPS[k.backspinStep as BackspinStep] ?? 0;
  const sidespinRps = SIDESPIN_STEP_RPS[k.sidespinStep as SidespinStep] ?? 0;
  try {
    // No speed under the physiological cap explains the carry: a wrong log or a wrong assumed angle, not a
    // carry to normalise (else a 45 m lofted carry into a 6 m/s headwind became 70 m of still air).
    const maxSpeedMs = LAUNCH_SPEED_CAP_MS[s.ballSize === 3 || s.ballSize === 4 ? s.ballSize : 5];
    const speed = solveLaunchSpeed({ carryM: k.carryM, elevationDeg, backspinRps, sidespinRps, maxSpeedMs, ...conditionsOf(s) });
    if (speed === null) return null;
    const flight = simulateKick({ speed, elevationDeg, backspinRps, sidespinRps, ...standardConditions(s.ballSize, s.dragCrisisRe) });
    return flight.landed ? Math.round(flight.carryM * 100) / 100 : null;
  } catch (err) {
    if (err instanceof RangeError) return null;
    throw err;
  }
}
