/**
 * A deploy while a coach has kicks waiting to sync: the production build is copied to a folder the server
 * serves (`LOFTLINE_CLIENT_DIR`), the coach logs repetitions with no signal, and a new build is then put in
 * that folder (a changed `index.html`, listed in `ngsw.json` with its new SHA-1, as `ng build` would). When
 * the connection returns the app asks its service worker for a new version; the offer waits while a carry is
 * typed, appears once the repetition is saved, and after "Reload now" the new build runs with every kick
 * still in the outbox, then synced. A TCP relay in front of the server refuses sync pushes until the spec
 * allows them, so "still pending after the reload" does not depend on how fast anything is.
 */
import Database from 'better-sqlite3';
import { createHash } from 'node:crypto';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { launchContext } from './support/browser';
import { startE2eServer, type E2eServer } from './support/server';
import { startsSyncPush, TcpRelay, type RelayVerdict } from './support/tcp-relay';
import { signInThroughUi } from './support/sign-in';
import { until, untilAppCached } from './support/waiting';

/** Forwards TCP to the server, closing any connection that starts a sync push while pushes are refused. */
class PushGate extends TcpRelay<null> {
  refusePushes = false;
  refused = 0;

  protected newConnection(): null {
    return null;
  }

  protected override fromClient(chunk: Buffer): RelayVerdict {
    if (!this.refusePushes || !startsSyncPush(chunk)) return 'forward';
    this.refused++;
    return 'close';
  }
}

/** The build marker the "new deploy" adds to `index.html`. */
const NEW_BUILD = '<meta name="loftline-build" content="e2e-second-deploy" />';

/**
 * Deploys a new build into `dir`: `index.html` changes and `ngsw.json` lists its new hash, so the service
 * worker sees a new version (Angular service worker: the version is the hash of the manifest; each file is
 * checked against its SHA-1 in `hashTable`).
 */
function deployNewBuild(dir: string): void {
  const indexPath = join(dir, 'index.html');
  const html = readFileSync(indexPath, 'utf8').replace('<head>', `<head>${NEW_BUILD}`);
  expect(html).toContain(NEW_BUILD);
  const manifestPath = join(dir, 'ngsw.json');
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as { timestamp: number; hashTable: Record<string, string> };
  manifest.hashTable['/index.html'] = createHash('sha1').update(html).digest('hex');
  manifest.timestamp = Date.now();
  // Precompressed copies of the old files would be stale; the server never serves a copy older than its file.
  for (const file of ['index.html.br', 'index.html.gz', 'ngsw.json.br', 'ngsw.json.gz']) rmSync(join(dir, file), { force: true });
  writeFileSync(indexPath, html);
  writeFileSync(manifestPath, JSON.stringify(manifest, null, 2));
}

const OUTCOMES = ['On target', 'Short', 'Long'];

describe('a deploy while kicks wait to sync (end to end, Chromium, service worker)', () => {
  let server: E2eServer;
  let gate: PushGate;
  let context: BrowserContext;
  let closeBrowser: () => Promise<void>;
  let page: Page;
  let clientDir = '';
  let baseUrl = '';

  function kicksIn(sessionId: string): { n: number; withCarry: number } {
    const db = new Database(server.dbPath, { readonly: true, fileMustExist: true });
    try {
      return db.prepare('SELECT count(*) AS n, sum(carry_m IS NOT NULL) AS withCarry FROM kicks WHERE session_id = ?').get(sessionId) as {
        n: number;
        withCarry: number;
      };
    } finally {
      db.close();
    }
  }

  beforeAll(async () => {
    clientDir = mkdtempSync(join(tmpdir(), 'loftline-deploy-'));
    cpSync(resolve('dist/loftline/browser'), clientDir, { recursive: true });
    server = await startE2eServer({ env: { LOFTLINE_CLIENT_DIR: clientDir } });
    gate = new PushGate(() => server.port);
    await gate.start();
    baseUrl = `http://127.0.0.1:${gate.port}`;
    ({ context, close: closeBrowser } = await launchContext({ width: 360, height: 740 }));
    page = await context.newPage();
  }, 90_000);

  afterAll(async () => {
    await closeBrowser?.();
    await gate?.stop();
    await server?.stop();
    server?.cleanup();
    if (clientDir) rmSync(clientDir, { recursive: true, force: true });
  });

  it('offers the new version only once the repetition is saved, and keeps every pending kick through the reload', async () => {
    await signInThroughUi(page, baseUrl, DEMO_ACCOUNTS.assistant_coach);
    await untilAppCached(page);
    await page.getByRole('link', { name: 'Pitchside' }).click();
    await page.getByRole('radio', { name: 'U16', exact: true }).click();
    await page.getByRole('button', { name: 'Start session' }).click();
    await page.waitForURL(/\/pitchside\/[0-9a-f-]{36}$/);
    const sessionId = new URL(page.url()).pathname.split('/').at(-1) ?? '';
    await page.getByRole('button', { name: 'Use this drill' }).click();
    await page.getByTestId('player-chip').first().waitFor();
    const badge = page.getByTestId('sync-badge');
    // The session and its drill reach the server (and the phone hears so) before the signal goes.
    await until('the session to sync', async () => /all synced/i.test(await badge.innerText()), 90_000).catch(async (error: unknown) => {
      throw new Error(`${String(error)}; sync badge: ${await badge.innerText()}`);
    });

    // No signal: three repetitions wait in the outbox.
    gate.refusePushes = true;
    await context.setOffline(true);
    await page
      .getByTestId('sync-badge')
      .filter({ hasText: /Offline/ })
      .waitFor();
    for (let i = 0; i < OUTCOMES.length; i++) {
      await page.getByTestId('player-chip').nth(i).click();
      await page.getByRole('button', { name: OUTCOMES[i], exact: true }).click();
      await page.locator(`[data-testid="log-status"][data-saved-count="${i + 1}"]`).waitFor();
    }
    await page.getByTestId('sync-badge').filter({ hasText: '3 unsynced' }).waitFor();

    // A fourth is half entered (a carry typed) when the new build is deployed and the signal returns.
    await page.getByTestId('player-chip').nth(3).click();
    await page.getByLabel('Carry').fill('31.5');
    deployNewBuild(clientDir);
    await context.setOffline(false);
    await page
      .getByRole('status')
      .filter({ hasText: 'it will be offered once this repetition is saved' })
      .waitFor({ timeout: 60_000 })
      .catch(async (error: unknown) => {
        // The Angular service worker's own debug page says which versions it has and why an update failed.
        const state = await page.evaluate(() => fetch('/ngsw/state').then((r) => r.text()));
        throw new Error(`${String(error)}\n${state}`);
      });
    expect(await page.getByRole('button', { name: 'Reload now' }).count()).toBe(0);
    await until('the push to be refused', () => gate.refused > 0);
    await page.getByTestId('sync-badge').filter({ hasText: '3 unsynced' }).waitFor();

    // Saving the repetition lets the offer through.
    await page.getByRole('button', { name: 'On target', exact: true }).click();
    await page.locator(`[data-testid="log-status"][data-saved-count="4"]`).waitFor();
    await page.getByRole('button', { name: 'Reload now' }).waitFor();
    await page.getByTestId('sync-badge').filter({ hasText: '4 unsynced' }).waitFor();
    expect(kicksIn(sessionId).n).toBe(0);

    // The new build runs, with the four kicks still on the device and not yet on the server.
    await page.getByRole('button', { name: 'Reload now' }).click();
    await page.locator('meta[name="loftline-build"]').waitFor({ state: 'attached', timeout: 30_000 });
    await page.getByTestId('player-chip').first().waitFor({ timeout: 30_000 });
    await page.getByTestId('sync-badge').filter({ hasText: '4 unsynced' }).waitFor();
    expect(kicksIn(sessionId).n).toBe(0);
    expect(await page.getByRole('button', { name: 'Reload now' }).count()).toBe(0);

    // Pushes allowed again: the next chance to sync (the connection returning) delivers all four, once.
    gate.refusePushes = false;
    await context.setOffline(true);
    await context.setOffline(false);
    await page
      .getByTestId('sync-badge')
      .filter({ hasText: /all synced/i })
      .waitFor({ timeout: 60_000 });
    expect(kicksIn(sessionId)).toEqual({ n: 4, withCarry: 1 });
  }, 180_000);
});
