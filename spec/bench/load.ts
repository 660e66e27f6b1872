/**
 * Load-test plumbing for `npm run bench:api`: the server as its own process on loopback, and
 * autocannon phases whose every response time is kept, so percentiles are exact rather than
 * read off autocannon's fixed buckets (it has no p95).
 */
import autocannon from 'autocannon';
import { spawnApiServer, type ServerProcess } from '../support/server-process';

/** Starts `api/cli/start.ts --api-only` (what `npm run start:api` runs) on 127.0.0.1 with this database. */
export function startBenchServer(dbPath: string, jwtSecret: string): Promise<ServerProcess> {
  return spawnApiServer(
    { NODE_ENV: 'production', LOFTLINE_HOST: '127.0.0.1', LOFTLINE_DB: dbPath, LOFTLINE_JWT_SECRET: jwtSecret },
    { readyTimeoutMs: 180_000 },
  );
}

/** Exact percentile (nearest rank) of a sample. */
export function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}

/** What one phase measured. */
export interface PhaseResult {
  label: string;
  requests: number;
  non2xx: number;
  errors: number;
  timeouts: number;
  seconds: number;
  perSecond: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
}

/** One autocannon phase: a request builder per call and a response check per answer. */
export interface PhaseOptions {
  label: string;
  url: string;
  connections: number;
  durationS: number;
  /**
   * Requests per second over all connections (absent: as fast as answers come back). Paced as that many
   * autocannon streams of one request a second each, their starts spread evenly over the first second:
   * one instance with `overallRate` sends each second's requests together at the top of the second (it
   * resets a per-connection count every second), so its latencies would be the queue of a burst.
   */
  overallRate?: number;
  method?: 'GET' | 'POST';
  headers: Record<string, string>;
  /** Path and body of the next request on a connection; `context` is that connection's own. */
  next(context: Record<string, unknown>): { path: string; body?: string };
  /** Called with each answer and the connection's context (which still holds what `next` put there). */
  answered?(status: number, body: string, context: Record<string, unknown>): void;
}

/** Runs a phase with autocannon from this process (the server is another process). */
export async function runPhase(o: PhaseOptions): Promise<PhaseResult> {
  const times: number[] = [];
  const streams = o.overallRate ? Math.max(1, Math.round(o.overallRate)) : 1;
  const runs: Promise<autocannon.Result>[] = [];
  for (let i = 0; i < streams; i++) {
    const delayMs = o.overallRate ? (1000 * i) / streams : 0;
    runs.push(
      new Promise((ok) => setTimeout(ok, delayMs)).then(() =>
        runStream(o, o.overallRate ? 1 : o.connections, o.overallRate ? 1 : undefined, times),
      ),
    );
  }
  const results = await Promise.all(runs);
  const result = {
    duration: Math.max(...results.map((r) => r.duration)),
    non2xx: results.reduce((a, r) => a + r.non2xx, 0),
    errors: results.reduce((a, r) => a + r.errors, 0),
    timeouts: results.reduce((a, r) => a + r.timeouts, 0),
  };
  times.sort((a, b) => a - b);
  const seconds = result.duration;
  return {
    label: o.label,
    requests: times.length,
    non2xx: result.non2xx,
    errors: result.errors,
    timeouts: result.timeouts,
    seconds,
    perSecond: times.length / seconds,
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    p99: percentile(times, 99),
    max: times.at(-1) ?? NaN,
  };
}

/** One autocannon instance of a phase; every answer's latency goes into `times`. */
function runStream(o: PhaseOptions, connections: number, rate: number | undefined, times: number[]): Promise<autocannon.Result> {
  let finish: (r: autocannon.Result) => void = () => undefined;
  let fail: (e: Error) => void = () => undefined;
  const done = new Promise<autocannon.Result>((ok, bad) => {
    finish = ok;
    fail = bad;
  });
  const instance = autocannon(
    {
      url: o.url,
      connections,
      duration: o.durationS,
      ...(rate ? { overallRate: rate } : {}),
      timeout: 30,
      requests: [
        {
          method: o.method ?? 'GET',
          headers: o.headers,
          setupRequest: (req, context) => {
            const { path, body } = o.next(context as Record<string, unknown>);
            return { ...req, path, ...(body === undefined ? {} : { body }) };
          },
          onResponse: (status, body, context) => o.answered?.(status, body, context as Record<string, unknown>),
        },
      ],
    },
    (err, result) => (err ? fail(err) : finish(result)),
  );
  // autocannon emits (client, statusCode, resBytes, responseTime in ms) for every answer.
  (instance as NodeJS.EventEmitter).on('response', (...args: unknown[]) => {
    const ms = args[3];
    if (typeof ms === 'number') times.push(ms);
  });
  return done;
}
