/**
 * Squads and players as the API lists them, and the error body of every failing call: one zod schema each,
 * the TypeScript type inferred from it, referenced by the OpenAPI document through its `id`.
 */
import * as z from 'zod';
import { FEET } from '../vocabulary';

/** The ground facts Pitchside needs at session start. */
export const squadGroundSchema = z
  .object({
    id: z.string(),
    name: z.string(),
    altitudeM: z.number(),
    kickingBearingDeg: z.number().describe('Compass bearing of the main kicking direction (0 = north, 90 = east)'),
  })
  .meta({ id: 'SquadGround' });
export type SquadGround = z.infer<typeof squadGroundSchema>;

/** A squad as `GET /api/squads` lists it (scoped to the caller). */
export const squadSummarySchema = z
  .object({
    id: z.string(),
    name: z.string(),
    ageGroup: z.string(),
    ballSize: z.number().int().describe('Ball size the squad trains with (3, 4 or 5)'),
    playerCount: z.number().int(),
    /**
     * Where the squad usually trains (altitude and kicking bearing for session conditions), cached on
     * the phone with the squad so a session started with no signal still gets the ground's altitude.
     * Absent from older servers' answers.
     */
    ground: squadGroundSchema.nullable().optional(),
  })
  .meta({ id: 'SquadSummary' });
export type SquadSummary = z.infer<typeof squadSummarySchema>;

/** A player as `GET /api/players` lists it (scoped to the caller). */
export const playerSummarySchema = z
  .object({
    id: z.string(),
    squadId: z.string(),
    squadName: z.string(),
    displayName: z.string(),
    shirtNumber: z.number().int().nullable(),
    dominantFoot: z.enum(FEET),
    isMinor: z.boolean().describe('Whether the player is under 18 (academy youth data rules apply)'),
  })
  .meta({ id: 'PlayerSummary' });
export type PlayerSummary = z.infer<typeof playerSummarySchema>;

/** The error body every failing API call answers with. */
export const apiErrorBodySchema = z
  .object({
    error: z.object({
      code: z.string(),
      message: z.string(),
      /** For validation failures: each offending field (dotted path) and why. */
      fields: z.array(z.object({ field: z.string(), message: z.string() })).optional(),
    }),
  })
  .meta({ id: 'Error' });
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;
