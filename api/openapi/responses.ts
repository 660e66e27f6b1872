/**
 * Zod schemas of the answers the API documents in detail. The OpenAPI document is generated from them and
 * the API specs parse real answers with the same schemas, so the reference cannot drift from what the server
 * sends. Payloads themselves are defined once in shared/schemas/ (the types both sides use are inferred from
 * them); this file only wraps them in the envelopes the routes answer with. Every JSON answer has a schema: there is
 * no "any object" fallback, and a spec fails when an operation lacks one.
 */
import * as z from 'zod';
import { sessionUserSchema } from '../../shared/schemas/auth';
import { clubSettingsSchema } from '../../shared/schemas/club';
import { groundSchema } from '../../shared/schemas/grounds';
import { capturedMailMessageSchema, capturedMailSummarySchema, guardianLinkViewSchema, outboxMailSchema } from '../../shared/schemas/mail';
import { apiErrorBodySchema, playerSummarySchema, squadSummarySchema } from '../../shared/schemas/squads';

/** The error body every failing call answers with (4xx/5xx). */
export const errorBodySchema = apiErrorBodySchema;

/** `GET /api/health`. */
export const healthSchema = z.object({ ok: z.literal(true) });

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

/** `GET /api/squads`. */
export const squadListSchema = z.object({ squads: z.array(squadSummarySchema) });

/** `GET /api/players`. */
export const playerListSchema = z.object({ players: z.array(playerSummarySchema) });

/** `GET /api/players/:id`. */
export const playerAnswerSchema = z.object({ player: playerSummarySchema });

/** `GET /api/grounds`. */
export const groundListSchema = z.object({ grounds: z.array(groundSchema) });

/** `GET /api/guardians/links`. */
export const guardianLinkListSchema = z.object({ links: z.array(guardianLinkViewSchema) });

/** One guardian link created or changed (`POST /api/guardians/links`, consent, digest choice). */
export const guardianLinkAnswerSchema = z.object({ link: guardianLinkViewSchema });

/** `GET /api/admin/outbox`. */
export const outboxListSchema = z.object({ mails: z.array(outboxMailSchema) });

/** `GET /api/dev/mail`. */
export const capturedMailListSchema = z.object({ messages: z.array(capturedMailSummarySchema) });

/** `GET /api/dev/mail/:id`. */
export const capturedMailAnswerSchema = z.object({ message: capturedMailMessageSchema });
