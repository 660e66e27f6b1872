import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import { STAFF_ROLES, type Role } from '../../../shared/roles';
import { AuthSession } from '../core/auth/auth-session';

/** Who may open the Flight sandbox: club staff and players (it computes locally and reads no one's data). */
export const SANDBOX_ROLES: readonly Role[] = [...STAFF_ROLES, 'player'];

/**
 * Lets staff and players into the sandbox and sends guardians home; the sandbox reads no server data,
 * so this only keeps the screen out of a guardian's way.
 */
export const requireSandboxAccess: CanMatchFn = () => {
  const role = inject(AuthSession).role();
  return role !== null && SANDBOX_ROLES.includes(role) ? true : inject(Router).createUrlTree(['/home']);
};
