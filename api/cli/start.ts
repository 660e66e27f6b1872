/**
 * `npm start` / `npm run start:api`: builds the client when its build is missing or older
 * than its sources (not with `--api-only`), then starts the server.
 */
import { ConfigError, loadConfig } from '../config';
import { PortInUseError, startServer } from '../server';
import { buildClient, clientBuildIsStale } from './client-build';

async function main(): Promise<void> {
  const apiOnly = process.argv.includes('--api-only');
  const config = loadConfig();
  if (!apiOnly && clientBuildIsStale()) buildClient();
  const server = await startServer(config);
  // A parent process (the test and benchmark harness) that started us with PORT=0 learns the real port here.
  process.send?.({ loftline: 'listening', port: server.port });
  const stop = (): void => {
    void server.close().then(() => process.exit(0));
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

main().catch((err: unknown) => {
  console.error(err instanceof ConfigError || err instanceof PortInUseError ? err.message : err);
  process.exit(1);
});
