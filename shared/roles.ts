/**
 * The five roles of docs/design.md §2. The server is the only guard; the client uses these
 * to hide what a role cannot do.
 */
export const ROLES = ['admin', 'head_coach', 'assistant_coach', 'player', 'guardian'] as const;

/** One of the roles a Loftline account can hold. */
export type Role = (typeof ROLES)[number];

/** Roles that count as club staff (they work with squads rather than with one player). */
export const STAFF_ROLES: readonly Role[] = ['admin', 'head_coach', 'assistant_coach'];

/** Whether the role is one of the club staff roles. */
export function isStaffRole(role: Role): boolean {
  return STAFF_ROLES.includes(role);
}

/** Human-readable label for a role, used in the app shell and admin screens. */
export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Club administrator',
  head_coach: 'Head coach',
  assistant_coach: 'Assistant coach',
  player: 'Player',
  guardian: 'Guardian',
};
