/**
 * A real Loftline API process for tests and benchmarks: `api/cli/start.ts --api-only` spawned with the
 * given settings, ready once it reports the port it listens on. Shared by the end-to-end
 * harness and `bench:api`, so both start the server exactly as `npm run start:api` does.
 */
import { spawn, type ChildProcess } from 'node:child_process';
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

/** Whether the spawned process stopped because its port was taken (the start-up message of `PortInUseError`). */
function portWasBusy(output: string): boolean {
  return /port \d+ is already in use/.test(output);
}

/**
 * Spawns the API with `env` added to this process's and resolves once it listens and answers. Without
 * `port` the server listens on port 0 and reports the port the system gave it over the IPC channel, so no
 * other process can take the port between choosing and listening. With `port` (a restart on the port a
 * browser already knows) a port still held by a dying process or briefly taken by an outgoing connection is
 * retried until `readyTimeoutMs`.
 */
export async function spawnApiServer(
  env: Record<string, string>,
  options: { port?: number; readyTimeoutMs: number },
): Promise<ServerProcess> {
  const deadline = Date.now() + options.readyTimeoutMs;
  for (;;) {
    const attempt = await spawnOnce(env, options.port ?? 0, deadline);
    if ('server' in attempt) return attempt.server;
    if (!portWasBusy(attempt.output) || Date.now() > deadline) {
      throw new Error(`server exited early (${attempt.exitCode}):\n${attempt.output}`);
    }
    await new Promise((r) => setTimeout(r, 250));
  }
}

type Attempt = { server: ServerProcess } | { exitCode: number | null; output: string };

function spawnOnce(env: Record<string, string>, port: number, deadline: number): Promise<Attempt> {
  let output = '';
  const child = spawn(process.execPath, ['--import', 'tsx', resolve('api/cli/start.ts'), '--api-only'], {
    env: { ...process.env, PORT: String(port), LOFTLINE_SMTP_PORT: '0', LOFTLINE_LOG_LEVEL: 'warn', ...env },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  child.stdout?.on('data', (c: Buffer) => (output += c.toString()));
  child.stderr?.on('data', (c: Buffer) => (output += c.toString()));
  const stop = (signal: NodeJS.Signals = 'SIGTERM'): Promise<void> =>
    new Promise<void>((done) => {
      if (child.exitCode !== null || child.signalCode !== null) return done();
      child.once('exit', () => done());
      child.kill(signal);
    });
  return new Promise<Attempt>((done, reject) => {
    const timer = setTimeout(
      () => {
        void stop('SIGKILL').then(() => reject(new Error(`server did not start within the time allowed:\n${output}`)));
      },
      Math.max(0, deadline - Date.now()),
    );
    child.once('exit', (code) => {
      clearTimeout(timer);
      // Let the last of its output arrive before reading it.
      setImmediate(() => done({ exitCode: code, output }));
    });
    child.on('message', (message: unknown) => {
      const m = message as { loftline?: string; port?: number };
      if (m.loftline !== 'listening' || typeof m.port !== 'number') return;
      clearTimeout(timer);
      child.removeAllListeners('exit');
      // The IPC channel was only for this one message; it must not keep this process alive.
      child.disconnect();
      const actual = m.port;
      done({
        server: {
          port: actual,
          baseUrl: `http://127.0.0.1:${actual}`,
          process: child,
          log: () => output,
          stop,
        },
      });
    });
  });
}
