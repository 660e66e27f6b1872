import type { SyncChange, SyncRow } from '../../../../shared/schemas/sync';
import { newId, type LoftlineDb } from '../loftline-db';
import { SPEC_COACH, SPEC_IDS, freshDb } from '../spec-support';
import { LAND_SLICE_ROWS, landPulledChanges } from './sync-apply';

/** A pulled kick as the server sends it (only what landing reads matters here). */
function pulledKick(sessionId: string, outcome: string): SyncRow {
  const at = new Date().toISOString();
  return {
    id: newId(),
    sessionId,
    playerId: SPEC_IDS.playerA,
    technique: 'lofted',
    outcome,
    recordedAt: at,
    updatedAt: at,
    deletedAt: null,
    version: 1,
  } as unknown as SyncRow;
}

describe('landPulledChanges (real IndexedDB)', () => {
  let db: LoftlineDb;

  beforeEach(() => {
    db = freshDb();
  });

  afterEach(async () => {
    db.close();
    await db.delete();
  });

  it('lands a page in slices with a pause between them, moves the cursor with the last, and spares a row edited meanwhile', async () => {
    const sessionId = newId();
    const rows = Array.from({ length: 2 * LAND_SLICE_ROWS + 50 }, () => pulledKick(sessionId, 'short'));
    const changes: SyncChange[] = rows.map((data, i) => ({ entity: 'kick', changeSeq: i + 1, data }));
    const edited = rows[rows.length - 1];
    const cursorsAtPauses: (number | undefined)[] = [];

    await landPulledChanges(db, SPEC_COACH.id, changes, 250, {}, async () => {
      cursorsAtPauses.push((await db.syncState.get(SPEC_COACH.id))?.cursor);
      if (cursorsAtPauses.length === 1) {
        // The coach edits a row of a later slice between two slices: it goes to the outbox.
        await db.kicks.put({ ...(edited as unknown as Parameters<typeof db.kicks.put>[0]), outcome: 'over', version: 0 });
        await db.outbox.add({
          id: newId(),
          seq: 1,
          userId: SPEC_COACH.id,
          entity: 'kick',
          entityId: edited.id,
          sessionId,
          op: 'upsert',
          data: { ...edited, outcome: 'over' },
          queuedAt: new Date().toISOString(),
          state: 'pending',
          revision: 0,
          attempts: 0,
        });
      }
    });

    expect(cursorsAtPauses).withContext('two pauses, and no cursor before the last slice').toEqual([undefined, undefined]);
    expect(await db.kicks.count()).toBe(rows.length);
    expect((await db.syncState.get(SPEC_COACH.id))?.cursor).toBe(250);
    const kept = await db.kicks.get(edited.id);
    expect(kept?.outcome).withContext('the local edit stays').toBe('over');
    expect(kept?.confirmed?.['outcome']).withContext('the server copy is recorded as confirmed').toBe('short');
    expect((await db.kicks.get(rows[0].id))?.outcome).toBe('short');
  });
});
