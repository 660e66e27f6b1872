/** Waiting in end-to-end specs: for a condition, and for the Angular service worker's caches. */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Page } from 'playwright-core';

/** Polls until `check` returns true. */
export async function until(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

/**
 * Waits until the service worker has every file of the given prefetch asset groups (by default
 * the app shell, the fonts and the icons) in its caches, as listed in the build's `ngsw.json`.
 */
export async function untilAppCached(page: Page, groups: readonly string[] = ['app-shell', 'fonts', 'icons-and-images']): Promise<void> {
  const manifest = JSON.parse(readFileSync(resolve('dist/loftline/browser/ngsw.json'), 'utf8')) as {
    assetGroups: { name: string; urls: string[] }[];
  };
  const expected = Object.fromEntries(manifest.assetGroups.filter((g) => groups.includes(g.name)).map((g) => [g.name, g.urls.length]));
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  await until('the service worker to cache the app', () =>
    page.evaluate(async (want: Record<string, number>) => {
      const names = await caches.keys();
      for (const [group, count] of Object.entries(want)) {
        const name = names.find((n) => n.endsWith(`:assets:${group}:cache`));
        if (!name || (await (await caches.open(name)).keys()).length < count) return false;
      }
      return true;
    }, expected),
  );
}
