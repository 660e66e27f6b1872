import { HttpBackend, HttpXhrBackend, provideHttpClient, withInterceptors } from '@angular/common/http';
import type { EnvironmentProviders, Provider } from '@angular/core';
import { authInterceptor } from '../core/auth/auth-interceptor';

/**
 * An `HttpClient` for the import routes that sends through XMLHttpRequest instead of `fetch`.
 *
 * The app's client uses `fetch` (`withFetch()` in `app.config.ts`), and `fetch` cannot report how
 * much of a request body has been sent, so a coach uploading a 5 MB device export on pitch-side
 * signal would see no progress at all. Only uploads need this; everything else keeps `fetch`.
 * Provide it on a route together with the services that upload (they must be provided on the same
 * route so they get this client, not the root one). The auth interceptor runs here too, so uploads
 * carry the bearer and survive an expired access token like every other call.
 */
export function provideUploadHttp(): (Provider | EnvironmentProviders)[] {
  return [provideHttpClient(withInterceptors([authInterceptor])), { provide: HttpBackend, useExisting: HttpXhrBackend }];
}
