/**
 * `npm run bench:api`: the aggregate queries at a large academy's scale. Generates about
 * 1,000,000 kicks into a temp database (or `--kicks=N`), then times, through the real HTTP
 * stack (supertest, no network), `GET /api/squads/:id/week` and `GET /api/players/:id/progress`,
 * and a 500-mutation sync push. Targets (issue 5): week ≤ 100 ms, progress ≤ 50 ms.
 */
import bcrypt from 'bcryptjs';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pino } from 'pino';
import request from 'supertest';
import { createApp } from '../../api/app';
import { loadConfig } from '../../api/config';
import { openDatabase } from '../../api/db/client';
import { squadStaff, users } from '../../api/db/schema';
import { generateLargeAcademy } from '../../seed/large';

const kicksArg = process.argv.find((a) => a.startsWith('--kicks='));
const KICKS = kicksArg ? Number(kicksArg.slice('--kicks='.length)) : 1_000_000;
const ROUNDS = 25;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

async function timeIt(label: string, run: () => Promise<unknown>, rounds = ROUNDS): Promise<number> {
  await run(); // warm the page cache and the statement cache
  const ms: number[] = [];
  for (let i = 0; i < rounds; i++) {
    const t0 = performance.now();
    await run();
    ms.push(performance.now() - t0);
  }
  const m = median(ms);
  console.log(`${label.padEnd(44)} median ${m.toFixed(1)} ms   min ${Math.min(...ms).toFixed(1)} ms   max ${Math.max(...ms).toFixed(1)} ms`);
  return m;
}

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'loftline-bench-'));
  try {
    const config = loadConfig(
      { NODE_ENV: 'test', LOFTLINE_DB: join(dir, 'bench.db'), LOFTLINE_JWT_SECRET: 'bench-secret-0123456789-0123456789-abcdef', LOFTLINE_LOG_LEVEL: 'silent' },
      { bcryptCost: 4, clientDir: join(dir, 'none'), loginFailuresPerIp: 1e6 },
    );
    const db = openDatabase(config.dbPath);
    let t0 = performance.now();
    const academy = generateLargeAcademy(db, { kicks: KICKS });
    console.log(`generated ${academy.kicks.toLocaleString('en-GB')} kicks in ${academy.sessions} sessions, ${academy.playerIds.length} players, ${academy.squadIds.length} squads in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    const adminId = randomUUID();
    const coachId = randomUUID();
    const hash = bcrypt.hashSync('bench-password', 4);
    db.insert(users).values([
      { id: adminId, clubId: academy.clubId, email: 'admin@bench.test', displayName: 'Bench Admin', role: 'admin', passwordHash: hash },
      { id: coachId, clubId: academy.clubId, email: 'coach@bench.test', displayName: 'Bench Coach', role: 'assistant_coach', passwordHash: hash },
    ]).run();
    db.insert(squadStaff).values({ squadId: academy.squadIds[0]!, userId: coachId }).run();
    const app = createApp({ db, config, logger: pino({ level: 'silent' }) });
    const login = async (email: string) => (await request(app).post('/api/auth/login').send({ email, password: 'bench-password' })).body.accessToken as string;
    const admin = await login('admin@bench.test');
    const coach = await login('coach@bench.test');
    const squad = academy.squadIds[3]!;
    const player = academy.playerIds[40]!;
    const check = await request(app).get(`/api/squads/${squad}/week?start=${academy.lastWeekStart}`).set('Authorization', `Bearer ${admin}`);
    const reps = (check.body.players as { reps: number }[]).reduce((a, p) => a + p.reps, 0);
    console.log(`squad week of ${academy.lastWeekStart}: ${check.body.players.length} players, ${reps} repetitions`);

    const week = await timeIt('GET /api/squads/:id/week', () =>
      request(app).get(`/api/squads/${squad}/week?start=${academy.lastWeekStart}`).set('Authorization', `Bearer ${admin}`).expect(200),
    );
    const weekStill = await timeIt('GET /api/squads/:id/week?carry=still-air', () =>
      request(app).get(`/api/squads/${squad}/week?start=${academy.lastWeekStart}&carry=still-air`).set('Authorization', `Bearer ${admin}`).expect(200),
    );
    const progress = await timeIt('GET /api/players/:id/progress (season)', () =>
      request(app).get(`/api/players/${player}/progress`).set('Authorization', `Bearer ${admin}`).expect(200),
    );
    const progressTech = await timeIt('GET /api/players/:id/progress?technique', () =>
      request(app).get(`/api/players/${player}/progress?technique=lofted`).set('Authorization', `Bearer ${admin}`).expect(200),
    );

    // A 500-mutation push: one new session and 499 kicks, each round a fresh batch.
    const squad0Players = academy.playerIds.slice(0, 25);
    const batch = () => {
      const sessionId = randomUUID();
      return [
        { id: randomUUID(), entity: 'training_session', op: 'upsert', data: { id: sessionId, squadId: academy.squadIds[0], startedAt: '2026-11-30T18:00:00Z', ballSize: 5, windSpeedMs: 3, windFromDeg: 0 } },
        ...Array.from({ length: 499 }, (_, i) => ({
          id: randomUUID(),
          entity: 'kick',
          op: 'upsert',
          data: { id: randomUUID(), sessionId, playerId: squad0Players[i % 25], technique: 'lofted', foot: 'right', backspinStep: 1, sidespinStep: 0, targetDistanceM: 30, targetRadiusM: 3, outcome: 'on_target', carryM: i % 3 === 0 ? 29.5 : null, recordedAt: '2026-11-30T18:10:00Z' },
        })),
      ];
    };
    const pushMs = await timeIt('POST /api/sync/push (500 mutations)', async () => {
      const res = await request(app).post('/api/sync/push').set('Authorization', `Bearer ${coach}`).send({ deviceId: 'bench', mutations: batch() });
      if (res.status !== 200 || res.body.results.some((r: { status: string }) => r.status !== 'applied')) throw new Error('push failed');
    }, 9);
    t0 = performance.now();
    const mem = process.memoryUsage();
    console.log(`peak RSS ${(mem.rss / 1048576).toFixed(0)} MB`);
    const verdict = (ms: number, target: number) => (ms <= target ? 'met' : 'MISSED');
    console.log(
      `targets: week ≤ 100 ms ${verdict(Math.max(week, weekStill), 100)}; progress ≤ 50 ms ${verdict(Math.max(progress, progressTech), 50)}; push of 500 = ${pushMs.toFixed(0)} ms`,
    );
    db.$client.close();
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

void main();
