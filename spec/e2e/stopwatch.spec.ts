/**
 * The hang-time stopwatch end to end: a coach turns the stopwatch on for a drill, taps at "contact" and
 * again at "bounce" with no signal, logs the repetition with its carry, and once the phone syncs the
 * player's file shows the timed repetition and the spin inferred from it. The expected spin is solved
 * here from the very reading the phone recorded, so the check is exact, not a guess at tap latency.
 */
import Database from 'better-sqlite3';
import type { BrowserContext, Page } from 'playwright-core';
import { conditionsOf, type SessionConditions } from '../../api/analysis/flight-inputs';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { DEFAULT_ELEVATION_DEG, timedKickEvidence } from '../../shared/flight';
import { DEFAULT_TIMING } from '../../shared/schemas/club';
import { launchContext } from './support/browser';
import { startE2eServer, type E2eServer } from './support/server';
import { signInThroughUi } from './support/sign-in';

async function until(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

interface TimedKickRow extends SessionConditions {
  playerId: string;
  hangTimeS: number | null;
  carryM: number | null;
}

describe('Pitchside stopwatch to Player file (end to end)', () => {
  let server: E2eServer;
  let context: BrowserContext;
  let closeBrowser: () => Promise<void>;
  let page: Page;

  function timedKick(sessionId: string): TimedKickRow | undefined {
    const db = new Database(server.dbPath, { readonly: true, fileMustExist: true });
    try {
      return db
        .prepare(
          `SELECT k.player_id AS playerId, k.hang_time_s AS hangTimeS, k.carry_m AS carryM, s.temperature_c AS temperatureC, s.altitude_m AS altitudeM,
                  s.relative_humidity_pct AS relativeHumidityPct, s.pressure_hpa AS pressureHpa, s.wind_speed_ms AS windSpeedMs,
                  s.wind_from_deg AS windFromDeg, s.ball_size AS ballSize, s.conditions_source_json AS conditionsSourceJson
             FROM kicks k JOIN training_sessions s ON s.id = k.session_id WHERE k.session_id = ?`,
        )
        .get(sessionId) as TimedKickRow | undefined;
    } finally {
      db.close();
    }
  }

  function sessionAndDrillOnServer(sessionId: string): boolean {
    const db = new Database(server.dbPath, { readonly: true, fileMustExist: true });
    try {
      return (
        db.prepare('SELECT 1 FROM training_sessions t JOIN drills d ON d.session_id = t.id WHERE t.id = ?').get(sessionId) !== undefined
      );
    } finally {
      db.close();
    }
  }

  beforeAll(async () => {
    server = await startE2eServer();
    ({ context, close: closeBrowser } = await launchContext({ width: 360, height: 740 }));
    page = await context.newPage();
  }, 90_000);

  afterAll(async () => {
    await closeBrowser?.();
    await server?.stop();
    server?.cleanup();
  });

  it('times a repetition offline, syncs it and shows the spin it implies in the Player file', async () => {
    await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.assistant_coach);
    await page.getByRole('link', { name: 'Pitchside' }).click();
    await page.getByRole('radio', { name: 'U16', exact: true }).click();
    await page.getByRole('button', { name: 'Start session' }).click();
    await page.waitForURL(/\/pitchside\/[0-9a-f-]{36}$/);
    const sessionId = new URL(page.url()).pathname.split('/').at(-1) ?? '';
    await page.getByRole('button', { name: 'Use this drill' }).click();
    await page.getByTestId('player-chip').first().waitFor();

    // The kicker first, as on the pitch: then contact, bounce and the outcome are all in the thumb zone.
    await page.getByTestId('player-chip').first().click();
    await page.getByRole('switch', { name: /Stopwatch/ }).click();
    const tap = page.getByTestId('hang-timer-tap');
    await tap.waitFor();

    await until('the session and drill on the server', () => sessionAndDrillOnServer(sessionId));

    // No signal (the server stopped: the service worker's fetches ignore setOffline): the stopwatch and the log need none.
    await context.setOffline(true);
    const port = server.port;
    await server.stop();
    await tap.click();
    await page
      .getByTestId('hang-timer-tap')
      .filter({ hasText: /Bounce/ })
      .waitFor();
    // A lofted kick at 20 m/s with 5 rev/s of backspin carries ~30.9 m in ~2.67 s (shared/flight); the hand adds ~0.2 s.
    await page.waitForTimeout(2_850);
    await tap.click();
    const reading = Number(await page.getByTestId('hang-time').inputValue());
    expect(reading).toBeGreaterThan(2.7);
    expect(reading).toBeLessThan(3.3);
    // The corrected time renders after the reading (a tick later): wait for it rather than count at once.
    await page.getByText(/in the air after the club's 0\.20 s timing bias/).waitFor({ timeout: 5_000 });
    expect(await page.getByText(/in the air after the club's 0\.20 s timing bias/).count()).toBe(1);

    await page.getByLabel('Carry', { exact: true }).fill('30.9');
    await page.getByRole('button', { name: 'On target', exact: true }).click();
    await page
      .getByTestId('log-status')
      .filter({ hasText: `${reading.toFixed(2)} s` })
      .waitFor();
    expect(await page.getByTestId('hang-time').inputValue()).toBe('');
    await page
      .getByTestId('sync-badge')
      .filter({ hasText: /\b1 unsynced/ })
      .waitFor();
    expect(timedKick(sessionId)).toBeUndefined();

    // Signal again: the timed repetition reaches the server with its reading.
    server = await startE2eServer({ dbPath: server.dbPath, port });
    await context.setOffline(false);
    await until('the timed kick on the server', () => timedKick(sessionId) !== undefined, 45_000);
    const row = timedKick(sessionId)!;
    expect(row.hangTimeS).toBe(reading);
    expect(row.carryM).toBe(30.9);

    // What the flight model says about exactly this reading, with the club's default calibration.
    const expected = timedKickEvidence({
      carryM: 30.9,
      hangTimeS: reading,
      elevationDeg: DEFAULT_ELEVATION_DEG.lofted,
      sidespinRps: 0,
      conditions: conditionsOf(row),
      timing: { biasS: DEFAULT_TIMING.biasS, sdS: DEFAULT_TIMING.sdS },
    });
    expect(expected.ok).toBeTrue();
    if (!expected.ok) return;

    await page.goto(`${server.baseUrl}/players/${row.playerId}`);
    const spinRow = page.locator('ll-hang-time-spin tr[data-technique="lofted"]');
    await spinRow.waitFor({ timeout: 30_000 });
    const cells = await spinRow.locator('td').allInnerTexts();
    // Timed, used, from hang time (± one standard deviation), by eye, launch speed.
    expect(cells[0]).toBe('1');
    expect(cells[1]).toBe('1');
    expect(cells[2]).toBe(`${expected.backspinRps.toFixed(1)} ± ${expected.backspinSdRps.toFixed(1)} rev/s`);
    expect(cells[4]).toBe(`${expected.speedMs.toFixed(1)} ± ${expected.speedSdMs.toFixed(1)} m/s`);
    expect(await page.getByText('calibrate it from video in Club admin').count()).toBe(1);
  }, 150_000);
});
