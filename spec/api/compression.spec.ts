import { mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import { get, type IncomingHttpHeaders } from 'node:http';
import request from 'supertest';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { precompressDir } from '../../api/client/precompressed';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { createTestApp, signIn, type TestApp } from './fixture';

interface RawResponse {
  status: number;
  headers: IncomingHttpHeaders;
  body: Buffer;
}

/** GETs `path` from the app on a loopback port and keeps the body as sent (supertest would decode it). */
function getRaw(app: Express, path: string, headers: Record<string, string>): Promise<RawResponse> {
  return new Promise((done, reject) => {
    const server = app.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      get({ host: '127.0.0.1', port, path, headers }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => server.close(() => done({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) })));
      }).on('error', reject);
    });
  });
}

describe('compression of the app and the API', () => {
  const script = `export const drills = [${Array.from({ length: 400 }, (_, i) => `{ id: ${i}, name: "drill ${i}" }`).join(', ')}];\n`;
  let dir: string;
  let t: TestApp;
  beforeAll(() => {
    dir = join(tmpdir(), `loftline-compress-${process.pid}-${Date.now()}`);
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, 'index.html'), '<!doctype html><title>Loftline</title>');
    writeFileSync(join(dir, 'main-ABCDEFGH.js'), script);
    writeFileSync(join(dir, 'robots.txt'), 'User-agent: *\nDisallow: /\n');
    precompressDir(dir);
    writeFileSync(join(dir, 'chunk-NOCOPY12.js'), script); // built after precompression: no copy
    t = createTestApp({ clientDir: dir });
  });
  afterAll(() => t.close());

  it('serves the brotli copy of a bundle with its own content type, the encoding and Vary', async () => {
    const res = await getRaw(t.app, '/main-ABCDEFGH.js', { 'Accept-Encoding': 'gzip, br' });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toContain('text/javascript');
    expect(res.headers['vary']).toContain('Accept-Encoding');
    expect(res.headers['cache-control']).toContain('immutable');
    const body = res.body;
    expect(body.length).toBeLessThan(script.length / 4);
    // The service worker hashes what the browser decodes: the original file, byte for byte.
    expect(brotliDecompressSync(body).toString()).toBe(script);
  });

  it('serves the gzip copy to a client without brotli, and the file as it is to one without either', async () => {
    const gz = await getRaw(t.app, '/main-ABCDEFGH.js', { 'Accept-Encoding': 'gzip' });
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.body).toString()).toBe(script);
    const plain = await getRaw(t.app, '/main-ABCDEFGH.js', { 'Accept-Encoding': 'identity' });
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString()).toBe(script);
  });

  it('serves a file without a precompressed copy as it is', async () => {
    const res = await getRaw(t.app, '/chunk-NOCOPY12.js', { 'Accept-Encoding': 'br' });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.body.toString()).toBe(script);
  });

  it('compresses API answers with gzip for a client without brotli, and not at all for one without either', async () => {
    const { accessToken } = await signIn(t.app, DEMO_ACCOUNTS.head_coach);
    const auth = { Authorization: `Bearer ${accessToken}` };
    const gz = await getRaw(t.app, '/api/sync/pull?since=0&limit=200', { ...auth, 'Accept-Encoding': 'gzip, deflate' });
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.headers['vary']).toContain('Accept-Encoding');
    const plain = await getRaw(t.app, '/api/sync/pull?since=0&limit=200', { ...auth, 'Accept-Encoding': 'identity' });
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(gunzipSync(gz.body).toString()).toBe(plain.body.toString());
  });

  it('compresses API answers', async () => {
    const { accessToken } = await signIn(t.app, DEMO_ACCOUNTS.head_coach);
    const res = await getRaw(t.app, '/api/sync/pull?since=0&limit=500', {
      Authorization: `Bearer ${accessToken}`,
      'Accept-Encoding': 'br',
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    const json = brotliDecompressSync(res.body).toString();
    expect((JSON.parse(json) as { changes: unknown[] }).changes.length).toBeGreaterThan(0);
    expect(res.body.length).toBeLessThan(json.length / 3);
  });

  it('answers /robots.txt with the file, and a missing file with a 404 rather than the app', async () => {
    const robots = await request(t.app).get('/robots.txt').set('Accept', '*/*');
    expect(robots.status).toBe(200);
    expect(robots.headers['content-type']).toContain('text/plain');
    expect(robots.text).toContain('Disallow: /');
    const missing = await request(t.app).get('/chunk-GONE1234.js').set('Accept', '*/*');
    expect(missing.status).toBe(404);
  });
});
