/**
 * A real Loftline API process for tests and benchmarks: `api/cli/start.ts --api-only` spawned on a
 * loopback port with the given settings, ready once `/api/health` answers. Shared by the end-to-end
 * harness and `bench:api`, so both start the server exactly as `npm run start:api` does.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { resolve } from 'node:path';

/** A spawned server process. */
export interface ServerProcess {
  port: number;
  baseUrl: string;
  process: ChildProcess;
  /** Output so far, for diagnosing a failure. */
  log(): string;
  /** Stops the process (SIGTERM by default; SIGKILL to simulate a crash). */
  stop(signal?: NodeJS.Signals): Promise<void>;
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

/** Spawns the API on `port` (a free one if absent) with `env` added to this process's, and waits until it answers. */
export async function spawnApiServer(
  env: Record<string, string>,
  options: { port?: number; readyTimeoutMs: number },
): Promise<ServerProcess> {
  const port = options.port ?? (await freePort());
  let output = '';
  const child = spawn(process.execPath, ['--import', 'tsx', resolve('api/cli/start.ts'), '--api-only'], {
    env: { ...process.env, PORT: String(port), LOFTLINE_SMTP_PORT: '0', LOFTLINE_LOG_LEVEL: 'warn', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (c: Buffer) => (output += c.toString()));
  child.stderr?.on('data', (c: Buffer) => (output += c.toString()));
  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + options.readyTimeoutMs;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early (${child.exitCode}):\n${output}`);
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`server did not answer within ${options.readyTimeoutMs / 1000} s:\n${output}`);
    await new Promise((r) => setTimeout(r, 150));
  }
  return {
    port,
    baseUrl,
    process: child,
    log: () => output,
    stop: (signal: NodeJS.Signals = 'SIGTERM') =>
      new Promise<void>((done) => {
        if (child.exitCode !== null || child.signalCode !== null) return done();
        child.once('exit', () => done());
        child.kill(signal);
      }),
  };
}
