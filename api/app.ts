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
import { AccountsService } from './accounts/accounts.service';
import { adminRouter } from './admin/admin.router';
import { ProfileCache } from './analysis/profile-cache';
import { digestsRouter, unsubscribeRouter } from './digests/digests.router';
import { DigestJob } from './digests/digests.service';
import { GroundConditionsService } from './grounds/conditions.service';
import { groundsRouter } from './grounds/grounds.router';
import { GuardiansService } from './guardians/guardians.service';
import { guardiansRouter } from './guardians/guardians.router';
import { devMailRouter } from './mail/dev-mail.router';
import { erasureRouter } from './exports/erasure.router';
import { exportsRouter } from './exports/exports.router';
import { ImportRunner } from './imports/import-runner';
import { importsRouter } from './imports/imports.router';
import { Mailer } from './mail/mailer';
import { AuthService } from './auth/auth.service';
import { compressJson } from './client/compress-json';
import { servePrecompressed } from './client/precompressed';
import { clubRouter } from './club/club.router';
import { authRouter } from './auth/auth.router';
import { createAuthMiddleware, requireRole } from './auth/passport';
import type { AppConfig } from './config';
import type { Db } from './db/client';
import { cachedStatement } from './db/statements';
import { errorMiddleware, NotFound } from './errors';
import { refuseUnsafeJson } from './json-guard';
import { redactRequest } from './logger';
import { meRouter } from './me/me.router';
import { playersRouter } from './players/players.router';
import { attachScope } from './scope/scope.middleware';
import { squadsRouter } from './squads/squads.router';
import { syncRouter } from './sync/sync.router';
import { openApiRouter } from './openapi/openapi.router';
import { OpenMeteoClient, type WeatherSource } from './weather/open-meteo-client';

/** What the app needs from the outside world. */
export interface AppDeps {
  db: Db;
  config: AppConfig;
  logger: Logger;
  /** Launch-profile cache; created here when not given (the server passes one it starts). */
  profiles?: ProfileCache;
  /** Outgoing mail; without one, mail is queued in the outbox but not sent. */
  mailer?: Mailer;
  /** Whether the local fake SMTP server is the transport (enables `/api/dev/mail`, never in production). */
  devMail?: boolean;
  /** Runs imports on a worker thread; created here when not given (the server passes one it closes). */
  imports?: ImportRunner;
  /** The digest job (the server passes the one its scheduler uses). */
  digests?: DigestJob;
  /**
   * The weather service for session conditions. Undefined: the one `config.weatherUrl` names, if any
   * (the server passes a client of its local fake when none is configured); null: none.
   */
  weather?: WeatherSource | null;
}

/** JSON bodies above this are refused (a 500-kick sync batch is far below it). */
export const JSON_BODY_LIMIT = '1mb';

/** Creates the Express application. */
export function createApp(deps: AppDeps): Express {
  const { db, config, logger } = deps;
  const profiles = deps.profiles ?? new ProfileCache(db);
  const mailer = deps.mailer ?? new Mailer(db, null, config.mailFrom);
  const digests = deps.digests ?? new DigestJob(db, mailer, config);
  const weather =
    deps.weather !== undefined
      ? deps.weather
      : config.weatherUrl
        ? new OpenMeteoClient(config.weatherUrl, { apiKey: config.weatherApiKey, timeoutMs: config.weatherTimeoutMs })
        : null;
  const conditions = new GroundConditionsService(
    db,
    weather,
    {
      cacheTtlS: config.weatherCacheTtlS,
      noServiceReason: config.weatherOff
        ? 'The weather service is switched off on this server'
        : 'No weather service is configured on this server',
    },
    logger,
  );
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Angular Material sets inline styles at run time; scripts stay same-origin only.
          'style-src': ["'self'", "'unsafe-inline'"],
          'worker-src': ["'self'"],
          // Measure from video plays the coach's clip from an object URL: it never leaves the phone.
          'media-src': ["'self'", 'blob:'],
          'upgrade-insecure-requests': config.env === 'production' ? [] : null,
        },
      },
    }),
  );
  // Request lines go through redactRequest whatever logger was passed in: no bearer or link token is ever logged.
  app.use(
    pinoHttp({
      logger,
      serializers: { req: redactRequest },
      autoLogging: { ignore: (req) => !(req.url ?? '').startsWith('/api') },
    }),
  );

  const api = express.Router();
  // Brotli or gzip for API answers; client files are compressed once, after the build (serveClient).
  api.use(compressJson());
  api.use((_req, _res, next) => {
    profiles.noteRequest();
    next();
  });
  api.use(express.json({ limit: JSON_BODY_LIMIT }), refuseUnsafeJson);
  // Liveness: the process answers. Readiness: it can also read the database (a load balancer routes to it).
  api.get('/health', (_req, res) => {
    res.json({ ok: true });
  });
  api.get('/ready', (req, res) => {
    try {
      cachedStatement(db.$client, 'SELECT COUNT(*) AS n FROM change_counter').get();
      res.json({ ready: true });
    } catch (err) {
      req.log.error({ err }, 'not ready: the database cannot be read');
      res.status(503).json({ ready: false, error: { code: 'database_unavailable', message: 'The database cannot be read' } });
    }
  });
  const auth = new AuthService(db, config);
  const accounts = new AccountsService(db, config, mailer);
  // The API reference: public outside production, admins only in production (mounted after sign-in below).
  if (config.env !== 'production') api.use(openApiRouter(config));
  api.use('/auth', authRouter(auth, accounts, config));
  api.use('/digests', unsubscribeRouter(db, config));

  const requireAuth = createAuthMiddleware(db, config);
  api.use(requireAuth, attachScope(db));
  if (config.env === 'production') api.use(openApiRouter(config, requireRole('admin')));
  api.use('/me', meRouter(db));
  api.use('/club', clubRouter(db));
  api.use('/squads', squadsRouter(db, profiles));
  api.use('/players', playersRouter(db, profiles));
  api.use('/sync', syncRouter(db));
  api.use('/grounds', groundsRouter(db, conditions));
  api.use('/guardians', guardiansRouter(new GuardiansService(db)));
  api.use('/admin/players', erasureRouter(db));
  api.use('/admin', adminRouter(db, accounts));
  api.use('/imports', importsRouter(deps.imports ?? new ImportRunner(db, config.dbPath)));
  api.use('/exports', exportsRouter(db));
  api.use('/digests', digestsRouter(digests));
  // Captured mail holds sign-in links: the viewer exists only outside production, whatever the caller asks.
  if (deps.devMail && config.env !== 'production') api.use('/dev/mail', devMailRouter(db));
  api.use(() => {
    throw new NotFound('No such API route');
  });
  app.use(
    '/api',
    (_req, res, next) => {
      res.setHeader('Cache-Control', 'no-store');
      next();
    },
    api,
  );

  serveClient(app, config.clientDir);
  app.use(errorMiddleware);
  return app;
}

/** Serves the built Angular app; unknown non-API GETs that accept HTML get `index.html`. */
function serveClient(app: Express, clientDir: string): void {
  const index = join(clientDir, 'index.html');
  app.use(servePrecompressed(clientDir));
  app.use(
    express.static(clientDir, {
      index: false,
      setHeaders: (res, path) => {
        // Hashed bundles are immutable; the shell and the service-worker files must revalidate.
        if (/\.[0-9a-f]{8,}\.(js|css)(\.br|\.gz)?$/i.test(path) || /-[A-Z0-9]{8}\.(js|css)(\.br|\.gz)?$/.test(path)) {
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        } else {
          res.setHeader('Cache-Control', 'no-cache');
        }
      },
    }),
  );
  app.get('/{*splat}', (req, res, next) => {
    // A path with a file extension names a file (robots.txt, a stale chunk): a 404, never the app's HTML.
    if (/\.[^/]*$/.test(req.path) || !req.accepts('html') || !existsSync(index)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  app.use((_req, _res, next) => next(new NotFound('Nothing here')));
}
