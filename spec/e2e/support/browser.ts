/**
 * Launches Debian's Chromium through playwright-core (never a browser download) with the
 * flags needed when running as root in a container, and a fresh profile per launch.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

/** Chromium flags for headless runs as root (see the project's contributor guide). */
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

/** A persistent context on a fresh profile (service workers and IndexedDB behave as on a phone). */
export async function launchContext(
  options: { width?: number; height?: number } = {},
): Promise<{ context: BrowserContext; close(): Promise<void> }> {
  const profile = mkdtempSync(join(tmpdir(), 'loftline-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env['CHROME_BIN'] ?? '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: options.width ?? 1280, height: options.height ?? 800 },
    serviceWorkers: 'allow',
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
