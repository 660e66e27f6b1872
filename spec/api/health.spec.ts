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

describe('serving the built app', () => {
  it('answers the root, deep links and assets, but never hides an API 404 behind the app', async () => {
    const { mkdirSync, writeFileSync } = await import('node:fs');
    const { join } = await import('node:path');
    const { tmpdir } = await import('node:os');
    const dir = join(tmpdir(), `loftline-client-${process.pid}-${Date.now()}`);
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, 'index.html'), '<!doctype html><title>Loftline</title>');
    writeFileSync(join(dir, 'main-ABCDEFGH.js'), 'console.log(1)');
    const t = createTestApp({ clientDir: dir });
    try {
      for (const path of ['/', '/home', '/sign-in?returnUrl=%2Fhome']) {
        const res = await request(t.app).get(path).set('Accept', 'text/html');
        expect(res.status).withContext(path).toBe(200);
        expect(res.text).toContain('<title>Loftline</title>');
        expect(res.headers['cache-control']).toBe('no-cache');
      }
      const js = await request(t.app).get('/main-ABCDEFGH.js');
      expect(js.headers['cache-control']).toContain('immutable');
      const api = await request(t.app).get('/api/health/nope').set('Accept', 'text/html');
      expect(api.status).not.toBe(200);
      expect(api.headers['content-type']).toContain('application/json');
    } finally {
      t.close();
    }
  });
});
