/**
 * Zod schemas of the answers the API documents in detail. The OpenAPI document is generated from them and
 * the API specs parse real answers with the same schemas, so the reference cannot drift from what the server
 * sends. Answers not (yet) described here are documented as "a JSON object" with a summary.
 */
import * as z from 'zod';
import { sessionUserSchema } from '../../shared/schemas/auth';
import { clubSettingsSchema } from '../../shared/schemas/club';

/** The error body every failing call answers with (4xx/5xx). */
export const errorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.array(z.object({ field: z.string(), message: z.string() })).optional(),
  }),
});

/** `GET /api/health`. */
export const healthSchema = z.object({ ok: z.literal(true) });

/** `POST /api/auth/login` and `POST /api/auth/refresh`. */
export const authTokensSchema = z.object({ accessToken: z.string(), refreshToken: z.string(), user: sessionUserSchema });

/** `GET /api/me`. */
export const meSchema = z.object({
  user: sessionUserSchema,
  club: z.object({ id: z.string(), name: z.string() }),
  playerId: z.string().nullable(),
  childPlayerIds: z.array(z.string()),
});

/** `GET /api/me/digest-opt-in`. */
export const digestOptInAnswerSchema = z.object({ optIn: z.boolean() });

/** `GET /api/club/settings` and `PUT /api/club/settings`. */
export const clubSettingsAnswerSchema = clubSettingsSchema;

const squadGroundSchema = z.object({ id: z.string(), name: z.string(), altitudeM: z.number(), kickingBearingDeg: z.number() });

/** `GET /api/squads`. */
export const squadListSchema = z.object({
  squads: z.array(
    z.object({
      id: z.string(),
      name: z.string(),
      ageGroup: z.string(),
      ballSize: z.number().int(),
      playerCount: z.number().int(),
      ground: squadGroundSchema.nullable().optional(),
    }),
  ),
});

/** `GET /api/players`. */
export const playerListSchema = z.object({
  players: z.array(
    z.object({
      id: z.string(),
      squadId: z.string(),
      squadName: z.string(),
      displayName: z.string(),
      shirtNumber: z.number().int().nullable(),
      dominantFoot: z.enum(['left', 'right']),
      isMinor: z.boolean(),
    }),
  ),
});

/** `GET /api/grounds`. */
export const groundListSchema = z.object({
  grounds: z.array(
    z.object({
      id: z.string(),
      name: z.string(),
      latitude: z.number().nullable(),
      longitude: z.number().nullable(),
      altitudeM: z.number(),
      kickingBearingDeg: z.number(),
    }),
  ),
});

/** Any JSON object: answers documented by summary only. */
export const anyObjectSchema = z.looseObject({});
