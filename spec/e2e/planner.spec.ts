import { signInThroughUi } from './support/sign-in';
/**
 * Set-piece planner and Flight sandbox end to end: the head coach signs in on the production build
 * against a real server, opens the planner, waits for the squad's ranking (the server may still be
 * fitting profiles when the page opens; the planner asks again), drags the ball with the pointer, and
 * checks that every chart drew something — by its marks and by the pixels of its screenshot.
 */
import { mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { launchContext } from './support/browser';
import { profilesFitted } from './support/profiles';
import { startE2eServer, type E2eServer } from './support/server';

const HEAD_COACH = 'head.coach@kestrel-vale.test';
const SHOTS = join(tmpdir(), 'loftline-e2e-shots');

const signIn = signInThroughUi;

/**
 * Screenshot an element and count the distinct colours in it (decoded by the browser itself), so
 * "the chart is not empty" is checked on what was painted, not only on the DOM.
 */
async function paintedColours(page: Page, element: Locator, file: string): Promise<number> {
  const png = await element.screenshot({ path: join(SHOTS, file) });
  return page.evaluate(async (base64) => {
    const image = new Image();
    image.src = `data:image/png;base64,${base64}`;
    await image.decode();
    const canvas = document.createElement('canvas');
    canvas.width = image.width;
    canvas.height = image.height;
    const g = canvas.getContext('2d')!;
    g.drawImage(image, 0, 0);
    const data = g.getImageData(0, 0, canvas.width, canvas.height).data;
    const colours = new Set<number>();
    for (let i = 0; i < data.length; i += 4) colours.add((data[i]! << 16) | (data[i + 1]! << 8) | data[i + 2]!);
    return colours.size;
  }, png.toString('base64'));
}

async function openPlanner(page: Page, server: E2eServer): Promise<void> {
  await signIn(page, server.baseUrl, HEAD_COACH);
  await page.goto(server.baseUrl + '/planner');
  await page.getByRole('heading', { name: 'Set-piece planner' }).waitFor();
  // Ranked rows carry a button with the player's name; wait for the first cloud mark too.
  await page.locator('table').getByRole('button').first().waitFor({ timeout: 120_000 });
  await page.locator('g.ll-goal-mouth__cloud path').first().waitFor({ timeout: 60_000 });
}

describe('set-piece planner (end to end, Chromium)', () => {
  let server: E2eServer;
  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    server = await startE2eServer();
  }, 90_000);
  afterAll(async () => {
    await server.stop();
    server.cleanup();
  });

  it('ranks the head coach’s squad for a free kick and draws the pitch, goal mouth and side view', async () => {
    const { context, close } = await launchContext();
    try {
      const page = await context.newPage();
      await openPlanner(page, server);

      const rows = page.locator('table tbody tr');
      expect(await rows.count()).toBeGreaterThan(3);
      const firstIn = await rows.first().locator('td').nth(2).innerText();
      expect(firstIn).toMatch(/^\d+ %$/);
      const shares = await rows.locator('td:nth-child(3)').allInnerTexts();
      const numbers = shares.filter((s) => s.endsWith('%')).map((s) => Number(s.replace(' %', '')));
      // Ranked by share in: never increasing down the table.
      expect(numbers).toEqual([...numbers].sort((a, b) => b - a));

      const pitch = page.locator('ll-set-piece-pitch');
      // IFAB Laws of the Game, Law 1 markings of the attacking half: 7 line paths, goal, two marks.
      expect(await pitch.locator('path.ll-pitch__line').count()).toBe(7);
      expect(await pitch.locator('line.ll-pitch__wall').count()).toBe(1);
      expect(await page.locator('g.ll-goal-mouth__cloud path').count()).toBeGreaterThan(50);
      const side = page.locator('ll-planner ll-trajectory-chart');
      expect((await side.locator('path.ll-trajectory__trace').getAttribute('d'))?.length ?? 0).toBeGreaterThan(50);

      expect(await paintedColours(page, pitch, 'planner-pitch.png')).toBeGreaterThan(4);
      expect(await paintedColours(page, page.locator('ll-goal-mouth-view'), 'planner-goal-mouth.png')).toBeGreaterThan(6);
      expect(await paintedColours(page, side, 'planner-side.png')).toBeGreaterThan(4);
      await page.screenshot({ path: join(SHOTS, 'planner-desktop.png') });
    } finally {
      await close();
    }
  }, 240_000);

  it('moves the ball when it is dragged on a phone and recomputes the ranking for the new spot', async () => {
    const { context, close } = await launchContext({ width: 360, height: 740 });
    try {
      const page = await context.newPage();
      await openPlanner(page, server);
      const spotText = page.locator('.planner__spot');
      const before = await spotText.innerText();
      const firstBefore = await page.locator('table tbody tr').first().innerText();

      const ball = page.getByTestId('planner-ball');
      await ball.scrollIntoViewIfNeeded();
      const box = (await ball.boundingBox())!;
      const x = box.x + box.width / 2;
      const y = box.y + box.height / 2;
      await page.mouse.move(x, y);
      await page.mouse.down();
      for (let i = 1; i <= 10; i++) await page.mouse.move(x - 6 * i, y + 5 * i);
      await page.mouse.up();

      await page.waitForFunction((old) => document.querySelector('.planner__spot')?.textContent?.trim() !== old.trim(), before);
      const after = await spotText.innerText();
      expect(after).not.toBe(before);
      // Moved away from goal (down the screen) and to the left.
      const out = (text: string): number => Number(/Ball ([\d.]+) m out/.exec(text)?.[1]);
      expect(out(after)).toBeGreaterThan(out(before) + 4);

      // The ranking is recomputed for the new spot (its shares change) and drawn again.
      await page.waitForFunction(
        (old) => {
          const row = document.querySelector('table tbody tr');
          return row !== null && row.textContent !== old && !document.querySelector('mat-progress-bar');
        },
        firstBefore,
        { timeout: 60_000 },
      );
      expect(await page.locator('g.ll-goal-mouth__cloud path').count()).toBeGreaterThan(0);
      await page.screenshot({ path: join(SHOTS, 'planner-phone.png'), fullPage: true });
    } finally {
      await close();
    }
  }, 240_000);

  it('reopens on the last spot with the kept ranking when the server cannot be reached', async () => {
    const offlineServer = await startE2eServer();
    const { context, close } = await launchContext();
    try {
      const page = await context.newPage();
      // The ranking to keep is the settled one: every profile fitted on the server first.
      await profilesFitted(offlineServer.baseUrl, HEAD_COACH);
      await openPlanner(page, offlineServer);
      // The service worker must control the page so the shell loads without the server.
      await page.evaluate(async () => {
        await navigator.serviceWorker.ready;
      });
      // Every profile in and the ranking settled, then a second's rest: the ranking is kept.
      await page.waitForFunction(
        () => !/still computing|computing…/.test(document.body.textContent ?? '') && !document.querySelector('mat-progress-bar'),
        undefined,
        {
          timeout: 120_000,
        },
      );
      const online = await page.locator('table tbody tr').allInnerTexts();
      await page.waitForTimeout(2500);
      await offlineServer.stop();
      await context.setOffline(true);
      await page.reload();
      await page.getByRole('heading', { name: 'Set-piece planner' }).waitFor({ timeout: 30_000 });
      await page.getByText('Ranking kept on this device').waitFor({ timeout: 30_000 });
      expect(await page.locator('table tbody tr').allInnerTexts()).toEqual(online);
      expect(await page.locator('g.ll-goal-mouth__cloud path').count()).toBeGreaterThan(0);
      await page.screenshot({ path: join(SHOTS, 'planner-offline.png') });
    } finally {
      await close();
      offlineServer.cleanup();
    }
  }, 240_000);

  it('opens the Flight sandbox from a permalink with two kicks overlaid in both views', async () => {
    const { context, close } = await launchContext({ width: 360, height: 740 });
    try {
      const page = await context.newPage();
      await signIn(page, server.baseUrl, HEAD_COACH);
      await page.goto(server.baseUrl + '/sandbox?k=25,28,0,6,0,0,0,15,0,50,5&k=23,19,0,3,7,3,90,15,0,50,5&goal=22');
      await page.locator('ll-trajectory-chart path.ll-trajectory__trace').first().waitFor();
      expect(await page.locator('ll-trajectory-chart path.ll-trajectory__trace').count()).toBe(4);
      const side = page.locator('ll-trajectory-chart').first();
      expect(await paintedColours(page, side, 'sandbox-side.png')).toBeGreaterThan(4);
      const carry = page.locator('table tbody tr').first();
      expect(await carry.innerText()).toMatch(/Carry\s+[\d.]+ m\s+[\d.]+ m/);
      await page.screenshot({ path: join(SHOTS, 'sandbox-phone.png') });
    } finally {
      await close();
    }
  }, 120_000);
});
