/**
 * `npm run bench:api`: the server under load at a large academy's scale.
 *
 * Generates about 1,000,000 kicks (`-- --kicks=N` for fewer) into a temp database, starts the real
 * server (`api/cli/start.ts --api-only`) as a separate process on 127.0.0.1, and drives it with
 * autocannon from this process:
 *   1. sync push: 50 simulated devices, each pushing 500-kick batches (fresh mutation and kick ids
 *      every request) at a fixed offered rate (`--rate=` batches per second, default 11 = 5,500 kicks/s);
 *   2. sync pull: a device catching up, 500 changes a page;
 *   3. Squad week (`GET /api/squads/:id/week`) and 4. Player progress (`GET /api/players/:id/progress`);
 *      the query phases are offered `--query-rate=` requests per second (default 20) over 4 connections, so
 *      their latency is the answer time under steady use, not the queue of a closed loop.
 * Then it retries any batch that got no answer, replays a sample (all must be `duplicate`), stops the
 * server and checks in the database that every pushed kick is stored exactly once.
 *
 * Targets (on a 2-core machine): ≥ 5,000 kicks/s sustained push with p99 ≤ 250 ms per batch;
 * Squad week p95 ≤ 100 ms; zero lost or duplicated kicks. Bounded: each phase runs `--seconds=` (default
 * 20 for push, half that for the others); loopback only.
 */
import Database from 'better-sqlite3';
import bcrypt from 'bcryptjs';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openDatabase } from '../../api/db/client';
import { squadStaff, users } from '../../api/db/schema';
import { generateLargeAcademy } from '../../seed/large';
import type { PushResponse } from '../../shared/schemas/sync';
import { runPhase, startBenchServer, type PhaseResult } from './load';

const arg = (name: string, fallback: number): number => {
  const a = process.argv.find((x) => x.startsWith(`--${name}=`));
  return a ? Number(a.slice(name.length + 3)) : fallback;
};
const KICKS = arg('kicks', 1_000_000);
const DEVICES = 50;
const BATCH = 500;
const RATE = arg('rate', 11);
/** Offered rate of each query phase, requests per second over its 4 connections (a busy club's staff, and then some). */
const QUERY_RATE = arg('query-rate', 20);
const PUSH_S = arg('seconds', 20);
const QUERY_S = Math.max(5, Math.round(PUSH_S / 2));
const SECRET = 'bench-secret-0123456789-0123456789-abcdef';
const PASSWORD = 'bench-password-2026';

interface Batch {
  device: number;
  mutationIds: string[];
  kickIds: string[];
  body: string;
  answered: boolean;
}

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'loftline-bench-'));
  const dbPath = join(dir, 'bench.db');
  let server: Awaited<ReturnType<typeof startBenchServer>> | null = null;
  try {
    let t0 = performance.now();
    const db = openDatabase(dbPath);
    const academy = generateLargeAcademy(db, { kicks: KICKS });
    const hash = bcrypt.hashSync(PASSWORD, 12);
    const coachId = randomUUID();
    db.insert(users)
      .values({
        id: coachId,
        clubId: academy.clubId,
        email: 'coach@bench.test',
        displayName: 'Bench Coach',
        role: 'head_coach',
        passwordHash: hash,
      })
      .run();
    db.insert(squadStaff)
      .values(academy.squadIds.map((squadId) => ({ squadId, userId: coachId })))
      .run();
    db.$client.pragma('wal_checkpoint(TRUNCATE)');
    db.$client.close();
    console.log(
      `generated ${academy.kicks.toLocaleString('en-GB')} kicks, ${academy.sessions} sessions, ${academy.playerIds.length} players, ${academy.squadIds.length} squads in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );

    t0 = performance.now();
    server = await startBenchServer(dbPath, SECRET);
    const base = server.baseUrl;
    console.log(`server process ${server.process.pid} listening on ${base} after ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    const login = await fetch(`${base}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'coach@bench.test', password: PASSWORD }),
    });
    const token = ((await login.json()) as { accessToken: string }).accessToken;
    const auth = { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' };
    const pushNow = async (body: string): Promise<PushResponse> => {
      const res = await fetch(`${base}/api/sync/push`, { method: 'POST', headers: auth, body });
      if (res.status !== 200) throw new Error(`push answered ${res.status}: ${await res.text()}`);
      return (await res.json()) as PushResponse;
    };

    // Each device starts its own session on its squad (set-up, not measured).
    const sessions: string[] = [];
    for (let d = 0; d < DEVICES; d++) {
      const id = randomUUID();
      sessions.push(id);
      const squadId = academy.squadIds[d % academy.squadIds.length]!;
      await pushNow(
        JSON.stringify({
          deviceId: `bench-device-${d}`,
          mutations: [
            {
              id: randomUUID(),
              entity: 'training_session',
              op: 'upsert',
              data: { id, squadId, startedAt: '2026-11-30T18:00:00Z', ballSize: 5, windSpeedMs: 2, windFromDeg: 0 },
            },
          ],
        }),
      );
    }

    const batches: Batch[] = [];
    let nextDevice = 0;
    const seqOf = new Array<number>(DEVICES).fill(0);
    const makeBatch = (device: number): Batch => {
      const squad = device % academy.squadIds.length;
      const squadPlayers = academy.playerIds.slice(squad * 25, squad * 25 + 25);
      const mutationIds: string[] = [];
      const kickIds: string[] = [];
      const mutations = [];
      for (let i = 0; i < BATCH; i++) {
        const n = seqOf[device]!++;
        const id = randomUUID();
        const kickId = randomUUID();
        mutationIds.push(id);
        kickIds.push(kickId);
        mutations.push({
          id,
          entity: 'kick',
          op: 'upsert',
          data: {
            id: kickId,
            sessionId: sessions[device],
            playerId: squadPlayers[n % 25],
            technique: 'lofted',
            foot: 'right',
            backspinStep: (n % 7) - 3,
            sidespinStep: (n % 5) - 2,
            targetDistanceM: 30,
            targetRadiusM: 3,
            outcome: 'on_target',
            carryM: null,
            recordedAt: new Date(Date.UTC(2026, 10, 30, 18) + n * 1000).toISOString(),
          },
        });
      }
      const batch: Batch = {
        device,
        mutationIds,
        kickIds,
        body: JSON.stringify({ deviceId: `bench-device-${device}`, mutations }),
        answered: false,
      };
      batches.push(batch);
      return batch;
    };

    let notApplied = 0;
    const push = await runPhase({
      label: `sync push (${BATCH}-kick batches from ${DEVICES} devices, offered ${RATE}/s)`,
      url: base,
      connections: DEVICES,
      durationS: PUSH_S,
      overallRate: RATE,
      method: 'POST',
      headers: auth,
      next: (ctx) => {
        // Every batch comes from the next of the 50 devices, whichever stream carries it.
        const batch = makeBatch(nextDevice++ % DEVICES);
        ctx['batch'] = batch;
        return { path: '/api/sync/push', body: batch.body };
      },
      answered: (status, body, ctx) => {
        const batch = ctx['batch'] as Batch | undefined;
        if (!batch || status !== 200) return;
        batch.answered = true;
        notApplied += (JSON.parse(body) as PushResponse).results.filter((r) => r.status !== 'applied').length;
      },
    });
    const pushedKicks = batches.filter((b) => b.answered).length * BATCH;

    const squadStart = academy.lastWeekStart;
    /** A read phase at the offered query rate; `path(n)` is a connection's n-th request (n from 1). */
    const queryPhase = (label: string, path: (n: number) => string) =>
      runPhase({
        label: `${label}, offered ${QUERY_RATE}/s`,
        url: base,
        connections: 4,
        durationS: QUERY_S,
        overallRate: QUERY_RATE,
        headers: auth,
        next: (ctx) => {
          const n = ((ctx['n'] as number | undefined) ?? Math.floor(Math.random() * 1000)) + 1;
          ctx['n'] = n;
          return { path: path(n) };
        },
      });
    // Pages through the season from different starting points, as devices catching up would.
    const pull = await queryPhase(
      'sync pull (500 changes a page)',
      (n) => `/api/sync/pull?since=${(n * 7919) % Math.max(1, KICKS)}&limit=500`,
    );
    const week = await queryPhase(
      'Squad week (GET /api/squads/:id/week)',
      (n) => `/api/squads/${academy.squadIds[n % academy.squadIds.length]}/week?start=${squadStart}`,
    );
    const progress = await queryPhase(
      'Player progress (GET /api/players/:id/progress)',
      (n) => `/api/players/${academy.playerIds[n % academy.playerIds.length]}/progress`,
    );

    // Exactly once: retry every batch that got no answer, replay a sample of answered ones.
    const unanswered = batches.filter((b) => !b.answered);
    for (const b of unanswered) {
      const r = await pushNow(b.body);
      if (r.results.some((x) => x.status !== 'applied' && x.status !== 'duplicate')) throw new Error('a retried batch was not applied');
    }
    let replayedDuplicates = 0;
    const sample = batches.filter((b) => b.answered).slice(0, 5);
    for (const b of sample) replayedDuplicates += (await pushNow(b.body)).results.filter((x) => x.status === 'duplicate').length;
    await server.stop();
    server = null;

    const check = new Database(dbPath);
    check.exec('CREATE TEMP TABLE pushed (kick_id TEXT PRIMARY KEY, mutation_id TEXT NOT NULL)');
    const insert = check.prepare('INSERT INTO pushed VALUES (?, ?)');
    check.transaction(() => {
      for (const b of batches) b.kickIds.forEach((k, i) => insert.run(k, b.mutationIds[i]));
    })();
    const n = (sql: string) => (check.prepare(sql).get() as { n: number }).n;
    const generated = batches.length * BATCH;
    const stored = n('SELECT COUNT(*) AS n FROM pushed p JOIN kicks k ON k.id = p.kick_id');
    const lost = generated - stored;
    const onDevices = n("SELECT COUNT(*) AS n FROM kicks WHERE device_id LIKE 'bench-device-%'");
    const duplicated =
      onDevices -
      stored +
      n(
        "SELECT COUNT(*) AS n FROM (SELECT 1 FROM kicks WHERE device_id LIKE 'bench-device-%' GROUP BY session_id, recorded_at HAVING COUNT(*) > 1)",
      );
    const acknowledged = n('SELECT COUNT(*) AS n FROM pushed p JOIN applied_mutations a ON a.id = p.mutation_id');
    const integrity = check.pragma('integrity_check', { simple: true });
    check.close();

    const kicksPerS = pushedKicks / push.seconds;
    const row = (r: PhaseResult, unit: string, per: number) =>
      `${r.label.padEnd(62)} ${r.requests.toString().padStart(6)} ${(r.perSecond * per).toFixed(0).padStart(8)} ${unit.padEnd(8)} ${r.p50.toFixed(0).padStart(6)} ${r.p95.toFixed(0).padStart(6)} ${r.p99.toFixed(0).padStart(6)} ${r.max.toFixed(0).padStart(6)}  ${r.non2xx + r.errors}`;
    console.log('');
    console.log(
      `${'phase'.padEnd(62)} ${'reqs'.padStart(6)} ${'rate'.padStart(8)} ${''.padEnd(8)} ${'p50'.padStart(6)} ${'p95'.padStart(6)} ${'p99'.padStart(6)} ${'max'.padStart(6)}  errors  (latency in ms)`,
    );
    console.log(row(push, 'kicks/s', BATCH));
    console.log(row(pull, 'req/s', 1));
    console.log(row(week, 'req/s', 1));
    console.log(row(progress, 'req/s', 1));
    console.log('');
    console.log(
      `pushed ${generated.toLocaleString('en-GB')} kicks in ${batches.length} batches (${unanswered.length} retried after no answer); stored ${stored.toLocaleString('en-GB')}; applied_mutations ${acknowledged.toLocaleString('en-GB')}; not applied on first push ${notApplied}; sample replay ${replayedDuplicates}/${sample.length * BATCH} duplicate; integrity_check ${integrity}`,
    );
    const verdicts: [string, boolean][] = [
      [`push ≥ 5,000 kicks/s sustained (${kicksPerS.toFixed(0)} kicks/s)`, kicksPerS >= 5000],
      [`push p99 ≤ 250 ms per batch (${push.p99.toFixed(0)} ms)`, push.p99 <= 250],
      [`Squad week p95 ≤ 100 ms (${week.p95.toFixed(0)} ms)`, week.p95 <= 100],
      [`zero lost kicks (${lost})`, lost === 0],
      [
        `zero duplicated kicks (${duplicated})`,
        duplicated === 0 && acknowledged === generated && replayedDuplicates === sample.length * BATCH,
      ],
    ];
    for (const [what, ok] of verdicts) console.log(`${ok ? 'PASS' : 'FAIL'}  ${what}`);
    console.log(
      `(database: ${KICKS.toLocaleString('en-GB')} generated kicks; peak RSS of this load process ${(process.memoryUsage().rss / 1048576).toFixed(0)} MB)`,
    );
    if (verdicts.some(([, ok]) => !ok)) process.exitCode = 1;
  } finally {
    if (server) {
      console.error(server.log().slice(-4000));
      await server.stop();
    }
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
