/**
 * Issue 15 (second round), the data side: kicks the model cannot use, CSV formula injection, erasure
 * that leaves no name behind, and the sync boundary (dates, ids, unknown fields, squads of sessions).
 */
import { randomUUID } from 'node:crypto';
import { kickUpsert as aKick, sessionUpsert as aSession } from './mutations';
import { and, eq, isNull } from 'drizzle-orm';
import request from 'supertest';
import { kicks, players, trainingSessions } from '../../api/db/schema';
import { fitProfile, type LoggedKick } from '../../shared/flight/index';
import { HANG_TIME_RANGE_S, KICK_DOMAIN, type PushResponse } from '../../shared/schemas/sync';
import { DEMO_ACCOUNTS, DEMO_SQUAD_IDS } from '../../seed/scenario';
import { createTestApp, signIn, type TestApp } from './fixture';

describe('issue 15 data hardening', () => {
  let t: TestApp;
  let coach: string;
  let admin: string;
  let sessionId: string;
  let player: typeof players.$inferSelect;

  beforeAll(async () => {
    t = createTestApp({ loginFailuresPerIp: 1e6 });
    coach = (await signIn(t.app, DEMO_ACCOUNTS.head_coach)).accessToken;
    admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
    player = t.db
      .select()
      .from(players)
      .where(and(eq(players.squadId, DEMO_SQUAD_IDS.u16), isNull(players.deletedAt)))
      .all()
      .find((p) => p.shirtNumber !== null)!;
    sessionId = randomUUID();
    const res = await push([sessionUpsert(sessionId)]);
    expect(res.body.results[0].status).toBe('applied');
  }, 60_000);
  afterAll(() => t.close());

  function sessionUpsert(id: string, extra: Record<string, unknown> = {}, squadId = DEMO_SQUAD_IDS.u16) {
    return aSession(id, squadId, '2026-11-20T18:30:00Z', extra);
  }
  function kickUpsert(extra: Record<string, unknown> = {}) {
    return aKick(sessionId, player.id, { carryM: 34, ...extra });
  }
  const push = (mutations: unknown[], deviceId = 'hardening-phone') =>
    request(t.app).post('/api/sync/push').set('Authorization', `Bearer ${coach}`).send({ deviceId, mutations });
  const firstResult = (res: request.Response) => (res.body as PushResponse).results[0]!;

  describe('kicks the model cannot use (7)', () => {
    const outside: [string, number][] = [
      ['carryM', 0],
      ['measuredSpeedMs', 0],
      ['launchAngleDeg', 0],
      ['launchAngleDeg', -5],
      ['lateralM', 61],
      ['lateralM', -70],
      ['measuredSpinRps', -2],
    ];
    for (const [field, value] of outside) {
      it(`rejects ${field} = ${value} at the sync boundary, naming the field`, async () => {
        const m = kickUpsert({ [field]: value });
        const result = firstResult(await push([m]));
        expect(result.status).toBe('rejected');
        expect(result.error!.fields!.map((f) => f.field)).toContain(`data.${field}`);
        expect(
          t.db
            .select()
            .from(kicks)
            .where(eq(kicks.id, (m.data as { id: string }).id))
            .get(),
        ).toBeUndefined();
      });
    }

    it('gives a measured-kick import row outside the domain a row error naming the column', async () => {
      const mapping = {
        squadId: DEMO_SQUAD_IDS.u16,
        technique: 'lofted',
        targetDistanceM: 30,
        targetRadiusM: 3,
        columns: { player: 'player', speed: 'speed', carry: 'carry' },
        units: { speed: 'm/s', spin: 'rev/s', distance: 'm' },
      };
      const csv = `player,speed,carry\n${player.shirtNumber},25,30\n${player.shirtNumber},0,0\n`;
      const res = await request(t.app)
        .post('/api/imports/kicks?dryRun=true')
        .set('Authorization', `Bearer ${coach}`)
        .field('mapping', JSON.stringify(mapping))
        .attach('file', Buffer.from(csv), { filename: 'kicks.csv', contentType: 'text/csv' });
      const errors = (res.body.errors ?? res.body.error?.rows ?? []) as { row: number; column: string }[];
      expect(errors.filter((e) => e.row === 3).map((e) => e.column)).toEqual(jasmine.arrayContaining(['speed', 'carry']));
      expect(errors.some((e) => e.row === 2)).toBeFalse();
    });

    it('skips and reports stored kicks it cannot use instead of answering 500', async () => {
      const good = kickUpsert({ technique: 'driven', targetDistanceM: 30, carryM: 29 });
      expect(firstResult(await push([good])).status).toBe('applied');
      // Rows stored before the boundary checks existed: written straight to the database.
      const base = t.db
        .select()
        .from(kicks)
        .where(eq(kicks.id, (good.data as { id: string }).id))
        .get()!;
      const bad = [{ carryM: 0 }, { measuredSpeedMs: 0 }, { launchAngleDeg: -3 }, { lateralM: 70 }, { measuredSpinRps: -4 }];
      for (const b of bad)
        t.db
          .insert(kicks)
          .values({ ...base, id: randomUUID(), changeSeq: base.changeSeq + 1, ...b })
          .run();
      const res = await request(t.app).get(`/api/players/${player.id}/profile?technique=driven`).set('Authorization', `Bearer ${coach}`);
      expect(res.status).toBe(200);
      expect(res.body.skippedKicks).toBe(bad.length);
      expect(res.body.pending).toBeFalse();
      expect(res.body.profile).not.toBeNull();
    });

    it('accepts only what the fit can use: kicks at the edges of the sync domain fit without error', () => {
      const edge = (over: Partial<LoggedKick>): LoggedKick => ({
        technique: 'lofted',
        outcome: 'on_target',
        targetDistanceM: 35,
        targetRadiusM: 3,
        backspinStep: 1,
        sidespinStep: 0,
        carryM: null,
        lateralM: null,
        measuredSpeedMs: null,
        launchAngleDeg: null,
        measuredSpinRps: null,
        hangTimeS: null,
        ...over,
      });
      const smallest = (r: { min: number; minExclusive: boolean }) => (r.minExclusive ? r.min + 0.01 : r.min);
      const kicksAtEdges = [
        edge({ carryM: smallest(KICK_DOMAIN.carryM) }),
        edge({ carryM: KICK_DOMAIN.carryM.max, outcome: 'long' }),
        edge({ lateralM: KICK_DOMAIN.lateralM.min, outcome: 'left' }),
        edge({ lateralM: KICK_DOMAIN.lateralM.max, outcome: 'right' }),
        edge({ measuredSpeedMs: smallest(KICK_DOMAIN.measuredSpeedMs), outcome: 'short' }),
        edge({ measuredSpeedMs: KICK_DOMAIN.measuredSpeedMs.max, outcome: 'long' }),
        edge({ launchAngleDeg: smallest(KICK_DOMAIN.launchAngleDeg), carryM: 20, outcome: 'short' }),
        edge({ launchAngleDeg: KICK_DOMAIN.launchAngleDeg.max, carryM: 1, outcome: 'short' }),
        edge({ measuredSpinRps: KICK_DOMAIN.measuredSpinRps.min }),
        edge({ measuredSpinRps: KICK_DOMAIN.measuredSpinRps.max }),
        edge({ hangTimeS: HANG_TIME_RANGE_S[0] }),
        edge({ hangTimeS: HANG_TIME_RANGE_S[1] }),
      ];
      expect(() => fitProfile(kicksAtEdges)).not.toThrow();
    });
  });

  it('defuses spreadsheet formulas in the kicks export (8)', async () => {
    const m = kickUpsert();
    expect(firstResult(await push([m])).status).toBe('applied');
    t.db.update(players).set({ displayName: '=HYPERLINK("http://evil.example","open")' }).where(eq(players.id, player.id)).run();
    try {
      const res = await request(t.app)
        .get(`/api/exports/kicks.csv?playerId=${player.id}`)
        .set('Authorization', `Bearer ${coach}`)
        .buffer(true)
        .parse((r, done) => {
          let body = '';
          r.on('data', (c: Buffer) => (body += c.toString('utf8')));
          r.on('end', () => done(null, body));
        });
      const text = res.body as string;
      expect(text).toContain(`"'=HYPERLINK(""http://evil.example"",""open"")"`);
      expect(text).not.toMatch(/(^|,)=HYPERLINK/m);
      expect(text.endsWith('\r\n')).toBeTrue();
    } finally {
      t.db.update(players).set({ displayName: player.displayName }).where(eq(players.id, player.id)).run();
    }
  });

  describe('the sync boundary (low)', () => {
    it('refuses dates out of bounds and stores offsets as UTC', async () => {
      for (const recordedAt of ['0000-01-01T00:00:00Z', '9999-12-31T23:59:59Z']) {
        const result = firstResult(await push([kickUpsert({ recordedAt })]));
        expect(result.status).toBe('rejected');
        expect(result.error!.fields!.map((f) => f.field)).toContain('data.recordedAt');
      }
      const m = kickUpsert({ recordedAt: '2026-11-20T20:41:12+02:00' });
      expect(firstResult(await push([m])).status).toBe('applied');
      const row = t.db
        .select()
        .from(kicks)
        .where(eq(kicks.id, (m.data as { id: string }).id))
        .get()!;
      expect(row.recordedAt).toBe('2026-11-20T18:41:12.000Z');
    });

    it('counts a kick once when its ids come back in capitals', async () => {
      const m = kickUpsert();
      const data = m.data as { id: string };
      expect(firstResult(await push([m])).status).toBe('applied');
      const shouted = { ...m, id: m.id.toUpperCase(), data: { ...data, id: data.id.toUpperCase() } };
      expect(firstResult(await push([shouted])).status).toBe('duplicate');
      const edited = { ...kickUpsert(), data: { ...data, id: data.id.toUpperCase() } };
      // A new mutation on the same kick in capitals is an edit of that kick (a conflict without baseVersion), never a second kick.
      expect(firstResult(await push([edited])).status).toBe('conflict');
      expect(t.db.select().from(kicks).where(eq(kicks.id, data.id)).all().length).toBe(1);
    });

    it('refuses unknown fields inside data and unknown conditionsSource keys', async () => {
      const typo = firstResult(await push([kickUpsert({ carryMeters: 30 })]));
      expect(typo.status).toBe('rejected');
      expect(typo.error!.message).toContain('carryMeters');
      const sources = firstResult(
        await push([sessionUpsert(randomUUID(), { conditionsSource: { temperatureC: 'coach', junk: 'x'.repeat(5000) } })]),
      );
      expect(sources.status).toBe('rejected');
      expect(sources.error!.message).toContain('junk');
      const known = firstResult(
        await push([sessionUpsert(randomUUID(), { conditionsSource: { temperatureC: 'coach', ballSize: 'default' } })]),
      );
      expect(known.status).toBe('applied');
    });

    it('keeps a session with kicks on its squad', async () => {
      const id = randomUUID();
      expect(firstResult(await push([sessionUpsert(id)])).status).toBe('applied');
      const k = kickUpsert();
      (k.data as { sessionId: string }).sessionId = id;
      expect(firstResult(await push([k])).status).toBe('applied');
      const move = { ...sessionUpsert(id, {}, DEMO_SQUAD_IDS.u14), baseVersion: 1 };
      const result = firstResult(await push([move]));
      expect(result.status).toBe('rejected');
      expect(result.error!.fields!.map((f) => f.field)).toEqual(['data.squadId']);
      expect(t.db.select().from(trainingSessions).where(eq(trainingSessions.id, id)).get()!.squadId).toBe(DEMO_SQUAD_IDS.u16);
    });

    it('names deviceId when it is over 100 characters', async () => {
      const res = await push([], 'd'.repeat(101));
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toContain(
        jasmine.objectContaining({ field: 'deviceId', message: 'deviceId must be at most 100 characters' }),
      );
    });

    it('refuses NUL and text-direction overrides in names', async () => {
      for (const displayName of ['Coach \u202Egnp.exe', 'Coach\u0000Admin', 'Coach \u2066Isolate']) {
        const invite = await request(t.app)
          .post('/api/admin/invites')
          .set('Authorization', `Bearer ${admin}`)
          .send({ email: 'rtl@kestrel-vale.test', displayName, role: 'assistant_coach' });
        expect(invite.status).toBe(400);
        expect(invite.body.error.fields[0].field).toBe('displayName');
      }
      // A NUL inside an uploaded file is refused as binary already; the bidi override is the case to catch.
      const roster = await request(t.app)
        .post('/api/imports/roster?dryRun=true')
        .set('Authorization', `Bearer ${admin}`)
        .attach('file', Buffer.from('squad,name\nU12 Names,Ana \u202Eavlis\n'), { filename: 'roster.csv', contentType: 'text/csv' });
      const errors = (res: request.Response) => (res.body.errors ?? res.body.error?.rows ?? []) as { column: string }[];
      expect(roster.status).withContext(JSON.stringify(roster.body)).toBe(200);
      expect(errors(roster).map((e) => e.column)).toContain('name');
    });
  });

  it('lets guardians read only the child summary, not raw kicks, progress, profile or spin estimates (low)', async () => {
    const guardian = await signIn(t.app, DEMO_ACCOUNTS.guardian);
    const child = (await request(t.app).get('/api/players').set('Authorization', `Bearer ${guardian.accessToken}`)).body.players[0].id;
    for (const path of ['kicks', 'progress', 'profile?technique=lofted', 'spin-estimates']) {
      const res = await request(t.app).get(`/api/players/${child}/${path}`).set('Authorization', `Bearer ${guardian.accessToken}`);
      expect(res.status).withContext(path).toBe(403);
    }
    const summary = await request(t.app)
      .get(`/api/guardians/children/${child}/summary`)
      .set('Authorization', `Bearer ${guardian.accessToken}`);
    expect(summary.status).toBe(200);
  });

  describe('erasure (10, low)', () => {
    const name = 'Wren Halloway-Tisch';

    beforeAll(async () => {
      const roster = `squad,name,shirt_number,guardian_emails\nU12 Erasure,${name},4,wren.family@example.test\nU12 Erasure,Kit Abara,5,\n`;
      const res = await request(t.app)
        .post('/api/imports/roster')
        .set('Authorization', `Bearer ${admin}`)
        .attach('file', Buffer.from(roster), { filename: `${name}.csv`, contentType: 'text/csv' });
      expect(res.status).toBe(201);
    });

    it('leaves the name nowhere in the database: every text column of every table is searched', async () => {
      const wren = t.db.select().from(players).where(eq(players.displayName, name)).get()!;
      const res = await request(t.app)
        .post(`/api/admin/players/${wren.id}/erase`)
        .set('Authorization', `Bearer ${admin}`)
        .send({ mode: 'anonymise', confirmName: name });
      expect(res.status).toBe(200);
      const sqlite = t.db.$client;
      const tables = sqlite.prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'`).all() as {
        name: string;
      }[];
      const found: string[] = [];
      for (const { name: table } of tables) {
        const columns = (sqlite.prepare(`PRAGMA table_info("${table}")`).all() as { name: string; type: string }[]).filter((c) =>
          /TEXT|CHAR|CLOB|^$/i.test(c.type),
        );
        for (const { name: column } of columns) {
          for (const part of [name, 'Halloway']) {
            const n = sqlite.prepare(`SELECT COUNT(*) AS n FROM "${table}" WHERE instr(lower("${column}"), lower(?)) > 0`).get(part) as {
              n: number;
            };
            if (n.n > 0) found.push(`${table}.${column} (${part})`);
          }
        }
      }
      expect(tables.length).toBeGreaterThan(10);
      expect(found).toEqual([]);
    });

    it('does not bring an erased player back when a roster row carries the erased name', async () => {
      const kit = t.db.select().from(players).where(eq(players.displayName, 'Kit Abara')).get()!;
      const erase = await request(t.app)
        .post(`/api/admin/players/${kit.id}/erase`)
        .set('Authorization', `Bearer ${admin}`)
        .send({ mode: 'remove', confirmName: 'Kit Abara' });
      expect(erase.status).toBe(200);
      const erased = t.db.select().from(players).where(eq(players.displayName, 'Erased player')).all();
      expect(erased.map((e) => e.id)).toContain(kit.id);
      const roster = 'squad,name,shirt_number\nU12 Erasure,Erased player,9\n';
      const res = await request(t.app)
        .post('/api/imports/roster')
        .set('Authorization', `Bearer ${admin}`)
        .attach('file', Buffer.from(roster), { filename: 'again.csv', contentType: 'text/csv' });
      expect(res.status).toBe(201);
      for (const e of erased) {
        const row = t.db.select().from(players).where(eq(players.id, e.id)).get()!;
        expect(row.deletedAt).not.toBeNull();
        expect(row.shirtNumber).toBeNull();
      }
    });
  });
});
