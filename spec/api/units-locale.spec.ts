import { eq } from 'drizzle-orm';
import request from 'supertest';
import { capturedMail, kicks, users } from '../../api/db/schema';
import { QuantityFormat } from '../../shared/quantity-format';
import { METRES_PER_YARD } from '../../shared/units';
import { DEFAULT_DRAG_CRISIS_RE } from '../../shared/schemas/club';
import { DEMO_ACCOUNTS, demoPeriod } from '../../seed/scenario';
import { createMailTestApp, FIXTURE_NOW, signIn, type MailTestApp } from './fixture';

const LAST_WEEK = demoPeriod(FIXTURE_NOW).weekStarts.at(-1)!.toISOString().slice(0, 10);

describe('A club in yards and a decimal-comma locale', () => {
  let t: MailTestApp;
  let admin: string;
  let coach: string;
  let initial: request.Response;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    t = await createMailTestApp();
    admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
    coach = (await signIn(t.app, DEMO_ACCOUNTS.head_coach)).accessToken;
    initial = await request(t.app).get('/api/club/settings').set(auth(coach));
  }, 30_000);
  afterAll(() => t.close());

  it('keeps the demo in metres and British English until the admin changes it', async () => {
    expect(initial.body).toEqual(jasmine.objectContaining({ distanceUnit: 'm', locale: 'en-GB' }));
  });

  it('refuses a unit or locale it cannot use, naming the field, and changes nothing', async () => {
    const before = (await request(t.app).get('/api/club/settings').set(auth(coach))).body;
    const badUnit = await request(t.app)
      .put('/api/club/settings')
      .set(auth(admin))
      .send({ timingBiasS: 0.2, timingSdS: 0.08, distanceUnit: 'ft' });
    expect(badUnit.status).toBe(400);
    expect(JSON.stringify(badUnit.body)).toContain('distanceUnit');
    const badLocale = await request(t.app)
      .put('/api/club/settings')
      .set(auth(admin))
      .send({ timingBiasS: 0.2, timingSdS: 0.08, locale: 'no such tag' });
    expect(badLocale.status).toBe(400);
    expect(JSON.stringify(badLocale.body)).toContain('locale');
    expect(
      (await request(t.app).put('/api/club/settings').set(auth(coach)).send({ timingBiasS: 0.2, timingSdS: 0.08, distanceUnit: 'yd' }))
        .status,
    ).toBe(403);
    expect((await request(t.app).get('/api/club/settings').set(auth(coach))).body).toEqual(before);
  });

  describe('after the switch to yards and de-DE', () => {
    beforeAll(async () => {
      const res = await request(t.app)
        .put('/api/club/settings')
        .set(auth(admin))
        .send({ timingBiasS: 0.2, timingSdS: 0.08, distanceUnit: 'yd', locale: 'de-de' });
      expect(res.status).toBe(200);
      expect(res.body).toEqual({
        timingBiasS: 0.2,
        timingSdS: 0.08,
        dragCrisisRe: DEFAULT_DRAG_CRISIS_RE,
        distanceUnit: 'yd',
        locale: 'de-DE',
        repLimitPerSession: 40,
      });
    });

    it('leaves the unit and locale alone when a calibration-only client saves', async () => {
      const res = await request(t.app).put('/api/club/settings').set(auth(admin)).send({ timingBiasS: 0.2, timingSdS: 0.08 });
      expect(res.body).toEqual(jasmine.objectContaining({ distanceUnit: 'yd', locale: 'de-DE' }));
      // Storage stays SI: no stored carry changed.
      expect(
        t.db
          .select()
          .from(kicks)
          .all()
          .every((k) => k.carryM === null || k.carryM <= 120),
      ).toBeTrue();
    });

    it('exports the kicks CSV with yard columns converted from the stored metres', async () => {
      const clubPlayer = t.db
        .select()
        .from(kicks)
        .all()
        .find((k) => k.carryM !== null && k.deletedAt === null)!;
      const res = await request(t.app).get(`/api/exports/kicks.csv?playerId=${clubPlayer.playerId}`).set(auth(coach));
      expect(res.status).toBe(200);
      const [header, ...lines] = res.text.trim().split('\r\n');
      const columns = header!.split(',');
      expect(columns).toContain('carry_yd');
      expect(columns).toContain('target_distance_yd');
      expect(columns).not.toContain('carry_m');
      const row = lines.map((l) => l.split(',')).find((cells) => cells[0] === clubPlayer.id)!;
      const carryYd = Number(row[columns.indexOf('carry_yd')]);
      // 1 yd = 0.9144 m exactly (1959); the file keeps 4 decimals.
      expect(carryYd).toBeCloseTo(clubPlayer.carryM! / METRES_PER_YARD, 3);
      expect(Number(row[columns.indexOf('target_distance_yd')])).toBeCloseTo(clubPlayer.targetDistanceM / METRES_PER_YARD, 3);
    });

    it('writes the Family digest in yards, with a decimal comma and a German date', async () => {
      const clubId = t.db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.admin)).get()!.clubId;
      await t.digests.run({ clubId, weekStart: LAST_WEEK });
      const germanWeek = new QuantityFormat({ locale: 'de-DE', distanceUnit: 'yd' }).day(LAST_WEEK, true);
      const digests = t.db
        .select()
        .from(capturedMail)
        .all()
        .filter((m) => m.subject.includes('kicking week'));
      expect(digests.length).toBeGreaterThan(0);
      for (const m of digests) expect(m.textBody).toContain(`week of ${germanWeek}`);
      const longest = digests.map((m) => /Longest \w+ kick on target: ([^\n]+)/.exec(m.textBody)?.[1]).filter((x) => x !== undefined);
      expect(longest.length).toBeGreaterThan(0);
      for (const text of longest) expect(text).toMatch(/^\d+,\d yd$/);
    });
  });
});
