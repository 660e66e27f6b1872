/**
 * Geometry and wording of the video measurement screen that needs no Angular: where a tap lands in the
 * video's own pixels, the flight conditions of the session the kick was logged in, and the result in
 * a coach's words.
 */
import { BALL_SIZES, COACH_WIND_HEIGHT_M, WEATHER_WIND_HEIGHT_M, type FlightConditions } from '../../../shared/flight';
import type { LocalSession } from '../core/loftline-db';

/** A box on screen in CSS pixels (what `getBoundingClientRect` gives). */
export interface ScreenBox {
  left: number;
  top: number;
  width: number;
  height: number;
}

/**
 * The video pixel under a point on screen, for a `<video>` shown with `object-fit: contain`: the frame is
 * scaled by the smaller of the two ratios and centred, so bars (letterboxing) fill the rest. Client
 * coordinates are CSS pixels, as are the box's, so the device pixel ratio cancels out. Null off the frame.
 */
export function videoPixelAt(box: ScreenBox, frameWidthPx: number, frameHeightPx: number, clientX: number, clientY: number) {
  const scale = Math.min(box.width / frameWidthPx, box.height / frameHeightPx);
  if (!(scale > 0)) return null;
  const offsetX = (box.width - frameWidthPx * scale) / 2;
  const offsetY = (box.height - frameHeightPx * scale) / 2;
  const xPx = (clientX - box.left - offsetX) / scale;
  const yPx = (clientY - box.top - offsetY) / scale;
  if (xPx < 0 || yPx < 0 || xPx > frameWidthPx || yPx > frameHeightPx) return null;
  return { xPx, yPx };
}

/**
 * The session's air, wind and ball as the flight model takes them (the server's profile fit reads the same
 * fields). Wind entered by a coach is felt at head height; wind from the weather service is at 10 m.
 */
export function sessionConditions(session: LocalSession | null | undefined): FlightConditions {
  if (!session) return {};
  const air: NonNullable<FlightConditions['air']> = {};
  if (session.temperatureC != null) air.temperatureC = session.temperatureC;
  if (session.altitudeM != null) air.altitudeM = session.altitudeM;
  if (session.relativeHumidityPct != null) air.relativeHumidityPct = session.relativeHumidityPct;
  if (session.pressureHpa != null) air.pressureHpa = session.pressureHpa;
  const ball = BALL_SIZES[session.ballSize];
  const conditions: FlightConditions = { air, ball: { massKg: ball.massKg, radiusM: ball.radiusM } };
  if (session.windSpeedMs && session.windSpeedMs > 0) {
    conditions.wind = {
      speedMs: session.windSpeedMs,
      fromDeg: session.windFromDeg ?? 0,
      referenceHeightM: session.conditionsSource?.windSpeedMs === 'weather' ? WEATHER_WIND_HEIGHT_M : COACH_WIND_HEIGHT_M,
    };
  }
  return conditions;
}

/**
 * Above this one-standard-deviation spread (rev/s) the spin is called rough: it no longer separates the
 * spin steps a coach logs (3 rev/s apart, docs/design.md §6), typically a clip that shows only the rise.
 */
export const ROUGH_SPIN_SD_RPS = 1.5;

/** Spin in words: "backspin 4.2 ± 0.8 rev/s", "topspin …", or "no clear spin". */
export function spinWords(backspinRps: number, sdRps: number): string {
  const spread = Number.isFinite(sdRps) ? ` ± ${sdRps.toFixed(1)}` : '';
  if (Math.abs(backspinRps) < 0.5) return `no clear spin (${backspinRps.toFixed(1)}${spread} rev/s)`;
  return `${backspinRps > 0 ? 'backspin' : 'topspin'} ${Math.abs(backspinRps).toFixed(1)}${spread} rev/s`;
}

/** Frames between suggested taps: about ten taps a second of flight, at least every frame. */
export function suggestedStepFrames(framesPerSecond: number): number {
  return Math.max(1, Math.round(framesPerSecond / 10));
}
