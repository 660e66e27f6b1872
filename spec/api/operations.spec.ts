/**
 * Operating the server: a busy port, readiness, oversized bodies and the proxy setting.
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer, type AddressInfo, type Server } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import request from 'supertest';
import { ConfigError, loadConfig } from '../../api/config';
import { createTestApp, type TestApp } from './fixture';

/** Runs `api/cli/start.ts --api-only` to its exit with `env` added; resolves with its exit code and output. */
function runStart(env: Record<string, string>): Promise<{ code: number | null; output: string }> {
  return new Promise((done) => {
    let output = '';
    const child = spawn(process.execPath, ['--import', 'tsx', resolve('api/cli/start.ts'), '--api-only'], {
      env: { ...process.env, LOFTLINE_SMTP_PORT: '0', LOFTLINE_LOG_LEVEL: 'info', ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout.on('data', (c: Buffer) => (output += c.toString()));
    child.stderr.on('data', (c: Buffer) => (output += c.toString()));
    child.once('close', (code) => done({ code, output }));
  });
}

describe('a second server on a busy port', () => {
  let blocker: Server;
  let port: number;
  let dir: string;
  beforeAll(async () => {
    blocker = createServer();
    await new Promise<void>((done) => blocker.listen(0, '127.0.0.1', done));
    port = (blocker.address() as AddressInfo).port;
    dir = mkdtempSync(join(tmpdir(), 'loftline-busy-'));
  });
  afterAll(async () => {
    await new Promise<void>((done) => blocker.close(() => done()));
    rmSync(dir, { recursive: true, force: true });
  });

  it('says the port is in use and exits 1 before touching the database', async () => {
    const dbPath = join(dir, 'second.db');
    const { code, output } = await runStart({
      NODE_ENV: 'test',
      PORT: String(port),
      LOFTLINE_HOST: '127.0.0.1',
      LOFTLINE_DB: dbPath,
      LOFTLINE_JWT_SECRET: 'busy-secret-0123456789-0123456789-abcdef',
    });
    expect(code).toBe(1);
    expect(output).toContain(`port ${port} is already in use`);
    expect(output).not.toContain('TypeError');
    // Listening comes first: the database was never opened, migrated or seeded.
    expect(existsSync(dbPath)).withContext(output).toBe(false);
  });
});

describe('readiness', () => {
  let t: TestApp;
  beforeEach(() => {
    t = createTestApp();
  });
  afterEach(() => {
    if (t.db.$client.open) t.close();
  });

  it('answers /api/ready 200 while the database can be read, 503 once it cannot', async () => {
    const ok = await request(t.app).get('/api/ready');
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ ready: true });
    t.db.$client.close();
    const down = await request(t.app).get('/api/ready');
    expect(down.status).toBe(503);
    expect(down.body.ready).toBe(false);
    expect(down.body.error.code).toBe('database_unavailable');
    // Liveness is about the process only.
    expect((await request(t.app).get('/api/health')).status).toBe(200);
    rmSync(t.dir, { recursive: true, force: true });
  });
});

describe('trust proxy from configuration', () => {
  const base = {
    NODE_ENV: 'test',
    LOFTLINE_DB: ':memory:',
    LOFTLINE_JWT_SECRET: 'proxy-secret-0123456789-0123456789-abcdef',
  } as const;

  it('defaults to a proxy on the same machine and reads hop counts, lists and switches', () => {
    expect(loadConfig({ ...base }).trustProxy).toEqual(['loopback']);
    expect(loadConfig({ ...base, LOFTLINE_TRUST_PROXY: '2' }).trustProxy).toBe(2);
    expect(loadConfig({ ...base, LOFTLINE_TRUST_PROXY: 'false' }).trustProxy).toBe(false);
    expect(loadConfig({ ...base, LOFTLINE_TRUST_PROXY: '10.0.0.0/8, loopback' }).trustProxy).toEqual(['10.0.0.0/8', 'loopback']);
  });

  it('refuses a value it cannot read, naming the variable', () => {
    expect(() => loadConfig({ ...base, LOFTLINE_TRUST_PROXY: 'the usual' })).toThrowMatching(
      (e: unknown) => e instanceof ConfigError && e.message.includes('LOFTLINE_TRUST_PROXY'),
    );
  });

  it('gives the app the configured setting, so X-Forwarded-For counts only from the configured proxies', async () => {
    const t = createTestApp({ trustProxy: ['10.1.2.3'] });
    try {
      const trusts = t.app.get('trust proxy fn') as (address: string, hop: number) => boolean;
      expect(trusts('10.1.2.3', 0)).toBe(true);
      expect(trusts('127.0.0.1', 0)).toBe(false);
    } finally {
      t.close();
    }
  });
});
