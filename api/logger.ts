/** The server's pino logger, built from configuration. */
import { pino, type DestinationStream, type Logger } from 'pino';
import pretty from 'pino-pretty';
import type { AppConfig } from './config';

/**
 * Creates the logger: JSON lines (for log shippers) unless a person is watching — outside production, with
 * the output going to a terminal, lines are prettified (time, level, message) so `npm start` is readable.
 */
export function createLogger(config: Pick<AppConfig, 'logLevel' | 'env'>, out: NodeJS.WriteStream = process.stdout): Logger {
  const options = { level: config.logLevel, base: { app: 'loftline' } };
  if (config.env !== 'production' && out.isTTY) {
    const stream: DestinationStream = pretty({
      colorize: true,
      destination: out,
      translateTime: 'SYS:HH:MM:ss',
      ignore: 'pid,hostname,app',
    });
    return pino(options, stream);
  }
  return pino(options);
}
