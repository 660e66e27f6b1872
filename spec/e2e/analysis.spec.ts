import { signInThroughUi } from './support/sign-in';
/**
 * Player file and Squad week end to end: a real server with the demo scenario, the production
 * build, Chromium. The head coach reviews the demo's last week; a player opens their own file
 * and is refused someone else's. Each chart is photographed and the photograph checked for
 * drawn marks, so a chart that renders an empty frame fails.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { demoPeriod } from '../../seed/calendar';
import { launchContext } from './support/browser';
import { profilesFitted } from './support/profiles';
import { type E2eServer, startE2eServer, useE2eServer } from './support/server';

const PASSWORD = 'loftline-demo';
const HEAD_COACH = 'head.coach@kestrel-vale.test';
const PLAYER = 'player@kestrel-vale.test';
const SHOTS = join(tmpdir(), 'loftline-e2e-analysis');

const signIn = signInThroughUi;

/** Signs in through the API and returns the access token (for looking up ids the spec needs). */
async function apiToken(baseUrl: string, email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  return ((await res.json()) as { accessToken: string }).accessToken;
}

async function apiGet<T>(baseUrl: string, token: string, path: string): Promise<T> {
  const res = await fetch(baseUrl + path, { headers: { Authorization: `Bearer ${token}` } });
  return (await res.json()) as T;
}

/**
 * Photographs a chart and counts the distinct colours in the picture (in the page, through a
 * canvas). An empty chart frame has its background and a few axis greys; a drawn one has many more.
 */
async function photograph(page: Page, chart: Locator, name: string): Promise<number> {
  mkdirSync(SHOTS, { recursive: true });
  const path = join(SHOTS, `${name}.png`);
  await chart.locator('svg').first().screenshot({ path });
  const base64 = readFileSync(path).toString('base64');
  return page.evaluate(async (data) => {
    const image = new Image();
    image.src = `data:image/png;base64,${data}`;
    await image.decode();
    const canvas = document.createElement('canvas');
    canvas.width = image.width;
    canvas.height = image.height;
    const context = canvas.getContext('2d')!;
    context.drawImage(image, 0, 0);
    const pixels = context.getImageData(0, 0, canvas.width, canvas.height).data;
    const colours = new Set<number>();
    for (let i = 0; i < pixels.length; i += 4) {
      colours.add((pixels[i]! << 16) | (pixels[i + 1]! << 8) | pixels[i + 2]!);
    }
    return colours.size;
  }, base64);
}

describe('Player file and Squad week (end to end, Chromium)', () => {
  let server: E2eServer;
  useE2eServer((started) => (server = started));

  it('shows the head coach the demo’s last week with its table, charts and CSV export', async () => {
    const { context, close } = await launchContext({ width: 1280, height: 900 });
    try {
      const page = await context.newPage();
      const lastWeek = demoPeriod(new Date()).weekStarts.at(-1)!.toISOString().slice(0, 10);
      await profilesFitted(server.baseUrl, HEAD_COACH);
      await signIn(page, server.baseUrl, HEAD_COACH);
      const weekAnswer = page.waitForResponse((r) => r.url().includes('/week?') && r.url().includes(`start=${lastWeek}`));
      await page.getByRole('link', { name: 'Squad week' }).first().click();
      await page.waitForURL(/\/squad-week/);
      expect((await weekAnswer).status()).toBe(200);

      const table = page.locator('ll-squad-week-table table');
      await table.locator('tbody tr').first().waitFor();
      const rows = await table.locator('tbody tr').count();
      expect(rows).toBeGreaterThan(5);
      expect(await page.getByRole('heading', { name: /Players · / }).count()).toBe(1);

      const zones = page.locator('ll-zone-rate-chart');
      const calibration = page.locator('ll-calibration-chart');
      expect(await zones.locator('rect.ll-zone__bar').count()).toBeGreaterThan(0);
      expect(await calibration.locator('circle.ll-calibration__point').count()).toBeGreaterThan(0);
      expect(await photograph(page, zones, 'squad-week-zones')).toBeGreaterThan(12);
      expect(await photograph(page, calibration, 'squad-week-calibration')).toBeGreaterThan(12);
      await page.screenshot({ path: join(SHOTS, 'squad-week.png') });

      const download = page.waitForEvent('download');
      await page.getByRole('button', { name: 'Export CSV' }).click();
      const file = await download;
      expect(file.suggestedFilename()).toContain(lastWeek);
      const csv = readFileSync((await file.path())!, 'utf8')
        .replace(/^\ufeff/, '')
        .trim()
        .split('\r\n');
      expect(csv[0]).toContain('Player');
      expect(csv.length).toBe(rows + 1);

      // Reliable reach is a number for most of the squad (the envelope is fitted against each drill's target).
      const reachCells = await table.locator('tbody td.mat-column-reach').allInnerTexts();
      expect(reachCells.length).toBe(rows);
      expect(reachCells.filter((text) => /^\d+(\.\d)? m/.test(text.trim())).length).toBeGreaterThan(rows / 2);

      // A row leads to the player's file, where staff get next week's targets with "add as drill".
      await table.locator('tbody tr a').first().click();
      await page.waitForURL(/\/players\/[0-9a-f-]{36}/);
      await page.locator('ll-progress-chart circle.ll-progress__point').first().waitFor();
      await page
        .getByRole('link', { name: /in Pitchside/ })
        .first()
        .waitFor({ timeout: 60_000 });
      expect(await page.locator('ll-reach-panel .reach-panel__number').first().innerText()).toMatch(/^\d+\.\d m$/);
    } finally {
      await close();
    }
  }, 240_000);

  it('lets a player open their own file, with drawn charts, and refuses someone else’s', async () => {
    const coachToken = await apiToken(server.baseUrl, HEAD_COACH);
    const playerToken = await apiToken(server.baseUrl, PLAYER);
    const me = await apiGet<{ playerId: string }>(server.baseUrl, playerToken, '/api/me');
    const { players } = await apiGet<{ players: { id: string }[] }>(server.baseUrl, coachToken, '/api/players');
    const other = players.find((p) => p.id !== me.playerId)!;

    const { context, close } = await launchContext({ width: 360, height: 740 });
    try {
      const page = await context.newPage();
      await signIn(page, server.baseUrl, PLAYER);
      await page.getByRole('link', { name: 'My file' }).click();
      await page.waitForURL(/\/players\/me$/);

      const progress = page.locator('ll-progress-chart');
      const mix = page.locator('ll-outcome-mix-chart');
      const reach = page.locator('ll-reach-diagram');
      await progress.locator('circle.ll-progress__point').first().waitFor();
      // The envelope is computed in the flight worker from the server's profile: 1000 landings.
      await reach.locator('circle.ll-reach__landing').nth(999).waitFor({ state: 'attached', timeout: 30_000 });
      expect(await mix.locator('rect.ll-outcome__segment').count()).toBeGreaterThan(0);
      expect(await photograph(page, progress, 'player-file-progress')).toBeGreaterThan(12);
      expect(await photograph(page, mix, 'player-file-outcomes')).toBeGreaterThan(12);
      expect(await photograph(page, reach, 'player-file-reach')).toBeGreaterThan(12);
      await page.screenshot({ path: join(SHOTS, 'player-file.png') });
      expect(await page.locator('ll-recent-kicks tbody tr').count()).toBeGreaterThan(0);
      // Pitchside is staff-only: a player gets no "add as drill".
      expect(await page.getByRole('link', { name: /in Pitchside/ }).count()).toBe(0);

      await page.goto(`${server.baseUrl}/players/${other.id}`);
      await page.getByRole('heading', { name: 'This player file is not available to you' }).waitFor();
      expect(await page.locator('ll-progress-chart, ll-reach-diagram, ll-recent-kicks').count()).toBe(0);
      await page.screenshot({ path: join(SHOTS, 'player-file-refused.png') });
    } finally {
      await close();
    }
  }, 120_000);

  it('reopens the player’s own file with its envelope when the server cannot be reached', async () => {
    const offlineServer = await startE2eServer();
    const { context, close } = await launchContext({ width: 360, height: 740 });
    try {
      const page = await context.newPage();
      await signIn(page, offlineServer.baseUrl, PLAYER);
      await page.getByRole('link', { name: 'My file' }).click();
      await page.waitForURL(/\/players\/me$/);
      const reach = page.locator('ll-reach-diagram');
      await reach.locator('circle.ll-reach__landing').nth(999).waitFor({ state: 'attached', timeout: 60_000 });
      await page.locator('ll-recent-kicks tbody tr').first().waitFor();
      const headline = await page.locator('ll-reach-panel .reach-panel__number').first().innerText();
      // The service worker must control the page, and the answers and envelopes must be on the device.
      await page.evaluate(async () => {
        await navigator.serviceWorker.ready;
      });
      await page.waitForTimeout(2500);
      await offlineServer.stop();
      await context.setOffline(true);
      await page.reload();
      await reach.locator('circle.ll-reach__landing').nth(999).waitFor({ state: 'attached', timeout: 30_000 });
      await page.locator('ll-progress-chart circle.ll-progress__point').first().waitFor({ timeout: 30_000 });
      expect(await page.locator('ll-reach-panel .reach-panel__number').first().innerText()).toBe(headline);
      expect(await page.locator('ll-recent-kicks tbody tr').count()).toBeGreaterThan(0);
      await page.screenshot({ path: join(SHOTS, 'player-file-offline.png') });
    } finally {
      await close();
      offlineServer.cleanup();
    }
  }, 240_000);
});
