/**
 * Measure from video end to end: a coach logs a repetition on Pitchside, opens a side-on clip of it (a
 * WebM rendered here from the flight model with a known launch), marks the kick spot and a cone 30 m
 * along the line, taps the ball's true centre (plus a pixel of seeded noise) every third frame, measures
 * and saves. The launch must come back within the solver's stated accuracy (speed 3 %, elevation 1.5°)
 * and reach the server with its source and taps after the phone syncs.
 *
 * Taps are placed in client coordinates computed here, independently of the app, from the video element's
 * box and `object-fit: contain` letterboxing (the frame scaled by the smaller ratio and centred).
 */
import Database from 'better-sqlite3';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { conditionsOf, type SessionConditions } from '../../api/analysis/flight-inputs';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { SeededRandom } from '../../shared/flight/random';
import type { TrackCalibration } from '../../shared/flight';
import { launchContext } from './support/browser';
import { startE2eServer, type E2eServer } from './support/server';
import { signInThroughUi } from './support/sign-in';
import { renderKickClip, type SyntheticClip } from './support/synthetic-video';

async function until(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 20_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

interface MeasuredRow {
  measuredSource: string | null;
  measuredSpeedMs: number | null;
  launchAngleDeg: number | null;
  measuredSpinRps: number | null;
  videoTrackJson: string | null;
}

const FRAME = { widthPx: 854, heightPx: 480, framesPerSecond: 30, durationS: 2.6 };
/** Kick spot at 0 m and a cone at 30 m, 500 px apart (16.7 px per metre), the phone tilted 2° (the far end lower). */
const CALIBRATION: TrackCalibration = {
  a: { xPx: 60, yPx: 400, alongM: 0 },
  b: { xPx: 60 + 500 * Math.cos((2 * Math.PI) / 180), yPx: 400 + 500 * Math.sin((2 * Math.PI) / 180), alongM: 30 },
};
const TRUTH = { speedMs: 24, elevationDeg: 21, backspinRps: 5, contactTimeS: 0.21 };

describe('Measure from video (end to end)', () => {
  let server: E2eServer;
  let context: BrowserContext;
  let closeBrowser: () => Promise<void>;
  let page: Page;
  let dir: string;

  function readDb<T>(sql: string, ...params: unknown[]): T | undefined {
    const db = new Database(server.dbPath, { readonly: true, fileMustExist: true });
    try {
      return db.prepare(sql).get(...params) as T | undefined;
    } finally {
      db.close();
    }
  }

  /** Clicks the frame at a video pixel, converted to client coordinates through the letterboxed box. */
  async function tapVideoPixel(xPx: number, yPx: number): Promise<void> {
    const box = await page.locator('video').boundingBox();
    if (!box) throw new Error('no video box');
    const scale = Math.min(box.width / FRAME.widthPx, box.height / FRAME.heightPx);
    const left = box.x + (box.width - FRAME.widthPx * scale) / 2;
    const top = box.y + (box.height - FRAME.heightPx * scale) / 2;
    await page.mouse.click(left + xPx * scale, top + yPx * scale);
  }

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'loftline-video-'));
    server = await startE2eServer();
    ({ context, close: closeBrowser } = await launchContext({ width: 1024, height: 900 }));
    page = await context.newPage();
  }, 90_000);

  afterAll(async () => {
    await closeBrowser?.();
    await server?.stop();
    server?.cleanup();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('measures a filmed kick from taps, within tolerance of the launch that made the clip, and syncs it', async () => {
    await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.assistant_coach);
    await page.getByRole('link', { name: 'Pitchside' }).click();
    await page.getByRole('radio', { name: 'U16', exact: true }).click();
    await page.getByRole('button', { name: 'Start session' }).click();
    await page.waitForURL(/\/pitchside\/[0-9a-f-]{36}$/);
    const sessionId = new URL(page.url()).pathname.split('/').at(-1) ?? '';
    await page.getByRole('button', { name: 'Use this drill' }).click();
    await page.getByTestId('player-chip').first().click();
    await page.getByRole('button', { name: 'On target', exact: true }).click();
    await until('the kick on the server', () => readDb('SELECT 1 FROM kicks WHERE session_id = ?', sessionId) !== undefined);

    // The clip is filmed in the session's own conditions, as the screen will model them.
    const session = readDb<SessionConditions>(
      `SELECT temperature_c AS temperatureC, altitude_m AS altitudeM, relative_humidity_pct AS relativeHumidityPct, pressure_hpa AS pressureHpa,
              wind_speed_ms AS windSpeedMs, wind_from_deg AS windFromDeg, ball_size AS ballSize, conditions_source_json AS conditionsSourceJson
         FROM training_sessions WHERE id = ?`,
      sessionId,
    )!;
    const clip: SyntheticClip = await renderKickClip(
      join(dir, 'kick.webm'),
      { ...TRUTH, conditions: conditionsOf(session) },
      CALIBRATION,
      FRAME,
    );

    await page.getByText(/Entries/).click();
    await page
      .getByRole('link', { name: /Measure from video/ })
      .first()
      .click();
    await page.waitForURL(/\/measure\/[0-9a-f-]{36}$/);
    await page.getByText('The video stays on this phone').waitFor();
    await page.getByTestId('video-file').setInputFiles(clip.path);
    const frameLabel = page.getByTestId('frame-label');
    // The frame count comes from the clip's own duration once its metadata has loaded.
    await frameLabel.filter({ hasText: `Frame 1 of ${clip.frameCount} ` }).waitFor();
    expect(await frameLabel.innerText()).toContain(`Frame 1 of ${clip.frameCount} `);
    await page.getByLabel('Second point distance (m)').fill('30');

    await tapVideoPixel(CALIBRATION.a.xPx, CALIBRATION.a.yPx);
    await tapVideoPixel(CALIBRATION.b.xPx, CALIBRATION.b.yPx);
    // Every third frame of the flight (the screen's suggested step at 30 fps), ±1 px of seeded noise.
    const random = new SeededRandom(17);
    const noise = () => random.uniform();
    const frames = [...clip.ballPx.keys()].filter((n) => n % 3 === 0);
    expect(frames.length).toBeGreaterThan(12);
    await page.getByRole('button', { name: 'Forward one frame' }).waitFor();
    for (const n of frames) {
      // Step to the frame with the stepper's own buttons, as a coach would.
      while (true) {
        const label = await frameLabel.innerText();
        const current = Number(/Frame (\d+)/.exec(label)![1]) - 1;
        if (current === n) break;
        if (n - current >= 3) await page.getByRole('button', { name: /Next suggested frame/ }).click();
        else await page.getByRole('button', { name: 'Forward one frame' }).click();
        await frameLabel.filter({ hasNotText: label }).waitFor();
      }
      const px = clip.ballPx.get(n)!;
      await tapVideoPixel(px.xPx + (2 * noise() - 1), px.yPx + (2 * noise() - 1));
    }
    await page
      .getByRole('list', { name: 'Ball taps' })
      .getByRole('listitem')
      .nth(frames.length - 1)
      .waitFor();

    await page.getByRole('button', { name: 'Measure the launch' }).click();
    const speedText = await page.getByTestId('measured-speed').innerText();
    const angleText = await page.getByTestId('measured-angle').innerText();
    const speed = Number(/^([\d.]+)/.exec(speedText)![1]);
    const angle = Number(/^([\d.]+)/.exec(angleText)![1]);
    // The accuracy on noisy synthetic tracks: speed within 3 %, elevation within 1.5°.
    expect(Math.abs(speed - TRUTH.speedMs) / TRUTH.speedMs).toBeLessThan(0.03);
    expect(Math.abs(angle - TRUTH.elevationDeg)).toBeLessThan(1.5);
    expect(await page.getByTestId('measured-spin').innerText()).toMatch(/^backspin /);

    await page.getByRole('button', { name: 'Save to this repetition' }).click();
    await page.getByText('Saved on this phone').waitFor();
    await until('the measurement on the server', () => {
      const row = readDb<MeasuredRow>(
        `SELECT measured_source AS measuredSource, measured_speed_ms AS measuredSpeedMs, launch_angle_deg AS launchAngleDeg,
                measured_spin_rps AS measuredSpinRps, video_track_json AS videoTrackJson FROM kicks WHERE session_id = ?`,
        sessionId,
      );
      return row?.measuredSource === 'video';
    });
    const row = readDb<MeasuredRow>(
      `SELECT measured_source AS measuredSource, measured_speed_ms AS measuredSpeedMs, launch_angle_deg AS launchAngleDeg,
              measured_spin_rps AS measuredSpinRps, video_track_json AS videoTrackJson FROM kicks WHERE session_id = ?`,
      sessionId,
    )!;
    expect(row.measuredSpeedMs!.toFixed(1)).toBe(speed.toFixed(1));
    expect(row.launchAngleDeg!.toFixed(1)).toBe(angle.toFixed(1));
    const track = JSON.parse(row.videoTrackJson!) as { points: unknown[]; frameWidthPx: number; calibration: TrackCalibration };
    expect(track.points.length).toBe(frames.length);
    expect(track.frameWidthPx).toBe(FRAME.widthPx);
    // The calibration taps landed where they were aimed, in the video's own pixels (not the screen's).
    expect(Math.abs(track.calibration.b.xPx - track.calibration.a.xPx)).toBeCloseTo(CALIBRATION.b.xPx - CALIBRATION.a.xPx, -1);
  }, 120_000);
});
