import request from 'supertest';
import { createTestApp, type TestApp } from './fixture';

describe('health and unknown routes', () => {
  let t: TestApp;
  beforeAll(() => {
    t = createTestApp();
  });
  afterAll(() => t.close());

  it('answers GET /api/health with ok', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });

  it('answers unknown API routes with a JSON 404 after authentication', async () => {
    expect((await request(t.app).get('/api/nope')).status).toBe(401);
  });

  it('sets security headers', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
