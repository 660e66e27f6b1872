/**
 * The server's pino logger, built from configuration. Secrets never reach a log line: the
 * Authorization and Cookie headers are censored by pino's `redact`, and every URL written
 * (the request's `url`) has its token-bearing query parameters (invite, reset, unsubscribe
 * links) replaced, through the request serializer.
 */
import { pino, stdSerializers, type DestinationStream, type Logger } from 'pino';
import pretty from 'pino-pretty';
import type { AppConfig } from './config';

/** Query parameters that carry a secret (invite, reset and unsubscribe tokens, and any access token). */
const SECRET_PARAMS = /^(token|access_token|refresh_token|refreshtoken|accesstoken|code|key|apikey|api_key|secret|password)$/i;

/** Shown instead of a secret. */
export const REDACTED = '[redacted]';

/** A URL (path and query, or absolute) with every secret query parameter's value replaced. */
export function redactUrl(url: string): string {
  const q = url.indexOf('?');
  if (q < 0) return url;
  const hash = url.indexOf('#', q);
  const query = url.slice(q + 1, hash < 0 ? undefined : hash);
  const redacted = query
    .split('&')
    .map((pair) => {
      const eq = pair.indexOf('=');
      const rawName = eq < 0 ? pair : pair.slice(0, eq);
      let name = rawName;
      try {
        name = decodeURIComponent(rawName.replace(/\+/g, ' '));
      } catch {
        // A malformed escape: judge the raw name.
      }
      return SECRET_PARAMS.test(name.trim()) && eq >= 0 ? `${rawName}=${REDACTED}` : pair;
    })
    .join('&');
  return url.slice(0, q + 1) + redacted + (hash < 0 ? '' : url.slice(hash));
}

/** Paths censored wherever they appear in a log object (pino `redact`). */
const REDACT_PATHS = [
  'req.headers.authorization',
  'req.headers.cookie',
  'req.headers["x-refresh-token"]',
  'res.headers["set-cookie"]',
  'headers.authorization',
  'authorization',
  'refreshToken',
  'accessToken',
  'password',
  '*.refreshToken',
  '*.accessToken',
  '*.password',
];

/** Headers whose value is a secret. */
const SECRET_HEADERS = new Set(['authorization', 'cookie', 'proxy-authorization', 'x-refresh-token']);

/** The request as pino's standard serializer shapes it (the fields this module touches). */
interface SerializedReq {
  url?: unknown;
  query?: unknown;
  headers?: unknown;
}

/**
 * Censors a serialized request: its URL's secret query parameters, the parsed `query` object's,
 * and secret headers. Used by pino-http (which wraps it around its standard request serializer)
 * and by the logger itself, so whichever logger the app is given, tokens stay out.
 */
export function redactRequest<T extends SerializedReq>(req: T): T {
  const out: T = { ...req };
  if (typeof req.url === 'string') out.url = redactUrl(req.url);
  if (req.query && typeof req.query === 'object') {
    out.query = Object.fromEntries(Object.entries(req.query).map(([k, v]) => [k, SECRET_PARAMS.test(k) ? REDACTED : v]));
  }
  if (req.headers && typeof req.headers === 'object') {
    out.headers = Object.fromEntries(Object.entries(req.headers).map(([k, v]) => [k, SECRET_HEADERS.has(k.toLowerCase()) ? REDACTED : v]));
  }
  return out;
}

/**
 * Creates the logger: JSON lines (for log shippers, or to `destination` in tests) unless a person is
 * watching — outside production, with the output going to a terminal, lines are prettified (time, level,
 * message) so `npm start` is readable. Redaction applies either way.
 */
export function createLogger(
  config: Pick<AppConfig, 'logLevel'> & Partial<Pick<AppConfig, 'env'>>,
  destination?: DestinationStream,
): Logger {
  const options = {
    level: config.logLevel,
    base: { app: 'loftline' },
    redact: { paths: REDACT_PATHS, censor: REDACTED },
    serializers: { req: stdSerializers.wrapRequestSerializer(redactRequest) },
  };
  if (!destination && config.env !== undefined && config.env !== 'production' && process.stdout.isTTY) {
    const stream: DestinationStream = pretty({
      colorize: true,
      destination: process.stdout,
      translateTime: 'SYS:HH:MM:ss',
      ignore: 'pid,hostname,app',
    });
    return pino(options, stream);
  }
  return pino(options, destination ?? pino.destination(1));
}
