/**
 * Pitchside end to end: a real server process, the production build with its service worker,
 * Chromium at phone size. "No signal" is the server process stopped (the service worker's own
 * fetches ignore `context.setOffline`) plus `setOffline` for the browser's online/offline
 * events. A small TCP relay in front of the server lets the spec kill the server at an exact
 * moment of a push: after it committed, before the phone heard the answer.
 */
import Database from 'better-sqlite3';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { launchContext } from './support/browser';
import { startE2eServer, type E2eServer } from './support/server';
import { startsSyncPush, TcpRelay, type RelayVerdict } from './support/tcp-relay';

const PASSWORD = 'loftline-demo';
const COACH = 'assistant.coach@kestrel-vale.test';

/** Forwards TCP to the server; can cut one push's answer off and report when it did. */
class Relay extends TcpRelay<{ pushSent: boolean }> {
  private cutNextPush: (() => void) | null = null;

  /** Resolves once the server has started answering a push, whose answer is then withheld. */
  cutNextPushAnswer(): Promise<void> {
    return new Promise((done) => (this.cutNextPush = done));
  }

  protected newConnection(): { pushSent: boolean } {
    return { pushSent: false };
  }

  protected override fromClient(chunk: Buffer, connection: { pushSent: boolean }): RelayVerdict {
    if (this.cutNextPush && startsSyncPush(chunk)) connection.pushSent = true;
    return 'forward';
  }

  protected override fromServer(_chunk: Buffer, connection: { pushSent: boolean }): RelayVerdict {
    const cut = this.cutNextPush;
    if (!connection.pushSent || !cut) return 'forward';
    // The server answers only after its transaction committed: the phone never hears it.
    this.cutNextPush = null;
    cut();
    return 'close';
  }
}

/** Polls until `check` returns true. */
async function until(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

/** Page-side timing of taps on the outcome pad until the "saved" count moves. */
interface TapTiming {
  lastTapAt: number;
  samplesMs: number[];
}

async function instrumentTaps(page: Page): Promise<void> {
  await page.evaluate(() => {
    const timing: TapTiming = { lastTapAt: 0, samplesMs: [] };
    (window as unknown as { llTapTiming: TapTiming }).llTapTiming = timing;
    document.addEventListener(
      'pointerdown',
      (event) => {
        if (event.target instanceof Element && event.target.closest('ll-outcome-pad button')) timing.lastTapAt = performance.now();
      },
      true,
    );
    const status = document.querySelector('[data-testid="log-status"]');
    if (!status) throw new Error('no log status on the page');
    new MutationObserver(() => {
      if (timing.lastTapAt > 0) {
        timing.samplesMs.push(performance.now() - timing.lastTapAt);
        timing.lastTapAt = 0;
      }
    }).observe(status, { attributes: true, attributeFilter: ['data-saved-count'] });
  });
}

async function tapSamples(page: Page): Promise<number[]> {
  return page.evaluate(() => (window as unknown as { llTapTiming: TapTiming }).llTapTiming.samplesMs);
}

const OUTCOMES = ['On target', 'Short', 'Long', 'Left', 'Right', 'Blocked', 'Over'];

/** Logs `count` repetitions, tapping the chip and the outcome each time (two taps). */
async function logKicks(page: Page, count: number, offset: number): Promise<void> {
  const chips = page.getByTestId('player-chip');
  const status = page.getByTestId('log-status');
  const players = await chips.count();
  const start = Number((await status.getAttribute('data-saved-count')) ?? '0');
  for (let i = 0; i < count; i++) {
    await chips.nth((offset + i) % players).click();
    await page.getByRole('button', { name: OUTCOMES[(offset + i) % OUTCOMES.length], exact: true }).click();
    await page.locator(`[data-testid="log-status"][data-saved-count="${start + i + 1}"]`).waitFor();
  }
}

/** Waits until the service worker has every app-shell and font file in its caches. */
async function untilAppCached(page: Page): Promise<void> {
  const manifest = JSON.parse(readFileSync(resolve('dist/loftline/browser/ngsw.json'), 'utf8')) as {
    assetGroups: { name: string; urls: string[] }[];
  };
  const expected = Object.fromEntries(manifest.assetGroups.map((g) => [g.name, g.urls.length]));
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  await until('the service worker to cache the app', () =>
    page.evaluate(async (want: Record<string, number>) => {
      const names = await caches.keys();
      for (const group of ['app-shell', 'fonts']) {
        const name = names.find((n) => n.endsWith(`:assets:${group}:cache`));
        if (!name || (await (await caches.open(name)).keys()).length < want[group]) return false;
      }
      return true;
    }, expected),
  );
}

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

describe('Pitchside offline logging (end to end, Chromium, service worker)', () => {
  let server: E2eServer;
  let relay: Relay;
  let context: BrowserContext;
  let closeBrowser: () => Promise<void>;
  let page: Page;
  let sessionId = '';
  let baseUrl = '';
  const dbPath = (): string => server.dbPath;

  function kicksInSession(): { rows: number; uniq: number; live: number } {
    const db = new Database(dbPath(), { readonly: true, fileMustExist: true });
    try {
      return db
        .prepare('SELECT count(*) AS rows, count(DISTINCT id) AS uniq, sum(deleted_at IS NULL) AS live FROM kicks WHERE session_id = ?')
        .get(sessionId) as { rows: number; uniq: number; live: number };
    } finally {
      db.close();
    }
  }

  function rowExists(table: 'training_sessions' | 'drills', column: 'id' | 'session_id', id: string): boolean {
    const db = new Database(dbPath(), { readonly: true, fileMustExist: true });
    try {
      return db.prepare(`SELECT 1 FROM ${table} WHERE ${column} = ?`).get(id) !== undefined;
    } finally {
      db.close();
    }
  }

  async function restartServer(): Promise<void> {
    server = await startE2eServer({ dbPath: server.dbPath, port: server.port });
  }

  beforeAll(async () => {
    server = await startE2eServer();
    relay = new Relay(() => server.port);
    await relay.start();
    baseUrl = `http://127.0.0.1:${relay.port}`;
    ({ context, close: closeBrowser } = await launchContext({ width: 360, height: 740 }));
    page = await context.newPage();
  }, 90_000);

  afterAll(async () => {
    await closeBrowser?.();
    await relay?.stop();
    await server?.stop();
    server?.cleanup();
  });

  it('keeps kicks logged with no signal through an offline reload and syncs exactly 50', async () => {
    await page.goto(baseUrl + '/');
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail', { exact: true }).fill(COACH);
    await page.getByLabel('Password', { exact: true }).fill(PASSWORD);
    await page.getByRole('button', { name: /sign in/i }).click();
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    await untilAppCached(page);

    await page.getByRole('link', { name: 'Pitchside' }).click();
    await page.getByRole('radio', { name: 'U16', exact: true }).click();
    await page.getByRole('radio', { name: 'Headwind' }).click();
    await page.getByRole('radio', { name: 'Moderate' }).click();
    await page.getByRole('button', { name: 'Start session' }).click();
    await page.waitForURL(/\/pitchside\/[0-9a-f-]{36}$/);
    sessionId = new URL(page.url()).pathname.split('/').at(-1) ?? '';
    await page.getByRole('button', { name: 'Use this drill' }).click();
    await page.getByTestId('player-chip').first().waitFor();
    expect(await page.getByTestId('player-chip').count()).toBeGreaterThan(5);
    await until(
      'the session and drill to reach the server',
      () => rowExists('training_sessions', 'id', sessionId) && rowExists('drills', 'session_id', sessionId),
    );

    // No signal.
    await context.setOffline(true);
    await server.stop();
    await page
      .getByTestId('sync-badge')
      .filter({ hasText: /Offline/ })
      .waitFor();
    await instrumentTaps(page);
    await logKicks(page, 30, 0);
    const samples = await tapSamples(page);
    await page.getByTestId('sync-badge').filter({ hasText: '30 unsynced' }).waitFor();

    // A reload with no network opens Pitchside from the service worker and IndexedDB.
    await page.reload();
    await page.getByTestId('player-chip').first().waitFor({ timeout: 20_000 });
    expect(await page.locator('.pitchside__summary').innerText()).toContain('U16');
    await page.getByTestId('sync-badge').filter({ hasText: '30 unsynced' }).waitFor();
    await instrumentTaps(page);
    await logKicks(page, 20, 30);
    samples.push(...(await tapSamples(page)));
    await page.getByTestId('sync-badge').filter({ hasText: '50 unsynced' }).waitFor();
    expect(kicksInSession().rows).toBe(0);

    // Signal again.
    await restartServer();
    await context.setOffline(false);
    await until('50 kicks on the server', () => kicksInSession().rows >= 50, 45_000);
    await page
      .getByTestId('sync-badge')
      .filter({ hasText: /all synced/i })
      .waitFor({ timeout: 30_000 });
    expect(kicksInSession()).toEqual({ rows: 50, uniq: 50, live: 50 });

    expect(samples.length).toBe(50);
    console.log(
      `\n  Pitchside tap → "saved" (ms, n=${samples.length}): median ${percentile(samples, 50).toFixed(1)}, ` +
        `p95 ${percentile(samples, 95).toFixed(1)}, max ${Math.max(...samples).toFixed(1)}`,
    );
  }, 150_000);

  it('stays exactly-once when the server is killed during a push of 200 kicks', async () => {
    expect(sessionId).not.toBe('');
    await context.setOffline(true);
    await server.stop();
    await page
      .getByTestId('sync-badge')
      .filter({ hasText: /Offline/ })
      .waitFor();
    // The kicker stays selected between reps, so from here on each rep is one tap.
    const chips = page.getByTestId('player-chip');
    const players = await chips.count();
    const status = page.getByTestId('log-status');
    const start = Number((await status.getAttribute('data-saved-count')) ?? '0');
    for (let i = 0; i < 200; i++) {
      if (i % 20 === 0) await chips.nth((i / 20) % players).click();
      await page.getByRole('button', { name: OUTCOMES[i % OUTCOMES.length], exact: true }).click();
      await page.locator(`[data-testid="log-status"][data-saved-count="${start + i + 1}"]`).waitFor();
    }
    await page.getByTestId('sync-badge').filter({ hasText: '200 unsynced' }).waitFor();

    await restartServer();
    const cut = relay.cutNextPushAnswer();
    await context.setOffline(false);
    await cut;
    await server.stop('SIGKILL');
    // The server committed the whole batch before it died; the phone still thinks it is unsent.
    expect(kicksInSession().rows).toBe(250);
    await page.getByTestId('sync-badge').filter({ hasText: '200 unsynced' }).waitFor();

    await restartServer();
    await page
      .getByTestId('sync-badge')
      .filter({ hasText: /all synced/i })
      .waitFor({ timeout: 60_000 });
    expect(kicksInSession()).toEqual({ rows: 250, uniq: 250, live: 250 });
    const db = new Database(dbPath(), { readonly: true, fileMustExist: true });
    try {
      const recorded = db
        .prepare(
          `SELECT count(*) AS n, count(DISTINCT m.entity_id) AS rows FROM applied_mutations m
           JOIN kicks k ON k.id = m.entity_id WHERE k.session_id = ?`,
        )
        .get(sessionId) as { n: number; rows: number };
      expect(recorded).toEqual({ n: 250, rows: 250 });
    } finally {
      db.close();
    }
  }, 150_000);
});
