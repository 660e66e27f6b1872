/**
 * Starts a real Loftline server process for end-to-end specs: a port the system picks, a temp database
 * (migrated and loaded with the demo scenario at start-up), the production client build.
 */
import type { ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { spawnApiServer } from '../../support/server-process';

/** A server process under test. */
export interface E2eServer {
  port: number;
  baseUrl: string;
  dbPath: string;
  process: ChildProcess;
  /** Output so far, for diagnosing a failed spec. */
  log(): string;
  /** Stops the process (SIGTERM by default; SIGKILL to simulate a crash). */
  stop(signal?: NodeJS.Signals): Promise<void>;
  /** Removes the temp folder. */
  cleanup(): void;
}

/** Starts the server; pass `dbPath`/`port` to restart on the same database and port, `env` for more settings (e.g. `WEATHER_URL`). */
export async function startE2eServer(options: { dbPath?: string; port?: number; env?: Record<string, string> } = {}): Promise<E2eServer> {
  const dir = options.dbPath ? null : mkdtempSync(join(tmpdir(), 'loftline-e2e-'));
  const dbPath = options.dbPath ?? join(dir!, 'e2e.db');
  const server = await spawnApiServer(
    { NODE_ENV: 'test', LOFTLINE_DB: dbPath, LOFTLINE_JWT_SECRET: 'e2e-secret-0123456789-0123456789-abcdef', ...options.env },
    { ...(options.port === undefined ? {} : { port: options.port }), readyTimeoutMs: 60_000 },
  );
  return {
    ...server,
    dbPath,
    cleanup: () => {
      if (dir) rmSync(dir, { recursive: true, force: true });
    },
  };
}

/**
 * Starts one server (fresh temporary database) before a spec file's tests and stops it and removes
 * its files after them; `keep` receives it, so tests read `server.baseUrl` as before.
 */
export function useE2eServer(keep: (server: E2eServer) => void): void {
  let started: E2eServer | null = null;
  beforeAll(async () => {
    started = await startE2eServer();
    keep(started);
  }, 90_000);
  afterAll(async () => {
    await started?.stop();
    started?.cleanup();
  });
}
