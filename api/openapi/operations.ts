/**
 * Every API operation as the reference documents it: method, Express path, who may call it, and the zod
 * schemas of its query, body and answer — the same schemas the routers parse with. A spec compares this list
 * with the routes Express actually has, so a new route without an entry here fails the build.
 */
import type * as z from 'zod';
import { ROLES, STAFF_ROLES, type Role } from '../../shared/roles';
import { adminUserListSchema, inviteCreatedSchema, inviteViewSchema, resetRequestedSchema } from '../../shared/schemas/accounts';
import { authTokensSchema, loginRequestSchema, refreshRequestSchema } from '../../shared/schemas/auth';
import { erasureSchema, playerDataExportSchema } from '../../shared/schemas/exports';
import { kicksImportAnswerSchema, rosterImportAnswerSchema } from '../../shared/schemas/imports';
import { openApiDocumentSchema, readinessSchema } from '../../shared/schemas/service';
import { clubSettingsUpdateSchema } from '../../shared/schemas/club';
import { groundConditionsSchema, groundInputSchema, groundSchema } from '../../shared/schemas/grounds';
import {
  acceptInviteSchema,
  childSummarySchema,
  consentSchema,
  consentTextSchema,
  createLinkSchema,
  digestOptInSchema,
  digestRunResultSchema,
  forgotPasswordSchema,
  inviteRequestSchema,
  resetPasswordSchema,
  unsubscribeResultSchema,
} from '../../shared/schemas/mail';
import {
  playerKicksResponseSchema,
  profileEntrySchema,
  progressResponseSchema,
  spinEstimatesResponseSchema,
  squadProfilesResponseSchema,
  squadWeekSchema,
} from '../../shared/schemas/analysis';
import { pullQuerySchema, pullResponseSchema, pushRequestSchema, pushResponseSchema } from '../../shared/schemas/sync';
import { usersQuerySchema } from '../admin/admin.schemas';
import { runSchema } from '../digests/digests.schemas';
import { eraseSchema } from '../exports/erasure.router';
import { kicksQuery } from '../exports/exports.router';
import { kicksQuerySchema, listPlayersQuerySchema, profileQuerySchema, progressQuerySchema } from '../players/players.schemas';
import { weekQuerySchema } from '../squads/squads.router';
import {
  capturedMailAnswerSchema,
  capturedMailListSchema,
  clubSettingsAnswerSchema,
  digestOptInAnswerSchema,
  groundListSchema,
  guardianLinkAnswerSchema,
  guardianLinkListSchema,
  healthSchema,
  meSchema,
  outboxListSchema,
  playerAnswerSchema,
  playerListSchema,
  squadListSchema,
} from './responses';

/** Who may call an operation: anyone, or signed-in users of these roles. */
export type Access = 'public' | readonly Role[];

/** What every documented operation has. */
interface OperationBase {
  readonly method: 'GET' | 'POST' | 'PUT' | 'DELETE';
  /** Express path under `/api`, e.g. `/api/players/:id`. */
  readonly path: string;
  readonly tag: string;
  readonly summary: string;
  readonly access: Access;
  readonly query?: z.ZodType;
  readonly body?: z.ZodType;
  /** A multipart upload (`file` field) instead of a JSON body. */
  readonly upload?: boolean;
  /** Whether success is 201 Created. */
  readonly created?: boolean;
}

/**
 * One documented operation. Its success is exactly one of: a JSON answer with its schema, a non-JSON answer
 * of a content type, or 204 without a body — so an operation cannot be added without saying what it answers.
 */
export type Operation = OperationBase &
  (
    | {
        /** The JSON answer's schema (the spec parses real answers with it). */
        readonly answer: z.ZodType;
        readonly produces?: never;
        readonly noContent?: never;
      }
    | {
        /** Content type of a non-JSON answer. */
        readonly produces: 'text/csv' | 'text/html' | 'text/javascript';
        readonly answer?: never;
        readonly noContent?: never;
      }
    | {
        /** Success is 204 without a body. */
        readonly noContent: true;
        readonly answer?: never;
        readonly produces?: never;
      }
  );

const STAFF: readonly Role[] = STAFF_ROLES;
const ALL: readonly Role[] = ROLES;

/** The documented operations (the reference page lists them in this order). */
export const OPERATIONS: readonly Operation[] = [
  {
    method: 'GET',
    path: '/api/ready',
    tag: 'Service',
    summary: 'Whether the server is ready to serve',
    access: 'public',
    answer: readinessSchema,
  },
  { method: 'GET', path: '/api/health', tag: 'Service', summary: 'Whether the server is up', access: 'public', answer: healthSchema },
  {
    method: 'GET',
    path: '/api/openapi.json',
    tag: 'Service',
    summary: 'This OpenAPI 3.1 document',
    access: 'public',
    answer: openApiDocumentSchema,
  },
  {
    method: 'GET',
    path: '/api/reference',
    tag: 'Service',
    summary: 'The readable API reference page',
    access: 'public',
    produces: 'text/html',
  },
  {
    method: 'GET',
    path: '/api/reference.js',
    tag: 'Service',
    summary: 'Script of the reference page',
    access: 'public',
    produces: 'text/javascript',
  },
  {
    method: 'POST',
    path: '/api/auth/login',
    tag: 'Auth',
    summary: 'Sign in with e-mail and password',
    access: 'public',
    body: loginRequestSchema,
    answer: authTokensSchema,
  },
  {
    method: 'POST',
    path: '/api/auth/refresh',
    tag: 'Auth',
    summary: 'Rotate a refresh token for new tokens',
    access: 'public',
    body: refreshRequestSchema,
    answer: authTokensSchema,
  },
  {
    method: 'POST',
    path: '/api/auth/logout',
    tag: 'Auth',
    summary: 'Revoke a refresh token',
    access: 'public',
    body: refreshRequestSchema,
    noContent: true,
  },
  {
    method: 'GET',
    path: '/api/auth/invite',
    tag: 'Auth',
    summary: 'Check an invitation token (`?token=`)',
    access: 'public',
    answer: inviteViewSchema,
  },
  {
    method: 'POST',
    path: '/api/auth/accept-invite',
    tag: 'Auth',
    summary: 'Accept an invitation and choose a password',
    access: 'public',
    body: acceptInviteSchema,
    answer: authTokensSchema,
  },
  {
    method: 'POST',
    path: '/api/auth/forgot-password',
    tag: 'Auth',
    summary: 'Mail a password-reset link (same answer whether or not the account exists)',
    access: 'public',
    body: forgotPasswordSchema,
    answer: resetRequestedSchema,
  },
  {
    method: 'POST',
    path: '/api/auth/reset-password',
    tag: 'Auth',
    summary: 'Set a new password with a reset token',
    access: 'public',
    body: resetPasswordSchema,
    noContent: true,
  },
  {
    method: 'POST',
    path: '/api/digests/unsubscribe',
    tag: 'Mail',
    summary: 'One-click unsubscribe from the Family digest (RFC 8058, `?token=`)',
    access: 'public',
    answer: unsubscribeResultSchema,
  },
  {
    method: 'GET',
    path: '/api/me',
    tag: 'Account',
    summary: 'The signed-in user, their club and linked players',
    access: ALL,
    answer: meSchema,
  },
  {
    method: 'GET',
    path: '/api/me/digest-opt-in',
    tag: 'Account',
    summary: "An adult player's Family digest choice",
    access: ['player'],
    answer: digestOptInAnswerSchema,
  },
  {
    method: 'PUT',
    path: '/api/me/digest-opt-in',
    tag: 'Account',
    summary: "Set an adult player's Family digest choice",
    access: ['player'],
    body: digestOptInSchema,
    answer: digestOptInAnswerSchema,
  },
  {
    method: 'GET',
    path: '/api/club/settings',
    tag: 'Club',
    summary: 'Stopwatch calibration, distance unit (m or yd) and locale (BCP 47)',
    access: ALL,
    answer: clubSettingsAnswerSchema,
  },
  {
    method: 'PUT',
    path: '/api/club/settings',
    tag: 'Club',
    summary: 'Change the club settings (unit and locale optional: left out, unchanged)',
    access: ['admin'],
    body: clubSettingsUpdateSchema,
    answer: clubSettingsAnswerSchema,
  },
  { method: 'GET', path: '/api/squads', tag: 'Squads', summary: "The caller's squads", access: ALL, answer: squadListSchema },
  {
    method: 'GET',
    path: '/api/squads/:id/week',
    tag: 'Squads',
    summary: 'Squad week: per-player figures, zones, load cautions',
    access: STAFF,
    query: weekQuerySchema,
    answer: squadWeekSchema,
  },
  {
    method: 'GET',
    path: '/api/squads/:id/profiles',
    tag: 'Squads',
    summary: "Every player's fitted launch profile for one technique",
    access: STAFF,
    query: profileQuerySchema,
    answer: squadProfilesResponseSchema,
  },
  {
    method: 'GET',
    path: '/api/players',
    tag: 'Players',
    summary: 'Players the caller may see',
    access: ALL,
    query: listPlayersQuerySchema,
    answer: playerListSchema,
  },
  {
    method: 'GET',
    path: '/api/players/:id',
    tag: 'Players',
    summary: 'One player',
    access: [...STAFF, 'player'],
    answer: playerAnswerSchema,
  },
  {
    method: 'GET',
    path: '/api/players/:id/progress',
    tag: 'Players',
    summary: 'Weekly progress per technique',
    access: [...STAFF, 'player'],
    query: progressQuerySchema,
    answer: progressResponseSchema,
  },
  {
    method: 'GET',
    path: '/api/players/:id/kicks',
    tag: 'Players',
    summary: 'Recent kicks',
    access: [...STAFF, 'player'],
    query: kicksQuerySchema,
    answer: playerKicksResponseSchema,
  },
  {
    method: 'GET',
    path: '/api/players/:id/profile',
    tag: 'Players',
    summary: 'Fitted launch profile and reach curve for one technique',
    access: [...STAFF, 'player'],
    query: profileQuerySchema,
    answer: profileEntrySchema,
  },
  {
    method: 'GET',
    path: '/api/players/:id/spin-estimates',
    tag: 'Players',
    summary: 'Spin and speed solved from timed repetitions',
    access: [...STAFF, 'player'],
    answer: spinEstimatesResponseSchema,
  },
  {
    method: 'POST',
    path: '/api/sync/push',
    tag: 'Sync',
    summary: 'Push outbox mutations (each applied at most once)',
    access: STAFF,
    body: pushRequestSchema,
    answer: pushResponseSchema,
  },
  {
    method: 'GET',
    path: '/api/sync/pull',
    tag: 'Sync',
    summary: 'Changes since a cursor',
    access: [...STAFF, 'player'],
    query: pullQuerySchema,
    answer: pullResponseSchema,
  },
  { method: 'GET', path: '/api/grounds', tag: 'Grounds', summary: "The club's training grounds", access: STAFF, answer: groundListSchema },
  {
    method: 'POST',
    path: '/api/grounds',
    tag: 'Grounds',
    summary: 'Add a training ground',
    access: ['admin'],
    body: groundInputSchema,
    answer: groundSchema,
    created: true,
  },
  {
    method: 'PUT',
    path: '/api/grounds/:id',
    tag: 'Grounds',
    summary: 'Change a training ground',
    access: ['admin'],
    body: groundInputSchema,
    answer: groundSchema,
  },
  {
    method: 'GET',
    path: '/api/grounds/:id/conditions',
    tag: 'Grounds',
    summary: 'Weather at the ground now (or why not)',
    access: STAFF,
    answer: groundConditionsSchema,
  },
  {
    method: 'GET',
    path: '/api/guardians/consent-text',
    tag: 'Guardians',
    summary: 'The consent text guardians agree to, with its version',
    access: ALL,
    answer: consentTextSchema,
  },
  {
    method: 'GET',
    path: '/api/guardians/links',
    tag: 'Guardians',
    summary: 'Guardian links (admins: all; guardians: their own)',
    access: ['admin', 'guardian'],
    answer: guardianLinkListSchema,
  },
  {
    method: 'POST',
    path: '/api/guardians/links',
    tag: 'Guardians',
    summary: 'Link a guardian to a player',
    access: ['admin'],
    body: createLinkSchema,
    answer: guardianLinkAnswerSchema,
    created: true,
  },
  {
    method: 'DELETE',
    path: '/api/guardians/links/:id',
    tag: 'Guardians',
    summary: 'Remove a guardian link',
    access: ['admin'],
    noContent: true,
  },
  {
    method: 'POST',
    path: '/api/guardians/links/:id/consent',
    tag: 'Guardians',
    summary: 'Give or withdraw consent',
    access: ['guardian'],
    body: consentSchema,
    answer: guardianLinkAnswerSchema,
  },
  {
    method: 'PUT',
    path: '/api/guardians/links/:id/digest',
    tag: 'Guardians',
    summary: 'Family digest opt-in',
    access: ['guardian'],
    body: digestOptInSchema,
    answer: guardianLinkAnswerSchema,
  },
  {
    method: 'GET',
    path: '/api/guardians/children/:playerId/summary',
    tag: 'Guardians',
    summary: "A linked child's summary",
    access: ['guardian'],
    answer: childSummarySchema,
  },
  {
    method: 'POST',
    path: '/api/admin/players/:id/erase',
    tag: 'Admin',
    summary: "Erase or anonymise a player's data",
    access: ['admin'],
    body: eraseSchema,
    answer: erasureSchema,
  },
  {
    method: 'GET',
    path: '/api/admin/users',
    tag: 'Admin',
    summary: "The club's users",
    access: ['admin'],
    query: usersQuerySchema,
    answer: adminUserListSchema,
  },
  {
    method: 'POST',
    path: '/api/admin/invites',
    tag: 'Admin',
    summary: 'Invite a user by e-mail',
    access: ['admin'],
    body: inviteRequestSchema,
    answer: inviteCreatedSchema,
    created: true,
  },
  {
    method: 'POST',
    path: '/api/admin/users/:id/invite',
    tag: 'Admin',
    summary: 'Invite again an account that never set a password (expired invite, imported guardian)',
    access: ['admin'],
    answer: inviteCreatedSchema,
    created: true,
  },
  {
    method: 'POST',
    path: '/api/admin/users/{id}/disable',
    tag: 'Admin',
    summary: 'Disable a user and end every sign-in they have',
    access: ['admin'],
    noContent: true,
  },
  {
    method: 'GET',
    path: '/api/admin/outbox',
    tag: 'Admin',
    summary: "The club's mail outbox",
    access: ['admin'],
    answer: outboxListSchema,
  },
  {
    method: 'POST',
    path: '/api/imports/roster',
    tag: 'Imports',
    summary: 'Roster CSV (dry run or commit)',
    access: ['admin'],
    upload: true,
    answer: rosterImportAnswerSchema,
  },
  {
    method: 'POST',
    path: '/api/imports/kicks',
    tag: 'Imports',
    summary: 'Measured-kick CSV from a device (dry run or commit)',
    access: STAFF,
    upload: true,
    answer: kicksImportAnswerSchema,
  },
  {
    method: 'GET',
    path: '/api/exports/kicks.csv',
    tag: 'Exports',
    summary: "Kicks as CSV (RFC 4180), distances in the club's unit",
    access: STAFF,
    query: kicksQuery,
    produces: 'text/csv',
  },
  {
    method: 'GET',
    path: '/api/exports/players/:id.json',
    tag: 'Exports',
    summary: "A player's full data (data-access request)",
    access: ['admin'],
    answer: playerDataExportSchema,
  },
  {
    method: 'POST',
    path: '/api/digests/run',
    tag: 'Mail',
    summary: "Send the week's digests now (safe to repeat)",
    access: ['admin', 'head_coach'],
    body: runSchema,
    answer: digestRunResultSchema,
  },
  {
    method: 'GET',
    path: '/api/dev/mail',
    tag: 'Mail',
    summary: 'Captured mail (development only, with the local fake SMTP server)',
    access: ['admin'],
    answer: capturedMailListSchema,
  },
  {
    method: 'GET',
    path: '/api/dev/mail/:id',
    tag: 'Mail',
    summary: 'One captured message (development only)',
    access: ['admin'],
    answer: capturedMailAnswerSchema,
  },
];
