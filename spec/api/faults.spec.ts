import Database from 'better-sqlite3';
import { randomUUID } from 'node:crypto';
import { kickUpsert, sessionUpsert } from './mutations';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_SQUAD_IDS } from '../../seed/scenario';
import type { PushResponse } from '../../shared/schemas/sync';
import { startE2eServer, type E2eServer } from '../e2e/support/server';

/**
 * Faults against a real server process (the one `npm run start:api` runs): SIGKILL in the middle
 * of a 500-mutation push and of an import commit, and a second connection holding SQLite's write
 * lock. Afterwards the database must pass its own checks and retries must apply exactly once.
 */
describe('faults: crashes and a locked database', () => {
  let server: E2eServer;
  let first: E2eServer;
  let token: string;
  let squad: { id: string; shirt: number }[];

  const read = <T>(fn: (db: Database.Database) => T): T => {
    const db = new Database(server.dbPath, { readonly: true });
    try {
      return fn(db);
    } finally {
      db.close();
    }
  };
  const count = (sql: string, ...params: unknown[]) => read((db) => (db.prepare(sql).get(...params) as { n: number }).n);

  /** SQLite documentation, PRAGMA integrity_check and PRAGMA foreign_key_check: "ok" and no rows on a sound file. */
  function expectSound(): void {
    const db = new Database(server.dbPath);
    try {
      expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
      expect(db.pragma('foreign_key_check')).toEqual([]);
    } finally {
      db.close();
    }
  }

  async function signIn(): Promise<string> {
    const res = await fetch(`${server.baseUrl}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: DEMO_ACCOUNTS.head_coach, password: DEMO_PASSWORD }),
    });
    return ((await res.json()) as { accessToken: string }).accessToken;
  }

  async function restart(): Promise<void> {
    server = await startE2eServer({ dbPath: server.dbPath, port: server.port });
    token = await signIn();
  }

  const push = (mutations: unknown[]) =>
    fetch(`${server.baseUrl}/api/sync/push`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${token}` },
      body: JSON.stringify({ deviceId: 'fault-phone', mutations }),
    });

  /** One new session and `kicks` kicks in it. */
  function batch(kicks: number): { sessionId: string; mutations: { id: string; data: { id: string } }[] } {
    const sessionId = randomUUID();
    const mutations = [
      sessionUpsert(sessionId, DEMO_SQUAD_IDS.u16, '2026-11-30T18:00:00Z'),
      ...Array.from({ length: kicks }, (_, i) =>
        kickUpsert(sessionId, squad[i % squad.length]!.id, {
          targetDistanceM: 30,
          outcome: 'short',
          carryM: null,
          recordedAt: new Date(Date.UTC(2026, 10, 30, 18, 0, i)).toISOString(),
        }),
      ),
    ];
    return { sessionId, mutations };
  }

  /**
   * Waits until the server holds SQLite's write lock (a non-blocking BEGIN IMMEDIATE from here
   * answers SQLITE_BUSY), i.e. it is inside its write transaction, then SIGKILLs it. Real timing,
   * no hook in the server. Returns whether the kill landed while the lock was held.
   */
  async function killDuringWrite(answered: () => boolean): Promise<boolean> {
    const probe = new Database(server.dbPath);
    probe.pragma('busy_timeout = 0');
    const deadline = Date.now() + 30_000;
    try {
      while (Date.now() < deadline && !answered()) {
        try {
          probe.exec('BEGIN IMMEDIATE');
          probe.exec('ROLLBACK');
        } catch (err) {
          if ((err as { code?: string }).code !== 'SQLITE_BUSY') throw err;
          await server.stop('SIGKILL');
          return true;
        }
        await new Promise((r) => setTimeout(r, 1));
      }
      await server.stop('SIGKILL');
      return false;
    } finally {
      probe.close();
    }
  }

  beforeAll(async () => {
    // A server that loads the demo itself: these specs need no fitted profiles, only the rows.
    server = await startE2eServer({ seedOnStart: true });
    first = server;
    token = await signIn();
    squad = read(
      (db) =>
        db
          .prepare('SELECT id, shirt_number AS shirt FROM players WHERE squad_id = ? AND deleted_at IS NULL AND shirt_number IS NOT NULL')
          .all(DEMO_SQUAD_IDS.u16) as { id: string; shirt: number }[],
    );
  }, 90_000);
  afterAll(async () => {
    await server.stop();
    first.cleanup(); // the temp folder belongs to the first start; restarts reuse it
  });

  it('survives SIGKILL during a 500-mutation push, and the retry applies it exactly once', async () => {
    const { sessionId, mutations } = batch(499);
    let answered = false;
    const inFlight = push(mutations).then(
      () => (answered = true),
      () => undefined, // the connection dies with the server
    );
    const midWrite = await killDuringWrite(() => answered);
    await inFlight;
    expectSound();
    const kicksAfterCrash = count('SELECT COUNT(*) AS n FROM kicks WHERE session_id = ?', sessionId);
    console.log(
      `push SIGKILL: ${midWrite ? 'inside the write transaction' : 'outside it'}, answered first: ${answered}, kicks after the crash: ${kicksAfterCrash}`,
    );
    // All or nothing: one transaction per batch (docs/design.md §5). Killed inside it, nothing of it survives.
    expect([0, 499]).toContain(kicksAfterCrash);
    if (midWrite && !answered) expect(kicksAfterCrash).toBe(0);
    await restart();
    const retry = await push(mutations);
    expect(retry.status).toBe(200);
    const statuses = ((await retry.json()) as PushResponse).results.map((r) => r.status);
    expect(statuses.every((s) => s === (kicksAfterCrash === 0 ? 'applied' : 'duplicate')))
      .withContext(statuses.join(','))
      .toBeTrue();
    const again = (await (await push(mutations)).json()) as PushResponse;
    expect(again.results.every((r) => r.status === 'duplicate')).toBeTrue();
    expect(count('SELECT COUNT(*) AS n FROM kicks WHERE session_id = ?', sessionId)).toBe(499);
    const ids = mutations.map((m) => m.id);
    expect(count(`SELECT COUNT(*) AS n FROM applied_mutations WHERE id IN (${ids.map(() => '?').join(',')})`, ...ids)).toBe(500);
    expectSound();
  }, 90_000);

  it('survives SIGKILL during an import commit, and the retried upload adds exactly its rows', async () => {
    const ROWS = 5_000;
    const lines = ['player,time,speed,carry'];
    for (let i = 0; i < ROWS; i++)
      lines.push(
        `${squad[i % squad.length]!.shirt},${new Date(Date.UTC(2026, 10, 2, 17, 0, 0) + i * 1000).toISOString().slice(0, 19).replace('T', ' ')},${(20 + (i % 10)).toFixed(1)},${(25 + (i % 15)).toFixed(1)}`,
      );
    const csv = lines.join('\n') + '\n';
    const mapping = {
      squadId: DEMO_SQUAD_IDS.u16,
      technique: 'driven',
      targetDistanceM: 30,
      targetRadiusM: 3,
      device: 'Fault radar',
      columns: { player: 'player', time: 'time', speed: 'speed', carry: 'carry' },
      units: { speed: 'm/s', spin: 'rev/s', distance: 'm' },
    };
    const upload = () => {
      const form = new FormData();
      form.append('mapping', JSON.stringify(mapping));
      form.append('file', new Blob([csv], { type: 'text/csv' }), 'radar-export.csv');
      return fetch(`${server.baseUrl}/api/imports/kicks`, { method: 'POST', headers: { Authorization: `Bearer ${token}` }, body: form });
    };
    const imported = () =>
      count(
        "SELECT COUNT(*) AS n FROM kicks WHERE device_id = 'import' AND technique = 'driven' AND recorded_at >= '2026-11-02' AND recorded_at < '2026-11-03'",
      );
    const uploadsCommitted = () => count("SELECT COUNT(*) AS n FROM uploads WHERE filename = 'radar-export.csv' AND status = 'committed'");
    expect(imported()).toBe(0);
    let answered = false;
    const inFlight = upload().then(
      () => (answered = true),
      () => undefined,
    );
    const midWrite = await killDuringWrite(() => answered);
    await inFlight;
    expectSound();
    const afterCrash = imported();
    console.log(
      `import SIGKILL: ${midWrite ? 'inside the commit transaction' : 'outside it'}, answered first: ${answered}, kicks after the crash: ${afterCrash}`,
    );
    expect([0, ROWS]).toContain(afterCrash);
    expect(uploadsCommitted()).toBe(afterCrash === 0 ? 0 : 1);
    if (midWrite && !answered) expect(afterCrash).toBe(0);
    await restart();
    const retry = await upload();
    const body = (await retry.json()) as { alreadyImported: boolean; summary: { kicksCreated: number } };
    expect(retry.status)
      .withContext(JSON.stringify(body))
      .toBe(afterCrash === 0 ? 201 : 200);
    if (afterCrash === 0) expect(body.summary.kicksCreated).toBe(ROWS);
    const replay = (await (await upload()).json()) as { alreadyImported: boolean };
    expect(replay.alreadyImported).toBeTrue();
    expect(imported()).toBe(ROWS);
    expect(uploadsCommitted()).toBe(1);
    expectSound();
  }, 120_000);

  describe('while a second connection holds the write lock', () => {
    let holder: Database.Database;
    beforeEach(() => {
      holder = new Database(server.dbPath);
      holder.exec('BEGIN IMMEDIATE');
      // The holder writes too, so a deferred transaction in the server would find its snapshot stale.
      holder.prepare("INSERT INTO audit_log (id, action, entity) VALUES (?, 'fault.lock', 'test')").run(randomUUID());
    });
    afterEach(() => {
      if (holder.inTransaction) holder.exec('ROLLBACK');
      holder.close();
    });

    it('a push waits for a short lock and then succeeds', async () => {
      const { sessionId, mutations } = batch(20);
      setTimeout(() => holder.exec('COMMIT'), 1000);
      const started = Date.now();
      const res = await push(mutations);
      const body = (await res.json()) as PushResponse;
      expect(res.status).withContext(JSON.stringify(body)).toBe(200);
      expect(Date.now() - started).toBeGreaterThanOrEqual(900);
      expect(body.results.every((r) => r.status === 'applied')).toBeTrue();
      expect(count('SELECT COUNT(*) AS n FROM kicks WHERE session_id = ?', sessionId)).toBe(20);
    }, 30_000);

    it('a push held past the busy timeout fails clearly with 503 and changes nothing; the retry applies', async () => {
      const { sessionId, mutations } = batch(20);
      // Held until the server answers: the server waits out its 5 s busy timeout (a background slice may wait first).
      const started = Date.now();
      const res = await push(mutations);
      const body = (await res.json()) as { error?: { code: string; message: string } };
      holder.exec('ROLLBACK');
      expect(Date.now() - started).toBeGreaterThanOrEqual(4900);
      expect(res.status).withContext(JSON.stringify(body)).toBe(503);
      expect(body.error?.code).toBe('database_busy');
      expect(body.error?.message).toMatch(/try again/);
      // RFC 9110 §10.2.3: Retry-After in seconds tells the client when to come back.
      expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
      expect(count('SELECT COUNT(*) AS n FROM kicks WHERE session_id = ?', sessionId)).toBe(0);
      expect(server.process.exitCode).withContext('the server is still running').toBeNull();
      const health = await fetch(`${server.baseUrl}/api/health`);
      expect(health.status).toBe(200);
      const retry = (await (await push(mutations)).json()) as PushResponse;
      expect(retry.results.every((r) => r.status === 'applied')).toBeTrue();
      expect(count('SELECT COUNT(*) AS n FROM kicks WHERE session_id = ?', sessionId)).toBe(20);
      expectSound();
    }, 30_000);
  });
});
