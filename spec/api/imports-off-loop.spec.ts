/**
 * An import never holds up the API: it runs on a worker thread with its own database connection, so
 * while it waits for (or holds) SQLite's write lock every other request is still answered.
 */
import request from 'supertest';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { createTestApp, signIn, type TestApp } from './fixture';

describe('imports off the request event loop', () => {
  let t: TestApp;
  let admin: string;
  beforeAll(async () => {
    t = createTestApp();
    admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
  });
  afterAll(() => t.close());

  it('keeps answering /api/health while a roster commit waits for the write lock, then commits it', async () => {
    const csv =
      'squad,name,guardian_emails\n' + Array.from({ length: 500 }, (_, i) => `U11 Lock,Player ${i},lock.${i}@family.test`).join('\n');
    // Another writer holds the lock: on the API's own thread the import would block every request until it gave up.
    t.db.$client.exec('BEGIN IMMEDIATE');
    let released = false;
    try {
      let answered = false;
      const commit = request(t.app)
        .post('/api/imports/roster')
        .set('Authorization', `Bearer ${admin}`)
        .attach('file', Buffer.from(csv), 'roster.csv')
        // Sent now; the import then waits on the worker for the lock.
        .then((res) => {
          answered = true;
          return res;
        });
      for (let i = 0; i < 20; i++) {
        const health = await request(t.app).get('/api/health');
        expect(health.status).toBe(200);
      }
      expect(answered).withContext('the import answered while another writer held the lock').toBeFalse();
      t.db.$client.exec('COMMIT');
      released = true;
      const res = await commit;
      expect(res.status).toBe(201);
      expect(res.body.summary.playersCreated).toBe(500);
      expect(res.body.summary.guardiansCreated).toBe(500);
    } finally {
      if (!released) t.db.$client.exec('ROLLBACK');
    }
  });
});
