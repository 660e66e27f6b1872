/**
 * Guardians, consent, invites, password reset and mail: request schemas and response shapes
 * shared by the server and the client (issue: Family digest and account mail).
 */
import * as z from 'zod';
import { isCommonPassword } from '../common-passwords';
import { ROLES } from '../roles';
import { hasUnsafeNameCharacters, unsafeNameMessage } from '../safe-text';

/** Shortest password an account may set (common practice; NIST SP 800-63B asks for at least 8). */
export const MIN_PASSWORD_LENGTH = 10;

const password = z
  .string({ error: 'password is required' })
  .min(MIN_PASSWORD_LENGTH, { error: `password must be at least ${MIN_PASSWORD_LENGTH} characters` })
  .max(200, { error: 'password must be at most 200 characters' })
  .refine((p) => !isCommonPassword(p), { error: 'password is one of the most common passwords; choose another' });
const token = z.string({ error: 'token is required' }).min(20, { error: 'token is not valid' }).max(300, { error: 'token is not valid' });
const email = z
  .string({ error: 'email is required' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'email is not a valid e-mail address' }));

/** `POST /api/auth/accept-invite`. */
export const acceptInviteSchema = z.strictObject({ token, password });
/** `POST /api/auth/forgot-password`. */
export const forgotPasswordSchema = z.strictObject({ email });
/** `POST /api/auth/reset-password`. */
export const resetPasswordSchema = z.strictObject({ token, password });

/** `POST /api/admin/invites`. */
export const inviteRequestSchema = z.strictObject({
  email,
  displayName: z
    .string({ error: 'displayName is required' })
    .trim()
    .min(1, { error: 'displayName is required' })
    .max(120)
    .refine((n) => !hasUnsafeNameCharacters(n), { error: unsafeNameMessage('displayName') }),
  role: z.enum(ROLES, { error: `role must be one of ${ROLES.join(', ')}` }),
  squadIds: z
    .array(z.uuid({ error: 'squadIds must hold squad ids' }))
    .max(50)
    .optional(),
  playerId: z.uuid({ error: 'playerId must be a player id' }).optional(),
});
export type InviteRequest = z.infer<typeof inviteRequestSchema>;

/** `POST /api/guardians/links`. */
export const createLinkSchema = z.strictObject({
  guardianUserId: z.uuid({ error: 'guardianUserId must be a user id' }),
  playerId: z.uuid({ error: 'playerId must be a player id' }),
  relationship: z.string().trim().min(1).max(60).optional(),
});

/** `POST /api/guardians/links/:id/consent`. */
export const consentSchema = z.discriminatedUnion(
  'consent',
  [
    z.strictObject({
      consent: z.literal(true),
      textVersion: z.string({ error: 'textVersion is required' }).min(1, { error: 'textVersion is required' }).max(40),
    }),
    z.strictObject({ consent: z.literal(false) }),
  ],
  { error: 'consent must be true (with textVersion) or false' },
);

/** `PUT /api/guardians/links/:id/digest`. */
export const digestOptInSchema = z.strictObject({ optIn: z.boolean({ error: 'optIn must be true or false' }) });

/** A guardian link as the API shows it. */
export const guardianLinkViewSchema = z
  .object({
    id: z.string(),
    guardianUserId: z.string(),
    guardianName: z.string(),
    guardianEmail: z.string(),
    playerId: z.string(),
    playerName: z.string(),
    playerFirstName: z.string(),
    squadName: z.string(),
    relationship: z.string(),
    consentAt: z.string().nullable(),
    consentTextVersion: z.string().nullable(),
    consentRecordedByName: z.string().nullable(),
    consentWithdrawnAt: z.string().nullable(),
    digestOptIn: z.boolean(),
  })
  .meta({ id: 'GuardianLink' });
export type GuardianLinkView = z.infer<typeof guardianLinkViewSchema>;

/** `GET /api/guardians/children/:playerId/summary`. */
export const childSummarySchema = z
  .object({
    playerId: z.string(),
    firstName: z.string(),
    squadName: z.string(),
    weeks: z.array(z.object({ weekStart: z.string(), reps: z.number().int(), hitRate: z.number().nullable() })),
    highlight: z.string().nullable(),
  })
  .meta({ id: 'ChildSummary' });
export type ChildSummary = z.infer<typeof childSummarySchema>;

/** A captured message in the list (`GET /api/dev/mail`). */
export const capturedMailSummarySchema = z
  .object({ id: z.string(), from: z.string(), to: z.array(z.string()), subject: z.string(), receivedAt: z.string() })
  .meta({ id: 'CapturedMailSummary' });
export type CapturedMailSummary = z.infer<typeof capturedMailSummarySchema>;

/** A captured message in full (`GET /api/dev/mail/:id`). */
export const capturedMailMessageSchema = capturedMailSummarySchema
  .extend({ text: z.string(), html: z.string().nullable(), headers: z.record(z.string(), z.string()) })
  .meta({ id: 'CapturedMailMessage' });
export type CapturedMailMessage = z.infer<typeof capturedMailMessageSchema>;

/** A row of the mail outbox (`GET /api/admin/outbox`). */
export const outboxMailSchema = z
  .object({
    id: z.string(),
    kind: z.enum(['invite', 'password_reset', 'family_digest', 'squad_week']),
    toAddress: z.string(),
    subject: z.string(),
    status: z.enum(['queued', 'sent', 'failed']),
    attempts: z.number().int(),
    lastError: z.string().nullable(),
    createdAt: z.string(),
    sentAt: z.string().nullable(),
  })
  .meta({ id: 'OutboxMail' });
export type OutboxMail = z.infer<typeof outboxMailSchema>;

/** `POST /api/digests/run`. */
export const digestRunResultSchema = z
  .object({ weekStart: z.string(), familySent: z.number().int(), familySkipped: z.number().int(), squadWeekSent: z.number().int() })
  .meta({ id: 'DigestRunResult' });
export type DigestRunResult = z.infer<typeof digestRunResultSchema>;

/** The consent wording guardians agree to (`GET /api/guardians/consent-text`); versioned so a record says which text was shown. */
export const consentTextSchema = z.object({ version: z.string(), text: z.string() }).meta({ id: 'ConsentText' });
export type ConsentText = z.infer<typeof consentTextSchema>;

/** Answer of the one-click unsubscribe (`POST /api/digests/unsubscribe?token=`): the child's first name for the confirmation. */
export const unsubscribeResultSchema = z.object({ unsubscribed: z.literal(true), firstName: z.string() }).meta({ id: 'UnsubscribeResult' });
export type UnsubscribeResult = z.infer<typeof unsubscribeResultSchema>;
