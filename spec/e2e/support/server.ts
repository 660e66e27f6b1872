/**
 * Starts a real Loftline server process for end-to-end specs: a port the system picks, a temp database
 * (migrated and loaded with the demo scenario at start-up), the production client build.
 */
import type { ChildProcess } from 'node:child_process';
import { copyFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ProfileCache } from '../../../api/analysis/profile-cache';
import type { Technique } from '../../../shared/vocabulary';
import { buildDemoTemplate } from '../../support/demo-template';
import { spawnApiServer } from '../../support/server-process';

let templatePath: string | null = null;

/**
 * A database file with the demo loaded exactly as an empty server would load it (`seedDemo` with its
 * defaults), and every player × technique profile fitted as the server's background refresher would fit
 * it, built once per run. Generating the demo flies every repetition through the flight model, and each
 * server would otherwise spend minutes of both cores refitting the same profiles while its specs run: the
 * server finds the copy non-empty and up to date, and loads and refits nothing. (The refresher itself is
 * covered by the Node specs of the profile cache.)
 */
export function demoTemplate(): string {
  templatePath ??= buildDemoTemplate('e2e', {}, (db) => {
    const cache = new ProfileCache(db);
    const pairs = db.$client.prepare('SELECT DISTINCT player_id AS playerId, technique FROM kicks').all() as {
      playerId: string;
      technique: Technique;
    }[];
    for (const { playerId, technique } of pairs) if (cache.isStale(playerId, technique)) cache.compute(playerId, technique);
  });
  return templatePath;
}

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
export async function startE2eServer(
  options: {
    dbPath?: string;
    port?: number;
    env?: Record<string, string>;
    /** Whether the server starts on an empty database and loads the demo itself (no template, no fitted profiles). */
    seedOnStart?: boolean;
  } = {},
): Promise<E2eServer> {
  const dir = options.dbPath ? null : mkdtempSync(join(tmpdir(), 'loftline-e2e-'));
  const dbPath = options.dbPath ?? join(dir!, 'e2e.db');
  if (!options.dbPath && !options.seedOnStart) copyFileSync(demoTemplate(), dbPath);
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
