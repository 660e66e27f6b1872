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
export const groundSchema = z
  .object({
    id: z.string(),
    name: z.string(),
    latitude: z.number().nullable(),
    longitude: z.number().nullable(),
    altitudeM: z.number(),
    kickingBearingDeg: z.number().describe('0 = north, 90 = east'),
  })
  .meta({ id: 'Ground' });
export type Ground = z.infer<typeof groundSchema>;

/** Where a session's condition value came from. */
export type ConditionSource = 'coach' | 'ground' | 'weather' | 'default';

/** Conditions measured by the weather service at a ground, converted to the flight model's units. */
export const measuredConditionsSchema = z
  .object({
    source: z.literal('weather'),
    groundId: z.string(),
    observedAt: z.string().describe('When the service measured (or modelled) the values, ISO 8601 UTC'),
    fetchedAt: z.string().describe('When Loftline asked the service (answers are cached for ten minutes), ISO 8601 UTC'),
    temperatureC: z.number(),
    relativeHumidityPct: z.number(),
    pressureHpa: z.number().describe("Air pressure at the ground's surface (not reduced to sea level), hPa"),
    windSpeedMs: z.number(),
    windFromBearingDeg: z.number().describe('Compass bearing the wind comes from (WMO convention: clockwise from north)'),
    windFromDeg: z
      .number()
      .describe("The wind relative to the ground's kicking direction: 0 = headwind, 90 = from the left, 180 = tailwind"),
    altitudeM: z.number().describe("The ground's altitude, m"),
  })
  .meta({ id: 'MeasuredConditions' });
export type MeasuredConditions = z.infer<typeof measuredConditionsSchema>;

/** No measurement: the service is not configured, timed out or failed; Pitchside keeps the coach's taps. */
export const unavailableConditionsSchema = z
  .object({
    source: z.literal('unavailable'),
    groundId: z.string(),
    reason: z.string().describe('Why, in words a coach or an admin can act on'),
  })
  .meta({ id: 'UnavailableConditions' });
export type UnavailableConditions = z.infer<typeof unavailableConditionsSchema>;

/** Answer of `GET /api/grounds/:id/conditions`. */
export const groundConditionsSchema = z.discriminatedUnion('source', [measuredConditionsSchema, unavailableConditionsSchema]);
export type GroundConditions = z.infer<typeof groundConditionsSchema>;
