import { count, eq } from 'drizzle-orm';
import request from 'supertest';
import { auditLog, guardianLinks, kicks, players, squads } from '../../api/db/schema';
import { distanceToM, METRES_PER_YARD, MS_PER_MPH, speedToMs, spinToRps } from '../../api/imports/units';
import { DEMO_ACCOUNTS, DEMO_SQUAD_IDS } from '../../seed/scenario';
import { createTestApp, OTHER_CLUB, signIn, type TestApp } from './fixture';

describe('unit conversions', () => {
  it('follows the exact definitions', () => {
    // International yard and pound agreement (1959): 1 yd = 0.9144 m exactly, so 1 mph = 0.44704 m/s.
    expect(METRES_PER_YARD).toBe(0.9144);
    expect(MS_PER_MPH).toBeCloseTo(0.44704, 15);
    expect(speedToMs(1, 'mph')).toBeCloseTo(0.44704, 15);
    expect(distanceToM(1, 'yd')).toBe(0.9144);
    // SI: 1 km/h = 1000 m / 3600 s; 1 rpm = 1/60 rev/s.
    expect(speedToMs(36, 'km/h')).toBeCloseTo(10, 15);
    expect(spinToRps(600, 'rpm')).toBeCloseTo(10, 15);
    expect(speedToMs(25, 'm/s')).toBe(25);
  });
});

describe('imports', () => {
  let t: TestApp;
  let admin: string;
  let head: string;
  beforeAll(async () => {
    t = createTestApp();
    admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
    head = (await signIn(t.app, DEMO_ACCOUNTS.head_coach)).accessToken;
  });
  afterAll(() => t.close());

  const snapshot = () =>
    ['squads', 'players', 'users', 'guardian_links', 'kicks', 'training_sessions', 'drills', 'uploads']
      .map((table) => (t.db.$client.prepare(`SELECT COUNT(*) AS n FROM ${table}`).get() as { n: number }).n)
      .join(',');
  const roster = (body: string | Buffer, dryRun: boolean, name = 'roster.csv') =>
    request(t.app)
      .post(`/api/imports/roster?dryRun=${dryRun}`)
      .set('Authorization', `Bearer ${admin}`)
      .attach('file', Buffer.isBuffer(body) ? body : Buffer.from(body, 'utf8'), { filename: name, contentType: 'text/csv' });

  // RFC 4180 §2: CRLF records, quoted fields with commas and line breaks, quotes escaped by doubling.
  const GOOD =
    '\uFEFFsquad,name,shirt_number,birth_year,foot,guardian_emails\r\n' +
    'U12 Blue,"Ofori, Kwame",7,2014,left,kwame.parent@example.test\r\n' +
    'U12 Blue,"Tamsin ""Tam"" Reyes",9,2014,right,"tam.mum@example.test;tam.dad@example.test"\r\n' +
    'U12 Blue,"Line\r\nBreak",11,2015,right,\r\n';

  it('previews a roster without writing, then commits it, and a re-import changes nothing', async () => {
    const before = snapshot();
    const preview = await roster(GOOD, true);
    expect(preview.status).toBe(200);
    expect(preview.body.errors).toEqual([]);
    expect(preview.body.rows).toBe(3);
    expect(preview.body.summary).toEqual({ squadsCreated: 1, playersCreated: 3, playersUpdated: 0, guardiansCreated: 3, linksCreated: 3 });
    expect(snapshot()).toBe(before);
    const commit = await roster(GOOD, false);
    expect(commit.status).toBe(201);
    const squad = t.db.select().from(squads).where(eq(squads.name, 'U12 Blue')).get()!;
    expect(squad.ballSize).toBe(4);
    const names = t.db
      .select()
      .from(players)
      .where(eq(players.squadId, squad.id))
      .all()
      .map((p) => p.displayName)
      .sort();
    expect(names).toEqual(['Line\r\nBreak', 'Ofori, Kwame', 'Tamsin "Tam" Reyes'].sort());
    const kwame = t.db.select().from(players).where(eq(players.displayName, 'Ofori, Kwame')).get()!;
    expect(kwame.dominantFoot).toBe('left');
    expect(kwame.birthDate).toBe('2014-01-01');
    const after = snapshot();
    const audits = () => t.db.select().from(auditLog).where(eq(auditLog.action, 'import.roster')).all().length;
    const auditsBefore = audits();
    const again = await roster(GOOD, false);
    expect(again.body.alreadyImported).toBeTrue();
    expect(snapshot()).toBe(after);
    // The same people in a different file update rather than duplicate (natural keys).
    const edited = GOOD.replace(',7,2014,left,', ',8,2014,left,');
    const update = await roster(edited, false);
    expect(update.body.summary.playersUpdated).toBe(3);
    expect(update.body.summary.playersCreated).toBe(0);
    expect(t.db.select().from(players).where(eq(players.id, kwame.id)).get()!.shirtNumber).toBe(8);
    expect(t.db.select({ n: count() }).from(guardianLinks).get()!.n).toBe(Number(after.split(',')[3]));
    expect(audits()).toBe(auditsBefore + 1);
  });

  it('reports each bad row with its row number and column, and a commit with errors writes nothing', async () => {
    const bad =
      'squad,name,shirt_number,birth_year,foot,guardian_emails\nU12 Red,Ana Silva,7,2014,left,ana@example.test\nU12 Red,,140,1850,both,not-an-email\n';
    const preview = await roster(bad, true);
    expect(preview.body.errors).toEqual(
      jasmine.arrayContaining([
        { row: 3, column: 'name', message: 'Name is required' },
        jasmine.objectContaining({ row: 3, column: 'shirt_number' }),
        jasmine.objectContaining({ row: 3, column: 'birth_year' }),
        jasmine.objectContaining({ row: 3, column: 'foot' }),
        jasmine.objectContaining({ row: 3, column: 'guardian_emails' }),
      ]),
    );
    const before = snapshot();
    const commit = await roster(bad, false);
    expect(commit.status).toBe(400);
    expect(commit.body.error.code).toBe('import_invalid');
    expect(commit.body.errors.length).toBe(5);
    expect(snapshot()).toBe(before);
  });

  it('reads a semicolon-delimited file and Latin-1 text', async () => {
    const latin1 = Buffer.from('squad;name;shirt_number\nU10 Green;José Peña;4\n', 'latin1');
    const res = await roster(latin1, false, 'latin1.csv');
    expect(res.status).withContext(JSON.stringify(res.body)).toBe(201);
    expect(t.db.select().from(players).where(eq(players.displayName, 'José Peña')).get()).toBeDefined();
    expect(t.db.select().from(squads).where(eq(squads.name, 'U10 Green')).get()!.ballSize).toBe(4);
  });

  it('refuses malformed files clearly and writes nothing', async () => {
    const before = snapshot();
    const cases: [string, Buffer, string, string][] = [
      ['empty', Buffer.alloc(0), 'roster.csv', 'file_empty'],
      ['header only', Buffer.from('squad,name\r\n'), 'roster.csv', 'file_empty'],
      ['no header', Buffer.from('\r\n\r\n'), 'roster.csv', 'file_empty'],
      ['missing column', Buffer.from('team,player\nA,B\n'), 'roster.csv', 'file_missing_columns'],
      ['wrong delimiter', Buffer.from('squad|name\nA|B\n'), 'roster.csv', 'file_missing_columns'],
      ['unclosed quote', Buffer.from('squad,name\n"U12,Ana\n'), 'roster.csv', 'file_malformed'],
      [
        'binary renamed .csv',
        Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 73, 72, 68, 82]),
        'photo.csv',
        'file_not_csv',
      ],
      ['not a .csv name', Buffer.from('squad,name\nA,B\n'), 'roster.xlsx', 'file_not_csv'],
      ['50,001 rows', Buffer.from('squad,name\n' + 'U9 X,Someone\n'.repeat(50_001)), 'big.csv', 'file_too_many_rows'],
    ];
    for (const [label, body, name, code] of cases) {
      const res = await roster(body, false, name);
      expect(res.status).withContext(label).toBe(400);
      expect(res.body.error.code).withContext(label).toBe(code);
      expect(res.body.error.message.length).withContext(label).toBeGreaterThan(10);
    }
    const huge = await roster(Buffer.alloc(5 * 1024 * 1024 + 10, 'a'), false);
    expect(huge.status).toBe(413);
    expect(huge.body.error.code).toBe('file_too_large');
    expect((await request(t.app).post('/api/imports/roster').set('Authorization', `Bearer ${admin}`)).body.error.fields[0].field).toBe(
      'file',
    );
    expect(snapshot()).toBe(before);
  });

  it('lets only admins import rosters', async () => {
    const res = await request(t.app)
      .post('/api/imports/roster')
      .set('Authorization', `Bearer ${head}`)
      .attach('file', Buffer.from(GOOD), 'roster.csv');
    expect(res.status).toBe(403);
  });

  describe('measured kicks', () => {
    const u16Shirts = () => t.db.select().from(players).where(eq(players.squadId, DEMO_SQUAD_IDS.u16)).all();
    const mapping = (extra: object = {}) => ({
      squadId: DEMO_SQUAD_IDS.u16,
      technique: 'lofted',
      targetDistanceM: 30,
      targetRadiusM: 3,
      device: 'Bench radar',
      columns: { player: 'Shirt', time: 'When', speed: 'Ball speed', launchAngle: 'Launch', spin: 'Spin', carry: 'Carry' },
      units: { speed: 'km/h', spin: 'rpm', distance: 'yd' },
      ...extra,
    });
    const device = () => {
      const [a, b] = u16Shirts();
      return `When,Shirt,Ball speed,Launch,Spin,Carry\r\n2026-11-20 18:05:00,${a!.shirtNumber},90,31,360,33\r\n2026-11-20 18:06:00,${b!.shirtNumber},86.4,29.5,300,30\r\n2026-11-20 18:07:00,99,80,30,300,28\r\n`;
    };
    const post = (tok: string, body: string, m: object, dryRun: boolean) =>
      request(t.app)
        .post(`/api/imports/kicks?dryRun=${dryRun}`)
        .set('Authorization', `Bearer ${tok}`)
        .field('mapping', JSON.stringify(m))
        .attach('file', Buffer.from(body), 'device.csv');

    it('converts units, reports unmatched players, and commits only a clean file', async () => {
      const preview = await post(head, device(), mapping(), true);
      expect(preview.status).toBe(200);
      expect(preview.body.errors).toEqual([{ row: 4, column: 'Shirt', message: 'No player with shirt number or name "99" in U16' }]);
      expect((await post(head, device(), mapping(), false)).status).toBe(400);
      const clean = device().split('\r\n').slice(0, 3).join('\r\n') + '\r\n';
      const commit = await post(head, clean, mapping(), false);
      expect(commit.status).toBe(201);
      expect(commit.body.summary.kicksCreated).toBe(2);
      const rows = t.db
        .select()
        .from(kicks)
        .where(eq(kicks.sessionId, commit.body.summary.sessionId))
        .all()
        .sort((x, y) => x.recordedAt.localeCompare(y.recordedAt));
      expect(rows[0]!.measuredSpeedMs).toBeCloseTo(25, 12); // 90 km/h
      expect(rows[0]!.measuredSpinRps).toBeCloseTo(6, 12); // 360 rpm
      expect(rows[0]!.carryM).toBeCloseTo(33 * 0.9144, 2); // 33 yd
      expect(rows[0]!.launchAngleDeg).toBe(31);
      expect(rows[0]!.backspinStep).toBe(2);
      // 30 yd = 27.432 m: 2.568 m short of a 30 m target, inside its 3 m radius.
      expect(rows[1]!.outcome).toBe('on_target');
      expect(rows[1]!.carryM).toBeCloseTo(27.43, 2);
      // Re-importing the same file adds nothing.
      const again = await post(head, clean, mapping(), false);
      expect(again.body.alreadyImported).toBeTrue();
      expect(t.db.select().from(kicks).where(eq(kicks.sessionId, commit.body.summary.sessionId)).all().length).toBe(2);
    });

    it('derives the outcome from the flight model when the device gives no carry', async () => {
      const [a] = u16Shirts();
      const body = `When,Shirt,Ball speed,Launch,Spin\n2026-11-21 18:05:00,${a!.shirtNumber},10,30,0\n`;
      const m = mapping({
        columns: { player: 'Shirt', time: 'When', speed: 'Ball speed', launchAngle: 'Launch', spin: 'Spin' },
        units: { speed: 'm/s', spin: 'rev/s', distance: 'm' },
      });
      const res = await post(head, body, m, false);
      expect(res.status).toBe(201);
      // A 10 m/s launch at 30° carries under 10 m (vacuum range v² sin 2θ / g = 8.8 m), far short of 30 m.
      const row = t.db.select().from(kicks).where(eq(kicks.sessionId, res.body.summary.sessionId)).get()!;
      expect(row.outcome).toBe('short');
      expect(row.carryM).toBeNull();
    });

    it('applies everything or nothing when the commit fails midway', async () => {
      const [a, b, c] = u16Shirts();
      const body = `When,Shirt,Ball speed,Carry\n2026-11-22 10:00:00,${a!.shirtNumber},20,25\n2026-11-22 10:01:00,${b!.shirtNumber},21,26\n2026-11-22 10:02:00,${c!.shirtNumber},22,27\n`;
      const m = mapping({
        columns: { player: 'Shirt', time: 'When', speed: 'Ball speed', carry: 'Carry' },
        units: { speed: 'm/s', spin: 'rev/s', distance: 'm' },
      });
      const before = snapshot();
      // A schema trigger, not a TEMP one: the import commits on the import worker's own connection.
      t.db.$client.exec(
        `CREATE TRIGGER fail_third AFTER INSERT ON kicks WHEN NEW.recorded_at LIKE '2026-11-22T10:02%' BEGIN SELECT RAISE(ABORT, 'injected failure'); END;`,
      );
      try {
        const res = await post(head, body, m, false);
        expect(res.status).toBe(500);
      } finally {
        t.db.$client.exec('DROP TRIGGER fail_third');
      }
      expect(snapshot()).toBe(before);
      expect((await post(head, body, m, false)).status).toBe(201);
    });

    it('refuses squads outside the caller’s scope', async () => {
      const assistant = (await signIn(t.app, DEMO_ACCOUNTS.assistant_coach)).accessToken;
      const res = await post(assistant, device(), mapping({ squadId: DEMO_SQUAD_IDS.first }), true);
      expect(res.status).toBe(403);
      const other = (await signIn(t.app, OTHER_CLUB.coachEmail)).accessToken;
      expect((await post(other, device(), mapping(), true)).status).toBe(403);
      const badMapping = await post(head, device(), { ...mapping(), units: { speed: 'furlongs' } }, true);
      expect(badMapping.status).toBe(400);
      expect(badMapping.body.error.fields[0].field).toBe('units.speed');
      const missingColumn = await post(head, device(), mapping({ columns: { player: 'Shirt', speed: 'Velocity' } }), true);
      expect(missingColumn.body.error.code).toBe('file_missing_columns');
    });

    it('round-trips: an exported kicks CSV re-imports to the same rows', async () => {
      const [a] = u16Shirts();
      const source = `When,Shirt,Ball speed,Launch,Spin,Carry\r\n2026-11-25 18:05:00,${a!.shirtNumber},90,31,360,33\r\n2026-11-25 18:06:00,${a!.shirtNumber},86.4,29.5,300,30\r\n`;
      expect((await post(head, source, mapping(), false)).status).toBe(201);
      const exported = await request(t.app)
        .get(`/api/exports/kicks.csv?playerId=${a!.id}&from=2026-11-25&to=2026-11-25`)
        .set('Authorization', `Bearer ${head}`);
      expect(exported.status).toBe(200);
      expect(exported.headers['content-type']).toContain('text/csv');
      // RFC 4180 §2: records end in CRLF.
      expect(exported.text.split('\r\n')[0]).toContain('kick_id,recorded_at');
      const lines = exported.text.trim().split('\r\n');
      expect(lines.length).toBe(3);
      const m = mapping({
        columns: {
          player: 'shirt_number',
          time: 'recorded_at',
          speed: 'measured_speed_ms',
          launchAngle: 'launch_angle_deg',
          spin: 'measured_spin_rps',
          carry: 'carry_m',
          lateral: 'lateral_m',
        },
        units: { speed: 'm/s', spin: 'rev/s', distance: 'm' },
      });
      const before = snapshot();
      const res = await post(head, exported.text, m, false);
      expect(res.status).withContext(JSON.stringify(res.body)).toBe(201);
      expect(res.body.summary.kicksCreated).toBe(0);
      expect(res.body.summary.kicksSkipped).toBe(lines.length - 1);
      expect(snapshot().split(',').slice(0, 7)).toEqual(before.split(',').slice(0, 7));
    });
  });

  describe('data requests', () => {
    it('exports a player’s full data as JSON and erases the player on request', async () => {
      const player = t.db.select().from(players).where(eq(players.squadId, DEMO_SQUAD_IDS.u14)).all()[0]!;
      const json = await request(t.app).get(`/api/exports/players/${player.id}.json`).set('Authorization', `Bearer ${admin}`);
      expect(json.status).toBe(200);
      expect(json.body.player.displayName).toBe(player.displayName);
      expect(json.body.kicks.length).toBeGreaterThan(10);
      expect((await request(t.app).get(`/api/exports/players/${player.id}.json`).set('Authorization', `Bearer ${head}`)).status).toBe(403);
      const wrongName = await request(t.app)
        .post(`/api/admin/players/${player.id}/erase`)
        .set('Authorization', `Bearer ${admin}`)
        .send({ mode: 'anonymise', confirmName: 'someone else' });
      expect(wrongName.status).toBe(400);
      const kicksBefore = t.db.select().from(kicks).where(eq(kicks.playerId, player.id)).all().length;
      const erased = await request(t.app)
        .post(`/api/admin/players/${player.id}/erase`)
        .set('Authorization', `Bearer ${admin}`)
        .send({ mode: 'anonymise', confirmName: player.displayName });
      expect(erased.body).toEqual({ erased: true, kicksAffected: kicksBefore });
      const after = t.db.select().from(players).where(eq(players.id, player.id)).get()!;
      expect(after.displayName).toBe('Erased player');
      expect(after.birthDate).toBeNull();
      expect(t.db.select().from(guardianLinks).where(eq(guardianLinks.playerId, player.id)).all()).toEqual([]);
      expect(
        t.db
          .select()
          .from(kicks)
          .where(eq(kicks.playerId, player.id))
          .all()
          .every((k) => k.carryM === null),
      ).toBeTrue();
      const other = t.db
        .select()
        .from(players)
        .where(eq(players.squadId, DEMO_SQUAD_IDS.u14))
        .all()
        .find((p) => p.id !== player.id && !p.deletedAt)!;
      await request(t.app)
        .post(`/api/admin/players/${other.id}/erase`)
        .set('Authorization', `Bearer ${admin}`)
        .send({ mode: 'remove', confirmName: other.displayName });
      expect(t.db.select().from(kicks).where(eq(kicks.playerId, other.id)).all()).toEqual([]);
      expect(
        t.db
          .select()
          .from(auditLog)
          .where(eq(auditLog.entityId, other.id))
          .all()
          .map((a) => a.action),
      ).toContain('erasure.remove');
    });
  });
});
