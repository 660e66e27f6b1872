/**
 * The production build as an installable PWA: a valid web app manifest with real icons, a
 * service worker controlling the page, Chromium's own installability check passing, and the
 * app shell opening with no network. "No network" is the server process stopped (the service
 * worker's own fetches ignore `context.setOffline`) plus `setOffline` for the page's events.
 * Pitchside's offline logging is covered by pitchside.spec.ts; this covers the shell itself and what
 * the first visit stores (Home and Pitchside; other screens the first time they open).
 */
import type { BrowserContext, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { launchContext } from './support/browser';
import { startE2eServer, type E2eServer } from './support/server';
import { until, untilAppCached } from './support/waiting';
import { signInThroughUi } from './support/sign-in';

/** The parts of a web app manifest this spec reads. */
interface WebAppManifest {
  name?: string;
  short_name?: string;
  start_url?: string;
  scope?: string;
  display?: string;
  theme_color?: string;
  background_color?: string;
  icons?: { src: string; sizes?: string; type?: string; purpose?: string }[];
}

/** Width and height from a PNG's IHDR chunk, or null when the bytes are not a PNG. */
function pngSize(bytes: Buffer): { width: number; height: number } | null {
  // W3C/ISO 15948 PNG: 8-byte signature, then IHDR (length, "IHDR", width, height as 32-bit big-endian).
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  if (bytes.length < 24 || !bytes.subarray(0, 8).equals(signature) || bytes.toString('latin1', 12, 16) !== 'IHDR') return null;
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

/** `#rrggbb` → `rgb(r, g, b)`, as computed styles report colours. */
function hexToRgb(hex: string): string {
  const n = Number.parseInt(hex.slice(1), 16);
  return `rgb(${(n >> 16) & 255}, ${(n >> 8) & 255}, ${n & 255})`;
}

describe('installable PWA (end to end, Chromium, production build)', () => {
  let server: E2eServer;
  let context: BrowserContext;
  let closeBrowser: () => Promise<void>;
  let page: Page;
  let indexHtml = '';
  let manifestUrl = '';
  let manifest: WebAppManifest = {};

  beforeAll(async () => {
    server = await startE2eServer();
    ({ context, close: closeBrowser } = await launchContext());
    page = await context.newPage();
  }, 90_000);

  afterAll(async () => {
    await closeBrowser?.();
    await server?.stop();
    server?.cleanup();
  });

  it('links a valid web app manifest from index.html', async () => {
    indexHtml = await (await fetch(server.baseUrl + '/')).text();
    const href = /<link[^>]*rel="manifest"[^>]*href="([^"]+)"/.exec(indexHtml)?.[1];
    expect(href).withContext('index.html links a manifest').toBeDefined();
    manifestUrl = new URL(href ?? '', server.baseUrl + '/').href;
    const res = await fetch(manifestUrl);
    expect(res.status).toBe(200);
    // W3C Web App Manifest, "Media type registration": application/manifest+json.
    expect(res.headers.get('content-type') ?? '').toContain('application/manifest+json');
    manifest = (await res.json()) as WebAppManifest;

    // W3C Web App Manifest: name, short_name, start_url within scope, a display mode that
    // opens without browser UI (Chromium's installability criteria ask for one of these).
    expect(manifest.name?.trim()).toBeTruthy();
    expect(manifest.short_name?.trim()).toBeTruthy();
    // Common practice: a short name of at most 12 characters fits under a home-screen icon.
    expect((manifest.short_name ?? '').length).toBeLessThanOrEqual(12);
    const scope = new URL(manifest.scope ?? '.', manifestUrl).href;
    const start = new URL(manifest.start_url ?? '', manifestUrl).href;
    expect(start.startsWith(scope)).withContext(`start_url ${start} within scope ${scope}`).toBeTrue();
    expect(['standalone', 'fullscreen']).toContain(manifest.display ?? 'browser');

    // CSS Color 4 hex colours; the toolbar colour matches the page's theme-color meta, the
    // splash background the light theme's page background (checked in the browser below).
    expect(manifest.theme_color).toMatch(/^#[0-9a-f]{6}$/i);
    expect(manifest.background_color).toMatch(/^#[0-9a-f]{6}$/i);
    const metaTheme = /<meta name="theme-color" content="([^"]+)"/.exec(indexHtml)?.[1];
    expect(metaTheme?.toLowerCase()).toBe(manifest.theme_color?.toLowerCase());
  });

  it('lists 192 and 512 px PNG icons that exist with those dimensions', async () => {
    const icons = manifest.icons ?? [];
    for (const size of [192, 512]) {
      const icon = icons.find(
        (i) =>
          i.type === 'image/png' &&
          (i.sizes ?? '').split(/\s+/).includes(`${size}x${size}`) &&
          (i.purpose ?? 'any').split(/\s+/).includes('any'),
      );
      expect(icon).withContext(`a ${size}x${size} PNG icon for any purpose`).toBeDefined();
    }
    // Every PNG icon listed must be a real PNG of the size it claims.
    for (const icon of icons.filter((i) => i.type === 'image/png')) {
      const res = await fetch(new URL(icon.src, manifestUrl));
      expect(res.status).withContext(icon.src).toBe(200);
      const size = pngSize(Buffer.from(await res.arrayBuffer()));
      expect(size).withContext(`${icon.src} is a PNG`).not.toBeNull();
      expect(`${size?.width}x${size?.height}`)
        .withContext(icon.src)
        .toBe(icon.sizes ?? '');
    }
  });

  it('is controlled by the service worker after a reload and passes Chromium’s installability check', async () => {
    await page.goto(server.baseUrl + '/');
    await page.waitForURL(/\/sign-in/);
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    await page.reload();
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
    expect(await page.evaluate(() => navigator.serviceWorker.controller?.scriptURL)).toBe(server.baseUrl + '/ngsw-worker.js');

    const cdp = await context.newCDPSession(page);
    const parsed = (await cdp.send('Page.getAppManifest')) as { url: string; errors: { message: string; critical: number }[] };
    expect(parsed.url).toBe(manifestUrl);
    expect(parsed.errors).toEqual([]);
    const { installabilityErrors } = (await cdp.send('Page.getInstallabilityErrors')) as {
      installabilityErrors: { errorId: string; errorArguments: { name: string; value: string }[] }[];
    };
    expect(installabilityErrors).toEqual([]);
    await cdp.detach();

    const background = await page.evaluate(() => getComputedStyle(document.body).backgroundColor);
    expect(background)
      .withContext('splash background matches the light theme page')
      .toBe(hexToRgb(manifest.background_color ?? '#000000'));
  }, 60_000);

  it('opens the shell, Pitchside never visited, and a screen opened once, with the server gone; says when a screen is not stored', async () => {
    await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.assistant_coach);
    await page.getByRole('heading', { level: 1, name: /Hello/ }).waitFor();
    await untilAppCached(page);
    // Screens other than Home and Pitchside are stored the first time they open through the service worker.
    await until('the service worker to control the page', () => page.evaluate(() => navigator.serviceWorker.controller !== null));
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'Flight sandbox' }).click();
    await page.getByRole('heading', { level: 1, name: 'Flight sandbox' }).waitFor();
    await nav.getByRole('link', { name: 'Home' }).click();
    await page.getByRole('heading', { level: 1, name: /Hello/ }).waitFor();

    await server.stop();
    await context.setOffline(true);
    try {
      await page.reload();
      await page.getByRole('heading', { level: 1, name: /Hello/ }).waitFor({ timeout: 20_000 });
      // Pitchside has never been opened on this phone: it comes from the cache filled at the first visit, fonts included.
      await nav.getByRole('link', { name: 'Pitchside' }).click();
      await page.locator('ll-session-start form').waitFor({ timeout: 20_000 });
      const fonts = await page.evaluate(async () => {
        await document.fonts.ready;
        return document.fonts.check('16px "Atkinson Hyperlegible"');
      });
      expect(fonts).toBeTrue();
      // Opened once with a signal: stored then.
      await nav.getByRole('link', { name: 'Flight sandbox' }).click();
      await page.getByRole('heading', { level: 1, name: 'Flight sandbox' }).waitFor({ timeout: 20_000 });
      // Never opened and not prefetched: the app says so instead of doing nothing.
      await nav.getByRole('link', { name: 'Set-piece planner' }).click();
      await page.getByRole('alert').filter({ hasText: 'not stored on this phone yet' }).waitFor({ timeout: 20_000 });
      expect(await page.getByRole('heading', { level: 1, name: 'Flight sandbox' }).count()).toBe(1);
    } finally {
      await context.setOffline(false);
    }
  }, 90_000);
});
