/**
 * Answers of the account calls: who an invitation is for, the invitation just sent, the club's accounts as
 * the admin list shows them, and the neutral answer of a password-reset request. Defined once here so the
 * server, the client and the OpenAPI document use the same shapes.
 */
import * as z from 'zod';
import { ROLES } from '../roles';

/** Answer of `GET /api/auth/invite?token=`: who an invitation is for, shown before the password is set. */
export const inviteViewSchema = z.object({ email: z.string(), displayName: z.string(), role: z.enum(ROLES) }).meta({ id: 'InviteView' });
export type InviteView = z.infer<typeof inviteViewSchema>;

/** Answer of `POST /api/admin/invites` and `POST /api/admin/users/:id/invite`. */
export const inviteCreatedSchema = z
  .object({
    userId: z.string(),
    email: z.string(),
    /** When the invitation link stops working (ISO time, 7 days on). */
    expiresAt: z.string(),
  })
  .meta({ id: 'InviteCreated' });
export type InviteCreated = z.infer<typeof inviteCreatedSchema>;

/** An account of the club as the admin list shows it. */
export const adminUserSchema = z
  .object({
    id: z.string(),
    email: z.string(),
    displayName: z.string(),
    role: z.enum(ROLES),
    /** When the last invitation went out (ISO time), or null for accounts made another way. */
    invitedAt: z.string().nullable(),
    /** Whether the account has a password (invitation accepted). */
    activated: z.boolean(),
    /** Whether an admin has disabled the account (it can no longer sign in). */
    disabled: z.boolean(),
  })
  .meta({ id: 'AdminUser' });
export type AdminUser = z.infer<typeof adminUserSchema>;

/** Answer of `GET /api/admin/users`. */
export const adminUserListSchema = z.object({ users: z.array(adminUserSchema) });

/**
 * Answer of `POST /api/auth/forgot-password` (202): the same words whether or not the account exists, so the
 * answer says nothing about who has one.
 */
export const resetRequestedSchema = z.object({ message: z.string() }).meta({ id: 'ResetRequested' });
