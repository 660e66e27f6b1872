import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import { STAFF_ROLES, type Role } from '../../../../shared/roles';
import { AuthSession } from './auth-session';

/**
 * Lets users holding one of `roles` into a route and sends everyone else home. The server checks
 * every call anyway; this only spares other roles a screen of refusals they cannot use.
 */
export function requireRole(...roles: readonly Role[]): CanMatchFn {
  return () => {
    const role = inject(AuthSession).role();
    return role !== null && roles.includes(role) ? true : inject(Router).createUrlTree(['/home']);
  };
}

/** Club administrators only (Club admin, roster and device imports). */
export const requireAdmin = requireRole('admin');

/** Club staff only (Pitchside, Squad week, the planner). */
export const requireStaff = requireRole(...STAFF_ROLES);

/** Guardians only (Guardian home; the server scopes their calls to their own links anyway). */
export const requireGuardian = requireRole('guardian');

/** Who may open the Flight sandbox: club staff and players (it computes locally and reads no one's data). */
export const requireSandboxAccess = requireRole(...STAFF_ROLES, 'player');
