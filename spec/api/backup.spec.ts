import Database from 'better-sqlite3';
import { randomUUID } from 'node:crypto';
import { join } from 'node:path';
import { backupDatabase, backupOnConnection, restoreDatabase } from '../../api/cli/db-backup';
import { nextChangeSeq } from '../../api/db/client';
import { kicks, trainingSessions } from '../../api/db/schema';
import { DEMO_SQUAD_IDS } from '../../seed/scenario';
import { createTestApp, type TestApp } from './fixture';

describe('database backup and restore', () => {
  let t: TestApp;
  beforeAll(() => {
    t = createTestApp();
  });
  afterAll(() => t.close());

  it('writes a consistent copy while writes continue, and restores it', async () => {
    const player = t.db.$client.prepare('SELECT id FROM players WHERE squad_id = ? LIMIT 1').get(DEMO_SQUAD_IDS.u16) as { id: string };
    const sessionId = randomUUID();
    t.db
      .insert(trainingSessions)
      .values({
        id: sessionId,
        clubId: (t.db.$client.prepare('SELECT club_id AS c FROM squads WHERE id = ?').get(DEMO_SQUAD_IDS.u16) as { c: string }).c,
        squadId: DEMO_SQUAD_IDS.u16,
        startedAt: '2026-11-30T18:00:00Z',
        ballSize: 5,
        changeSeq: nextChangeSeq(t.db),
      })
      .run();
    const clubId = (t.db.$client.prepare('SELECT club_id AS c FROM training_sessions WHERE id = ?').get(sessionId) as { c: string }).c;
    let writing = true;
    let written = 0;
    const writer = (async () => {
      while (writing) {
        t.db
          .insert(kicks)
          .values({
            id: randomUUID(),
            clubId,
            sessionId,
            playerId: player.id,
            technique: 'lofted',
            foot: 'right',
            targetDistanceM: 30,
            targetRadiusM: 3,
            outcome: 'on_target',
            recordedAt: new Date().toISOString(),
            changeSeq: nextChangeSeq(t.db),
          })
          .run();
        written++;
        await new Promise((r) => setImmediate(r));
      }
    })();
    const target = join(t.dir, 'backup.db');
    await backupDatabase(t.config.dbPath, target);
    writing = false;
    await writer;
    expect(written).toBeGreaterThan(0);
    const copy = new Database(target, { readonly: true });
    // SQLite online backup API: the copy is a consistent snapshot that passes integrity_check.
    expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
    const copied = (copy.prepare('SELECT COUNT(*) AS n FROM kicks WHERE session_id = ?').get(sessionId) as { n: number }).n;
    copy.close();
    expect(copied).toBeLessThanOrEqual(written);
    const restoredPath = join(t.dir, 'restored.db');
    restoreDatabase(target, restoredPath);
    const restored = new Database(restoredPath, { readonly: true });
    expect((restored.prepare('SELECT COUNT(*) AS n FROM kicks WHERE session_id = ?').get(sessionId) as { n: number }).n).toBe(copied);
    expect((restored.prepare('SELECT COUNT(*) AS n FROM players').get() as { n: number }).n).toBeGreaterThan(40);
    restored.close();
  });

  it('copies through the live connection with the online backup API', async () => {
    const target = join(t.dir, 'online.db');
    await backupOnConnection(t.db.$client, target);
    const copy = new Database(target, { readonly: true });
    expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
    expect((copy.prepare('SELECT COUNT(*) AS n FROM kicks').get() as { n: number }).n).toBe(
      (t.db.$client.prepare('SELECT COUNT(*) AS n FROM kicks').get() as { n: number }).n,
    );
    copy.close();
  });
});
