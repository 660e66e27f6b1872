/**
 * Session conditions from the weather service, end to end: the local fake weather service (started
 * here, given to the server as `WEATHER_URL`) serves a 6 m/s wind blowing from the demo ground's
 * kicking direction; Pitchside prefills a headwind, the session keeps the values with their source,
 * and the flight model reads that headwind for the session's kicks (the still-air carry the server
 * computes for a logged carry is the one the model gives for those conditions).
 */
import Database from 'better-sqlite3';
import type { BrowserContext, Page } from 'playwright-core';
import { stillAirCarryM, type SessionConditions, type StoredKick } from '../../api/analysis/flight-inputs';
import { startFakeWeather, type FakeWeather } from '../../api/weather/fake-weather';
import { launchContext } from './support/browser';
import { startE2eServer, type E2eServer } from './support/server';
import { signInThroughUi } from './support/sign-in';

const COACH = 'assistant.coach@kestrel-vale.test';
// The demo ground (seed/scenario.ts): kicked towards 205°.
const GROUND = { latitude: 52.7713, longitude: -1.5528, kickingBearingDeg: 205 };

async function until(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

describe('Session conditions from the weather service (end to end)', () => {
  let fake: FakeWeather;
  let server: E2eServer;
  let context: BrowserContext;
  let closeBrowser: () => Promise<void>;
  let page: Page;

  function query<T>(sql: string, ...params: unknown[]): T | undefined {
    const db = new Database(server.dbPath, { readonly: true, fileMustExist: true });
    try {
      return db.prepare(sql).get(...params) as T | undefined;
    } finally {
      db.close();
    }
  }

  beforeAll(async () => {
    fake = await startFakeWeather(0);
    // 21.6 km/h = 6 m/s (SI), blowing from the bearing the drills kick towards (WMO from-direction): a headwind.
    fake.pin({
      latitude: GROUND.latitude,
      longitude: GROUND.longitude,
      windSpeedKmh: 21.6,
      windFromDeg: GROUND.kickingBearingDeg,
      temperatureC: 8.5,
      relativeHumidityPct: 88,
      surfacePressureHpa: 996.2,
    });
    server = await startE2eServer({ env: { WEATHER_URL: fake.url } });
    ({ context, close: closeBrowser } = await launchContext({ width: 360, height: 740 }));
    page = await context.newPage();
  }, 90_000);

  afterAll(async () => {
    await closeBrowser?.();
    await server?.stop();
    server?.cleanup();
    await fake?.close();
  });

  it('prefills a headwind measured at the ground, stores it with its source, and the flight model uses it', async () => {
    await signInThroughUi(page, server.baseUrl, COACH);
    await page.getByRole('link', { name: 'Pitchside' }).click();
    await page.getByRole('radio', { name: 'U16', exact: true }).click();
    await page.getByTestId('weather-status').filter({ hasText: 'Measured by the weather service at' }).waitFor();
    expect(await page.getByRole('radio', { name: 'Headwind' }).getAttribute('aria-checked')).toBe('true');
    expect(await page.getByTestId('source-wind').innerText()).toContain('6 m/s headwind: speed measured by the weather service at');
    expect(await page.getByTestId('source-temperatureC').innerText()).toContain('measured by the weather service');
    expect(fake.calls).toBe(1);

    await page.getByRole('button', { name: 'Start session' }).click();
    await page.waitForURL(/\/pitchside\/[0-9a-f-]{36}$/);
    const sessionId = new URL(page.url()).pathname.split('/').at(-1) ?? '';
    // The header reads "Pitchside" until the session has loaded from IndexedDB.
    await page.locator('.pitchside__summary').filter({ hasText: '°C' }).waitFor();
    const summary = await page.locator('.pitchside__summary').innerText();
    expect(summary).toContain('8.5 °C');
    expect(summary).toContain('headwind moderate 6 m/s');
    expect(summary).toContain('measured');

    // One repetition with a logged carry, so the server re-flies it through the model.
    await page.getByRole('button', { name: 'Use this drill' }).click();
    await page.getByTestId('player-chip').first().click();
    await page.getByLabel('Carry').fill('34');
    await page.getByRole('button', { name: 'On target', exact: true }).click();
    await page
      .getByTestId('sync-badge')
      .filter({ hasText: /all synced/i })
      .waitFor({ timeout: 30_000 });

    const session = query<SessionConditions & { groundId: string; sources: string; observedAt: string | null }>(
      `SELECT temperature_c AS temperatureC, altitude_m AS altitudeM, relative_humidity_pct AS relativeHumidityPct, pressure_hpa AS pressureHpa,
              wind_speed_ms AS windSpeedMs, wind_from_deg AS windFromDeg, ball_size AS ballSize, ground_id AS groundId,
              conditions_source_json AS sources, conditions_source_json AS conditionsSourceJson, conditions_observed_at AS observedAt
         FROM training_sessions WHERE id = ?`,
      sessionId,
    );
    expect(session).toEqual(
      jasmine.objectContaining({
        windSpeedMs: 6,
        windFromDeg: 0,
        temperatureC: 8.5,
        relativeHumidityPct: 88,
        pressureHpa: 996.2,
        altitudeM: 88,
      }),
    );
    expect(JSON.parse(session!.sources)).toEqual(
      jasmine.objectContaining({
        windSpeedMs: 'weather',
        windFromDeg: 'weather',
        temperatureC: 'weather',
        relativeHumidityPct: 'weather',
        pressureHpa: 'weather',
        altitudeM: 'ground',
      }),
    );
    expect(session!.observedAt).not.toBeNull();

    const kickSql = `SELECT technique, outcome, target_distance_m AS targetDistanceM, target_radius_m AS targetRadiusM, backspin_step AS backspinStep,
              sidespin_step AS sidespinStep, carry_m AS carryM, lateral_m AS lateralM, measured_speed_ms AS measuredSpeedMs,
              launch_angle_deg AS launchAngleDeg, measured_spin_rps AS measuredSpinRps, still_air_carry_m AS stillAir
         FROM kicks WHERE session_id = ?`;
    await until(
      'the server to re-fly the carry',
      () => (query<{ stillAir: number | null }>(kickSql, sessionId)?.stillAir ?? null) !== null,
    );
    const kick = query<StoredKick & { stillAir: number }>(kickSql, sessionId)!;
    expect(kick.carryM).toBe(34);
    // The model with this session's headwind, humidity and pressure gives exactly what the server stored…
    expect(kick.stillAir).toBe(stillAirCarryM(kick, session!)!);
    // …and the headwind is in it: 34 m into 6 m/s is a longer kick in still air, unlike the same air without wind.
    expect(kick.stillAir).toBeGreaterThan(34.5);
    const calm = stillAirCarryM(kick, { ...session!, windSpeedMs: 0 })!;
    expect(kick.stillAir - calm).toBeGreaterThan(0.5);
  }, 120_000);

  it('still starts a session at once when the weather service hangs', async () => {
    fake.setMode('timeout');
    // Forget the cached answer, so the server really asks the hanging service.
    const db = new Database(server.dbPath, { fileMustExist: true });
    try {
      db.prepare('DELETE FROM ground_conditions').run();
    } finally {
      db.close();
    }
    const callsBefore = fake.calls;
    await page.goto(server.baseUrl + '/pitchside');
    await page.getByRole('radio', { name: 'U16', exact: true }).click();
    await page.getByTestId('weather-status').filter({ hasText: 'Asking the weather service' }).waitFor();
    await until('the server to ask the service', () => fake.calls > callsBefore);
    await page.getByRole('radio', { name: 'Tailwind' }).click();
    const started = Date.now();
    await page.getByRole('button', { name: 'Start session' }).click();
    await page.waitForURL(/\/pitchside\/[0-9a-f-]{36}$/);
    expect(Date.now() - started).toBeLessThan(2000);
    await page.locator('.pitchside__summary').filter({ hasText: 'U16' }).waitFor();
    expect(await page.locator('.pitchside__summary').innerText()).toContain('tailwind light');
    expect(await page.locator('.pitchside__summary').innerText()).not.toContain('measured');
  }, 60_000);
});
