import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { AuthSession } from '../core/auth/auth-session';

/**
 * Sends guardians from Home to Guardian home, which is their landing page: everything a
 * guardian may see (their children's summaries and consent) is there, and sign-in, the brand
 * link and the default route all lead to `/home`. Every other role stays on Home.
 */
export const guardianLanding: CanActivateFn = () =>
  inject(AuthSession).role() === 'guardian' ? inject(Router).createUrlTree(['/guardian']) : true;
