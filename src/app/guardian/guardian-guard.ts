import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import { AuthSession } from '../core/auth/auth-session';

/**
 * Lets guardians into Guardian home and sends everyone else home. The server scopes every
 * guardian call to the caller's own links anyway; this only spares others an empty page.
 */
export const requireGuardian: CanMatchFn = () =>
  inject(AuthSession).role() === 'guardian' ? true : inject(Router).createUrlTree(['/home']);
