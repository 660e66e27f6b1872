/**
 * Training grounds and the conditions measured at them: one definition for the client and the server.
 * A ground's coordinates let the server ask a weather service about the air at the pitch; its kicking
 * bearing turns the service's compass wind into the head/cross wind the flight model takes.
 */
import * as z from 'zod';
import { hasUnsafeNameCharacters, unsafeNameMessage } from '../safe-text';

const num = (name: string, min: number, max: number, unit: string) =>
  z
    .number({ error: `${name} must be a number` })
    .min(min, { error: `${name} must be at least ${min}${unit}` })
    .max(max, { error: `${name} must be at most ${max}${unit}` });

/** Body of `POST /api/grounds` and `PUT /api/grounds/:id` (admins). */
export const groundInputSchema = z.strictObject({
  name: z
    .string({ error: 'name is required' })
    .trim()
    .min(1, { error: 'name is required' })
    .max(120, { error: 'name must be at most 120 characters' })
    .refine((n) => !hasUnsafeNameCharacters(n), { error: unsafeNameMessage('name') }),
  // WGS 84 latitude and longitude in decimal degrees.
  latitude: num('latitude', -90, 90, '°'),
  longitude: num('longitude', -180, 180, '°'),
  // The same range a session's altitude may take (shared/schemas/sync.ts).
  altitudeM: num('altitudeM', -500, 5000, ' m'),
  kickingBearingDeg: z
    .number({ error: 'kickingBearingDeg must be a number' })
    .min(0, { error: 'kickingBearingDeg must be at least 0°' })
    .lt(360, { error: 'kickingBearingDeg must be less than 360° (0 = north, 90 = east)' }),
});
export type GroundInput = z.infer<typeof groundInputSchema>;

/** A training ground as the API lists it (grounds made before coordinates were asked for may lack them). */
export interface Ground extends Omit<GroundInput, 'latitude' | 'longitude'> {
  id: string;
  latitude: number | null;
  longitude: number | null;
}

/** Where a session's condition value came from. */
export type ConditionSource = 'coach' | 'ground' | 'weather' | 'default';

/** Conditions measured by the weather service at a ground, converted to the flight model's units. */
export interface MeasuredConditions {
  source: 'weather';
  groundId: string;
  /** When the service measured (or modelled) the values, ISO 8601 UTC. */
  observedAt: string;
  /** When Loftline asked the service (answers are cached for ten minutes), ISO 8601 UTC. */
  fetchedAt: string;
  temperatureC: number;
  relativeHumidityPct: number;
  /** Air pressure at the ground's surface (not reduced to sea level), hPa. */
  pressureHpa: number;
  windSpeedMs: number;
  /** Compass bearing the wind comes from (WMO convention: clockwise from north). */
  windFromBearingDeg: number;
  /** The same wind relative to the ground's kicking direction: 0 = headwind, 90 = from the left, 180 = tailwind. */
  windFromDeg: number;
  /** The ground's altitude, m (the session stores it as coming from the ground). */
  altitudeM: number;
}

/** No measurement: the service is not configured, timed out or failed; Pitchside keeps the coach's taps. */
export interface UnavailableConditions {
  source: 'unavailable';
  groundId: string;
  /** Why, in words a coach or an admin can act on. */
  reason: string;
}

/** Answer of `GET /api/grounds/:id/conditions`. */
export type GroundConditions = MeasuredConditions | UnavailableConditions;
