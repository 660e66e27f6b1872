import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import { isStaffRole } from '../../../../shared/roles';
import { AuthSession } from './auth-session';

/**
 * Lets club staff into staff-only pages (Pitchside) and sends players and guardians home. The
 * server refuses their pushes anyway; this only spares them a screen they cannot use.
 */
export const requireStaff: CanMatchFn = () => {
  const role = inject(AuthSession).role();
  return role !== null && isStaffRole(role) ? true : inject(Router).createUrlTree(['/home']);
};
