/**
 * A production server starts empty — never with the demo club and its published password — and gets its
 * first club and administrator from `npm run club:create`, whose one-time link goes through the invite flow.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pino } from 'pino';
import request from 'supertest';
import { createApp } from '../../api/app';
import { loadConfig } from '../../api/config';
import { openDatabase } from '../../api/db/client';
import { clubs, users } from '../../api/db/schema';
import { startServer } from '../../api/server';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../seed/scenario';

const SECRET = 'prod-secret-0123456789-0123456789-abcdef';

function clubCreate(args: string[], env: Record<string, string>): Promise<{ code: number | null; output: string }> {
  return new Promise((done) => {
    let output = '';
    const child = spawn(process.execPath, ['--import', 'tsx', resolve('api/cli/club-create.ts'), ...args], {
      env: { ...process.env, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout.on('data', (c: Buffer) => (output += c.toString()));
    child.stderr.on('data', (c: Buffer) => (output += c.toString()));
    child.once('close', (code) => done({ code, output }));
  });
}

describe('production set-up', () => {
  let dir: string;
  let dbPath: string;
  beforeEach(() => {
    dir = mkdtempSync(join(tmpdir(), 'loftline-prod-'));
    dbPath = join(dir, 'prod.db');
  });
  afterEach(() => rmSync(dir, { recursive: true, force: true }));

  it('never loads the demo club into an empty production database, even when asked to', async () => {
    const config = loadConfig(
      {
        NODE_ENV: 'production',
        PORT: '0',
        LOFTLINE_HOST: '127.0.0.1',
        LOFTLINE_DB: dbPath,
        LOFTLINE_JWT_SECRET: SECRET,
        LOFTLINE_LOG_LEVEL: 'silent',
        SMTP_URL: 'smtp://127.0.0.1:9',
      },
      { clientDir: join(dir, 'no-client') },
    );
    const server = await startServer(config, { seedIfEmpty: true });
    try {
      expect(server.db.select().from(clubs).all()).toEqual([]);
      const login = await fetch(`http://127.0.0.1:${server.port}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: DEMO_ACCOUNTS.admin, password: DEMO_PASSWORD }),
      });
      expect(login.status).toBe(401);
    } finally {
      await server.close();
    }
  });

  it('creates the first club with club:create, whose one-time link lets the administrator set a password', async () => {
    const env = {
      NODE_ENV: 'production',
      LOFTLINE_DB: dbPath,
      LOFTLINE_JWT_SECRET: SECRET,
      LOFTLINE_PUBLIC_URL: 'https://loftline.example.org',
    };
    const created = await clubCreate(['--name', 'Marsh Lane Juniors', '--admin', 'Chair@Marsh-Lane.test'], env);
    expect(created.code).withContext(created.output).toBe(0);
    const link = /https:\/\/loftline\.example\.org\/accept-invite\?token=([\w-]+)/.exec(created.output);
    expect(link).withContext(created.output).not.toBeNull();
    const token = link![1]!;

    const again = await clubCreate(['--name', 'Marsh Lane Juniors', '--admin', 'chair@marsh-lane.test'], env);
    expect(again.code).toBe(1);
    expect(again.output).toContain('already exists');
    const missing = await clubCreate(['--name', 'No Admin FC'], env);
    expect(missing.code).toBe(1);
    expect(missing.output).toContain('admin');

    const db = openDatabase(dbPath);
    try {
      expect(db.select({ name: clubs.name }).from(clubs).all()).toEqual([{ name: 'Marsh Lane Juniors' }]);
      const admin = db.select().from(users).all();
      expect(admin.map((u) => [u.email, u.role, u.passwordHash])).toEqual([['chair@marsh-lane.test', 'admin', null]]);
      const config = loadConfig({ NODE_ENV: 'test', LOFTLINE_DB: dbPath, LOFTLINE_JWT_SECRET: SECRET }, { bcryptCost: 4 });
      const app = createApp({ db, config, logger: pino({ level: 'silent' }) });
      const invite = await request(app).get(`/api/auth/invite?token=${token}`);
      expect(invite.status).toBe(200);
      expect(invite.body.email).toBe('chair@marsh-lane.test');
      const accepted = await request(app).post('/api/auth/accept-invite').send({ token, password: 'a long new password 7' });
      expect(accepted.status).toBe(200);
      expect(accepted.body.user.role).toBe('admin');
      const reuse = await request(app).post('/api/auth/accept-invite').send({ token, password: 'another long password 8' });
      expect(reuse.status).toBe(400);
      const login = await request(app).post('/api/auth/login').send({ email: 'chair@marsh-lane.test', password: 'a long new password 7' });
      expect(login.status).toBe(200);
    } finally {
      db.$client.close();
    }
  });
});
