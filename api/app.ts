/**
 * Builds the Express app (no listening here, so supertest can drive it): security headers,
 * JSON limits, request logs, `/api` routers behind authentication and scope, the built
 * Angular app with SPA fallback, and the one error middleware.
 */
import express, { type Express } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import { ProfileCache } from './analysis/profile-cache';
import { AuthService } from './auth/auth.service';
import { authRouter } from './auth/auth.router';
import { createAuthMiddleware } from './auth/passport';
import type { AppConfig } from './config';
import type { Db } from './db/client';
import { errorMiddleware, NotFound } from './errors';
import { meRouter } from './me/me.router';
import { playersRouter } from './players/players.router';
import { attachScope } from './scope/scope.middleware';
import { squadsRouter } from './squads/squads.router';
import { syncRouter } from './sync/sync.router';

/** What the app needs from the outside world. */
export interface AppDeps {
  db: Db;
  config: AppConfig;
  logger: Logger;
  /** Launch-profile cache; created here when not given (the server passes one it starts). */
  profiles?: ProfileCache;
}

/** JSON bodies above this are refused (a 500-kick sync batch is far below it). */
export const JSON_BODY_LIMIT = '1mb';

/** Creates the Express application. */
export function createApp({ db, config, logger, profiles = new ProfileCache(db) }: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Angular Material sets inline styles at run time; scripts stay same-origin only.
          'style-src': ["'self'", "'unsafe-inline'"],
          'worker-src': ["'self'"],
          'upgrade-insecure-requests': config.env === 'production' ? [] : null,
        },
      },
    }),
  );
  app.use(pinoHttp({ logger, autoLogging: { ignore: (req) => !(req.url ?? '').startsWith('/api') } }));

  const api = express.Router();
  api.use(express.json({ limit: JSON_BODY_LIMIT }));
  api.get('/health', (_req, res) => {
    res.json({ ok: true });
  });
  const auth = new AuthService(db, config);
  api.use('/auth', authRouter(auth, config));

  const requireAuth = createAuthMiddleware(db, config);
  api.use(requireAuth, attachScope(db));
  api.use('/me', meRouter(db));
  api.use('/squads', squadsRouter(db, profiles));
  api.use('/players', playersRouter(db, profiles));
  api.use('/sync', syncRouter(db));
  api.use(() => {
    throw new NotFound('No such API route');
  });
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  }, api);

  serveClient(app, config.clientDir);
  app.use(errorMiddleware);
  return app;
}

/** Serves the built Angular app; unknown non-API GETs that accept HTML get `index.html`. */
function serveClient(app: Express, clientDir: string): void {
  const index = join(clientDir, 'index.html');
  app.use(
    express.static(clientDir, {
      index: false,
      setHeaders: (res, path) => {
        // Hashed bundles are immutable; the shell and the service-worker files must revalidate.
        if (/\.[0-9a-f]{8,}\.(js|css)$/i.test(path) || /-[A-Z0-9]{8}\.(js|css)$/.test(path)) {
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        } else {
          res.setHeader('Cache-Control', 'no-cache');
        }
      },
    }),
  );
  app.get('/{*splat}', (req, res, next) => {
    if (!req.accepts('html') || !existsSync(index)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  app.use((_req, _res, next) => next(new NotFound('Nothing here')));
}
