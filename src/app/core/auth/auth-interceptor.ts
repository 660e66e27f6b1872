import { HttpErrorResponse, HttpInterceptorFn, HttpRequest } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, of, switchMap, throwError } from 'rxjs';
import { AuthSession, SessionExpiredError } from './auth-session';

/**
 * Endpoints that must never carry (or retry with) a bearer: login and refresh take credentials
 * in the body; the invitation, password-reset and unsubscribe endpoints are public and take a
 * one-time token instead, so a stale session must not send them into a refresh.
 */
const TOKEN_ENDPOINTS = [
  '/api/auth/login',
  '/api/auth/refresh',
  '/api/auth/invite',
  '/api/auth/accept-invite',
  '/api/auth/forgot-password',
  '/api/auth/reset-password',
  '/api/digests/unsubscribe',
];

/**
 * Adds the access token to Loftline API calls and renews it when it has expired.
 *
 * Access tokens are short-lived, so a 401 is routine: the interceptor refreshes once (the
 * session shares one refresh between parallel calls) and retries the request once with the
 * new token. Only when the server rejects the refresh token is the user signed out and sent
 * to the sign-in page, coming back to the page they were on. No signal on the pitch is not a
 * reason to sign anyone out, so network failures of the refresh are passed on as they are.
 * Requests to other origins never see the token.
 */
export const authInterceptor: HttpInterceptorFn = (request, next) => {
  const path = apiPath(request.url);
  if (path === null || TOKEN_ENDPOINTS.includes(path)) {
    return next(request);
  }
  const session = inject(AuthSession);
  const router = inject(Router);
  const sentToken = session.accessToken();

  return next(withBearer(request, sentToken)).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse) || error.status !== 401 || path.startsWith('/api/auth/')) {
        return throwError(() => error);
      }
      // Another call already renewed the token while this one was on its way: just retry.
      const current = session.accessToken();
      const freshToken$ = current !== null && current !== sentToken ? of(current) : session.refresh();
      return freshToken$.pipe(
        catchError((refreshError: unknown) => {
          if (refreshError instanceof SessionExpiredError) {
            sendToSignIn(router);
            return throwError(() => error);
          }
          return throwError(() => refreshError);
        }),
        switchMap((token) => next(withBearer(request, token))),
      );
    }),
  );
};

/** The path of a same-origin `/api/…` URL, or null for anything else. */
function apiPath(url: string): string | null {
  const base = globalThis.location?.href ?? 'http://localhost/';
  let parsed: URL;
  try {
    parsed = new URL(url, base);
  } catch {
    return null;
  }
  if (parsed.origin !== new URL(base).origin || !parsed.pathname.startsWith('/api/')) {
    return null;
  }
  return parsed.pathname;
}

function withBearer<T>(request: HttpRequest<T>, token: string | null): HttpRequest<T> {
  if (token === null || request.headers.has('Authorization')) {
    return request;
  }
  return request.clone({ setHeaders: { Authorization: `Bearer ${token}` } });
}

function sendToSignIn(router: Router): void {
  const here = router.url;
  if (here.startsWith('/sign-in')) {
    return;
  }
  const returnUrl = here === '/' ? undefined : here;
  void router.navigate(['/sign-in'], { queryParams: returnUrl ? { returnUrl } : {} });
}
