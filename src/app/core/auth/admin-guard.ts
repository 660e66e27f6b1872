import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import { AuthSession } from './auth-session';

/**
 * Lets club administrators into Club admin and sends everyone else home. Every admin call is
 * checked by the server as well; this only spares other roles a page of refusals.
 */
export const requireAdmin: CanMatchFn = () => (inject(AuthSession).role() === 'admin' ? true : inject(Router).createUrlTree(['/home']));
