import { randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import { kickUpsert, sessionUpsert } from './mutations';
import request from 'supertest';
import { kicks, players, trainingSessions } from '../../api/db/schema';
import { DEMO_ACCOUNTS, DEMO_SQUAD_IDS } from '../../seed/scenario';
import type { MutationResult, PullResponse, PushResponse, SyncChange } from '../../shared/schemas/sync';
import { createTestApp, signIn, type TestApp } from './fixture';

describe('sync push and pull', () => {
  let t: TestApp;
  let token: string;

  const playerOf = (squadId: string) =>
    t.db
      .select()
      .from(players)
      .where(and(eq(players.squadId, squadId), isNull(players.deletedAt)))
      .all();

  function sessionMutation(id = randomUUID(), squadId = DEMO_SQUAD_IDS.u16) {
    return sessionUpsert(id, squadId, '2026-11-20T18:30:00Z', { temperatureC: 9, windSpeedMs: 3, windFromDeg: 0 });
  }
  const kickMutation = kickUpsert;
  async function pushAs(tok: string, mutations: unknown[]) {
    return request(t.app).post('/api/sync/push').set('Authorization', `Bearer ${tok}`).send({ deviceId: 'phone-1', mutations });
  }
  const statuses = (res: request.Response) => (res.body as PushResponse).results.map((r: MutationResult) => r.status);
  const kickCount = (sessionId: string) => t.db.select().from(kicks).where(eq(kicks.sessionId, sessionId)).all().length;

  beforeAll(async () => {
    t = createTestApp();
    token = (await signIn(t.app, DEMO_ACCOUNTS.assistant_coach)).accessToken;
  });
  afterAll(() => t.close());

  it('applies new rows and acknowledges a replayed mutation as duplicate without a second row', async () => {
    const s = sessionMutation();
    const k = kickMutation(s.data.id, playerOf(DEMO_SQUAD_IDS.u16)[0].id);
    const first = await pushAs(token, [s, k]);
    expect(first.status).toBe(200);
    expect(statuses(first)).toEqual(['applied', 'applied']);
    const again = await pushAs(token, [s, k]);
    expect(statuses(again)).toEqual(['duplicate', 'duplicate']);
    expect(kickCount(s.data.id)).toBe(1);
    const row = t.db.select().from(kicks).where(eq(kicks.id, k.data.id)).get()!;
    expect(row.version).toBe(1);
    expect(row.recordedAt).toBe('2026-11-20T18:41:12.345Z');
  });

  it('answers conflict with the server row when the base version is stale', async () => {
    const s = sessionMutation();
    const pid = playerOf(DEMO_SQUAD_IDS.u16)[1].id;
    const k = kickMutation(s.data.id, pid);
    await pushAs(token, [s, k]);
    const edit1 = { ...k, id: randomUUID(), data: { ...k.data, outcome: 'short', carryM: 31 }, baseVersion: 1 };
    expect(statuses(await pushAs(token, [edit1]))).toEqual(['applied']);
    const edit2 = { ...k, id: randomUUID(), data: { ...k.data, outcome: 'long' }, baseVersion: 1 };
    const res = await pushAs(token, [edit2]);
    const result = (res.body as PushResponse).results[0];
    expect(result.status).toBe('conflict');
    expect(result.current?.['outcome']).toBe('short');
    expect(result.current?.version).toBe(2);
    expect(t.db.select().from(kicks).where(eq(kicks.id, k.data.id)).get()!.outcome).toBe('short');
    // An upsert of an existing row without a base version is a conflict too (never a silent overwrite).
    const blind = { ...k, id: randomUUID(), data: { ...k.data, outcome: 'over' } };
    expect(statuses(await pushAs(token, [blind]))).toEqual(['conflict']);
  });

  it('rejects invalid data with the field and still applies the rest of the batch', async () => {
    const s = sessionMutation();
    const pid = playerOf(DEMO_SQUAD_IDS.u16)[2].id;
    const good = kickMutation(s.data.id, pid);
    const bad = kickMutation(s.data.id, pid, { outcome: 'wide', backspinStep: 7 });
    const res = await pushAs(token, [s, bad, good]);
    expect(statuses(res)).toEqual(['applied', 'rejected', 'applied']);
    const rejected = (res.body as PushResponse).results[1];
    expect(rejected.error?.code).toBe('invalid');
    expect(rejected.error?.fields?.map((f) => f.field).sort()).toEqual(['data.backspinStep', 'data.outcome']);
    expect(kickCount(s.data.id)).toBe(1);
    // A rejected mutation was not recorded: the fixed version under the same id applies.
    const fixed = { ...bad, data: { ...bad.data, outcome: 'short', backspinStep: 1 } };
    expect(statuses(await pushAs(token, [fixed]))).toEqual(['applied']);
  });

  it('rejects with forbidden what lies outside the caller’s squads', async () => {
    // The assistant coach does not work with the first team.
    const s = sessionMutation(randomUUID(), DEMO_SQUAD_IDS.first);
    const res = await pushAs(token, [s]);
    expect(statuses(res)).toEqual(['rejected']);
    expect((res.body as PushResponse).results[0].error?.code).toBe('forbidden');
    expect(t.db.select().from(trainingSessions).where(eq(trainingSessions.id, s.data.id)).get()).toBeUndefined();
    // A kick into an existing first-team session is forbidden as well.
    const head = (await signIn(t.app, DEMO_ACCOUNTS.head_coach)).accessToken;
    expect(statuses(await pushAs(head, [s]))).toEqual(['applied']);
    const k = kickMutation(s.data.id, playerOf(DEMO_SQUAD_IDS.first)[0].id);
    const kr = await pushAs(token, [k]);
    expect((kr.body as PushResponse).results[0].error?.code).toBe('forbidden');
  });

  it('rejects a kick whose player is not on the session’s squad', async () => {
    const s = sessionMutation();
    const res = await pushAs(token, [s, kickMutation(s.data.id, playerOf(DEMO_SQUAD_IDS.u14)[0].id)]);
    expect(statuses(res)).toEqual(['applied', 'rejected']);
    expect((res.body as PushResponse).results[1].error?.fields?.[0].field).toBe('data.playerId');
  });

  it('refuses pushes from players and guardians', async () => {
    for (const email of [DEMO_ACCOUNTS.player, DEMO_ACCOUNTS.guardian]) {
      const tok = (await signIn(t.app, email)).accessToken;
      const res = await pushAs(tok, [sessionMutation()]);
      expect(res.status).toBe(403);
    }
  });

  it('refuses a push of more than 500 mutations with 400 naming mutations', async () => {
    const s = sessionMutation();
    const many = Array.from({ length: 501 }, () => kickMutation(s.data.id, playerOf(DEMO_SQUAD_IDS.u16)[0].id));
    const res = await pushAs(token, many);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].field).toBe('mutations');
    expect(kickCount(s.data.id)).toBe(0);
  });

  it('leaves exactly one row per kick when a batch is replayed three times in shuffled orders', async () => {
    const s = sessionMutation();
    const squad = playerOf(DEMO_SQUAD_IDS.u16);
    const batch = [s, ...Array.from({ length: 120 }, (_, i) => kickMutation(s.data.id, squad[i % squad.length].id))];
    let seed = 7;
    const shuffled = () =>
      [...batch].sort(() => {
        seed = (seed * 16807) % 2147483647;
        return seed / 2147483647 - 0.5;
      });
    const runs = [shuffled(), shuffled(), shuffled()];
    const r1 = await pushAs(token, runs[0]);
    expect(statuses(r1).every((x) => x === 'applied')).toBeTrue();
    for (const run of runs.slice(1)) expect(statuses(await pushAs(token, run)).every((x) => x === 'duplicate')).toBeTrue();
    expect(kickCount(s.data.id)).toBe(120);
  });

  it('pages through pull returning every change exactly once, tombstones included', async () => {
    const s = sessionMutation();
    const pid = playerOf(DEMO_SQUAD_IDS.u14)[0].id;
    const sU14 = sessionMutation(randomUUID(), DEMO_SQUAD_IDS.u14);
    const ks = Array.from({ length: 25 }, () => kickMutation(sU14.data.id, pid));
    await pushAs(token, [s, sU14, ...ks]);
    const del = { id: randomUUID(), entity: 'kick', op: 'delete', data: { id: ks[3].data.id }, baseVersion: 1 };
    expect(statuses(await pushAs(token, [del]))).toEqual(['applied']);

    const seen = new Map<string, SyncChange>();
    let cursor = 0;
    let pages = 0;
    const seqs: number[] = [];
    for (;;) {
      const res = await request(t.app).get(`/api/sync/pull?since=${cursor}&limit=997`).set('Authorization', `Bearer ${token}`);
      expect(res.status).toBe(200);
      const body = res.body as PullResponse;
      for (const c of body.changes) {
        const key = `${c.entity}:${c.data.id}`;
        expect(seen.has(key)).withContext(`seen twice: ${key}`).toBeFalse();
        seen.set(key, c);
        seqs.push(c.changeSeq);
      }
      cursor = body.cursor;
      pages++;
      if (!body.hasMore) break;
    }
    expect(pages).toBeGreaterThan(1);
    expect([...seqs].sort((a, b) => a - b)).toEqual(seqs);
    // Everything of the assistant's squads, and nothing of the first team.
    const visibleKicks = t.db
      .select({ id: kicks.id })
      .from(kicks)
      .innerJoin(trainingSessions, eq(trainingSessions.id, kicks.sessionId))
      .all()
      .filter((r) => r.id);
    const expectedIds = new Set(
      t.db
        .select({ id: kicks.id, squadId: trainingSessions.squadId })
        .from(kicks)
        .innerJoin(trainingSessions, eq(trainingSessions.id, kicks.sessionId))
        .all()
        .filter((r) => r.squadId !== DEMO_SQUAD_IDS.first)
        .map((r) => r.id),
    );
    expect(visibleKicks.length).toBeGreaterThan(expectedIds.size);
    const pulledKicks = [...seen.values()].filter((c) => c.entity === 'kick');
    expect(pulledKicks.length).toBe(expectedIds.size);
    expect(pulledKicks.every((c) => expectedIds.has(c.data.id))).toBeTrue();
    const tomb = seen.get(`kick:${ks[3].data.id}`)!;
    expect(tomb.data.deletedAt).toBeTruthy();
    expect(tomb.data.version).toBe(2);
    // Nothing new since the last cursor.
    const empty = await request(t.app).get(`/api/sync/pull?since=${cursor}`).set('Authorization', `Bearer ${token}`);
    expect(empty.body).toEqual({ changes: [], cursor, hasMore: false });
  });

  it('lets a player pull only their own kicks', async () => {
    const tok = (await signIn(t.app, DEMO_ACCOUNTS.player)).accessToken;
    const own = t.db
      .select()
      .from(players)
      .where(eq(players.userId, (await signIn(t.app, DEMO_ACCOUNTS.player)).user.id))
      .get()!;
    const res = await request(t.app).get('/api/sync/pull?since=0&limit=2000').set('Authorization', `Bearer ${tok}`);
    const body = res.body as PullResponse;
    const kickChanges = body.changes.filter((c) => c.entity === 'kick');
    expect(kickChanges.length).toBeGreaterThan(0);
    expect(kickChanges.every((c) => c.data['playerId'] === own.id)).toBeTrue();
  });

  describe('a new device: recent sessions first, history on demand', () => {
    type Device = Map<string, { version: number; deletedAt: unknown }>;
    const from = new Date(Date.parse('2026-11-18T12:00:00Z') - 14 * 86_400_000).toISOString();

    async function pullAll(query: string, since: number, land: (c: SyncChange) => void): Promise<number> {
      let cursor = since;
      for (;;) {
        const res = await request(t.app).get(`/api/sync/pull?since=${cursor}&limit=400${query}`).set('Authorization', `Bearer ${token}`);
        expect(res.status).withContext(query).toBe(200);
        const body = res.body as PullResponse;
        body.changes.forEach(land);
        cursor = body.cursor;
        if (!body.hasMore) return cursor;
      }
    }
    const put = (device: Device) => (c: SyncChange) =>
      device.set(`${c.entity}:${c.data.id}`, { version: c.data.version, deletedAt: c.data.deletedAt });
    // The device keeps a copy it has: it came from a later pull, so it is as new or newer.
    const putIfAbsent = (device: Device) => (c: SyncChange) => {
      if (!device.has(`${c.entity}:${c.data.id}`)) put(device)(c);
    };

    it('brings only sessions from the date on, and closes on the club’s latest change', async () => {
      const seen: SyncChange[] = [];
      const cursor = await pullAll(`&part=recent&from=${from}`, 0, (c) => seen.push(c));
      const sessionIds = new Set(seen.filter((c) => c.entity === 'training_session').map((c) => c.data.id));
      expect(sessionIds.size).toBeGreaterThan(0);
      for (const c of seen.filter((x) => x.entity === 'training_session')) expect(String(c.data['startedAt']) >= from).toBeTrue();
      for (const c of seen.filter((x) => x.entity !== 'training_session')) expect(sessionIds.has(String(c.data['sessionId']))).toBeTrue();
      const full: SyncChange[] = [];
      const fullCursor = await pullAll('', 0, (c) => full.push(c));
      expect(seen.length).toBeLessThan(full.length);
      // The club's latest change: at least the caller's own latest, and nothing is left after it.
      expect(cursor).toBeGreaterThanOrEqual(fullCursor);
      const after = await request(t.app).get(`/api/sync/pull?since=${cursor}`).set('Authorization', `Bearer ${token}`);
      expect((after.body as PullResponse).changes).toEqual([]);
    });

    it('ends up with every row a full pull gives, at its newest version, with changes made in between', async () => {
      const full: Device = new Map();
      const device: Device = new Map();
      const pid = playerOf(DEMO_SQUAD_IDS.u14)[0].id;
      // An older session (before `from`) with kicks, pushed before the device's first pull.
      const old = sessionMutation(randomUUID(), DEMO_SQUAD_IDS.u14);
      old.data.startedAt = '2026-10-01T17:00:00Z';
      const oldKicks = [kickMutation(old.data.id, pid), kickMutation(old.data.id, pid)];
      expect(statuses(await pushAs(token, [old, ...oldKicks]))).toEqual(['applied', 'applied', 'applied']);

      const upTo = await pullAll(`&part=recent&from=${from}`, 0, put(device));
      // Meanwhile another phone edits an old kick and logs a new session.
      const edit = { ...oldKicks[0], id: randomUUID(), baseVersion: 1, data: { ...oldKicks[0].data, outcome: 'short' } };
      const fresh = sessionMutation();
      expect(statuses(await pushAs(token, [edit, fresh]))).toEqual(['applied', 'applied']);
      await pullAll('', upTo, put(device));
      expect(device.has(`kick:${oldKicks[1].data.id}`))
        .withContext('old rows wait for the history')
        .toBeFalse();
      await pullAll(`&part=history&upTo=${upTo}`, 0, putIfAbsent(device));

      await pullAll('', 0, put(full));
      expect(device.size).toBe(full.size);
      for (const [key, row] of full) expect(device.get(key)).withContext(key).toEqual(row);
      expect(device.get(`kick:${oldKicks[0].data.id}`)?.version).toBe(2);
    });

    it('refuses a recent part without its date and a history without its cursor, naming the field', async () => {
      const recent = await request(t.app).get('/api/sync/pull?part=recent').set('Authorization', `Bearer ${token}`);
      expect(recent.status).toBe(400);
      expect(JSON.stringify(recent.body)).toContain('from');
      const history = await request(t.app).get('/api/sync/pull?part=history').set('Authorization', `Bearer ${token}`);
      expect(history.status).toBe(400);
      expect(JSON.stringify(history.body)).toContain('upTo');
    });
  });
});
