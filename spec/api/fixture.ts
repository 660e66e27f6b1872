/**
 * A real Loftline app on a temp SQLite file, loaded with the demo scenario plus a second,
 * unrelated club — so scoping tests can prove nothing crosses clubs.
 */
import bcrypt from 'bcryptjs';
import type { Express } from 'express';
import { copyFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pino } from 'pino';
import request from 'supertest';
import { createApp } from '../../api/app';
import { loadConfig, type AppConfig } from '../../api/config';
import { openDatabase, type Db } from '../../api/db/client';
import { DigestJob } from '../../api/digests/digests.service';
import { startFakeSmtp, type FakeSmtp } from '../../api/mail/fake-smtp';
import { Mailer } from '../../api/mail/mailer';
import { clubs, players, squads, squadStaff, users } from '../../api/db/schema';
import { DEMO_PASSWORD } from '../../seed/scenario';
import { buildDemoTemplate } from '../support/demo-template';

/** A fixed "now" so the demo scenario is the same in every run. */
export const FIXTURE_NOW = new Date('2026-11-18T12:00:00Z');

/** Ids of the second club's rows. */
export const OTHER_CLUB = {
  clubId: '00000000-0000-4000-8000-0000000000c2',
  squadId: '00000000-0000-4000-8000-0000000000c3',
  coachId: '00000000-0000-4000-8000-0000000000c4',
  playerUserId: '00000000-0000-4000-8000-0000000000c5',
  playerId: '00000000-0000-4000-8000-0000000000c6',
  coachEmail: 'coach@harrow-fen.test',
  playerEmail: 'player@harrow-fen.test',
};

/** A running test app. */
export interface TestApp {
  app: Express;
  db: Db;
  config: AppConfig;
  dir: string;
  close(): void;
}

/** Cheap bcrypt hash of the demo password: tests do not need cost 12 for every account. */
const cheapHash = bcrypt.hashSync(DEMO_PASSWORD, 4);

let templatePath: string | null = null;

/** The demo plus the second club, built once per process (see `buildDemoTemplate`). */
function demoTemplate(): string {
  templatePath ??= buildDemoTemplate('spec', { now: FIXTURE_NOW, passwordHash: cheapHash }, addOtherClub);
  return templatePath;
}

/** Creates the app on a fresh temp database (a copy of the demo template). */
export function createTestApp(overrides: Partial<AppConfig> = {}): TestApp {
  const dir = mkdtempSync(join(tmpdir(), 'loftline-spec-'));
  copyFileSync(demoTemplate(), join(dir, 'test.db'));
  const config = loadConfig(
    {
      NODE_ENV: 'test',
      LOFTLINE_DB: join(dir, 'test.db'),
      LOFTLINE_JWT_SECRET: 'test-secret-0123456789-0123456789-abcdef',
      LOFTLINE_LOG_LEVEL: 'silent',
    },
    { bcryptCost: 4, clientDir: join(dir, 'no-client'), ...overrides },
  );
  const db = openDatabase(config.dbPath);
  const app = createApp({ db, config, logger: pino({ level: 'silent' }) });
  return {
    app,
    db,
    config,
    dir,
    close: () => {
      db.$client.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

function addOtherClub(db: Db): void {
  const o = OTHER_CLUB;
  db.insert(clubs).values({ id: o.clubId, name: 'Harrow Fen Rovers' }).run();
  db.insert(squads).values({ id: o.squadId, clubId: o.clubId, name: 'U16', ageGroup: 'U16', ballSize: 5 }).run();
  db.insert(users)
    .values([
      { id: o.coachId, clubId: o.clubId, email: o.coachEmail, displayName: 'Other Coach', role: 'head_coach', passwordHash: cheapHash },
      { id: o.playerUserId, clubId: o.clubId, email: o.playerEmail, displayName: 'Other Player', role: 'player', passwordHash: cheapHash },
    ])
    .run();
  db.insert(squadStaff).values({ squadId: o.squadId, userId: o.coachId }).run();
  db.insert(players)
    .values({ id: o.playerId, clubId: o.clubId, squadId: o.squadId, userId: o.playerUserId, displayName: 'Other Player', shirtNumber: 9 })
    .run();
}

/** Signs in and returns the token pair and user. */
export async function signIn(app: Express, email: string, password = DEMO_PASSWORD) {
  const res = await request(app).post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { accessToken: string; refreshToken: string; user: { id: string; role: string; clubId: string } };
}

/** A test app whose mail goes over real SMTP to the local fake server (captures land in the database). */
export interface MailTestApp extends TestApp {
  smtp: FakeSmtp;
  mailer: Mailer;
  digests: DigestJob;
}

/** Like `createTestApp`, with a fake SMTP server on a free loopback port and `/api/dev/mail` enabled. */
export async function createMailTestApp(overrides: Partial<AppConfig> = {}): Promise<MailTestApp> {
  const base = createTestApp(overrides);
  const smtp = await startFakeSmtp(base.db, 0);
  const mailer = new Mailer(base.db, smtp.url, base.config.mailFrom);
  const digests = new DigestJob(base.db, mailer, base.config);
  const app = createApp({ db: base.db, config: base.config, logger: pino({ level: 'silent' }), mailer, digests, devMail: true });
  return {
    ...base,
    app,
    smtp,
    mailer,
    digests,
    close: () => {
      mailer.close();
      void smtp.close();
      base.close();
    },
  };
}
