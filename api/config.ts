/**
 * Environment, read once and validated at start-up. Nothing else in the server reads
 * `process.env`; the parsed `AppConfig` is passed in.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import * as z from 'zod';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4300),
  LOFTLINE_HOST: z.string().min(1).optional(),
  LOFTLINE_DB: z.string().min(1).default('data/loftline.db'),
  LOFTLINE_JWT_SECRET: z.string().min(32, { error: 'must be at least 32 characters' }).optional(),
  LOFTLINE_LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  LOFTLINE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  LOFTLINE_PUBLIC_URL: z.string().url().optional(),
  SMTP_URL: z.string().url({ error: 'must be an smtp:// or smtps:// URL' }).optional(),
  LOFTLINE_CLIENT_DIR: z.string().min(1).optional(),
  LOFTLINE_MAIL_FROM: z.string().min(3).default('Loftline <no-reply@loftline.invalid>'),
  WEATHER_URL: z
    .string()
    .url({ error: 'must be the weather service’s base URL, e.g. https://api.open-meteo.com, or "off"' })
    .or(z.literal('off'))
    .optional(),
  WEATHER_API_KEY: z.string().min(1).optional(),
  LOFTLINE_WEATHER_FAKE_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  LOFTLINE_TRUST_PROXY: z
    .string()
    .trim()
    .min(1)
    .refine((v) => trustProxyOf(v) !== undefined, {
      error: 'must be true, false, a number of proxy hops, or a comma-separated list of addresses/subnets (e.g. loopback, 10.0.0.0/8)',
    })
    .default('loopback'),
});

/** Express's named subnets and an IPv4/IPv6 address with an optional prefix length. */
const PROXY_ADDRESS = /^(loopback|linklocal|uniquelocal|[0-9a-f.:]+(\/\d{1,3})?)$/i;

/**
 * Reads `LOFTLINE_TRUST_PROXY` into Express's `trust proxy` setting: `true`/`false`, a hop count, or a list
 * of trusted proxy addresses. Undefined when the text is none of these.
 */
export function trustProxyOf(text: string): boolean | number | string[] | undefined {
  const v = text.trim().toLowerCase();
  if (v === 'true') return true;
  if (v === 'false') return false;
  if (/^\d{1,2}$/.test(v)) return Number(v);
  const list = v.split(',').map((p) => p.trim());
  return list.length > 0 && list.every((p) => PROXY_ADDRESS.test(p)) ? list : undefined;
}

/** The server's validated configuration. */
export interface AppConfig {
  env: 'development' | 'production' | 'test';
  port: number;
  /** Address to listen on (e.g. `127.0.0.1` for loopback only); all interfaces when absent. */
  host: string | null;
  dbPath: string;
  jwtSecret: string;
  logLevel: 'fatal' | 'error' | 'warn' | 'info' | 'debug' | 'trace' | 'silent';
  smtpPort: number;
  /** Real SMTP server; when absent a local fake server captures mail (development, tests, demo). */
  smtpUrl: string | null;
  mailFrom: string;
  publicUrl: string;
  /** Access tokens are short-lived: a stolen one is useful for minutes only. */
  accessTokenTtlS: number;
  /** Refresh tokens last 30 days so a phone stays signed in through weeks of training. */
  refreshTokenTtlS: number;
  /** A sign-in (refresh family) ends 90 days after it began, however often it was rotated. */
  refreshFamilyTtlS: number;
  /** bcrypt cost; ≥ 12 in production (OWASP password storage guidance), lower only in tests. */
  bcryptCost: number;
  /**
   * Failed sign-ins in a 15-minute window: per address (429 after), per account and address together (429
   * after), per account from anywhere (then slowed down, never locked).
   */
  loginFailuresPerIp: number;
  loginFailuresPerAccount: number;
  /** First sign-in delay once an account passes its free failures, ms; it doubles per failure up to the max. */
  loginSlowdownBaseMs: number;
  loginSlowdownMaxMs: number;
  /** Password-reset mails per account per hour; further requests answer the same and send nothing. */
  resetMailsPerAccountPerHour: number;
  /** Where the built Angular app lives. */
  clientDir: string;
  /**
   * Base URL of an Open-Meteo-compatible forecast API for session conditions. Null: the server starts
   * its local fake (outside production) or, with `WEATHER_URL=off` or in production, asks no service.
   */
  weatherUrl: string | null;
  /** Whether the weather service was switched off outright (`WEATHER_URL=off`). */
  weatherOff: boolean;
  /** API key for a keyed (commercial) service, sent as the `apikey` query parameter. */
  weatherApiKey: string | null;
  /** Loopback port of the local fake weather service (0 = any free port). */
  weatherFakePort: number;
  /**
   * Express's `trust proxy`: which hops in front of the server may set `X-Forwarded-For` (the client
   * address used by the sign-in throttles). Default `['loopback']`, a reverse proxy on the same machine;
   * behind a load balancer set its address or hop count, never `true` on a server reachable directly.
   */
  trustProxy: boolean | number | string[];
  /** How long the server waits for the service before answering "unavailable" (never blocks a session start). */
  weatherTimeoutMs: number;
  /** How long one answer is reused for the same ground. */
  weatherCacheTtlS: number;
}

/** Thrown when the environment is unusable; the message names the variable and the reason. */
export class ConfigError extends Error {}

/**
 * Parses the environment. In development a JWT secret is generated once and kept beside the
 * database (so tokens survive restarts); in production the server refuses to start without one.
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env, overrides: Partial<AppConfig> = {}): AppConfig {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new ConfigError(`Invalid environment:\n  ${lines.join('\n  ')}`);
  }
  const e = parsed.data;
  const dbPath = e.LOFTLINE_DB === ':memory:' ? e.LOFTLINE_DB : resolve(e.LOFTLINE_DB);
  let jwtSecret = e.LOFTLINE_JWT_SECRET;
  if (!jwtSecret) {
    if (e.NODE_ENV === 'production') {
      throw new ConfigError('LOFTLINE_JWT_SECRET is required in production (at least 32 characters).');
    }
    jwtSecret = devSecret(dbPath === ':memory:' ? resolve('data/loftline.db') : dbPath);
  }
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    host: e.LOFTLINE_HOST ?? null,
    dbPath,
    jwtSecret,
    logLevel: e.LOFTLINE_LOG_LEVEL,
    smtpPort: e.LOFTLINE_SMTP_PORT,
    smtpUrl: e.SMTP_URL ?? null,
    mailFrom: e.LOFTLINE_MAIL_FROM,
    publicUrl: e.LOFTLINE_PUBLIC_URL ?? `http://localhost:${e.PORT}`,
    accessTokenTtlS: 15 * 60,
    refreshTokenTtlS: 30 * 24 * 3600,
    refreshFamilyTtlS: 90 * 24 * 3600,
    bcryptCost: 12,
    loginFailuresPerIp: 50,
    loginFailuresPerAccount: 10,
    loginSlowdownBaseMs: 1000,
    loginSlowdownMaxMs: 30_000,
    resetMailsPerAccountPerHour: 3,
    clientDir: resolve(e.LOFTLINE_CLIENT_DIR ?? 'dist/loftline/browser'),
    weatherUrl: e.WEATHER_URL && e.WEATHER_URL !== 'off' ? e.WEATHER_URL.replace(/\/+$/, '') : null,
    weatherOff: e.WEATHER_URL === 'off',
    weatherApiKey: e.WEATHER_API_KEY ?? null,
    weatherFakePort: e.LOFTLINE_WEATHER_FAKE_PORT,
    trustProxy: trustProxyOf(e.LOFTLINE_TRUST_PROXY) ?? ['loopback'],
    weatherTimeoutMs: 2000,
    weatherCacheTtlS: 10 * 60,
    ...overrides,
  };
}

function devSecret(dbPath: string): string {
  const file = join(dirname(dbPath), 'jwt-secret.txt');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dirname(file), { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}
