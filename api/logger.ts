/** The server's pino logger, built from configuration. */
import { pino, type Logger } from 'pino';
import type { AppConfig } from './config';

/** Creates the logger (JSON lines to stdout). */
export function createLogger(config: Pick<AppConfig, 'logLevel'>): Logger {
  return pino({ level: config.logLevel, base: { app: 'loftline' } });
}
