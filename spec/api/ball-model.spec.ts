import request from 'supertest';
import { conditionsOf, stillAirCarryM, type SessionConditions, type StoredKick } from '../../api/analysis/flight-inputs';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { GOFF_CARRE_RE_CENTRE } from '../../shared/flight';
import { DEFAULT_DRAG_CRISIS_RE } from '../../shared/schemas/club';
import { createTestApp, signIn, type TestApp } from './fixture';

const STILL: SessionConditions = {
  temperatureC: 15,
  altitudeM: 0,
  relativeHumidityPct: 0,
  pressureHpa: null,
  windSpeedMs: 4,
  windFromDeg: 0,
  ballSize: 5,
};
const CHIP: StoredKick = {
  technique: 'chipped',
  outcome: 'on_target',
  targetDistanceM: 18,
  targetRadiusM: 2,
  backspinStep: 2,
  sidespinStep: 0,
  carryM: 18,
  lateralM: null,
  measuredSpeedMs: null,
  launchAngleDeg: null,
  measuredSpinRps: null,
};

describe('ball model: the club’s drag-crisis Reynolds number', () => {
  let t: TestApp;
  let admin: string;
  let coach: string;
  const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    t = createTestApp();
    admin = (await signIn(t.app, DEMO_ACCOUNTS.admin)).accessToken;
    coach = (await signIn(t.app, DEMO_ACCOUNTS.assistant_coach)).accessToken;
  });
  afterAll(() => t.close());

  it('defaults to the crisis of the Goff & Carré fit', () => {
    // Goff & Carré 2010 (Eur. J. Phys. 31:775): the fit's crisis centre, rounded to a whole Reynolds number.
    expect(DEFAULT_DRAG_CRISIS_RE).toBe(Math.round(GOFF_CARRE_RE_CENTRE));
  });

  it('is served to staff, changed only by the admin within bounds, kept when a body leaves it out, and refits profiles', async () => {
    const initial = await request(t.app).get('/api/club/settings').set(auth(coach));
    expect(initial.body.dragCrisisRe).toBe(DEFAULT_DRAG_CRISIS_RE);
    const before = (t.db.$client.prepare('SELECT COUNT(*) AS n FROM player_profiles').get() as { n: number }).n;
    const body = { timingBiasS: 0.2, timingSdS: 0.08, dragCrisisRe: 2.4e5 };
    expect((await request(t.app).put('/api/club/settings').set(auth(coach)).send(body)).status).toBe(403);
    // Asai et al. 2007 (Sports Engineering 10:101): footballs' critical Re 2.2–3.0 × 10⁵; 5 × 10⁴ is no football.
    const bad = await request(t.app)
      .put('/api/club/settings')
      .set(auth(admin))
      .send({ ...body, dragCrisisRe: 5e4 });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain('dragCrisisRe');
    const ok = await request(t.app).put('/api/club/settings').set(auth(admin)).send(body);
    expect(ok.status).toBe(200);
    expect(ok.body.dragCrisisRe).toBe(2.4e5);
    const kept = await request(t.app).put('/api/club/settings').set(auth(admin)).send({ timingBiasS: 0.2, timingSdS: 0.08 });
    expect(kept.body.dragCrisisRe).toBe(2.4e5);
    const after = (t.db.$client.prepare('SELECT COUNT(*) AS n FROM player_profiles').get() as { n: number }).n;
    if (before > 0) expect(after).toBe(0);
    const unset = await request(t.app)
      .put('/api/club/settings')
      .set(auth(admin))
      .send({ ...body, dragCrisisRe: DEFAULT_DRAG_CRISIS_RE });
    expect(unset.body.dragCrisisRe).toBe(DEFAULT_DRAG_CRISIS_RE);
  });

  it('reaches the flight model wherever a club kick is modelled', () => {
    expect(conditionsOf({ ...STILL, dragCrisisRe: 2.4e5 }).aero).toEqual({ dragCrisisRe: 2.4e5 });
    expect(conditionsOf(STILL).aero).toBeUndefined();
    // First principles: a later crisis keeps a slow chip in high drag, so its still-air equivalent changes.
    const standard = stillAirCarryM(CHIP, STILL)!;
    const late = stillAirCarryM(CHIP, { ...STILL, dragCrisisRe: 2.8e5 })!;
    expect(Math.abs(late - standard)).toBeGreaterThan(0.05);
  });
});
