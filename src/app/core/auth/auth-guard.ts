import { inject } from '@angular/core';
import { CanActivateFn, CanMatchFn, Router } from '@angular/router';
import { AuthSession } from './auth-session';

/**
 * Lets signed-in users through and sends everyone else to `/sign-in`, remembering where
 * they wanted to go so they land there after signing in. The server checks every call
 * anyway; this only keeps signed-out users from seeing empty screens.
 */
export const requireSignedIn: CanActivateFn = (_route, state) => {
  if (inject(AuthSession).isSignedIn()) {
    return true;
  }
  const returnUrl = state.url === '/' ? null : state.url;
  return inject(Router).createUrlTree(['/sign-in'], { queryParams: returnUrl ? { returnUrl } : {} });
};

/** Keeps a signed-in user off the sign-in page (e.g. an old bookmark) by sending them home. */
export const requireSignedOut: CanMatchFn = () => (inject(AuthSession).isSignedIn() ? inject(Router).createUrlTree(['/home']) : true);

/**
 * The in-app path to go to after signing in: the requested one when it is a plain local
 * path, home otherwise. Refusing `//host` and absolute URLs keeps a crafted sign-in link
 * from sending a coach to another site.
 */
export function safeReturnUrl(candidate: string | null | undefined): string {
  if (!candidate || !candidate.startsWith('/') || candidate.startsWith('//') || candidate.startsWith('/\\')) {
    return '/home';
  }
  if (candidate.startsWith('/sign-in')) {
    return '/home';
  }
  return candidate;
}
