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
export interface GuardianLinkView {
  id: string;
  guardianUserId: string;
  guardianName: string;
  guardianEmail: string;
  playerId: string;
  playerName: string;
  playerFirstName: string;
  squadName: string;
  relationship: string;
  consentAt: string | null;
  consentTextVersion: string | null;
  consentRecordedByName: string | null;
  consentWithdrawnAt: string | null;
  digestOptIn: boolean;
}

/** `GET /api/guardians/children/:playerId/summary`. */
export interface ChildSummary {
  playerId: string;
  firstName: string;
  squadName: string;
  weeks: { weekStart: string; reps: number; hitRate: number | null }[];
  highlight: string | null;
}

/** A captured message in the list (`GET /api/dev/mail`). */
export interface CapturedMailSummary {
  id: string;
  from: string;
  to: string[];
  subject: string;
  receivedAt: string;
}

/** A captured message in full (`GET /api/dev/mail/:id`). */
export interface CapturedMailMessage extends CapturedMailSummary {
  text: string;
  html: string | null;
  headers: Record<string, string>;
}

/** A row of the mail outbox (`GET /api/admin/outbox`). */
export interface OutboxMail {
  id: string;
  kind: 'invite' | 'password_reset' | 'family_digest' | 'squad_week';
  toAddress: string;
  subject: string;
  status: 'queued' | 'sent' | 'failed';
  attempts: number;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
}

/** `POST /api/digests/run`. */
export interface DigestRunResult {
  weekStart: string;
  familySent: number;
  familySkipped: number;
  squadWeekSent: number;
}
