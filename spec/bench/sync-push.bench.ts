/**
 * Server time for one full push (500 mutations: a new session plus 499 kicks) on this machine.
 *
 * A real app on a temp SQLite file with the demo scenario (WAL, foreign keys), listening on a
 * loopback port; each round signs nothing new but pushes fresh ids, so every mutation is applied
 * (not a duplicate). Prints, over ROUNDS rounds after one warm-up: the median, min and max of the
 * wall time of `POST /api/sync/push` as the client sees it (JSON encode/parse, auth, zod, the one
 * transaction), and of the same batch replayed (all `duplicate`), which is the retry after a lost
 * answer. Target: a 500-mutation push well under a second, so a phone's catch-up after a day
 * offline is one short wait per batch.
 */
import { randomUUID } from 'node:crypto';
import { kickUpsert, sessionUpsert } from '../api/mutations';
import type { AddressInfo } from 'node:net';
import { and, eq, isNull } from 'drizzle-orm';
import { players } from '../../api/db/schema';
import { DEMO_ACCOUNTS, DEMO_SQUAD_IDS } from '../../seed/scenario';
import type { PushResponse } from '../../shared/schemas/sync';
import { createTestApp, signIn } from '../api/fixture';

const ROUNDS = 9;
const BATCH = 500;

function batch(playerIds: string[]): unknown[] {
  const sessionId = randomUUID();
  const mutations: unknown[] = [
    sessionUpsert(sessionId, DEMO_SQUAD_IDS.u16, new Date().toISOString(), { temperatureC: 11, windSpeedMs: 3, windFromDeg: 0 }),
  ];
  for (let i = 1; i < BATCH; i++) {
    mutations.push(
      kickUpsert(sessionId, playerIds[i % playerIds.length]!, {
        backspinStep: (i % 7) - 3,
        sidespinStep: (i % 5) - 2,
        carryM: i % 3 === 0 ? 33.5 : null,
        recordedAt: new Date(Date.now() + i).toISOString(),
      }),
    );
  }
  return mutations;
}

function stats(ms: number[]): string {
  const sorted = [...ms].sort((a, b) => a - b);
  return `median ${sorted[Math.floor(sorted.length / 2)].toFixed(1)} ms (min ${sorted[0].toFixed(1)}, max ${sorted.at(-1)!.toFixed(1)})`;
}

async function main(): Promise<void> {
  const t = createTestApp();
  const server = t.app.listen(0, '127.0.0.1');
  await new Promise<void>((done) => server.once('listening', () => done()));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  try {
    const { accessToken } = await signIn(t.app, DEMO_ACCOUNTS.assistant_coach);
    const squad = t.db
      .select({ id: players.id })
      .from(players)
      .where(and(eq(players.squadId, DEMO_SQUAD_IDS.u16), isNull(players.deletedAt)))
      .all();
    const ids = squad.map((p) => p.id);
    const push = async (mutations: unknown[]): Promise<{ ms: number; body: PushResponse }> => {
      const body = JSON.stringify({ deviceId: 'bench-phone', mutations });
      const started = performance.now();
      const res = await fetch(`${base}/api/sync/push`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${accessToken}` },
        body,
      });
      const answer = (await res.json()) as PushResponse;
      const ms = performance.now() - started;
      if (res.status !== 200) throw new Error(`push answered ${res.status}: ${JSON.stringify(answer)}`);
      return { ms, body: answer };
    };

    await push(batch(ids)); // warm-up: JIT, statement cache
    const fresh: number[] = [];
    const replay: number[] = [];
    for (let round = 0; round < ROUNDS; round++) {
      const mutations = batch(ids);
      const first = await push(mutations);
      const applied = first.body.results.filter((r) => r.status === 'applied').length;
      if (applied !== BATCH) throw new Error(`expected ${BATCH} applied, got ${applied}`);
      fresh.push(first.ms);
      const again = await push(mutations);
      if (again.body.results.some((r) => r.status !== 'duplicate')) throw new Error('a replay was applied twice');
      replay.push(again.ms);
    }
    console.log(`POST /api/sync/push, ${BATCH} new mutations (1 session + ${BATCH - 1} kicks): ${stats(fresh)}`);
    console.log(`POST /api/sync/push, the same ${BATCH} replayed (all duplicate):          ${stats(replay)}`);
  } finally {
    server.close();
    t.close();
  }
}

await main();
