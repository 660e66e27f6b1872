/**
 * Starts a real Loftline server process for end-to-end specs: a free port, a temp database
 * (migrated and loaded with the demo scenario at start-up), the production client build.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

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

/** Finds a free loopback port. */
export function freePort(): Promise<number> {
  return new Promise((done, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const address = s.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      s.close(() => done(port));
    });
  });
}

/** Starts the server; pass `dbPath`/`port` to restart on the same database and port, `env` for more settings (e.g. `WEATHER_URL`). */
export async function startE2eServer(options: { dbPath?: string; port?: number; env?: Record<string, string> } = {}): Promise<E2eServer> {
  const dir = options.dbPath ? null : mkdtempSync(join(tmpdir(), 'loftline-e2e-'));
  const dbPath = options.dbPath ?? join(dir!, 'e2e.db');
  const port = options.port ?? (await freePort());
  let output = '';
  const child = spawn(process.execPath, ['--import', 'tsx', resolve('api/cli/start.ts'), '--api-only'], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: String(port),
      LOFTLINE_DB: dbPath,
      LOFTLINE_SMTP_PORT: '0',
      LOFTLINE_LOG_LEVEL: 'warn',
      LOFTLINE_JWT_SECRET: 'e2e-secret-0123456789-0123456789-abcdef',
      ...options.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (c: Buffer) => (output += c.toString()));
  child.stderr?.on('data', (c: Buffer) => (output += c.toString()));
  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early (${child.exitCode}):\n${output}`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`server did not answer within 60 s:\n${output}`);
    await new Promise((r) => setTimeout(r, 150));
  }
  return {
    port,
    baseUrl,
    dbPath,
    process: child,
    log: () => output,
    stop: (signal: NodeJS.Signals = 'SIGTERM') =>
      new Promise<void>((done) => {
        if (child.exitCode !== null || child.signalCode !== null) return done();
        child.once('exit', () => done());
        child.kill(signal);
      }),
    cleanup: () => {
      if (dir) rmSync(dir, { recursive: true, force: true });
    },
  };
}
