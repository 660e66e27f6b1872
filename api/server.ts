/**
 * Starts Loftline: claims its port, opens and migrates the database, loads the demo scenario into an
 * empty one (never in production), starts the local fake mail and weather servers (outside production,
 * when no real ones are configured) and the background jobs, then serves.
 */
import { createServer, type RequestListener, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { isDatabaseEmpty, seedDemo } from '../seed/scenario';
import { backfillStillAirCarry, StillAirRefresher } from './analysis/still-air';
import { ProfileCache } from './analysis/profile-cache';
import { createApp } from './app';
import type { AppConfig } from './config';
import { openDatabase, type Db } from './db/client';
import { createLogger } from './logger';
import { scheduleDigests } from './digests/scheduler';
import { DigestJob } from './digests/digests.service';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp';
import { ImportRunner } from './imports/import-runner';
import { Mailer } from './mail/mailer';
import { startFakeWeather, type FakeWeather } from './weather/fake-weather';
import { OpenMeteoClient } from './weather/open-meteo-client';

/** How long an idle kept-alive connection stays open (common practice: above a load balancer's 60 s). */
export const KEEP_ALIVE_TIMEOUT_MS = 65_000;

/** A running Loftline server. */
export interface RunningServer {
  port: number;
  db: Db;
  smtp: FakeSmtp | null;
  /** The local fake weather service, when no real one is configured (outside production). */
  weather: FakeWeather | null;
  close(): Promise<void>;
}

/** Options for `startServer`. */
export interface StartOptions {
  /** Whether to load the demo scenario when the database is empty (default true; never in production). */
  seedIfEmpty?: boolean;
}

/** The port (or address and port) is taken by another process; the message is what the operator reads. */
export class PortInUseError extends Error {
  constructor(
    readonly port: number,
    host: string | null,
  ) {
    super(`port ${port} is already in use${host ? ` on ${host}` : ''}: stop the other process or set PORT to a free port`);
  }
}

/**
 * Claims the port before anything else happens: a second server started by mistake on a busy port says so
 * and stops without having touched the database. Requests that arrive while start-up continues wait for
 * the app (`attach`).
 */
async function listenFirst(config: AppConfig): Promise<{ server: Server; attach(app: RequestListener): void; fail(err: unknown): void }> {
  let deliver!: (app: RequestListener) => void;
  let refuse!: (err: unknown) => void;
  const ready = new Promise<RequestListener>((done, reject) => {
    deliver = done;
    refuse = reject;
  });
  // Only the server's own handler waits: a failed start-up closes the server and the process exits.
  ready.catch(() => undefined);
  const server = createServer((req, res) => {
    void ready.then(
      (app) => app(req, res),
      () => res.destroy(),
    );
  });
  await new Promise<void>((done, reject) => {
    server.once('error', (err: NodeJS.ErrnoException) =>
      reject(err.code === 'EADDRINUSE' ? new PortInUseError(config.port, config.host) : err),
    );
    if (config.host) server.listen(config.port, config.host, () => done());
    else server.listen(config.port, () => done());
  });
  return { server, attach: deliver, fail: refuse };
}

/**
 * Starts the whole server on `config.port`: listens first (see `listenFirst`), then opens the database and
 * starts the background work.
 */
export async function startServer(config: AppConfig, options: StartOptions = {}): Promise<RunningServer> {
  const { server, attach, fail } = await listenFirst(config);
  try {
    return await startOn(server, attach, config, options);
  } catch (err) {
    fail(err);
    await new Promise<void>((done) => server.close(() => done()));
    throw err;
  }
}

async function startOn(
  server: Server,
  attach: (app: RequestListener) => void,
  config: AppConfig,
  options: StartOptions,
): Promise<RunningServer> {
  const logger = createLogger(config);
  const db = openDatabase(config.dbPath);
  if (isDatabaseEmpty(db)) {
    // The demo's accounts share a published password: a production server never loads them.
    if (config.env === 'production') {
      logger.warn(
        'the database has no club yet: create the first club and its administrator with ' +
          'npm run club:create -- --name "<club>" --admin <e-mail> (it prints a one-time link to set a password)',
      );
    } else if (options.seedIfEmpty ?? true) {
      const summary = seedDemo(db);
      logger.info({ summary }, 'loaded the demo scenario into the empty database');
    }
  }
  const normalised = backfillStillAirCarry(db);
  if (normalised) logger.info({ kicks: normalised }, 'normalised logged carries to still air');
  const stillAir = new StillAirRefresher(db);
  stillAir.start();
  const profiles = new ProfileCache(db, config.dbPath);
  profiles.start();
  let smtp: FakeSmtp | null = null;
  if (!config.smtpUrl && config.env === 'production') {
    // Captured mail is readable in the app: a production server never captures; mail waits for SMTP_URL.
    const warning =
      'NO SMTP_URL IN PRODUCTION: no mail is sent. Invitations, password resets and digests wait in the outbox ' +
      '(mail_outbox) and go out once SMTP_URL names a mail server and the server restarts.';
    logger.error(warning);
    console.error(`\n*** ${warning} ***\n`);
  } else if (!config.smtpUrl) {
    try {
      smtp = await startFakeSmtp(db, config.smtpPort);
      logger.info(
        { port: smtp.port },
        'no SMTP_URL: a local fake SMTP server captures all mail on 127.0.0.1 (admins read it at /admin/mail)',
      );
    } catch (err) {
      logger.warn({ err }, 'the fake SMTP server could not start; mail stays queued in the outbox');
    }
  }
  const mailer = new Mailer(db, config.smtpUrl ?? smtp?.url ?? null, config.mailFrom);
  const digests = new DigestJob(db, mailer, config);
  const stopSchedule = scheduleDigests(db, digests, logger);
  const retry = setInterval(() => void mailer.flush().catch((err: unknown) => logger.error({ err }, 'mail flush failed')), 60_000);
  retry.unref();
  let fakeWeather: FakeWeather | null = null;
  if (!config.weatherUrl && !config.weatherOff && config.env !== 'production') {
    try {
      fakeWeather = await startFakeWeather(config.weatherFakePort);
      logger.info(
        { url: fakeWeather.url },
        'no WEATHER_URL: a local fake weather service answers session conditions (deterministic per coordinate)',
      );
    } catch (err) {
      logger.warn({ err }, 'the fake weather service could not start; Pitchside keeps the coach’s taps');
    }
  }
  const weatherUrl = config.weatherUrl ?? fakeWeather?.url ?? null;
  const weather = weatherUrl ? new OpenMeteoClient(weatherUrl, { apiKey: config.weatherApiKey, timeoutMs: config.weatherTimeoutMs }) : null;
  const imports = new ImportRunner(db, config.dbPath);
  const app = createApp({ db, config, logger, profiles, mailer, digests, devMail: smtp !== null, weather, imports });
  attach(app);
  // Keep idle connections longer than a load balancer's usual 60 s idle timeout, and longer than any event-loop
  // stall (a write waiting out SQLite's 5 s busy timeout): at Node's default of 5 s such a stall makes the server
  // close kept-alive sockets that already carry the next request, and the client sees a reset instead of an answer.
  server.keepAliveTimeout = KEEP_ALIVE_TIMEOUT_MS;
  server.headersTimeout = KEEP_ALIVE_TIMEOUT_MS + 1000;
  const port = (server.address() as AddressInfo).port;
  logger.info({ port, db: config.dbPath }, `Loftline listening on http://localhost:${port}`);
  return {
    port,
    db,
    smtp,
    weather: fakeWeather,
    close: async () => {
      profiles.stop();
      stillAir.stop();
      stopSchedule();
      clearInterval(retry);
      mailer.close();
      await new Promise<void>((done) => server.close(() => done()));
      await imports.close();
      await smtp?.close();
      await fakeWeather?.close();
      db.$client.close();
    },
  };
}
